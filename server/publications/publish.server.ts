// Publishing an approved revision (designer or admin): in one transaction, the next publication
// number, sign numbers for markers published for the first time (retired numbers never reused), the
// complete snapshot (app/lib/publication), its RFC 8785 canonical JSON and SHA-256, the immutable
// publication row, the status, the audit event and the e-mails.
import { Op, type Transaction } from "sequelize";
import { decide } from "../../app/lib/permissions.ts";
import { buildSnapshot } from "../../app/lib/publication/build.ts";
import { canonicalJson } from "../../app/lib/publication/canonical.ts";
import { planSigns } from "../../app/lib/publication/signs.ts";
import type { PublicationMeta, PublicationSnapshot, SnapshotImage } from "../../app/lib/publication/types.ts";
import { failuresInWords } from "../../app/lib/review/checks.ts";
import { MarkerSign, Organisation, Publication, User } from "../../db/models/index.ts";
import { imagesForExhibit } from "../assets/usage.server.ts";
import { audit } from "../audit.server.ts";
import { listDecaySystems } from "../dated-events.server.ts";
import { sequelize } from "../db.server.ts";
import { env } from "../env.server.ts";
import { computeBundle, ExhibitError, howWeKnowFor, type ExhibitBundle } from "../exhibits/load.server.ts";
import { renderMarkdown } from "../markdown.server.ts";
import { checkExhibit } from "../review/checks.server.ts";
import { lockForTransition, mailEach, type ReviewActor } from "../review/lifecycle.server.ts";
import { editorsSincePublication, sha256Of } from "../review/revisions.server.ts";

async function decayPanels(bundle: ExhibitBundle) {
  const [{ byMarker }, systems] = await Promise.all([howWeKnowFor(bundle), listDecaySystems()]);
  const byId = new Map(systems.map((s) => [s.id, s]));
  const out = new Map<string, { system: string; sentence: string; citation: string }>();
  for (const row of bundle.markerRows) {
    const s = row.decaySystemId ? byId.get(row.decaySystemId) : undefined;
    const sentence = byMarker.get(String(row.id));
    if (s && sentence) out.set(String(row.id), { system: `${s.parent} → ${s.daughter}`, sentence, citation: s.citation });
  }
  return out;
}

async function snapshotImages(exhibitId: number): Promise<Map<string, SnapshotImage>> {
  const images = await imagesForExhibit(exhibitId);
  return new Map([...images].map(([markerId, i]) => [String(markerId), { assetId: i.assetId, alt: i.alt, credit: i.credit || null, sizes: i.sizes.map((s) => ({ width: s.width, format: s.format, url: s.url })) }]));
}

/** The snapshot of the exhibit as it is now, with the sign numbers planned for publication `number`. */
export async function snapshotFor(bundle: ExhibitBundle, number: number, transaction: Transaction) {
  const computed = computeBundle(bundle);
  if (!computed.ok) throw new ExhibitError(`Not published: the exhibit does not compute: ${computed.message}`);
  const exhibitId = bundle.exhibit.id;
  // One after another: these share the transaction's connection.
  const organisation = await Organisation.findByPk(bundle.exhibit.organisationId, { transaction });
  const signs = await MarkerSign.findAll({ where: { exhibitId }, order: [["number", "ASC"]], transaction, lock: transaction.LOCK.UPDATE });
  const previous = await Publication.findOne({ where: { exhibitId }, order: [["number", "DESC"]], attributes: ["snapshot"], transaction });
  const decay = await decayPanels(bundle);
  const images = await snapshotImages(exhibitId);
  const goneAges = new Map((previous?.snapshot.markers ?? []).map((m) => [m.id, m.ageMa]));
  const plan = planSigns(bundle.markers, signs.map((s) => ({ number: s.number, markerId: String(s.markerId), label: s.label, retiredAtPublication: s.retiredAtPublication, absorbedByNumber: s.absorbedByNumber })), number, goneAges);
  const snapshot: PublicationSnapshot = buildSnapshot({
    organisation: { slug: organisation!.slug, name: organisation!.name },
    exhibit: { slug: bundle.exhibit.slug, title: bundle.exhibit.title, revision: bundle.exhibit.revision },
    spec: bundle.spec,
    markers: bundle.markers,
    result: computed.result,
    edition: { slug: bundle.edition.slug, label: bundle.edition.label, source: bundle.edition.source ?? "", licence: bundle.edition.licence ?? "" },
    intervals: bundle.intervals,
    html: new Map(bundle.markers.map((m) => [m.id, renderMarkdown(m.text)])),
    decay,
    images,
    signs: plan.numbers,
    retiredSigns: plan.retiredSigns,
  });
  return { snapshot, plan };
}

