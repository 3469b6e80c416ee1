// Limits on guessing passwords and on reset e-mails, kept in Postgres (rate-limiter-flexible's
// RateLimiterPostgres on the rate_limits table), so every app server shares them.
//
// Sign-in follows OWASP ASVS 4.0.3 §2.2.1 (anti-automation "effective at mitigating breached
// credential testing, brute force, and account lockout attacks", e.g. "ever increasing delays
// between attempts"; "no more than 100 failed attempts per hour is possible on a single account")
// and OWASP's "Slow Down Online Guessing Attacks with Device Cookies": a wrong password never locks
// the account itself. Instead
//   - each client guessing at one address (the pair address + client, or a trusted device of that
//     address) has FREE_FAILURES free failures; after that it waits before every new attempt, the
//     wait doubling from 30 s up to 15 minutes;
//   - an address as a whole (all untrusted clients together) has FREE_FAILURES free failures per
//     hour; after that every untrusted attempt waits 1 s, 2 s, 4 s … up to 60 s, which bounds the
//     guesses reaching one account to under 100 an hour however many clients an attacker has;
//   - a client failing at many addresses (credential stuffing) is stopped for 15 minutes;
//   - a browser where the account signed in before carries a device cookie for it (auth.server.ts)
//     and is not slowed by other clients' failures at all: the owner keeps signing in while the
//     account is under attack.
// Failed and refused attempts answer the same for addresses with and without an account.
import { RateLimiterPostgres, type RateLimiterRes } from "rate-limiter-flexible";
import { sequelize } from "./db.server.ts";

export const SIGN_IN_LIMITS = {
  /** Free failures per (address, client), per trusted device, and per address (untrusted clients). */
  freeFailures: 5,
  /** Waits after that for one client at one address: 30 s doubling to 15 min. */
  clientWait: { firstSeconds: 30, maxSeconds: 15 * 60 },
  /** Waits for untrusted attempts at an address under attack: 1 s doubling to 60 s. */
  addressWait: { firstSeconds: 1, maxSeconds: 60 },
  /** Failures one client may make across all addresses in 15 minutes, then it is stopped. */
  perClient: 30,
} as const;

/** Reset requests: per client (then 429), and reset e-mails per address (then none, same answer). */
export const RESET_LIMITS = { perClient: 10, emailsPerAddress: 3, windowSeconds: 3600 } as const;

const QUARTER_HOUR = 15 * 60;
/** Counters that only count (their waits are set by us): a limit never reached. */
const UNCAPPED = 1_000_000;
const HOUR = 3600;

function limiter(keyPrefix: string, points: number, duration: number) {
  return new RateLimiterPostgres({ storeClient: sequelize, tableName: "rate_limits", tableCreated: true, keyPrefix, points, duration });
}

const counters = {
  pair: limiter("signin_pair", UNCAPPED, QUARTER_HOUR),
  device: limiter("signin_device", UNCAPPED, QUARTER_HOUR),
  address: limiter("signin_address", UNCAPPED, HOUR),
  client: limiter("signin_client", UNCAPPED, QUARTER_HOUR),
  resetClient: limiter("reset_client", RESET_LIMITS.perClient, RESET_LIMITS.windowSeconds),
  resetAddress: limiter("reset_address", RESET_LIMITS.emailsPerAddress, RESET_LIMITS.windowSeconds),
};
// Gates let one attempt through per wait: the first consume opens a window of the wait's length
// (customDuration), every other consume inside it is refused with the time left. Atomic in
// Postgres, so a burst of simultaneous attempts gets one through, not all.
const gates = {
  pair: limiter("signin_pair_gate", 1, QUARTER_HOUR),
  device: limiter("signin_device_gate", 1, QUARTER_HOUR),
  address: limiter("signin_address_gate", 1, HOUR),
};

export class RateLimitedError extends Error {
  constructor(public retryAfterSeconds: number, message: string) {
    super(message);
    this.name = "RateLimitedError";
  }
}

/** The headers of a 429 answer: Retry-After in whole seconds (RFC 9110 §10.2.3). */
export function retryAfter(error: RateLimitedError): Record<string, string> {
  return { "Retry-After": String(Math.max(1, Math.ceil(error.retryAfterSeconds))) };
}

function inWords(seconds: number) {
  const s = Math.max(1, Math.ceil(seconds));
  if (s < 90) return `${s} second${s === 1 ? "" : "s"}`;
  return `${Math.ceil(s / 60)} minutes`;
}

