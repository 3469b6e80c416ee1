// The automatic checks of one exhibit, recomputed on the server from what is stored: the exhibit
// with its markers resolved on the pinned edition, the interval each boundary marker points to, the
// stored warning acknowledgements, the markers' images, and the organisation's current edition.
// The pure rules are app/lib/review/checks.ts.
import type { Transaction } from "sequelize";
import { runChecks, type Acknowledgement, type BoundaryFact } from "../../app/lib/review/checks.ts";
import type { CheckReport } from "../../app/lib/review/types.ts";
import { DatedEvent } from "../../db/models/index.ts";
import { imagesForExhibit } from "../assets/usage.server.ts";
import { sequelize } from "../db.server.ts";
import { impactFor } from "../exhibits/impact.server.ts";
import { acknowledgementsFor } from "../exhibits/warnings.server.ts";
import { data } from "react-router";
import { EXHIBIT_NOT_FOUND, loadBundle, type ExhibitBundle } from "../exhibits/load.server.ts";

/** The interval each boundary marker points to, straight from the tables (it may be another edition's by mistake). */
async function boundaryFacts(exhibitId: number, transaction?: Transaction): Promise<BoundaryFact[]> {
  const [rows] = (await sequelize.query(
    `SELECT m.id AS "markerId", i.name AS "intervalName", i.edition_id AS "editionId", i.base_ma AS "baseMa"
       FROM markers m JOIN intervals i ON i.id = m.interval_id WHERE m.exhibit_id = $1 AND m.kind = 'boundary'`,
    { bind: [exhibitId], transaction },
  )) as [{ markerId: number; intervalName: string; editionId: number; baseMa: string }[], unknown];
  return rows.map((r) => ({ markerId: String(r.markerId), intervalName: r.intervalName, editionId: r.editionId, baseMa: Number(r.baseMa) }));
}

/** Stored acknowledgements of legibility warnings (server/exhibits/warnings.server.ts keeps them by warning key). */
export async function acknowledgementsOf(exhibitId: number, transaction?: Transaction): Promise<Acknowledgement[]> {
  return acknowledgementsFor(exhibitId, transaction);
}

async function eventTexts(bundle: ExhibitBundle) {
  const ids = bundle.markerRows.filter((m) => m.kind === "event").map((m) => m.datedEventId!);
  const rows = ids.length ? await DatedEvent.findAll({ where: { id: ids }, attributes: ["id", "name", "summary", "datingMethod"] }) : [];
  const byId = new Map(rows.map((r) => [r.id, r]));
  return new Map(
    bundle.markerRows.filter((m) => m.kind === "event" && byId.has(m.datedEventId!)).map((m) => {
      const ev = byId.get(m.datedEventId!)!;
      return [String(m.id), { name: ev.name, summary: ev.summary, datingMethod: ev.datingMethod }] as const;
    }),
  );
}

export interface CheckedExhibit {
  bundle: ExhibitBundle | null;
  report: CheckReport;
}

/**
 * The checks of the exhibit as stored now. A boundary marker pointing to another edition's interval
 * cannot even be resolved: that is reported as a failure of its own (nothing else is computed).
 */
export async function checkExhibit(organisationId: number, slug: string, transaction?: Transaction): Promise<CheckedExhibit & { exhibitId: number }> {
  const [[row]] = (await sequelize.query(
    `SELECT e.id, e.revision, e.edition_id AS "editionId", c.slug AS "editionSlug", c.label AS "editionLabel" FROM exhibits e JOIN chart_editions c ON c.id = e.edition_id WHERE e.organisation_id = $1 AND e.slug = $2`,
    { bind: [organisationId, slug], transaction },
  )) as [{ id: number; revision: number; editionId: number; editionSlug: string; editionLabel: string }[], unknown];
  if (!row) throw data({ message: EXHIBIT_NOT_FOUND }, { status: 404 });
  const facts = await boundaryFacts(row.id, transaction);
  const foreign = facts.filter((f) => f.editionId !== row.editionId);
  if (foreign.length) {
    const results = foreign.map((f) => ({
      kind: "boundary-age" as const,
      status: "fail" as const,
      message: `The marker at the base of the ${f.intervalName} (marker id ${f.markerId}) uses the ${f.intervalName} of another chart edition, not ${row.editionLabel}, the pinned one. Remove it and add it again from the pinned edition; the other checks run once this is fixed.`,
      markerId: f.markerId,
      markerNumber: null,
    }));
    return {
      exhibitId: row.id,
      bundle: null,
      report: { revision: row.revision, edition: { slug: row.editionSlug, label: row.editionLabel }, overall: "fail", counts: { pass: 0, warning: 0, fail: results.length }, results, figures: [], recheck: null },
    };
  }
  const bundle = (await loadBundle(organisationId, slug, transaction))!;
  const impact = await impactFor(bundle);
  const acknowledgements = await acknowledgementsOf(bundle.exhibit.id, transaction);
  const images = await imagesForExhibit(bundle.exhibit.id);
  const events = await eventTexts(bundle);
  const report = runChecks({
    revision: bundle.exhibit.revision,
    spec: bundle.spec,
    markers: bundle.markers,
    edition: { id: bundle.edition.id, slug: bundle.edition.slug, label: bundle.edition.label, intervals: bundle.intervals },
    boundaries: facts,
    events,
    acknowledgements,
    images: new Map([...images].map(([markerId, image]) => [String(markerId), { alt: image.alt }])),
    recheck: impact ? { edition: impact.edition, moved: impact.report.rows.filter((r) => r.shiftMa !== null && r.shiftMa !== 0).length, missing: impact.report.missing } : null,
  });
  return { exhibitId: bundle.exhibit.id, bundle, report };
}
