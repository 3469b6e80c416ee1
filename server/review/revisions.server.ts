// Every revision of an exhibit is kept: who made it, with which change, and a JSONB copy of the
// whole exhibit (route geometries kept once, by SHA-256). Written by the one change path
// (reviseExhibit) in the change's own transaction, together with the lifecycle rule: an edit of an
// exhibit in review, approved or published returns it to draft (the approval is void; the live
// publication stays).
import { createHash } from "node:crypto";
import { Op, type Transaction } from "sequelize";
import { revisionContent } from "../../app/lib/review/content.ts";
import { statusAfterEdit } from "../../app/lib/review/lifecycle.ts";
import type { RevisionContent } from "../../app/lib/review/types.ts";
import { ExhibitRevision, Publication, User } from "../../db/models/index.ts";
import { sequelize } from "../db.server.ts";
import type { ExhibitBundle } from "../exhibits/load.server.ts";

/** SHA-256 (hex) of a JSON value's text. */
export function sha256Of(text: string): string {
  return createHash("sha256").update(text).digest("hex");
}

async function keepGeometry(bundle: ExhibitBundle, transaction: Transaction): Promise<string | null> {
  const geometry = bundle.medium.kind === "route" ? bundle.medium.geometry : null;
  if (!geometry) return null;
  const text = JSON.stringify(geometry);
  const hash = sha256Of(text);
  await sequelize.query(`INSERT INTO exhibit_route_geometries (sha256, geometry, created_at) VALUES ($1, $2::jsonb, now()) ON CONFLICT (sha256) DO NOTHING`, { bind: [hash, text], transaction });
  return hash;
}

export async function contentOf(bundle: ExhibitBundle, transaction: Transaction): Promise<RevisionContent> {
  const e = bundle.exhibit;
  return revisionContent({
    title: e.title,
    slug: e.slug,
    edition: { id: bundle.edition.id, slug: bundle.edition.slug, label: bundle.edition.label },
    spec: bundle.spec,
    markers: bundle.markers,
    decaySystems: new Map(bundle.markerRows.map((r) => [String(r.id), r.decaySystemId])),
    medium: { vertexCount: bundle.medium.routeVertexCount, geometrySha256: await keepGeometry(bundle, transaction) },
  });
}

/** Stores the exhibit as it is now as revision `bundle.exhibit.revision`. */
export async function recordRevision(bundle: ExhibitBundle, authorId: number | null, action: string, transaction: Transaction) {
  const content = await contentOf(bundle, transaction);
  await ExhibitRevision.create({ exhibitId: bundle.exhibit.id, revision: bundle.exhibit.revision, authorId, action, content }, { transaction });
}

/**
 * After an edit (called by reviseExhibit with the exhibit as changed): keeps the revision and applies
 * the lifecycle rule. Returns the status before and after.
 */
export async function recordEdit(bundle: ExhibitBundle, authorId: number, action: string, transaction: Transaction) {
  await recordRevision(bundle, authorId, action, transaction);
  const before = bundle.exhibit.status;
  const after = statusAfterEdit(before);
  if (after !== before || bundle.exhibit.approvedRevision !== null) {
    await bundle.exhibit.update({ status: after, approvedRevision: null, approvedById: null, approvedAt: null, statusChangedAt: after !== before ? new Date() : bundle.exhibit.statusChangedAt }, { transaction, silent: true });
  }
  return { before, after };
}

/** The revision of the latest publication (0 when never published). */
export async function lastPublishedRevision(exhibitId: number, transaction?: Transaction): Promise<number> {
  const latest = await Publication.findOne({ where: { exhibitId }, order: [["number", "DESC"]], attributes: ["revision"], transaction });
  return latest?.revision ?? 0;
}

/**
 * Everyone who edited the exhibit since its last publication (the four-eyes rule counts every
 * revision's author, not only the last saver). Revisions made before revisions were kept count
 * their exhibit's creator and last saver.
 */
export async function editorsSincePublication(exhibit: { id: number; revision: number; createdById: number | null; updatedById: number | null }, transaction?: Transaction): Promise<number[]> {
  const since = await lastPublishedRevision(exhibit.id, transaction);
  const rows = await ExhibitRevision.findAll({ where: { exhibitId: exhibit.id, revision: { [Op.gt]: since } }, attributes: ["authorId", "revision"], transaction });
  const ids = new Set(rows.map((r) => r.authorId).filter((id): id is number => id !== null));
  if (exhibit.updatedById) ids.add(exhibit.updatedById);
  const kept = new Set(rows.map((r) => r.revision));
  const missing = exhibit.revision - since - kept.size;
  if (missing > 0 && exhibit.createdById) ids.add(exhibit.createdById);
  return [...ids].sort((a, b) => a - b);
}

export async function revisionsOf(exhibitId: number) {
  return ExhibitRevision.findAll({ where: { exhibitId }, include: [{ model: User, as: "author", attributes: ["id", "name", "email"] }], order: [["revision", "DESC"]] });
}

export async function revisionContentAt(exhibitId: number, revision: number): Promise<RevisionContent | null> {
  const row = await ExhibitRevision.findOne({ where: { exhibitId, revision }, attributes: ["content"] });
  return row?.content ?? null;
}
