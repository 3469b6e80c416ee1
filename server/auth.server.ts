// Sign-in (remix-auth + remix-auth-form + bcryptjs) and the guards every studio route uses:
// `requireMember` (signed in, in an organisation), `requirePermission` (and may do an action, asked of
// the permissions table in app/lib/permissions.ts), and the non-throwing `getMember`.
import { createHash, randomBytes } from "node:crypto";
import bcrypt from "bcryptjs";
import { data, redirect } from "react-router";
import { Authenticator } from "remix-auth";
import { FormStrategy } from "remix-auth-form";
import { z } from "zod";
import type { Transaction } from "sequelize";
import { Membership, Organisation, User } from "../db/models/index.ts";
import { can, decide, rolesFor, whoMay, type Action, type Resource, type Subject } from "../app/lib/permissions.ts";
import { normaliseRoles, rolesInWords, type Role } from "../app/lib/roles.ts";
import { sequelize } from "./db.server.ts";
import { beginSignInAttempt, signInSucceeded, type SignInAttempt } from "./rate-limit.server.ts";
import { deviceCookie, getSession, sessionStorage } from "./session.server.ts";

export const CLIENT_IP_HEADER = "x-eonscale-client-ip";
export const BCRYPT_COST = 10;

export interface AuthUser {
  id: number;
  email: string;
}

export const SignInSchema = z.object({
  email: z.email({ error: "Enter your e-mail address, like name@example.org." }).transform((e) => e.trim().toLowerCase()),
  password: z.string({ error: "Enter your password." }).min(1, { error: "Enter your password." }).max(200),
});

/** The message for every failed sign-in: it never says whether the address exists. */
export const SIGN_IN_FAILED = "That e-mail address and password do not match an account.";

export class SignInError extends Error {
  constructor(message: string, public fields: Record<string, string> = {}) {
    super(message);
    this.name = "SignInError";
  }
}

export function clientAddress(request: Request): string {
  return request.headers.get(CLIENT_IP_HEADER) ?? "unknown";
}

// A real bcrypt hash to compare against when the address is unknown, so both paths take as long.
const DUMMY_HASH = bcrypt.hashSync("not-a-real-password", BCRYPT_COST);

// ---------- device cookies: browsers where an address signed in before ----------

type DeviceEntry = { a: string; d: string };
const MAX_DEVICE_ENTRIES = 5;
const addressTag = (email: string) => createHash("sha256").update(email.trim().toLowerCase()).digest("base64url").slice(0, 22);

async function deviceEntries(request: Request): Promise<DeviceEntry[]> {
  const value: unknown = await deviceCookie.parse(request.headers.get("Cookie")).catch(() => null);
  return Array.isArray(value) ? value.filter((e): e is DeviceEntry => typeof e?.a === "string" && typeof e?.d === "string") : [];
}

/** This browser's device id for the address, when a sign-in to it succeeded here before. */
export async function trustedDevice(request: Request, email: string): Promise<string | null> {
  const tag = addressTag(email);
  return (await deviceEntries(request)).find((e) => e.a === tag)?.d ?? null;
}

/** The Set-Cookie that makes this browser trusted for the address (kept for a year, five addresses at most). */
export async function rememberDevice(request: Request, email: string): Promise<string> {
  const tag = addressTag(email);
  const entries = await deviceEntries(request);
  const mine = entries.find((e) => e.a === tag) ?? { a: tag, d: randomBytes(16).toString("base64url") };
  return deviceCookie.serialize([mine, ...entries.filter((e) => e.a !== tag)].slice(0, MAX_DEVICE_ENTRIES));
}

/**
 * Checks a password for an address under the sign-in limits (server/rate-limit.server.ts): throws
 * RateLimitedError when this client has to wait; the attempt counts as a failure unless the
 * password is right. `hash` is null for an unknown address (a dummy hash is compared instead).
 */
