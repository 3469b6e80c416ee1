// Sign-in: session cookie, failures that never reveal whether an address exists, and rate limits
// kept in Postgres per address and per client.
import { describe, expect, it } from "vitest";
import * as login from "../../app/routes/login.tsx";
import { Session } from "../../db/models/index.ts";
import { SIGN_IN_FAILED } from "../../server/auth.server.ts";
import { sessionCookie } from "../../server/session.server.ts";
import { SIGN_IN_LIMITS } from "../../server/rate-limit.server.ts";
import { sequelize } from "../../server/db.server.ts";
import { createMember, createOrganisation, formRequest, routeArgs, settle, TEST_PASSWORD, unique } from "../helpers/db.ts";

const signIn = (fields: Record<string, string>, ip = unique("198.51.100")) => settle(() => login.action(routeArgs(formRequest("/login", fields, { ip }))));

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

  it(`locks an address after ${SIGN_IN_LIMITS.perAddress} failures, even with the right password, from any client`, async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "reviewer");
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) {
      expect((await signIn({ email: user.email, password: `wrong-${i}` })).status).toBe(400);
    }
    const locked = await signIn({ email: user.email, password: TEST_PASSWORD });
    expect(locked.status).toBe(429);
    expect((locked.body as { error: string }).error).toMatch(/Too many failed sign-in attempts/);
    expect(Number(locked.headers.get("Retry-After"))).toBeGreaterThan(0);
    // An unknown address is locked the same way: the 429 reveals nothing either.
    const ghost = `${unique("ghost")}@example.org`;
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress; i++) await signIn({ email: ghost, password: "x" });
    expect((await signIn({ email: ghost, password: "x" })).status).toBe(429);
    // The counters live in Postgres, where every app server sees them.
    const [rows] = await sequelize.query(`SELECT points FROM rate_limits WHERE key = $1`, { bind: [`signin_address:${user.email}`] });
    expect((rows as { points: number }[])[0].points).toBeGreaterThanOrEqual(SIGN_IN_LIMITS.perAddress);
  });

  it(`locks a client after ${SIGN_IN_LIMITS.perClient} failures across many addresses`, async () => {
    const ip = unique("192.0.2");
    for (let i = 0; i < SIGN_IN_LIMITS.perClient; i++) {
      expect((await signIn({ email: `${unique("probe")}@example.org`, password: "guess" }, ip)).status).toBe(400);
    }
    const org = await createOrganisation();
    const { user } = await createMember(org, "editor");
    expect((await signIn({ email: user.email, password: TEST_PASSWORD }, ip)).status).toBe(429);
    // The same person from another client is fine.
    expect((await signIn({ email: user.email, password: TEST_PASSWORD })).status).toBe(302);
  });

  it("a successful sign-in clears the address's failures", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress - 1; i++) await signIn({ email: user.email, password: "nope" });
    expect((await signIn({ email: user.email, password: TEST_PASSWORD })).status).toBe(302);
    for (let i = 0; i < SIGN_IN_LIMITS.perAddress - 1; i++) await signIn({ email: user.email, password: "nope" });
    expect((await signIn({ email: user.email, password: TEST_PASSWORD })).status).toBe(302);
  });
});
