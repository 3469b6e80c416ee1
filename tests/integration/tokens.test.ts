// Invitation and password-reset links: single use, expiry, replacement — each refusal has a clear
// message and changes nothing.
import { describe, expect, it } from "vitest";
import * as invite from "../../app/routes/invite.tsx";
import * as resetRoute from "../../app/routes/reset-password.tsx";
import * as forgot from "../../app/routes/forgot-password.tsx";
import { Invitation, Membership, OutboxMessage, PasswordReset, Session, User } from "../../db/models/index.ts";
import { inviteMember, RESET_QUEUE, sendPasswordReset } from "../../server/accounts.server.ts";
import { getBoss } from "../../server/queue.server.ts";
import { RESET_LIMITS, SIGN_IN_LIMITS } from "../../server/rate-limit.server.ts";
import { verifyPassword } from "../../server/auth.server.ts";
import { hashToken, newToken } from "../../server/tokens.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle, TEST_PASSWORD, unique } from "../helpers/db.ts";

/** Runs the queued reset jobs here and now, as a worker would; returns how many ran. */
async function runResetJobs(): Promise<number> {
  const boss = await getBoss();
  let ran = 0;
  for (;;) {
    const jobs = await boss.fetch<{ email: string }>(RESET_QUEUE, { batchSize: 50 });
    if (!jobs.length) return ran;
    for (const job of jobs) await sendPasswordReset(job.data.email, job.id);
    await boss.complete(RESET_QUEUE, jobs.map((j) => j.id));
    ran += jobs.length;
  }
}

