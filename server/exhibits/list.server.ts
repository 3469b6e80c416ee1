// Exhibits as lists and counts (the studio home and the exhibit list), and the chart editions a
// new exhibit may be pinned to.
import { Op } from "sequelize";
import { currentEditionFor, listEditions } from "../editions.server.ts";
import { formatLengthAsGiven, type ExhibitListRow } from "../../app/lib/exhibit/index.ts";
import { toMetres } from "../../app/lib/units/index.ts";
import { ChartEdition, Exhibit, ExhibitMedium, Marker, User } from "../../db/models/index.ts";
import { sequelize } from "../db.server.ts";

/** Every exhibit of the organisation, unsorted, with its marker count and whether it needs a re-check. */
export async function listExhibits(organisationId: number): Promise<ExhibitListRow[]> {
  const current = await currentEditionFor(organisationId);
  const exhibits = await Exhibit.findAll({
    where: { organisationId },
    include: [
      { model: ExhibitMedium, as: "medium", required: true },
      { model: ChartEdition, as: "edition", required: true },
      { model: User, as: "updatedBy" },
    ],
  });
  const counts = (await Marker.findAll({
    where: { exhibitId: exhibits.map((e) => e.id) },
    attributes: ["exhibitId", [sequelize.fn("COUNT", sequelize.col("id")), "n"]],
    group: ["exhibitId"],
    raw: true,
  })) as unknown as { exhibitId: number; n: string }[];
  const markerCount = new Map(counts.map((c) => [c.exhibitId, Number(c.n)]));
  return exhibits.map((e) => {
    const m = e.medium!;
    const metres = m.kind === "route" ? (m.routeLengthM ?? 0) : toMetres({ value: Number(m.lengthValue), unit: m.lengthUnit! });
    return {
      slug: e.slug,
      title: e.title,
      medium: m.kind === "route" ? `route (${m.mediumType})` : m.mediumType,
      metres,
      length: formatLengthAsGiven(metres, e.unitsPreference, metres / 1e5),
      edition: e.edition!.label,
      needsRecheck: e.editionId !== current?.id,
      status: e.status,
      revision: e.revision,
      markers: markerCount.get(e.id) ?? 0,
      updated: e.updatedAt.toISOString(),
      updatedBy: e.updatedBy?.name ?? null,
    };
  });
}

/** How many exhibits the organisation has, and how many are pinned to another edition than its current one. */
export async function exhibitCounts(organisationId: number): Promise<{ exhibits: number; recheck: number }> {
  const current = await currentEditionFor(organisationId);
  const [exhibits, recheck] = await Promise.all([
    Exhibit.count({ where: { organisationId } }),
    current ? Exhibit.count({ where: { organisationId, editionId: { [Op.ne]: current.id } } }) : Exhibit.count({ where: { organisationId } }),
  ]);
  return { exhibits, recheck };
}

/**
 * The chart editions a new exhibit of the organisation may be pinned to: the released shared ones
 * and the organisation's own released ones; the organisation's current edition first.
 */
export async function pinnableEditions(organisationId: number): Promise<{ editions: { slug: string; label: string; status: string; current: boolean; own: boolean }[]; current: string | null }> {
  const released = await listEditions({ organisationId, steward: false, ownDrafts: false });
  const editions = released
    .filter((e) => e.status !== "draft")
    .map((e) => ({ slug: e.slug, label: e.label, status: e.status, current: e.currentForOrganisation, own: e.organisationId !== null }))
    .sort((a, b) => Number(b.current) - Number(a.current) || (a.status === b.status ? b.slug.localeCompare(a.slug) : a.status.localeCompare(b.status)));
  return { editions, current: editions.find((e) => e.current)?.slug ?? null };
}
