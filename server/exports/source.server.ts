// What an export is made from. Every export file (schedule, GeoJSON, GPX, panels, signs, …) is made
// from a publication snapshot (app/lib/publication/types.ts):
// - `?from=publication` — the exhibit's latest publication, exactly as checked and published. The
//   default when the exhibit has one: the crew sets out what the reviewer checked.
// - `?from=draft` — a snapshot built now from the working copy with the publication builder (the
//   sign numbers it would get if published next). Never stored; flagged `draft: true` so every file
//   says "DRAFT — not checked". The default while the exhibit has no publication.
// Members only (permission "exhibit.export"); another organisation's exhibit is a 404. The public
// route serves publications only (publicationSource), never drafts.
import { QueryTypes } from "sequelize";
import { data } from "react-router";
import type { PublicationMeta, PublicationSnapshot } from "../../app/lib/publication/types.ts";
import { Publication } from "../../db/models/index.ts";
import { requirePermission, type MemberContext } from "../auth.server.ts";
import { sequelize } from "../db.server.ts";
import { EXHIBIT_NOT_FOUND, ExhibitError, requireBundle } from "../exhibits/load.server.ts";
import { snapshotFor } from "../publications/publish.server.ts";

export { DRAFT_NOTICE } from "../../app/lib/exports/common.ts";

export const FROM_VALUES = ["publication", "draft"] as const;
export type From = (typeof FROM_VALUES)[number];

export interface ExportSource {
  snapshot: PublicationSnapshot;
  /** Built now from the working copy: not reviewed, not published. */
  draft: boolean;
  /** The publication the snapshot is (null for a draft). */
  publication: PublicationMeta | null;
  /** Base of file names: "riverside-walk-publication-1", "riverside-walk-draft-rev12". */
  fileStem: string;
}

/** A refusal with a status and a message in words; the routes answer it as JSON. */
export class ExportError extends Error {
  constructor(message: string, public status: 400 | 404 | 409) {
    super(message);
    this.name = "ExportError";
  }
}

/** The `from` query parameter: absent → null (the caller picks the default); anything else → 400. */
export function parseFrom(query: URLSearchParams): From | null {
  const values = query.getAll("from");
  if (values.length === 0) return null;
  const [value] = values;
  if (values.length > 1 || !(FROM_VALUES as readonly string[]).includes(value)) {
    throw new ExportError(`from: must be "publication" (the latest publication) or "draft" (the working copy, not checked); got ${JSON.stringify(values.join(","))}.`, 400);
  }
  return value as From;
}

async function latestPublication(exhibitId: number, number?: number) {
  return Publication.findOne({
    where: number === undefined ? { exhibitId } : { exhibitId, number },
    order: [["number", "DESC"]],
    attributes: ["number", "meta", "snapshot"],
  });
}

/** The working copy as a snapshot, numbered as the next publication would be; nothing is stored. */
async function draftSource(organisationId: number, slug: string): Promise<ExportSource> {
  // snapshotFor plans sign numbers under a row lock, as publishing does; the transaction only reads.
  const snapshot = await sequelize.transaction(async (transaction) => {
    const bundle = await requireBundle(organisationId, slug, transaction);
    const [row] = await sequelize.query<{ last: number | null }>(`SELECT max(number) AS last FROM publications WHERE exhibit_id = $1`, {
      bind: [bundle.exhibit.id],
      type: QueryTypes.SELECT,
      transaction,
    });
    try {
      return (await snapshotFor(bundle, (row?.last ?? 0) + 1, transaction)).snapshot;
    } catch (error) {
      if (error instanceof ExhibitError) throw new ExportError(`The draft cannot be exported: ${error.message.replace(/^Not published: /, "")}`, 409);
      throw error;
    }
  });
  return { snapshot, draft: true, publication: null, fileStem: `${slug}-draft-rev${snapshot.exhibit.revision}` };
}

/**
 * The source of a member's export of their organisation's exhibit `slug`, by `?from=`. Throws a
 * redirect (signed out), 403 (not a member), 404 (no such exhibit, or no publication when
 * `from=publication`), 400 (bad `from`), 409 (a draft that does not compute).
 */
export async function memberExportSource(request: Request, slug: string): Promise<{ member: MemberContext; source: ExportSource }> {
  const member = await requirePermission(request, "exhibit.export");
  const from = parseFrom(new URL(request.url).searchParams);
  const [exhibit] = await sequelize.query<{ id: number }>(`SELECT id FROM exhibits WHERE organisation_id = $1 AND slug = $2`, {
    bind: [member.organisation.id, slug],
    type: QueryTypes.SELECT,
  });
  if (!exhibit) throw new ExportError(EXHIBIT_NOT_FOUND, 404);
  if (from === "draft") return { member, source: await draftSource(member.organisation.id, slug) };
  const publication = await latestPublication(exhibit.id);
  if (!publication) {
    if (from === "publication") throw new ExportError("This exhibit has no publication yet: export the working copy with ?from=draft (its files say “DRAFT — not checked”).", 404);
    return { member, source: await draftSource(member.organisation.id, slug) };
  }
  return { member, source: publishedSource(publication) };
}

function publishedSource(row: Pick<Publication, "number" | "meta" | "snapshot">): ExportSource {
  return { snapshot: row.snapshot, draft: false, publication: row.meta, fileStem: `${row.snapshot.exhibit.slug}-publication-${row.number}` };
}

/** A publication by exhibit id and number (the public file route has already found the exhibit). */
export async function publicationSource(exhibitId: number, number: number): Promise<ExportSource | null> {
  const row = await latestPublication(exhibitId, number);
  return row ? publishedSource(row) : null;
}

/** ExportError → JSON answer; anything else is rethrown (redirects, 403s and 404s thrown by the guards). */
export function exportErrorData(error: unknown): never {
  if (error instanceof ExportError) throw data({ message: error.message }, { status: error.status });
  throw error;
}
