// Factories and request helpers for integration tests (real Postgres, no mocks).
import { randomBytes } from "node:crypto";
import { Membership, Organisation, User } from "../../db/models/index.ts";
import { normaliseRoles, type Role } from "../../app/lib/roles.ts";
import { sequelize } from "../../server/db.server.ts";
import { hashPassword, startSession } from "../../server/auth.server.ts";

export const TEST_PASSWORD = "correct horse battery";

export function unique(prefix: string) {
  return `${prefix}-${randomBytes(4).toString("hex")}`;
}

export async function createOrganisation(name = unique("Test Org")) {
  return Organisation.create({ name, slug: unique("org") });
}

let cachedHash: string | undefined;
export async function createUser(opts: { email?: string; name?: string } = {}) {
  cachedHash ??= await hashPassword(TEST_PASSWORD);
  return User.create({ email: opts.email ?? `${unique("user")}@example.org`, name: opts.name ?? "Test Person", passwordHash: cachedHash, lastSignInAt: null });
}

/** A new user holding one role, or a set of roles, in the organisation. */
export async function createMember(organisation: Organisation, roles: Role | Role[], opts: { email?: string } = {}) {
  const user = await createUser(opts);
  const membership = await Membership.create({ userId: user.id, organisationId: organisation.id, roles: normaliseRoles(Array.isArray(roles) ? roles : [roles]) });
  return { user, membership };
}

/** Make an existing user a site-wide chart steward (as `npm run steward -- add EMAIL` does). */
export async function makeSteward(userId: number) {
  await sequelize.query(`INSERT INTO chart_stewards (user_id) VALUES ($1) ON CONFLICT DO NOTHING`, { bind: [userId] });
}

/** A Cookie header for a signed-in session of this user (optionally in a given organisation). */
export async function cookieFor(userId: number, organisationId?: number) {
  const setCookie = await startSession(new Request("http://test.local/login"), userId, organisationId);
  return setCookie.split(";")[0];
}

export function formRequest(url: string, fields: Record<string, string>, opts: { cookie?: string; ip?: string } = {}) {
  const headers = new Headers({ "Content-Type": "application/x-www-form-urlencoded" });
  if (opts.cookie) headers.set("Cookie", opts.cookie);
  headers.set("x-eonscale-client-ip", opts.ip ?? "203.0.113.10");
  return new Request(new URL(url, "http://test.local"), { method: "POST", headers, body: new URLSearchParams(fields).toString() });
}

export function getRequest(url: string, opts: { cookie?: string } = {}) {
  return new Request(new URL(url, "http://test.local"), { headers: opts.cookie ? { Cookie: opts.cookie } : {} });
}

/** Runs a loader/action and returns the Response it returned or threw (redirects, data() errors). */
export async function settle(fn: () => unknown): Promise<{ status: number; headers: Headers; body: unknown }> {
  try {
    const value = await fn();
    return describe(value);
  } catch (thrown) {
    return describe(thrown);
  }
}

function describe(value: unknown): { status: number; headers: Headers; body: unknown } {
  if (value instanceof Response) return { status: value.status, headers: value.headers, body: null };
  if (value && typeof value === "object" && "type" in value && (value as { type: string }).type === "DataWithResponseInit") {
    const d = value as unknown as { data: unknown; init: ResponseInit | null };
    return { status: d.init?.status ?? 200, headers: new Headers(d.init?.headers), body: d.data };
  }
  if (value instanceof Error) throw value;
  return { status: 200, headers: new Headers(), body: value };
}

export function routeArgs(request: Request, params: Record<string, string> = {}) {
  return { request, params, context: { cspNonce: "test" } } as never;
}
