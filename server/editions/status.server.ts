// Status changes of chart editions, each in one transaction with its audit event:
//  - a chart steward makes a shared edition the latest (the previous latest is retired); the
//    organisations that had not chosen an edition stay on the one they were using;
//  - an organisation's editor or admin chooses the organisation's current edition (a released
//    shared edition, or one of its own, which is then released for the organisation);
//  - retire or discard a draft (stewards: shared drafts; editors and admins: their own).
// Another organisation's editions are invisible (404); shared editions refuse organisations (403).
import type { Transaction } from "sequelize";
import { ChartEdition, Organisation } from "../../db/models/index.ts";
import { decide, type Subject } from "../../app/lib/permissions.ts";
import { check } from "../../app/lib/timescale/index.ts";
import { audit } from "../audit.server.ts";
import { sequelize } from "../db.server.ts";
import { editionIntervals, EditionError } from "./reads.server.ts";
import { isVisible } from "./viewer.server.ts";

export interface EditionActor {
  id: number;
  subject: Subject;
}

/** Serialises status changes so two people cannot make two editions current for one owner at once. */
async function lockEditions(transaction: Transaction) {
  await sequelize.query(`SELECT pg_advisory_xact_lock(hashtext('eonscale:chart-editions:status'))`, { transaction });
}

const missing = (slug: string) => new EditionError(`There is no chart edition "${slug}".`, "_form", 404);

/** The edition, locked, if the actor may see it (else 404) and may change it (else 403). */
async function editionToChange(slug: string, actor: EditionActor, transaction: Transaction): Promise<ChartEdition> {
  const edition = await ChartEdition.findOne({ where: { slug }, transaction, lock: transaction.LOCK.UPDATE });
  const scope = { organisationId: actor.subject.organisationId ?? null, steward: actor.subject.steward, ownDrafts: true };
  if (!edition || !isVisible(edition, scope)) throw missing(slug);
  const owner = edition.organisationId;
  const decision = decide(actor.subject, owner === null ? "edition.manage-shared" : "edition.import", { editionOwnerId: owner });
  if (!decision.ok) throw new EditionError(decision.reason, "_form", 403);
  return edition;
}

async function assertPassesChecks(edition: ChartEdition, transaction: Transaction, what: string) {
  const problems = check(await editionIntervals(edition.id, transaction));
  if (problems.length) {
    throw new EditionError(`${edition.label} cannot be ${what}: its intervals fail ${problems.length} check${problems.length === 1 ? "" : "s"} (first: ${problems[0].interval} — ${problems[0].message}).`);
  }
}

/**
 * Steward: make a shared edition the latest. The previous latest is retired in the same transaction;
 * organisations that never chose an edition are kept on the previous latest (a museum adopts a new
 * edition when its reviewers are ready). Audited without an organisation (the shared log).
 */
export async function makeLatest(slug: string, actor: EditionActor) {
  return sequelize.transaction(async (transaction) => {
    await lockEditions(transaction);
    const edition = await editionToChange(slug, actor, transaction);
    if (edition.organisationId !== null) throw new EditionError(`${edition.label} is an organisation's own edition; only shared editions can be the latest.`);
    if (edition.status === "current") throw new EditionError(`${edition.label} is already the latest shared edition.`);
    await assertPassesChecks(edition, transaction, "made the latest edition");
    const now = new Date();
    const previous = await ChartEdition.findOne({ where: { organisationId: null, status: "current" }, transaction, lock: transaction.LOCK.UPDATE });
    let kept = 0;
    if (previous) {
      await previous.update({ status: "retired", retiredAt: now }, { transaction });
      [kept] = await Organisation.update({ currentEditionId: previous.id }, { where: { currentEditionId: null }, transaction });
    }
    const from = edition.status;
    await edition.update({ status: "current", madeCurrentAt: now, madeCurrentById: actor.id, retiredAt: null }, { transaction });
    await audit(
      {
        organisationId: null,
        actorId: actor.id,
        action: "edition.make-latest",
        objectType: "chart_edition",
        objectId: edition.id,
        details: { slug: edition.slug, from, previous: previous ? { slug: previous.slug, id: previous.id } : null, organisationsKeptOnPrevious: kept },
      },
      transaction,
    );
    return { edition, previous };
  });
}

