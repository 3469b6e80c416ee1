// The review transitions: submit for review (designer), approve and request changes (reviewer,
// four-eyes). Each is revision-checked (a form based on an older revision gets 409 and changes
// nothing), runs in one transaction with its audit event and its e-mails (the outbox), and
// recomputes the checks on the server. Publishing is server/publications/publish.server.ts.
import { data } from "react-router";
import type { Transaction } from "sequelize";
import { decide, type Subject } from "../../app/lib/permissions.ts";
import { failuresInWords } from "../../app/lib/review/checks.ts";
import { transitionRefusal, type ExhibitStatus, type Transition } from "../../app/lib/review/lifecycle.ts";
import type { CheckReport } from "../../app/lib/review/types.ts";
import { normaliseRoles } from "../../app/lib/roles.ts";
import { Exhibit, ExhibitComment, ExhibitReview, Membership, User } from "../../db/models/index.ts";
import { audit } from "../audit.server.ts";
import { sequelize } from "../db.server.ts";
import { env } from "../env.server.ts";
import { EXHIBIT_NOT_FOUND, ExhibitError } from "../exhibits/load.server.ts";
import { RevisionConflictError } from "../exhibits/revise.server.ts";
import { queueEmail } from "../mail.server.ts";
import { checkExhibit } from "./checks.server.ts";
import { editorsSincePublication } from "./revisions.server.ts";

export interface ReviewActor {
  organisationId: number;
  user: User;
  subject: Subject;
}

/** The composer's actor as the transitions need it (with the permission subject). */
export function reviewActorOf(actor: { organisationId: number; user: User; subject?: Subject }): ReviewActor {
  if (!actor.subject) throw new Error("review transitions need the member's permission subject");
  return { organisationId: actor.organisationId, user: actor.user, subject: actor.subject };
}

/** The exhibit locked for the transition, at the revision the form was based on, in a status the transition may start from. */
export async function lockForTransition(actor: ReviewActor, slug: string, revision: number, transition: Transition, transaction: Transaction): Promise<Exhibit> {
  const exhibit = await Exhibit.findOne({ where: { organisationId: actor.organisationId, slug }, lock: transaction.LOCK.UPDATE, transaction });
  if (!exhibit) throw data({ message: EXHIBIT_NOT_FOUND }, { status: 404 });
  if (exhibit.revision !== revision) {
    const by = exhibit.updatedById ? await User.findByPk(exhibit.updatedById, { transaction }) : null;
    throw new RevisionConflictError(exhibit.revision, by?.name ?? null, exhibit.updatedAt);
  }
  const refusal = transitionRefusal(transition, exhibit.status);
  if (refusal) throw new ExhibitError(refusal, "_form", 409);
  return exhibit;
}

export function reviewUrl(slug: string) {
  return `${env().APP_URL}/studio/exhibits/${slug}/review`;
}

/** Members of the organisation holding a role (their user rows). */
export async function membersWithRole(organisationId: number, role: "reviewer" | "designer", transaction?: Transaction): Promise<User[]> {
  const rows = await Membership.findAll({ where: { organisationId }, include: [{ model: User, as: "user" }], transaction });
  return rows.filter((m) => normaliseRoles(m.roles).includes(role) && m.user).map((m) => m.user!);
}

/** One e-mail per address (skipping the person who acted), queued in the transaction. */
export async function mailEach(people: readonly User[], except: number, message: (u: User) => { subject: string; text: string }, transaction: Transaction): Promise<string[]> {
  const sent: string[] = [];
  const seen = new Set<string>();
  for (const u of people) {
    if (u.id === except || seen.has(u.email)) continue;
    seen.add(u.email);
    await queueEmail({ to: u.email, ...message(u) }, transaction);
    sent.push(u.email);
  }
  return sent;
}

async function setStatus(exhibit: Exhibit, status: ExhibitStatus, extra: Partial<Pick<Exhibit, "approvedRevision" | "approvedById" | "approvedAt">>, transaction: Transaction) {
  await exhibit.update({ status, statusChangedAt: new Date(), ...extra }, { transaction, silent: true });
}

function refuseOnFailures(report: CheckReport, what: string) {
  if (report.overall === "fail") {
    throw new ExhibitError(`Not ${what}: ${report.counts.fail} check${report.counts.fail === 1 ? "" : "s"} fail${report.counts.fail === 1 ? "s" : ""}. ${failuresInWords(report)}`, "_form", 400);
  }
}

const auditTransition = (actor: ReviewActor, exhibit: Exhibit, transition: Transition, details: Record<string, unknown>, transaction: Transaction) =>
  audit({ organisationId: actor.organisationId, actorId: actor.user.id, action: `exhibit.${transition}`, objectType: "exhibit", objectId: exhibit.id, details: { slug: exhibit.slug, revision: exhibit.revision, ...details } }, transaction);