/** Designer or admin: publish the approved revision. */
export async function publish(actor: ReviewActor, slug: string, revision: number) {
  const allowed = decide(actor.subject, "exhibit.publish");
  if (!allowed.ok) throw new ExhibitError(allowed.reason, "_form", 403);
  return sequelize.transaction(async (transaction) => {
    const exhibit = await lockForTransition(actor, slug, revision, "publish", transaction);
    if (exhibit.approvedRevision !== revision) throw new ExhibitError(`Revision ${revision} is not the approved one; submit it for review again.`, "_form", 409);
    const { bundle, report } = await checkExhibit(actor.organisationId, slug, transaction);
    if (!bundle || report.overall === "fail") throw new ExhibitError(`Not published: ${failuresInWords(report)}`);
    const last = await Publication.max<number, Publication>("number", { where: { exhibitId: exhibit.id }, transaction });
    const number = (last ?? 0) + 1;
    const editorIds = await editorsSincePublication(exhibit, transaction);
    const { snapshot, plan } = await snapshotFor(bundle, number, transaction);
    for (const s of plan.created) await MarkerSign.create({ exhibitId: exhibit.id, number: s.number, markerId: Number(s.markerId), label: s.label, firstPublication: number, retiredAtPublication: null, absorbedByNumber: null }, { transaction });
    for (const r of plan.retired) await MarkerSign.update({ retiredAtPublication: number, absorbedByNumber: r.absorbedByNumber }, { where: { exhibitId: exhibit.id, number: r.number }, transaction });
    const canonical = canonicalJson(snapshot);
    const hash = sha256Of(canonical);
    const approver = exhibit.approvedById ? await User.findByPk(exhibit.approvedById, { transaction }) : null;
    const publishedAt = new Date();
    const meta: PublicationMeta = { number, hash, publishedAt: publishedAt.toISOString(), approvedBy: approver?.name ?? null, edition: { slug: bundle.edition.slug, label: bundle.edition.label } };
    const publication = await Publication.create(
      { exhibitId: exhibit.id, number, revision, editionId: bundle.edition.id, approvedById: exhibit.approvedById, publishedById: actor.user.id, approvedAt: exhibit.approvedAt ?? publishedAt, publishedAt, meta, snapshot, snapshotCanonical: canonical, sha256: hash },
      { transaction },
    );
    await exhibit.update({ status: "published", statusChangedAt: publishedAt }, { transaction, silent: true });
    const people = await User.findAll({ where: { id: { [Op.in]: [...editorIds, ...(approver ? [approver.id] : [])] } }, transaction });
    const org = snapshot.organisation.slug;
    const mailed = await mailEach(people, actor.user.id, () => ({
      subject: `Published: ${exhibit.title}`,
      text: `${actor.user.name} published “${exhibit.title}” (publication ${number}, revision ${revision}, ${bundle.edition.label}). Visitors now see this publication.\n\nPublic JSON: ${env().APP_URL}/api/exhibits/${org}/${exhibit.slug}\nSHA-256: ${hash}`,
    }), transaction);
    await audit({ organisationId: actor.organisationId, actorId: actor.user.id, action: "exhibit.publish", objectType: "exhibit", objectId: exhibit.id, details: { slug, revision, number, hash, newSigns: plan.created.length, retiredSigns: plan.retired.length, mailed } }, transaction);
    return { publication, number, hash, newSigns: plan.created.length };
  });
}
