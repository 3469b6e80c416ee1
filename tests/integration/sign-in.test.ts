// Sign-in: session cookie, failures that never reveal whether an address exists, redirects that
// stay on the site, and limits (kept in Postgres) that slow guessing down without locking the owner
// out: per client at one address, per address, per client across addresses, trusted devices.
import { describe, expect, it } from "vitest";
import * as login from "../../app/routes/login.tsx";
import { Session } from "../../db/models/index.ts";
import { SIGN_IN_FAILED } from "../../server/auth.server.ts";
import { sessionCookie } from "../../server/session.server.ts";
import { SIGN_IN_LIMITS, waitAfter } from "../../server/rate-limit.server.ts";
import { sequelize } from "../../server/db.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle, TEST_PASSWORD, unique } from "../helpers/db.ts";

const signIn = (fields: Record<string, string>, ip = unique("198.51.100"), cookie?: string) => settle(() => login.action(routeArgs(formRequest("/login", fields, { ip, cookie }))));

/** The device cookie a successful sign-in set, as a Cookie header. */
const deviceOf = (res: { headers: Headers }) => res.headers.getSetCookie().find((c) => c.startsWith("en_device="))!.split(";")[0];

/** Lets time pass for one limit key: its window or wait ends now. */
async function expire(key: string) {
  await sequelize.query(`UPDATE rate_limits SET expire = $2 WHERE key = $1`, { bind: [key, Date.now() - 1] });
}