function tokenFromOutbox(text: string, path: string) {
  const match = text.match(new RegExp(`${path}/([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`no ${path} link in: ${text}`);
  return match[1];
}

async function setup() {
  const org = await createOrganisation();
  const { user: admin } = await createMember(org, "admin");
  return { org, admin };
}

/** A member of another organisation invited to a new one; the token from the e-mail. */
async function inviteExistingUser() {
  const { org, admin } = await setup();
  const other = await createOrganisation();
  const { user } = await createMember(other, "designer");
  await inviteMember({ organisation: org, inviter: admin, email: user.email, roles: ["reviewer"] });
  const token = tokenFromOutbox((await OutboxMessage.findOne({ where: { to: user.email }, order: [["id", "DESC"]] }))!.text, "/invite");
  return { user, token };
}

describe("invitations", () => {
  it("queues the e-mail with the invitation in one transaction, and the link creates the account once", async () => {
    const { org, admin } = await setup();
    const email = `${unique("new")}@example.org`;
    const invitation = await inviteMember({ organisation: org, inviter: admin, email, roles: ["reviewer", "designer"] });
    const mail = await OutboxMessage.findOne({ where: { to: email } });
    expect(mail?.subject).toContain(org.name);
    expect(mail?.text).toContain("as designer and reviewer.");
    const token = tokenFromOutbox(mail!.text, "/invite");
    expect(hashToken(token)).toBe(invitation.tokenHash);

    const shown = await settle(() => invite.loader(routeArgs(getRequest(`/invite/${token}`), { token })));
    expect(shown.body).toMatchObject({ valid: true, email, roles: ["designer", "reviewer"], organisation: org.name, hasAccount: false });

    const accepted = await settle(() => invite.action(routeArgs(formRequest(`/invite/${token}`, { name: "New Reviewer", password: "a-long-password", confirm: "a-long-password" }), { token })));
    expect(accepted.status).toBe(302);
    expect(accepted.headers.get("Set-Cookie")).toMatch(/^en_session=/);
    const user = await User.findOne({ where: { email } });
    expect(await Membership.findOne({ where: { userId: user!.id, organisationId: org.id } })).toMatchObject({ roles: ["designer", "reviewer"] });

    // Reused: refused with a clear message, nothing changes.
    const again = await settle(() => invite.action(routeArgs(formRequest(`/invite/${token}`, { name: "Someone Else", password: "another-password", confirm: "another-password" }), { token })));
    expect(again.status).toBe(400);
    expect((again.body as { error: string }).error).toMatch(/already been used/);
    await user!.reload();
    expect(user!.name).toBe("New Reviewer");
    expect(await Membership.count({ where: { userId: user!.id } })).toBe(1);
  });

  it("refuses an expired invitation and creates no user", async () => {
    const { org, admin } = await setup();
    const email = `${unique("late")}@example.org`;
    const invitation = await inviteMember({ organisation: org, inviter: admin, email, roles: ["designer"] });
    const token = tokenFromOutbox((await OutboxMessage.findOne({ where: { to: email } }))!.text, "/invite");
    await invitation.update({ expiresAt: new Date(Date.now() - 1000) });
    const shown = await settle(() => invite.loader(routeArgs(getRequest(`/invite/${token}`), { token })));
    expect((shown.body as { message: string }).message).toMatch(/expired/);
    const res = await settle(() => invite.action(routeArgs(formRequest(`/invite/${token}`, { name: "Late", password: "a-long-password", confirm: "a-long-password" }), { token })));
    expect(res.status).toBe(400);
    expect((res.body as { error: string }).error).toMatch(/expired/);
    expect(await User.count({ where: { email } })).toBe(0);
  });

  it("a newer invitation replaces the older one", async () => {
    const { org, admin } = await setup();
    const email = `${unique("twice")}@example.org`;
    await inviteMember({ organisation: org, inviter: admin, email, roles: ["designer"] });
    const first = tokenFromOutbox((await OutboxMessage.findOne({ where: { to: email }, order: [["id", "ASC"]] }))!.text, "/invite");
    await inviteMember({ organisation: org, inviter: admin, email, roles: ["editor"] });
    const res = await settle(() => invite.loader(routeArgs(getRequest(`/invite/${first}`), { token: first })));
    expect((res.body as { message: string }).message).toMatch(/withdrawn or replaced/);
    expect(await Invitation.count({ where: { email, acceptedAt: null, revokedAt: null } })).toBe(1);
  });

  it("validates the invitee's form field by field and saves nothing", async () => {
    const { org, admin } = await setup();
    const email = `${unique("form")}@example.org`;
    await inviteMember({ organisation: org, inviter: admin, email, roles: ["designer"] });
    const token = tokenFromOutbox((await OutboxMessage.findOne({ where: { to: email } }))!.text, "/invite");
    const short = await settle(() => invite.action(routeArgs(formRequest(`/invite/${token}`, { name: "X", password: "short", confirm: "short" }), { token })));
    expect(short.body).toMatchObject({ field: "password", error: "Use at least 10 characters." });
    const differ = await settle(() => invite.action(routeArgs(formRequest(`/invite/${token}`, { name: "X", password: "long-enough-1", confirm: "long-enough-2" }), { token })));
    expect(differ.body).toMatchObject({ field: "confirm" });
    expect(await User.count({ where: { email } })).toBe(0);
    expect(await Invitation.count({ where: { email, acceptedAt: null } })).toBe(1);
  });

  it("an existing user joins a second organisation by confirming their password", async () => {
    const { user, token } = await inviteExistingUser();
    const wrong = await settle(() => invite.action(routeArgs(formRequest(`/invite/${token}`, { password: "not-it-at-all" }), { token })));
    expect(wrong.body).toMatchObject({ field: "password" });
    const ok = await settle(() => invite.action(routeArgs(formRequest(`/invite/${token}`, { password: TEST_PASSWORD }), { token })));
    expect(ok.status).toBe(302);
    expect(await Membership.count({ where: { userId: user.id } })).toBe(2);
  });

  it("refuses to invite someone who is already a member", async () => {
    const { org, admin } = await setup();
    const { user } = await createMember(org, "designer");
    await expect(inviteMember({ organisation: org, inviter: admin, email: user.email, roles: ["editor"] })).rejects.toThrow(/already a member/);
    expect(await Invitation.count({ where: { email: user.email } })).toBe(0);
  });
});

describe("password reset", () => {
  it("answers the same for unknown and known addresses, and queues mail only for a real account", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const ghost = `${unique("ghost")}@example.org`;
    const a = await settle(() => forgot.action(routeArgs(formRequest("/forgot-password", { email: user.email }))));
    const b = await settle(() => forgot.action(routeArgs(formRequest("/forgot-password", { email: ghost }))));
    expect(a.body).toEqual(b.body);
    expect(await runResetJobs()).toBe(2);
    expect(await OutboxMessage.count({ where: { to: user.email } })).toBe(1);
    expect(await OutboxMessage.count({ where: { to: ghost } })).toBe(0);
  });

  it("sets the new password once, ends other sessions, and refuses reuse", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const oldCookie = await cookieFor(user.id);
    await sendPasswordReset(user.email, unique("job"));
    const token = tokenFromOutbox((await OutboxMessage.findOne({ where: { to: user.email } }))!.text, "/reset-password");
    const res = await settle(() => resetRoute.action(routeArgs(formRequest(`/reset-password/${token}`, { password: "brand-new-password", confirm: "brand-new-password" }), { token })));
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe("/login?reset=1");
    await user.reload();
    expect(await verifyPassword("brand-new-password", user.passwordHash)).toBe(true);
    expect(await Session.count({ where: { userId: user.id } })).toBe(0);
    expect(oldCookie).toBeTruthy();

    const reused = await settle(() => resetRoute.action(routeArgs(formRequest(`/reset-password/${token}`, { password: "third-password-x", confirm: "third-password-x" }), { token })));
    expect(reused.status).toBe(400);
    expect((reused.body as { error: string }).error).toMatch(/already been used/);
    await user.reload();
    expect(await verifyPassword("brand-new-password", user.passwordHash)).toBe(true);
  });

  it("refuses an expired or unknown link and leaves the password alone", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const { token, hash } = newToken();
    await PasswordReset.create({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() - 60_000), usedAt: null });
    const shown = await settle(() => resetRoute.loader(routeArgs(getRequest(`/reset-password/${token}`), { token })));
    expect(shown.body).toMatchObject({ valid: false });
    expect((shown.body as { message: string }).message).toMatch(/expired/);
    const res = await settle(() => resetRoute.action(routeArgs(formRequest(`/reset-password/${token}`, { password: "brand-new-password", confirm: "brand-new-password" }), { token })));
    expect((res.body as { error: string }).error).toMatch(/expired/);
    const unknown = await settle(() => resetRoute.loader(routeArgs(getRequest(`/reset-password/nope`), { token: "nope" })));
    expect((unknown.body as { message: string }).message).toMatch(/not valid/);
    await user.reload();
    expect(await verifyPassword(TEST_PASSWORD, user.passwordHash)).toBe(true);
  });
});

describe("limits on reset requests and invitation passwords", () => {
  it("reset requests: the same work for every address (one queued job), e-mails capped per address, 429 with Retry-After per client", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const ghost = `${unique("ghost")}@example.org`;
    const ip = unique("192.0.2");
    const ask = (email: string) => settle(() => forgot.action(routeArgs(formRequest("/forgot-password", { email }, { ip }))));
    // Known and unknown addresses: the same answer after the same work (one job each, nothing else written).
    const counts = async () => ({ resets: await PasswordReset.count(), mails: await OutboxMessage.count() });
    const before = await counts();
    const known = await ask(user.email);
    const unknown = await ask(ghost);
    expect(known).toEqual(unknown);
    expect(await counts()).toEqual(before);
    expect(await runResetJobs()).toBe(2);
    expect(await OutboxMessage.count({ where: { to: user.email } })).toBe(1);
    // Fifteen requests for one address send RESET_LIMITS.emailsPerAddress e-mails, not fifteen.
    for (let i = 1; i < 15; i++) {
      const res = await settle(() => forgot.action(routeArgs(formRequest("/forgot-password", { email: user.email }, { ip: unique("198.51.100") }))));
      expect(res.body).toEqual(known.body);
    }
    await runResetJobs();
    expect(await OutboxMessage.count({ where: { to: user.email } })).toBe(RESET_LIMITS.emailsPerAddress);
    // One client asking too often is told to wait, with Retry-After.
    let last = known;
    for (let i = 2; i <= RESET_LIMITS.perClient + 1; i++) last = await ask(`${unique("many")}@example.org`);
    expect(last.status).toBe(429);
    expect(Number(last.headers.get("Retry-After"))).toBeGreaterThan(0);
    expect((last.body as { error: string }).error).toMatch(/Too many reset requests/);
  });

  it("a reset job run twice sends one link", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    const job = unique("job");
    await Promise.all([sendPasswordReset(user.email, job), sendPasswordReset(user.email, job)]);
    await sendPasswordReset(user.email, job);
    expect(await OutboxMessage.count({ where: { to: user.email } })).toBe(1);
    expect(await PasswordReset.count({ where: { userId: user.id } })).toBe(1);
  });

  it("when any reset succeeds, the account's older unused links die", async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "designer");
    for (const job of [unique("job"), unique("job")]) await sendPasswordReset(user.email, job);
    const mails = await OutboxMessage.findAll({ where: { to: user.email }, order: [["id", "ASC"]] });
    const [older, newer] = mails.map((m) => tokenFromOutbox(m.text, "/reset-password"));
    const reset = (token: string, password: string) => settle(() => resetRoute.action(routeArgs(formRequest(`/reset-password/${token}`, { password, confirm: password }), { token })));
    expect((await reset(newer, "newest-password-1")).status).toBe(302);
    const stale = await reset(older, "older-link-password");
    expect(stale.status).toBe(400);
    expect((stale.body as { error: string }).error).toMatch(/already been used/);
    await user.reload();
    expect(await verifyPassword("newest-password-1", user.passwordHash)).toBe(true);
  });

  it("confirming an invitation with an existing account's password is limited like signing in (429, Retry-After, nothing joined)", async () => {
    const { user, token } = await inviteExistingUser();
    const ip = unique("192.0.2");
    const accept = (password: string) => settle(() => invite.action(routeArgs(formRequest(`/invite/${token}`, { password }, { ip }), { token })));
    for (let i = 0; i < SIGN_IN_LIMITS.freeFailures + 1; i++) expect((await accept(`guess-${i}`)).body).toMatchObject({ field: "password" });
    const limited = await accept(TEST_PASSWORD);
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("Retry-After"))).toBeGreaterThan(0);
    expect(await Membership.count({ where: { userId: user.id } })).toBe(1);
    expect(await Invitation.count({ where: { email: user.email, acceptedAt: null, revokedAt: null } })).toBe(1);
  });
});
