// Failed sign-in counters kept in Postgres (rate-limiter-flexible), so every app server shares them.
import { RateLimiterPostgres, type RateLimiterRes } from "rate-limiter-flexible";
import { sequelize } from "./db.server.ts";

const WINDOW_SECONDS = 15 * 60;

function limiter(keyPrefix: string, points: number) {
  return new RateLimiterPostgres({
    storeClient: sequelize,
    tableName: "rate_limits",
    tableCreated: true,
    keyPrefix,
    points,
    duration: WINDOW_SECONDS,
    blockDuration: WINDOW_SECONDS,
  });
}

/** Failed sign-ins allowed per e-mail address and per client address within 15 minutes. */
export const SIGN_IN_LIMITS = { perAddress: 5, perClient: 30 } as const;

const byAddress = limiter("signin_address", SIGN_IN_LIMITS.perAddress);
const byClient = limiter("signin_client", SIGN_IN_LIMITS.perClient);

export class RateLimitedError extends Error {
  constructor(public retryAfterSeconds: number) {
    super(`Too many failed sign-in attempts. Wait ${Math.ceil(retryAfterSeconds / 60)} minutes and try again, or reset your password.`);
    this.name = "RateLimitedError";
  }
}

/** Throws RateLimitedError when either counter is used up. */
export async function assertSignInAllowed(email: string, client: string) {
  const [a, c] = await Promise.all([byAddress.get(email), byClient.get(client)]);
  const over = [
    a && a.consumedPoints >= SIGN_IN_LIMITS.perAddress ? a : null,
    c && c.consumedPoints >= SIGN_IN_LIMITS.perClient ? c : null,
  ].filter((r): r is RateLimiterRes => r !== null);
  if (over.length) throw new RateLimitedError(Math.max(...over.map((r) => r.msBeforeNext / 1000)));
}

export async function recordFailedSignIn(email: string, client: string) {
  await Promise.all([
    byAddress.penalty(email, 1),
    byClient.penalty(client, 1),
  ]);
}

export async function clearFailedSignIns(email: string) {
  await byAddress.delete(email);
}
