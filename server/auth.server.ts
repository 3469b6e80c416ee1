// Sign-in (remix-auth + remix-auth-form + bcryptjs) and the guards every studio route uses.
import bcrypt from "bcryptjs";
import { data, redirect } from "react-router";
import { Authenticator } from "remix-auth";
import { FormStrategy } from "remix-auth-form";
import { z } from "zod";
import { Membership, Organisation, User } from "../db/models/index.ts";
import type { Role } from "../app/lib/roles.ts";
import { assertSignInAllowed, clearFailedSignIns, recordFailedSignIn } from "./rate-limit.server.ts";
import { getSession, sessionStorage } from "./session.server.ts";

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

export const authenticator = new Authenticator<AuthUser>();
authenticator.use(
  new FormStrategy<AuthUser>(async ({ form, request }) => {
    const parsed = SignInSchema.safeParse({ email: form.get("email"), password: form.get("password") });
    if (!parsed.success) {
      const fields = Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message]));
      throw new SignInError("Check the highlighted fields.", fields);
    }
    const { email, password } = parsed.data;
    const client = clientAddress(request);
    await assertSignInAllowed(email, client);
    const user = await User.findOne({ where: { email } });
    const ok = await bcrypt.compare(password, user?.passwordHash ?? DUMMY_HASH);
    if (!user || !ok) {
      await recordFailedSignIn(email, client);
      throw new SignInError(SIGN_IN_FAILED);
    }
    await clearFailedSignIns(email);
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

export interface MemberContext {
  user: User;
  organisation: Organisation;
  membership: Membership;
  memberships: Membership[];
  role: Role;
  sessionId: string;
}

/**
 * The guard of every studio route. Signed out → redirect to /login?redirectTo=…; signed in but not
 * holding one of `roles` in the active organisation → 403. Routes then scope every query by
 * `organisation.id` and answer 404 for another organisation's data.
 */
export async function requireMember(request: Request, roles?: readonly Role[]): Promise<MemberContext> {
  const session = await getSession(request);
  const userId = session.get("userId");
  const user = userId ? await User.findByPk(userId) : null;
  if (!user) loginRedirect(request);
  const memberships = await Membership.findAll({
    where: { userId: user.id },
    include: [{ model: Organisation, as: "organisation" }],
    order: [["createdAt", "ASC"]],
  });
  if (memberships.length === 0) {
    throw data({ message: "Your account does not belong to any organisation yet. Ask an organisation's admin for an invitation." }, { status: 403 });
  }
  const active = memberships.find((m) => m.organisationId === session.get("organisationId")) ?? memberships[0];
  if (roles && !roles.includes(active.role)) {
    throw data(
      { message: `This page is for ${roles.join(" or ")} members of ${active.organisation!.name}. Your role there is ${active.role}.` },
      { status: 403 },
    );
  }
  return { user, organisation: active.organisation!, membership: active, memberships, role: active.role, sessionId: session.id };
}

export function notFound(message = "Not found"): never {
  throw data({ message }, { status: 404 });
}
