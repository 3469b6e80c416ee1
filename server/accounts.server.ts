// Account and team operations: invitations, password resets, role changes. Each multi-row change
// runs in one transaction together with its audit event and any e-mail it sends (outbox).
import type PgBoss from "pg-boss";
import { Op, type Transaction } from "sequelize";
import { z } from "zod";
import { Invitation, Membership, Organisation, PasswordReset, User } from "../db/models/index.ts";
import { sequelize } from "./db.server.ts";
import { INVITATION_DAYS, RESET_MINUTES } from "../app/lib/account-links.ts";
import { normaliseRoles, ROLES, rolesInWords, type Role } from "../app/lib/roles.ts";
import { audit } from "./audit.server.ts";
import { checkPasswordLimited, hashPassword, NewPasswordSchema, notFound, verifyPassword } from "./auth.server.ts";
import { env } from "./env.server.ts";
import { logger } from "./logger.server.ts";
import { queueEmail } from "./mail.server.ts";
import { ensureQueue, getBoss } from "./queue.server.ts";
import { assertResetRequestAllowed, takeResetEmail } from "./rate-limit.server.ts";
import { endUserSessions } from "./session.server.ts";
import { hashToken, newToken } from "./tokens.server.ts";
import { TEXT_LIMITS } from "../app/lib/limits.ts";

export { INVITATION_DAYS, RESET_MINUTES };

/** A refusal meant for the person using the form: a field (or "_form") and the reason. */
export class AccountError extends Error {
  constructor(message: string, public field = "_form") {
    super(message);
    this.name = "AccountError";
  }
}

const EmailSchema = z
  .string({ error: "Enter an e-mail address, like name@example.org." })
  .max(TEXT_LIMITS.invitations.email, { error: `An e-mail address has at most ${TEXT_LIMITS.invitations.email} characters.` })
  .pipe(z.email({ error: "Enter an e-mail address, like name@example.org." }))
  .transform((e) => e.trim().toLowerCase());

/** One or more roles from a form's checkboxes (repeated `roles` fields, or one). Never empty. */
export const RoleSetSchema = z.preprocess(
  (v) => (v === undefined || v === null || v === "" ? [] : Array.isArray(v) ? v : [v]),
  z
    .array(z.enum(ROLES, { error: `Roles: choose from ${ROLES.join(", ")}.` }), { error: "Roles: choose at least one role." })
    .min(1, { error: "Roles: choose at least one role." })
    .transform((roles) => normaliseRoles(roles)),
);

export const InviteSchema = z.object({
  email: z.preprocess((v) => (typeof v === "string" ? v.trim() : v), EmailSchema),
  roles: RoleSetSchema,
});

export const NewAccountSchema = z
  .object({
    name: z.string({ error: "Enter your name." }).trim().min(1, { error: "Enter your name." }).max(200, { error: "Use at most 200 characters." }),
    password: NewPasswordSchema,
    confirm: z.string({ error: "Repeat the password." }),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "The two passwords differ." });

export const ResetSchema = z
  .object({ password: NewPasswordSchema, confirm: z.string({ error: "Repeat the password." }) })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "The two passwords differ." });

export const ChangePasswordSchema = z
  .object({
    current: z.string({ error: "Enter your current password." }).min(1, { error: "Enter your current password." }),
    password: NewPasswordSchema,
    confirm: z.string({ error: "Repeat the new password." }),
  })
  .refine((v) => v.password === v.confirm, { path: ["confirm"], error: "The two passwords differ." });

function link(path: string) {
  return new URL(path, env().APP_URL).toString();
}

// ---------- invitations ----------