export async function checkPasswordLimited(request: Request, email: string, password: string, hash: string | null): Promise<boolean> {
  const attempt: SignInAttempt = { email, client: clientAddress(request), device: await trustedDevice(request, email) };
  await beginSignInAttempt(attempt);
  const ok = await bcrypt.compare(password, hash ?? DUMMY_HASH);
  if (ok && hash) await signInSucceeded(attempt);
  return ok && hash !== null;
}

export const authenticator = new Authenticator<AuthUser>();
authenticator.use(
  new FormStrategy<AuthUser>(async ({ form, request }) => {
    const parsed = SignInSchema.safeParse({ email: form.get("email"), password: form.get("password") });
    if (!parsed.success) {
      const fields = Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message]));
      throw new SignInError("Check the highlighted fields.", fields);
    }
    const { email, password } = parsed.data;
    const user = await User.findOne({ where: { email } });
    if (!(await checkPasswordLimited(request, email, password, user?.passwordHash ?? null)) || !user) throw new SignInError(SIGN_IN_FAILED);
    await user.update({ lastSignInAt: new Date() });
    return { id: user.id, email: user.email };
  }),
  "form",
);

export function hashPassword(password: string) {
  return bcrypt.hash(password, BCRYPT_COST);
}

export function verifyPassword(password: string, hash: string) {
  return bcrypt.compare(password, hash);
}

export const NewPasswordSchema = z
  .string({ error: "Choose a password." })
  .min(10, { error: "Use at least 10 characters." })
  .max(200, { error: "Use at most 200 characters." });

/** Starts a signed-in session for the user and returns the Set-Cookie header. */
export async function startSession(request: Request, userId: number, organisationId?: number) {
  const session = await getSession(request);
  // A fresh session id at sign-in (no fixation): drop any previous server row.
  if (session.id) await sessionStorage.destroySession(session);
  const fresh = await sessionStorage.getSession();
  fresh.set("userId", userId);
  const orgId = organisationId ?? (await Membership.findOne({ where: { userId }, order: [["createdAt", "ASC"]] }))?.organisationId;
  if (orgId) fresh.set("organisationId", orgId);
  return sessionStorage.commitSession(fresh);
}

export async function getUser(request: Request) {
  const session = await getSession(request);
  const userId = session.get("userId");
  if (!userId) return null;
  return User.findByPk(userId);
}

function loginRedirect(request: Request): never {
  const url = new URL(request.url);
  const to = url.pathname + url.search;
  throw redirect(`/login?redirectTo=${encodeURIComponent(to)}`);
}

export async function requireUser(request: Request) {
  const user = await getUser(request);
  if (!user) loginRedirect(request);
  return user;
}

/** Is this user a site-wide chart steward (granted with `npm run steward -- add EMAIL`)? */
export async function isSteward(userId: number, transaction?: Transaction): Promise<boolean> {
  const [rows] = await sequelize.query(`SELECT 1 FROM chart_stewards WHERE user_id = $1`, { bind: [userId], transaction });
  return rows.length > 0;
}

/** A signed-in person as the guards see them: their memberships, the active one, and the permission subject. */
export interface Signed {
  user: User;
  sessionId: string;
  steward: boolean;
  memberships: Membership[];
  /** The active organisation's membership (chosen in the session), or null for someone in none. */
  membership: Membership | null;
  organisation: Organisation | null;
  roles: Role[];
  subject: Subject;
}

export interface MemberContext extends Signed {
  membership: Membership;
  organisation: Organisation;
}

// A page's loaders (layout and page) run on the same Request: a GET reads the signed-in person once
// for all of them. Writes (actions) always read afresh, as they may change what is read.
const signedOfRequest = new WeakMap<Request, Promise<Signed | null>>();

/** The signed-in person (member of an organisation or not), or null. Never throws a redirect or an error response. */
export function getSigned(request: Request): Promise<Signed | null> {
  if (request.method !== "GET" && request.method !== "HEAD") return readSigned(request);
  let signed = signedOfRequest.get(request);
  if (!signed) {
    signed = readSigned(request);
    signedOfRequest.set(request, signed);
  }
  return signed;
}

