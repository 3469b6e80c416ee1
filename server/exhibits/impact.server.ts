// What a newer chart edition would change on an exhibit, re-pinning an exhibit to it, and the
// exhibits each boundary of an edition touches (for the edition compare page).
import { impactReport, metresPerYearOf } from "../../app/lib/exhibit/index.ts";
import { sequelize } from "../db.server.ts";
import { currentEditionFor, editionIntervals } from "../editions.server.ts";
import { ExhibitError, intervalsWithIds, type ExhibitBundle } from "./load.server.ts";
import { reviseExhibit, type Actor } from "./revise.server.ts";

/** Set when the organisation now works against another edition than the exhibit's: what re-pinning would move. */
export async function impactFor(bundle: ExhibitBundle) {
  const current = await currentEditionFor(bundle.exhibit.organisationId);
  if (!current || current.id === bundle.edition.id) return null;
  const target = await editionIntervals(current.id);
  return { edition: { slug: current.slug, label: current.label }, report: impactReport(bundle.markers, bundle.intervals, target, metresPerYearOf(bundle.spec)) };
}

/** Re-pins the exhibit to the organisation's current edition: boundary markers follow their interval (by name, or its rename). */
export function repinToCurrent(actor: Actor, slug: string, revision: number) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    "repin",
    async (b, transaction) => {
      const current = await currentEditionFor(actor.organisationId, transaction);
      if (!current) throw new ExhibitError("Your organisation has no current chart edition.");
      if (current.id === b.edition.id) throw new ExhibitError(`This exhibit is already pinned to ${current.label}.`);
      const target = await intervalsWithIds(current.id, transaction);
      const report = impactReport(b.markers, b.intervals, target.domain, 1);
      const missing = report.rows.filter((r) => r.newAgeMa === null);
      if (missing.length) {
        throw new ExhibitError(`Not re-pinned: ${missing.map((r) => `marker ${r.number} (${r.intervalName})`).join(", ")} has no matching interval in ${current.label}. Remove or replace those markers first.`);
      }
      const renamed = new Map(report.rows.filter((r) => r.newIntervalName).map((r) => [r.intervalName, r.newIntervalName!]));
      for (const row of b.markerRows.filter((m) => m.kind === "boundary")) {
        const name = b.intervalIds.get(row.intervalId!)!.name;
        const newName = renamed.get(name) ?? name;
        const id = target.rowsByName.get(newName);
        if (!id) throw new ExhibitError(`The ${name} is not in ${current.label}.`);
        await row.update({ intervalId: id, ...(renamed.has(name) && row.label === `Base of the ${name}` ? { label: `Base of the ${newName}` } : {}) }, { transaction });
      }
      await b.exhibit.update({ editionId: current.id }, { transaction });
      return { from: b.edition.slug, to: current.slug, moved: report.rows.length };
    },
    (r) => r,
  );
}

/**
 * For the edition compare page: the organisation's exhibits pinned to `editionId` with a boundary
 * marker on each interval (by the interval's name in that edition).
 */
export async function exhibitsByBoundary(organisationId: number, editionId: number): Promise<Map<string, { slug: string; title: string }[]>> {
  const [rows] = (await sequelize.query(
    `SELECT DISTINCT i.name AS interval, e.slug, e.title
       FROM markers m JOIN exhibits e ON e.id = m.exhibit_id JOIN intervals i ON i.id = m.interval_id
      WHERE e.organisation_id = $1 AND e.edition_id = $2 AND m.kind = 'boundary'
      ORDER BY e.title`,
    { bind: [organisationId, editionId] },
  )) as [{ interval: string; slug: string; title: string }[], unknown];
  const out = new Map<string, { slug: string; title: string }[]>();
  for (const r of rows) out.set(r.interval, [...(out.get(r.interval) ?? []), { slug: r.slug, title: r.title }]);
  return out;
}