/** Designer: submit the revision for review. Refused while a check fails; e-mails every other reviewer of the organisation. */
export async function submitForReview(actor: ReviewActor, slug: string, revision: number) {
  return sequelize.transaction(async (transaction) => {
    const exhibit = await lockForTransition(actor, slug, revision, "submit-for-review", transaction);
    const { report } = await checkExhibit(actor.organisationId, slug, transaction);
    refuseOnFailures(report, "submitted");
    const from = exhibit.status;
    await setStatus(exhibit, "in_review", {}, transaction);
    const reviewers = await membersWithRole(actor.organisationId, "reviewer", transaction);
    const mailed = await mailEach(reviewers, actor.user.id, () => ({
      subject: `Review requested: ${exhibit.title}`,
      text: `${actor.user.name} submitted “${exhibit.title}” (revision ${exhibit.revision}) for review.\n\nChecks: ${report.counts.pass} pass, ${report.counts.warning} warning${report.counts.warning === 1 ? "" : "s"}, ${report.counts.fail} fail.\n\nReview it here: ${reviewUrl(slug)}\n\nYou cannot approve it if you edited it since its last publication (four-eyes rule).`,
    }), transaction);
    await auditTransition(actor, exhibit, "submit-for-review", { from, warnings: report.counts.warning, mailed }, transaction);
    return { report, mailed };
  });
}

/** The decision's e-mail to everyone who edited the revision. */
async function mailEditors(exhibit: Exhibit, actor: ReviewActor, subject: string, body: string, transaction: Transaction) {
  const ids = await editorsSincePublication(exhibit, transaction);
  const editors = ids.length ? await User.findAll({ where: { id: ids }, transaction }) : [];
  return mailEach(editors, actor.user.id, () => ({ subject, text: body }), transaction);
}

/**
 * Reviewer: approve the revision. The four-eyes rule: nobody approves a revision whose changes since
 * the last publication include one of their own edits (403 naming the rule). Refused while a check fails.
 */
export async function approve(actor: ReviewActor, slug: string, revision: number, comment: string) {
  return sequelize.transaction(async (transaction) => {
    const exhibit = await lockForTransition(actor, slug, revision, "approve", transaction);
    const editorIds = await editorsSincePublication(exhibit, transaction);
    const decision = decide(actor.subject, "exhibit.approve", { editorIds });
    if (!decision.ok) throw new ExhibitError(decision.reason, "_form", 403);
    const { report } = await checkExhibit(actor.organisationId, slug, transaction);
    refuseOnFailures(report, "approved");
    await ExhibitReview.create({ exhibitId: exhibit.id, revision, reviewerId: actor.user.id, decision: "approved", comment, checks: report }, { transaction });
    if (comment) await ExhibitComment.create({ exhibitId: exhibit.id, markerId: null, markerLabel: null, parentId: null, authorId: actor.user.id, body: comment, revision }, { transaction });
    await setStatus(exhibit, "approved", { approvedRevision: revision, approvedById: actor.user.id, approvedAt: new Date() }, transaction);
    const mailed = await mailEditors(exhibit, actor, `Approved: ${exhibit.title}`, `${actor.user.name} approved revision ${revision} of “${exhibit.title}”.${comment ? `\n\n“${comment}”` : ""}\n\nA designer or an admin may now publish it from the exhibit page: ${env().APP_URL}/studio/exhibits/${slug}`, transaction);
    await auditTransition(actor, exhibit, "approve", { editorIds, mailed }, transaction);
    return { report, mailed };
  });
}

/** Reviewer: send the revision back with a comment (required). */
export async function requestChanges(actor: ReviewActor, slug: string, revision: number, comment: string) {
  return sequelize.transaction(async (transaction) => {
    const exhibit = await lockForTransition(actor, slug, revision, "request-changes", transaction);
    const { report } = await checkExhibit(actor.organisationId, slug, transaction);
    await ExhibitReview.create({ exhibitId: exhibit.id, revision, reviewerId: actor.user.id, decision: "changes_requested", comment, checks: report }, { transaction });
    await ExhibitComment.create({ exhibitId: exhibit.id, markerId: null, markerLabel: null, parentId: null, authorId: actor.user.id, body: comment, revision }, { transaction });
    await setStatus(exhibit, "changes_requested", {}, transaction);
    const mailed = await mailEditors(exhibit, actor, `Changes requested: ${exhibit.title}`, `${actor.user.name} asked for changes to revision ${revision} of “${exhibit.title}”:\n\n“${comment}”\n\nSee every comment here: ${reviewUrl(slug)}`, transaction);
    await auditTransition(actor, exhibit, "request-changes", { mailed }, transaction);
    return { report, mailed };
  });
}