export async function inviteMember(input: { organisation: Organisation; inviter: User; email: string; roles: Role[] }) {
  const { organisation, inviter, email } = input;
  const roles = normaliseRoles(input.roles);
  if (!roles.length) throw new AccountError("Roles: choose at least one role.", "roles");
  const as = rolesInWords(roles, { lower: true });
  const existing = await User.findOne({ where: { email } });
  if (existing && (await Membership.findOne({ where: { userId: existing.id, organisationId: organisation.id } }))) {
    throw new AccountError(`${email} is already a member of ${organisation.name}.`, "email");
  }
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86400_000);
  return sequelize.transaction(async (transaction) => {
    // A newer invitation replaces any pending one for the same address.
    await Invitation.update(
      { revokedAt: new Date() },
      { where: { organisationId: organisation.id, email, acceptedAt: null, revokedAt: null }, transaction },
    );
    const invitation = await Invitation.create(
      { organisationId: organisation.id, invitedById: inviter.id, email, roles, tokenHash: hash, expiresAt, acceptedAt: null, revokedAt: null },
      { transaction },
    );
    const url = link(`/invite/${token}`);
    await queueEmail(
      {
        to: email,
        subject: `You're invited to ${organisation.name} on Eonscale`,
        text: [
          `${inviter.name} has invited you to join ${organisation.name} on Eonscale as ${as}.`,
          "",
          `Accept the invitation and choose a password here (the link works once, for ${INVITATION_DAYS} days):`,
          url,
          "",
          "If you did not expect this, you can ignore this message.",
        ].join("\n"),
        html: `<p>${escapeHtml(inviter.name)} has invited you to join <strong>${escapeHtml(organisation.name)}</strong> on Eonscale as ${escapeHtml(as)}.</p><p><a href="${url}">Accept the invitation</a> (the link works once, for ${INVITATION_DAYS} days).</p><p>If you did not expect this, you can ignore this message.</p>`,
      },
      transaction,
    );
    await audit({ organisationId: organisation.id, actorId: inviter.id, action: "invitation.create", objectType: "invitation", objectId: invitation.id, details: { email, roles } }, transaction);
    return invitation;
  });
}

export type InvitationState =
  | { ok: true; invitation: Invitation; organisation: Organisation; existingUser: User | null }
  | { ok: false; message: string };

export async function checkInvitation(token: string, transaction?: Transaction): Promise<InvitationState> {
  const invitation = await Invitation.findOne({
    where: { tokenHash: hashToken(token) },
    include: [{ model: Organisation, as: "organisation", required: true }],
    transaction,
    lock: transaction ? { level: transaction.LOCK.UPDATE, of: Invitation } : undefined,
  });
  if (!invitation) return { ok: false, message: "This invitation link is not valid. Check that you copied the whole link, or ask for a new invitation." };
  if (invitation.acceptedAt) return { ok: false, message: "This invitation has already been used. Sign in with the account it created, or ask for a new invitation." };
  if (invitation.revokedAt) return { ok: false, message: "This invitation was withdrawn or replaced by a newer one. Use the most recent invitation e-mail, or ask for a new one." };
  if (invitation.expiresAt.getTime() <= Date.now()) return { ok: false, message: `This invitation expired on ${invitation.expiresAt.toUTCString()}. Ask the organisation's admin to invite you again.` };
  const existingUser = await User.findOne({ where: { email: invitation.email }, transaction });
  return { ok: true, invitation, organisation: invitation.organisation!, existingUser };
}

/**
 * Accept an invitation: a new user chooses name + password; an existing user confirms with their
 * password, under the same limits as signing in (the request names the client).
 */
export async function acceptInvitation(token: string, form: Record<string, unknown>, request: Request) {
  return sequelize.transaction(async (transaction) => {
    const state = await checkInvitation(token, transaction);
    if (!state.ok) throw new AccountError(state.message);
    const { invitation, organisation } = state;
    let user = state.existingUser;
    if (user) {
      const password = typeof form.password === "string" ? form.password : "";
      if (!(await checkPasswordLimited(request, user.email, password, user.passwordHash))) throw new AccountError("That is not the password of this account.", "password");
    } else {
      const parsed = NewAccountSchema.safeParse(form);
      if (!parsed.success) {
        const issue = parsed.error.issues[0];
        throw new AccountError(issue.message, String(issue.path[0] ?? "_form"));
      }
      user = await User.create({ email: invitation.email, name: parsed.data.name, passwordHash: await hashPassword(parsed.data.password), lastSignInAt: null }, { transaction });
    }
    await Membership.create({ userId: user.id, organisationId: organisation.id, roles: normaliseRoles(invitation.roles) }, { transaction });
    await invitation.update({ acceptedAt: new Date() }, { transaction });
    await audit({ organisationId: organisation.id, actorId: user.id, action: "invitation.accept", objectType: "invitation", objectId: invitation.id, details: { email: invitation.email, roles: invitation.roles } }, transaction);
    return { user, organisation };
  });
}

export async function revokeInvitation(organisation: Organisation, actor: User, invitationId: number) {
  return sequelize.transaction(async (transaction) => {
    const invitation = await Invitation.findOne({ where: { id: invitationId, organisationId: organisation.id, acceptedAt: null, revokedAt: null }, transaction });
    if (!invitation) notFound("That invitation is not pending in this organisation.");
    await invitation.update({ revokedAt: new Date() }, { transaction });
    await audit({ organisationId: organisation.id, actorId: actor.id, action: "invitation.revoke", objectType: "invitation", objectId: invitation.id, details: { email: invitation.email } }, transaction);
  });
}