/** The wait after `failures` failures: none while free ones are left, then doubling up to a cap. */
export function waitAfter(failures: number, free: number, wait: { firstSeconds: number; maxSeconds: number }): number {
  if (failures < free) return 0;
  return Math.min(wait.maxSeconds, wait.firstSeconds * 2 ** Math.min(30, failures - free));
}

/** Who is trying: the address typed, the client's network address, and a trusted device id for that address, if any. */
export interface SignInAttempt {
  email: string;
  client: string;
  device: string | null;
}

type Guard = {
  counter: RateLimiterPostgres;
  gate: RateLimiterPostgres | null;
  key: string;
  schedule: { firstSeconds: number; maxSeconds: number } | null;
  /** On a right password: forget this counter's failures (one client's own), or only take this attempt back. */
  forgive: boolean;
};

function guardsFor(a: SignInAttempt): Guard[] {
  const email = a.email.toLowerCase();
  if (a.device) return [{ counter: counters.device, gate: gates.device, key: `${email}|${a.device}`, schedule: SIGN_IN_LIMITS.clientWait, forgive: true }];
  return [
    { counter: counters.client, gate: null, key: a.client, schedule: null, forgive: false },
    { counter: counters.pair, gate: gates.pair, key: `${email}|${a.client}`, schedule: SIGN_IN_LIMITS.clientWait, forgive: true },
    { counter: counters.address, gate: gates.address, key: email, schedule: SIGN_IN_LIMITS.addressWait, forgive: false },
  ];
}

/** Counts this attempt; 0 when it may go on, else the seconds to wait (and the count is taken back). */
async function enter(g: Guard): Promise<number> {
  const n = (await g.counter.penalty(g.key, 1)).consumedPoints; // this attempt included
  let wait = 0;
  if (!g.gate || !g.schedule) {
    if (n > SIGN_IN_LIMITS.perClient) wait = Math.max(1, ((await g.counter.get(g.key))?.msBeforeNext ?? 1000) / 1000);
  } else if (n > SIGN_IN_LIMITS.freeFailures) {
    try {
      await g.gate.consume(g.key, 1, { customDuration: waitAfter(n - 1, SIGN_IN_LIMITS.freeFailures, g.schedule) });
    } catch (res) {
      if (res instanceof Error) throw res;
      wait = Math.max(1, (res as RateLimiterRes).msBeforeNext / 1000);
    }
  }
  if (wait) await g.counter.reward(g.key, 1);
  return wait;
}

/**
 * Before checking a password: counts the attempt as a failure in advance (so simultaneous attempts
 * are counted one by one) or throws RateLimitedError with the seconds to wait. Call
 * `signInSucceeded` when the password was right.
 */
export async function beginSignInAttempt(attempt: SignInAttempt): Promise<void> {
  const entered: Guard[] = [];
  for (const g of guardsFor(attempt)) {
    const wait = await enter(g);
    if (wait) {
      await Promise.all(entered.map((e) => e.counter.reward(e.key, 1)));
      throw new RateLimitedError(wait, `Too many failed sign-in attempts. Wait ${inWords(wait)} and try again, or reset your password.`);
    }
    entered.push(g);
  }
}

/** The password was right: the attempt was no failure, and this client's (or device's) own failures are forgiven. */
export async function signInSucceeded(attempt: SignInAttempt): Promise<void> {
  await Promise.all(
    guardsFor(attempt).map((g) =>
      g.forgive ? Promise.all([g.counter.delete(g.key), g.gate?.delete(g.key)]) : g.counter.reward(g.key, 1),
    ),
  );
}

/** A reset request from this client: throws RateLimitedError beyond RESET_LIMITS.perClient per hour. */
export async function assertResetRequestAllowed(client: string): Promise<void> {
  try {
    await counters.resetClient.consume(client, 1);
  } catch (res) {
    if (res instanceof Error) throw res;
    const wait = (res as RateLimiterRes).msBeforeNext / 1000;
    throw new RateLimitedError(wait, `Too many reset requests from your network. Wait ${inWords(wait)} and try again.`);
  }
}

/** May another reset e-mail go to this address now? Counts it when it may. */
export async function takeResetEmail(email: string): Promise<boolean> {
  try {
    await counters.resetAddress.consume(email.toLowerCase(), 1);
    return true;
  } catch (res) {
    if (res instanceof Error) throw res;
    return false;
  }
}