async function readSigned(request: Request): Promise<Signed | null> {
  const session = await getSession(request);
  const userId = session.get("userId");
  const user = userId ? await User.findByPk(userId) : null;
  if (!user) return null;
  const [memberships, steward] = await Promise.all([
    Membership.findAll({
      where: { userId: user.id },
      include: [{ model: Organisation, as: "organisation" }],
      order: [["createdAt", "ASC"]],
    }),
    isSteward(user.id),
  ]);
  const active = memberships.find((m) => m.organisationId === session.get("organisationId")) ?? memberships[0] ?? null;
  const roles = active ? normaliseRoles(active.roles) : [];
  return {
    user,
    sessionId: session.id,
    steward,
    memberships,
    membership: active,
    organisation: active?.organisation ?? null,
    roles,
    subject: { roles, steward, userId: user.id, organisationId: active?.organisationId ?? null },
  };
}

/** The signed-in member in their active organisation, or null (signed out, or in no organisation). Never throws. */
export async function getMember(request: Request): Promise<MemberContext | null> {
  const s = await getSigned(request);
  return s?.membership ? (s as MemberContext) : null;
}

const NO_ORGANISATION = "Your account does not belong to any organisation yet. Ask an organisation's admin for an invitation.";

/** Signed in (member of an organisation or not); signed out → redirect to /login?redirectTo=…. */
export async function requireSigned(request: Request): Promise<Signed> {
  const s = await getSigned(request);
  if (!s) loginRedirect(request);
  return s;
}

/**
 * The guard of every studio route. Signed out → redirect to /login?redirectTo=…; signed in but in
 * no organisation → 403. Routes then scope every query by `organisation.id` and answer 404 for
 * another organisation's data. What the member may do is asked of `can()` (or `requirePermission`).
 */
export async function requireMember(request: Request): Promise<MemberContext> {
  const s = await requireSigned(request);
  if (!s.membership) throw data({ message: NO_ORGANISATION }, { status: 403 });
  return s as MemberContext;
}

/** 403 with the reason in plain words. */
export function forbidden(message: string): never {
  throw data({ message }, { status: 403 });
}

function refusal(s: Signed, action: Action, resource?: Resource): string | null {
  const decision = decide(s.subject, action, resource);
  if (decision.ok) return null;
  const roles = rolesFor(action);
  // Role-based refusals name the page's audience the way members read it.
  if (!resource && roles.length && s.organisation) {
    const held = s.roles.length ? rolesInWords(s.roles, { lower: true }) : "none";
    return `This page is for ${whoMay(action)} of ${s.organisation.name}. Your roles there: ${held}.`;
  }
  return decision.reason;
}

/**
 * The member may do `action` (to `resource`) in their active organisation, or 403 naming what is
 * needed. Signed out → redirect to sign-in; in no organisation → 403 (steward-only actions excepted:
 * use `requireAnyPermission` for pages a steward without an organisation may reach).
 */
export async function requirePermission(request: Request, action: Action, resource?: Resource): Promise<MemberContext> {
  const member = await requireMember(request);
  const message = refusal(member, action, resource);
  if (message) forbidden(message);
  return member;
}

/** Signed in and allowed at least one of `actions` (a page serving several audiences, e.g. stewards and editors). */
export async function requireAnyPermission(request: Request, actions: readonly Action[]): Promise<Signed> {
  const s = await requireSigned(request);
  if (actions.some((a) => can(s.subject, a))) return s;
  if (!s.membership && !s.steward) forbidden(NO_ORGANISATION);
  forbidden(refusal(s, actions[0]) ?? `This needs ${actions.map(whoMay).join(" or ")}.`);
}

export function notFound(message = "Not found"): never {
  throw data({ message }, { status: 404 });
}