export function pendingInvitations(organisationId: number) {
  return Invitation.findAll({
    where: { organisationId, acceptedAt: null, revokedAt: null, expiresAt: { [Op.gt]: new Date() } },
    include: [{ model: User, as: "invitedBy" }],
    order: [["createdAt", "DESC"]],
  });
}

// ---------- members ----------

/** The organisation's members with their role sets, oldest first (the team page). */
export async function listMembers(organisationId: number) {
  const rows = await Membership.findAll({ where: { organisationId }, include: [{ model: User, as: "user" }], order: [["createdAt", "ASC"]] });
  return rows.map((m) => ({
    id: m.id,
    name: m.user!.name,
    email: m.user!.email,
    roles: normaliseRoles(m.roles),
    since: m.createdAt.toISOString().slice(0, 10),
    lastSignIn: m.user!.lastSignInAt?.toISOString().slice(0, 10) ?? null,
  }));
}

/**
 * Serialises every change to an organisation's memberships: the organisation's row is locked
 * (SELECT … FOR UPDATE) for the rest of the transaction, so two admins demoting or removing each
 * other at the same moment run one after the other, and the second sees the first's result.
 */
async function lockOrganisation(organisationId: number, actor: User, transaction: Transaction) {
  await Organisation.findOne({ where: { id: organisationId }, attributes: ["id"], transaction, lock: transaction.LOCK.UPDATE });
  // The guard ran before the lock: an admin demoted meanwhile by another admin may no longer act.
  const still = await Membership.count({ where: { organisationId, userId: actor.id, roles: { [Op.contains]: ["admin"] } }, transaction });
  if (!still) throw new AccountError("You are no longer an admin of this organisation; nothing was changed.");
}

async function otherAdmins(organisationId: number, membershipId: number, transaction: Transaction) {
  return Membership.count({ where: { organisationId, id: { [Op.ne]: membershipId }, roles: { [Op.contains]: ["admin"] } }, transaction });
}

const LAST_ADMIN = "An organisation needs at least one admin. Make someone else admin first.";

/** Replace a member's role set (admin only; never leaves the organisation without an admin). */
export async function setRoles(organisation: Organisation, actor: User, membershipId: number, roles: Role[]) {
  const to = normaliseRoles(roles);
  if (!to.length) throw new AccountError("Roles: choose at least one role.", "roles");
  return sequelize.transaction(async (transaction) => {
    await lockOrganisation(organisation.id, actor, transaction);
    const m = await Membership.findOne({ where: { id: membershipId, organisationId: organisation.id }, transaction });
    if (!m) notFound("That person is not a member of this organisation.");
    const from = normaliseRoles(m.roles);
    if (from.join() === to.join()) return m;
    if (from.includes("admin") && !to.includes("admin") && (await otherAdmins(organisation.id, m.id, transaction)) === 0) {
      throw new AccountError(LAST_ADMIN, "roles");
    }
    await m.update({ roles: to }, { transaction });
    await audit({ organisationId: organisation.id, actorId: actor.id, action: "membership.roles", objectType: "membership", objectId: m.id, details: { from, to } }, transaction);
    return m;
  });
}

export async function removeMember(organisation: Organisation, actor: User, membershipId: number) {
  return sequelize.transaction(async (transaction) => {
    await lockOrganisation(organisation.id, actor, transaction);
    const m = await Membership.findOne({ where: { id: membershipId, organisationId: organisation.id }, transaction });
    if (!m) notFound("That person is not a member of this organisation.");
    if (m.roles.includes("admin") && (await otherAdmins(organisation.id, m.id, transaction)) === 0) {
      throw new AccountError("You cannot remove the last admin. Make someone else admin first.");
    }
    await m.destroy({ transaction });
    await audit({ organisationId: organisation.id, actorId: actor.id, action: "membership.remove", objectType: "membership", objectId: m.id, details: { userId: m.userId, roles: m.roles } }, transaction);
  });
}

// ---------- passwords ----------

export const RESET_QUEUE = "password-reset-request";

/** RESET_QUEUE (ensureQueue creates it once per server). */
function resetQueue(boss: PgBoss): Promise<void> {
  return ensureQueue(boss, RESET_QUEUE, { name: RESET_QUEUE, retryLimit: 5, retryDelay: 30, retryBackoff: true });
}

/**
 * The forgot-password form. Answers the same, after the same work, whether or not the address has
 * an account: the client's request limit (RESET_LIMITS.perClient, else RateLimitedError → 429) and
 * one job in the queue. Whether there is an account, and whether its reset e-mails for the hour are
 * used up, is decided by the job (`sendPasswordReset`), after the answer has gone.
 */
export async function requestPasswordReset(email: string, client: string) {
  await assertResetRequestAllowed(client);
  const boss = await getBoss();
  await resetQueue(boss);
  await boss.send(RESET_QUEUE, { email });
}