describe("sign-in", () => {
  it("redirects to redirectTo with an httpOnly SameSite=Lax cookie holding only a session id", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const res = await signIn({ email: user.email.toUpperCase(), password: TEST_PASSWORD, redirectTo: "/studio/account" });
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe("/studio/account");
    const cookie = res.headers.get("Set-Cookie")!;
    expect(cookie).toMatch(/^en_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // only in production over https
    // The signed value is only the id of a server-side session row, not the session's data.
    const id = await sessionCookie.parse(cookie.split(";")[0]);
    expect(id).toMatch(/^[A-Za-z0-9_-]{32}$/);
    const row = await Session.findByPk(id);
    expect(row?.userId).toBe(user.id);
    expect(await Session.count({ where: { userId: user.id } })).toBe(1);
  });

  it("refuses an off-site redirectTo", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const res = await signIn({ email: user.email, password: TEST_PASSWORD, redirectTo: "//evil.example/x" });
    expect(res.headers.get("Location")).toBe("/studio");
  });

  it("redirectTo with a tab, CR, LF, NUL, U+3000, a backslash or another host: never off-site, never 500, one session row per cookie", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const attacks = [
      "/\t/evil.example", "/\n/evil.example", "/\r\n/evil.example", "/studio\r\nSet-Cookie: x=1", "/\0/evil.example", "/studio\u0000",
      "/\u3000/evil.example", "/studio\u3000", "/\\evil.example", "\\\\evil.example", "//evil.example", "///evil.example", "https://evil.example/",
      "/a/..//evil.example", "/./\t/evil.example", " //evil.example", "javascript:alert(1)", "/studio\u2028", "\t/studio",
    ];
    let cookies = 0;
    for (const redirectTo of attacks) {
      const res = await signIn({ email: user.email, password: TEST_PASSWORD, redirectTo });
      expect([redirectTo, res.status]).toEqual([redirectTo, 302]);
      const location = res.headers.get("Location")!;
      // Resolved as a browser resolves a Location header, it stays on the site.
      expect([redirectTo, new URL(location, "https://eonscale.example").origin]).toEqual([redirectTo, "https://eonscale.example"]);
      expect(location).toMatch(/^\/(?![/\\])[\x21-\x7e]*$/);
      if (/^en_session=/.test(res.headers.get("Set-Cookie") ?? "")) cookies++;
      // The loader (already signed in, or not) says the same.
      const signedOut = await settle(() => login.loader(routeArgs(getRequest(`/login?redirectTo=${encodeURIComponent(redirectTo)}`))));
      expect((signedOut.body as { redirectTo: string }).redirectTo).toMatch(/^\/(?![/\\])/);
    }
    expect(cookies).toBe(attacks.length);
    // Every session row has gone out in a cookie: none was left behind by a failed redirect.
    expect(await Session.count({ where: { userId: user.id } })).toBe(cookies);
    // A path on the site is kept, dot segments applied.
    expect((await signIn({ email: user.email, password: TEST_PASSWORD, redirectTo: "/studio/exhibits/../team?x=1#y" })).headers.get("Location")).toBe("/studio/team?x=1#y");
    const cookie = await cookieFor(user.id);
    const signedIn = await settle(() => login.loader(routeArgs(getRequest(`/login?redirectTo=${encodeURIComponent("/\t/evil.example")}`, { cookie }))));
    expect(signedIn.status).toBe(302);
    expect(signedIn.headers.get("Location")).toBe("/studio");
  });

  it("gives the same message for an unknown address and a wrong password", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const wrong = await signIn({ email: user.email, password: "not the password" });
    const unknown = await signIn({ email: `${unique("nobody")}@example.org`, password: "whatever it is" });
    expect(wrong.status).toBe(400);
    expect(unknown.status).toBe(400);
    expect((wrong.body as { error: string }).error).toBe(SIGN_IN_FAILED);
    expect((unknown.body as { error: string }).error).toBe(SIGN_IN_FAILED);
  });

  it("names the field for malformed input", async () => {
    const res = await signIn({ email: "not-an-address", password: "" });
    expect(res.status).toBe(400);
    const fields = (res.body as { fields: Record<string, string> }).fields;
    expect(fields.email).toMatch(/e-mail address/);
    expect(fields.password).toMatch(/password/);
  });

  it("one client guessing at one address: five free failures, then a wait before each attempt (30 s doubling), then the right password works", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "reviewer");
    const device = deviceOf(await signIn({ email: user.email, password: TEST_PASSWORD }));
    const ip = unique("192.0.2");
    for (let i = 0; i < SIGN_IN_LIMITS.freeFailures + 1; i++) {
      expect((await signIn({ email: user.email, password: `wrong-${i}` }, ip)).status).toBe(400);
    }
    const waiting = await signIn({ email: user.email, password: TEST_PASSWORD }, ip);
    expect(waiting.status).toBe(429);
    expect((waiting.body as { error: string }).error).toMatch(/Too many failed sign-in attempts\. Wait \d+ seconds/);
    const retry = Number(waiting.headers.get("Retry-After"));
    expect(retry).toBeGreaterThan(1);
    expect(retry).toBeLessThanOrEqual(SIGN_IN_LIMITS.clientWait.firstSeconds);
    // The owner's own browser is not held up by this client's failures.
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, unique("198.18.2"), device)).status).toBe(302);
    // After the waits, this client may try again; the right password works and forgives its failures.
    await expire(`signin_pair_gate:${user.email}|${ip}`);
    await expire(`signin_address_gate:${user.email}`);
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, ip)).status).toBe(302);
    const [rows] = await sequelize.query(`SELECT key FROM rate_limits WHERE key = $1`, { bind: [`signin_pair:${user.email}|${ip}`] });
    expect(rows).toEqual([]);
  });

  it("an address attacked from many clients slows down untrusted attempts (at most 60 s), and never the owner's trusted browser", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const home = unique("203.0.113");
    const first = await signIn({ email: user.email, password: TEST_PASSWORD }, home);
    expect(first.status).toBe(302);
    const device = deviceOf(first);
    // Twenty attacker clients, one wrong password each.
    const statuses: number[] = [];
    for (let i = 0; i < 20; i++) statuses.push((await signIn({ email: user.email, password: `guess-${i}` })).status);
    // Five free failures, one more through the wait, then the address waits (an attempt may get
    // through now and then when a wait has ended: 1 s, 2 s, 4 s …).
    const slowed = (list: number[]) => {
      expect(list.slice(0, SIGN_IN_LIMITS.freeFailures + 1)).toEqual(Array(SIGN_IN_LIMITS.freeFailures + 1).fill(400));
      expect(list.filter((s) => s === 400).length).toBeLessThanOrEqual(SIGN_IN_LIMITS.freeFailures + 3);
      expect(list.filter((s) => s === 429).length).toBeGreaterThanOrEqual(20 - SIGN_IN_LIMITS.freeFailures - 3);
    };
    slowed(statuses);
    // The owner's browser signs in at once, even from a new network.
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, unique("198.18.0"), device)).status).toBe(302);
    // The owner on a new browser is slowed down, not locked out: the wait is seconds, not minutes.
    // The waits are short at first (1 s, 2 s, 4 s …), so on a slow machine one may end between two
    // requests: try right after an attacker's attempt was held, until the owner's is held too.
    let newBrowser = await signIn({ email: user.email, password: TEST_PASSWORD }, unique("198.18.1"));
    for (let i = 0; i < 12 && newBrowser.status !== 429; i++) {
      if ((await signIn({ email: user.email, password: `more-${i}` })).status !== 429) continue;
      newBrowser = await signIn({ email: user.email, password: TEST_PASSWORD }, unique("198.18.1"));
    }
    expect(newBrowser.status).toBe(429);
    expect(Number(newBrowser.headers.get("Retry-After"))).toBeLessThanOrEqual(SIGN_IN_LIMITS.addressWait.maxSeconds);
    await expire(`signin_address_gate:${user.email}`);
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, unique("198.18.1"))).status).toBe(302);
    // An address without an account is limited exactly the same (the answers reveal nothing).
    const ghost = `${unique("ghost")}@example.org`;
    const ghostStatuses: number[] = [];
    for (let i = 0; i < 20; i++) ghostStatuses.push((await signIn({ email: ghost, password: `guess-${i}` })).status);
    slowed(ghostStatuses);
  });

  it("a trusted browser that guesses wrong itself waits like any client", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const device = deviceOf(await signIn({ email: user.email, password: TEST_PASSWORD }));
    for (let i = 0; i < SIGN_IN_LIMITS.freeFailures + 1; i++) expect((await signIn({ email: user.email, password: `no-${i}` }, unique("10.1"), device)).status).toBe(400);
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, unique("10.1"), device)).status).toBe(429);
    // A device cookie of another address, or a forged one, trusts nothing.
    const forged = device.replace(/=.*/, "=eyJhIjoiIiwiZCI6IiJ9.forged");
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, unique("10.2"), forged)).status).toBe(302);
  });

  it("simultaneous guesses from 40 clients: the free failures and about one per wait reach the password check, not 40", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "editor");
    const t0 = Date.now();
    const results = await Promise.all(Array.from({ length: 40 }, (_, i) => signIn({ email: user.email, password: `burst-${i}` })));
    const seconds = (Date.now() - t0) / 1000;
    const checked = results.filter((r) => r.status === 400).length;
    console.info(`burst of 40 guesses in ${seconds.toFixed(1)} s: ${checked} reached the password check`);
    expect(results.every((r) => r.status === 400 || r.status === 429)).toBe(true);
    // Waits of 1 s, 2 s, 4 s … after the free failures: within the burst's own duration at most
    // one attempt per ended wait passes (log2 of the seconds, plus the first).
    expect(checked).toBeLessThanOrEqual(SIGN_IN_LIMITS.freeFailures + 2 + Math.ceil(Math.log2(1 + seconds)));
    expect(results.filter((r) => r.status === 429).every((r) => Number(r.headers.get("Retry-After")) > 0)).toBe(true);
  });

  it("the waits keep guesses at one account under 100 an hour (OWASP ASVS 4.0.3 §2.2.1), however many clients", () => {
    // An attacker with unlimited clients tries as soon as each wait ends.
    let t = 0;
    let failures = 0;
    while (true) {
      t += waitAfter(failures, SIGN_IN_LIMITS.freeFailures, SIGN_IN_LIMITS.addressWait);
      if (t >= 3600) break;
      failures++;
    }
    console.info(`guesses at one account in the first hour, unlimited clients: ${failures}`);
    expect(failures).toBeLessThan(100);
  });

  it(`stops a client after ${SIGN_IN_LIMITS.perClient} failures across many addresses; the owner elsewhere is fine`, async () => {
    const ip = unique("192.0.2");
    for (let i = 0; i < SIGN_IN_LIMITS.perClient; i++) {
      expect((await signIn({ email: `${unique("probe")}@example.org`, password: "guess" }, ip)).status).toBe(400);
    }
    const org = await createOrganisation();
    const { user } = await createMember(org, "editor");
    const stopped = await signIn({ email: user.email, password: TEST_PASSWORD }, ip);
    expect(stopped.status).toBe(429);
    expect(Number(stopped.headers.get("Retry-After"))).toBeGreaterThan(60);
    expect((await signIn({ email: user.email, password: TEST_PASSWORD })).status).toBe(302);
  });

  it("counters live in Postgres, where every app server sees them; a right password takes its own attempt back", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const ip = unique("192.0.2");
    for (let i = 0; i < SIGN_IN_LIMITS.freeFailures - 1; i++) await signIn({ email: user.email, password: "nope" }, ip);
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, ip)).status).toBe(302);
    await signIn({ email: user.email, password: "nope" }, ip);
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, ip)).status).toBe(302);
    const [rows] = await sequelize.query(`SELECT key, points FROM rate_limits WHERE key IN ($1, $2)`, { bind: [`signin_address:${user.email}`, `signin_client:${ip}`] });
    expect(Object.fromEntries((rows as { key: string; points: number }[]).map((r) => [r.key.split(":")[0], r.points]))).toEqual({
      signin_address: SIGN_IN_LIMITS.freeFailures,
      signin_client: SIGN_IN_LIMITS.freeFailures,
    });
  });
});