/**
 * An organisation's editor or admin: make an edition current for the organisation. It may be a
 * released shared edition or one of the organisation's own editions (a draft of its own is checked
 * and released). The organisation's own edition it replaces, if any, is retired. Audited under the
 * organisation.
 */
export async function setOrganisationCurrent(slug: string, actor: EditionActor, organisationId: number) {
  const allowed = decide(actor.subject, "edition.set-current");
  if (!allowed.ok || actor.subject.organisationId !== organisationId) throw new EditionError(allowed.ok ? "Choose the current edition of your own organisation." : allowed.reason, "_form", 403);
  return sequelize.transaction(async (transaction) => {
    await lockEditions(transaction);
    const org = await Organisation.findByPk(organisationId, { transaction, lock: transaction.LOCK.UPDATE });
    if (!org) throw new EditionError("That organisation does not exist.", "_form", 404);
    const edition = await ChartEdition.findOne({ where: { slug }, transaction, lock: transaction.LOCK.UPDATE });
    if (!edition || !isVisible(edition, { organisationId, steward: false, ownDrafts: true })) throw missing(slug);
    const previousId = org.currentEditionId ?? (await ChartEdition.findOne({ where: { organisationId: null, status: "current" }, transaction }))?.id ?? null;
    if (previousId === edition.id) throw new EditionError(`${edition.label} is already the current edition of ${org.name}.`);
    const previous = previousId === null ? null : await ChartEdition.findByPk(previousId, { transaction, lock: transaction.LOCK.UPDATE });
    const now = new Date();
    if (edition.organisationId !== null) {
      await assertPassesChecks(edition, transaction, "made current");
      await edition.update({ status: "current", madeCurrentAt: now, madeCurrentById: actor.id, retiredAt: null }, { transaction });
    }
    if (previous && previous.organisationId !== null) await previous.update({ status: "retired", retiredAt: now }, { transaction });
    await org.update({ currentEditionId: edition.id }, { transaction });
    await audit(
      {
        organisationId,
        actorId: actor.id,
        action: "edition.set-current",
        objectType: "chart_edition",
        objectId: edition.id,
        details: { slug: edition.slug, label: edition.label, shared: edition.organisationId === null, previous: previous ? { slug: previous.slug, id: previous.id } : null },
      },
      transaction,
    );
    return { edition, previous };
  });
}

/** Retire a draft (kept, readable, never current). A current edition is retired only by replacing it. */
export async function retireEdition(slug: string, actor: EditionActor) {
  return sequelize.transaction(async (transaction) => {
    await lockEditions(transaction);
    const edition = await editionToChange(slug, actor, transaction);
    if (edition.status === "current") {
      throw new EditionError(`${edition.label} is ${edition.organisationId === null ? "the latest shared edition. Make another shared edition the latest" : "your organisation's current edition. Make another edition current"} instead; this one is then retired.`);
    }
    if (edition.status === "retired") throw new EditionError(`${edition.label} is already retired.`);
    await edition.update({ status: "retired", retiredAt: new Date() }, { transaction });
    await audit(
      { organisationId: edition.organisationId, actorId: actor.id, action: "edition.retire", objectType: "chart_edition", objectId: edition.id, details: { slug: edition.slug, from: "draft" } },
      transaction,
    );
    return edition;
  });
}

/** Delete a draft and its intervals (only drafts: a released edition may be pinned by exhibits). */
export async function discardDraft(slug: string, actor: EditionActor) {
  return sequelize.transaction(async (transaction) => {
    await lockEditions(transaction);
    const edition = await editionToChange(slug, actor, transaction);
    if (edition.status !== "draft") throw new EditionError(`Only drafts can be discarded; ${edition.label} is ${edition.status}.`);
    await audit(
      { organisationId: edition.organisationId, actorId: actor.id, action: "edition.discard", objectType: "chart_edition", objectId: edition.id, details: { slug: edition.slug, label: edition.label } },
      transaction,
    );
    await edition.destroy({ transaction });
    return edition;
  });
}