/** The worker of RESET_QUEUE (registered in server/workers.server.ts). */
export async function startResetWorker(boss: PgBoss) {
  await resetQueue(boss);
  return boss.work<{ email: string }>(RESET_QUEUE, { batchSize: 5, pollingIntervalSeconds: 2 }, async (jobs) => {
    for (const job of jobs) await sendPasswordReset(job.data.email, job.id);
  });
}

/**
 * One reset request: a link to the account's address, at most RESET_LIMITS.emailsPerAddress an
 * hour (more requests send nothing; the links already sent still work). Idempotent per job: a job
 * run twice (the queue delivers at least once) sends one link.
 */
export async function sendPasswordReset(email: string, jobId: string) {
  const user = await User.findOne({ where: { email } });
  if (!user) return;
  await sequelize.transaction(async (transaction) => {
    await sequelize.query(`SELECT pg_advisory_xact_lock(hashtext($1))`, { bind: [`reset:${jobId}`], transaction });
    const [done] = await sequelize.query(`SELECT 1 FROM audit_events WHERE action = 'password.reset-request' AND details->>'job' = $1`, { bind: [jobId], transaction });
    if (done.length) return;
    if (!(await takeResetEmail(email))) {
      logger.info({ userId: user.id }, "reset e-mail not sent: the hourly limit for this address is used up");
      return;
    }
    const { token, hash } = newToken();
    await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_MINUTES * 60_000), usedAt: null }, { transaction });
    const url = link(`/reset-password/${token}`);
    await queueEmail(
      {
        to: user.email,
        subject: "Reset your Eonscale password",
        text: `Someone asked to reset the password of your Eonscale account.\n\nChoose a new password here (the link works once, for ${RESET_MINUTES} minutes):\n${url}\n\nIf it was not you, ignore this message; your password stays as it is.`,
        html: `<p>Someone asked to reset the password of your Eonscale account.</p><p><a href="${url}">Choose a new password</a> (the link works once, for ${RESET_MINUTES} minutes).</p><p>If it was not you, ignore this message; your password stays as it is.</p>`,
      },
      transaction,
    );
    await audit({ actorId: user.id, action: "password.reset-request", objectType: "user", objectId: user.id, details: { job: jobId } }, transaction);
  });
}

export async function checkResetToken(token: string, transaction?: Transaction): Promise<{ ok: true; reset: PasswordReset } | { ok: false; message: string }> {
  const reset = await PasswordReset.findOne({ where: { tokenHash: hashToken(token) }, transaction, lock: transaction ? transaction.LOCK.UPDATE : undefined });
  if (!reset) return { ok: false, message: "This reset link is not valid. Check that you copied the whole link, or ask for a new one." };
  if (reset.usedAt) return { ok: false, message: "This reset link has already been used. Ask for a new one if you need to change your password again." };
  if (reset.expiresAt.getTime() <= Date.now()) return { ok: false, message: `This reset link expired ${RESET_MINUTES} minutes after it was sent. Ask for a new one.` };
  return { ok: true, reset };
}

export async function resetPassword(token: string, password: string) {
  return sequelize.transaction(async (transaction) => {
    const state = await checkResetToken(token, transaction);
    if (!state.ok) throw new AccountError(state.message);
    const user = await User.findByPk(state.reset.userId, { transaction });
    if (!user) throw new AccountError("This reset link is not valid.");
    await user.update({ passwordHash: await hashPassword(password) }, { transaction });
    await state.reset.update({ usedAt: new Date() }, { transaction });
    // Every other unused link of this account dies with this reset.
    await PasswordReset.update({ usedAt: new Date() }, { where: { userId: user.id, usedAt: null }, transaction });
    await audit({ actorId: user.id, action: "password.reset", objectType: "user", objectId: user.id }, transaction);
    await endUserSessions(user.id, undefined, transaction);
    return user;
  });
}

export async function changePassword(user: User, sessionId: string, current: string, password: string) {
  if (!(await verifyPassword(current, user.passwordHash))) throw new AccountError("That is not your current password.", "current");
  await sequelize.transaction(async (transaction) => {
    await user.update({ passwordHash: await hashPassword(password) }, { transaction });
    await audit({ actorId: user.id, action: "password.change", objectType: "user", objectId: user.id }, transaction);
    await endUserSessions(user.id, sessionId, transaction);
  });
}

function escapeHtml(s: string) {
  return s.replace(/[&<>"']/g, (c) => ({ "&": "&amp;", "<": "&lt;", ">": "&gt;", '"': "&quot;", "'": "&#39;" })[c]!);
}
