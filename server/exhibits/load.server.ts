// Loading an exhibit: its row, medium and pinned edition, its markers with their ages resolved
// (app/lib/exhibit/resolve.ts), its insets, and the spec the scale engine reads.
import type { Transaction } from "sequelize";
import { data } from "react-router";
import { computeExhibit, mediumSpecOf, resolveMarkers, standardDurations, type ExhibitSpec, type InsetSpec, type ResolvedMarker } from "../../app/lib/exhibit/index.ts";
import { decayFigures, howWeKnow } from "../../app/lib/decay/index.ts";
import type { ScaleResult } from "../../app/lib/scale/compute.ts";
import type { Interval } from "../../app/lib/timescale/types.ts";
import { ChartEdition, Exhibit, ExhibitMedium, Inset, Marker, User } from "../../db/models/index.ts";
import { editionIntervalRows } from "../editions.server.ts";
import { eventsByIds, listDecaySystems } from "../dated-events.server.ts";

export class ExhibitError extends Error {
  constructor(message: string, public field = "_form", public status = 400) {
    super(message);
    this.name = "ExhibitError";
  }
}

export const EXHIBIT_NOT_FOUND = "There is no exhibit at this address in your organisation.";

export interface ExhibitBundle {
  exhibit: Exhibit;
  medium: ExhibitMedium;
  edition: ChartEdition;
  intervals: Interval[];
  /** DB id → domain interval of the pinned edition. */
  intervalIds: Map<number, Interval>;
  markers: ResolvedMarker[];
  markerRows: Marker[];
  insets: InsetSpec[];
  spec: ExhibitSpec;
}

export async function intervalsWithIds(editionId: number, transaction?: Transaction) {
  const rows = await editionIntervalRows(editionId, transaction);
  return {
    domain: rows.map((r) => r.interval),
    ids: new Map(rows.map((r) => [r.id, r.interval])),
    rowsByName: new Map(rows.map((r) => [r.interval.name, r.id])),
  };
}

export async function loadBundle(organisationId: number, slug: string, transaction?: Transaction): Promise<ExhibitBundle | null> {
  const exhibit = await Exhibit.findOne({
    where: { organisationId, slug },
    include: [
      { model: ExhibitMedium, as: "medium", required: true },
      { model: ChartEdition, as: "edition", required: true },
      { model: User, as: "updatedBy" },
    ],
    transaction,
  });
  if (!exhibit) return null;
  const [{ domain, ids }, markerRows, insetRows] = await Promise.all([
    intervalsWithIds(exhibit.editionId, transaction),
    Marker.findAll({ where: { exhibitId: exhibit.id }, order: [["id", "ASC"]], transaction }),
    Inset.findAll({ where: { exhibitId: exhibit.id }, order: [["id", "ASC"]], transaction }),
  ]);
  const events = await eventsByIds(markerRows.filter((m) => m.kind === "event").map((m) => m.datedEventId!), organisationId);
  const markers = resolveMarkers(markerRows, ids, events, domain, exhibit.edition!);
  const insets: InsetSpec[] = insetRows.map((r) => ({ id: `inset-${r.id}`, label: r.label, olderMa: Number(r.olderMa), youngerMa: Number(r.youngerMa), magnification: r.magnification }));
  const spec: ExhibitSpec = {
    spanOlder: { value: Number(exhibit.spanOlderValue), unit: exhibit.spanOlderUnit },
    spanYounger: { value: Number(exhibit.spanYoungerValue), unit: exhibit.spanYoungerUnit },
    medium: mediumSpecOf(exhibit.medium!),
    legibility: exhibit.legibility ?? {},
    unitsPreference: exhibit.unitsPreference,
    insets,
  };
  return { exhibit, medium: exhibit.medium!, edition: exhibit.edition!, intervals: domain, intervalIds: ids, markers, markerRows, insets, spec };
}

export async function requireBundle(organisationId: number, slug: string, transaction?: Transaction) {
  const bundle = await loadBundle(organisationId, slug, transaction);
  if (!bundle) throw data({ message: EXHIBIT_NOT_FOUND }, { status: 404 });
  return bundle;
}

export function computeBundle(bundle: Pick<ExhibitBundle, "spec" | "markers">, lifeYears = 80) {
  return computeExhibit(bundle.spec, bundle.markers, standardDurations(lifeYears));
}

export function resultOf(bundle: Pick<ExhibitBundle, "spec" | "markers">): ScaleResult {
  const c = computeBundle(bundle);
  if (!c.ok) throw new ExhibitError(c.message);
  return c.result;
}

/** "How we know" for markers with a decay system: how much of the parent is left after the marker's age. */
export async function howWeKnowFor(bundle: ExhibitBundle): Promise<{ systems: { id: number; label: string }[]; byMarker: Map<string, string> }> {
  const systems = await listDecaySystems();
  const byId = new Map(systems.map((s) => [s.id, s]));
  const byMarker = new Map<string, string>();
  const markers = new Map(bundle.markers.map((m) => [m.id, m]));
  for (const row of bundle.markerRows) {
    const system = row.decaySystemId ? byId.get(row.decaySystemId) : undefined;
    const marker = markers.get(String(row.id));
    if (!system || !marker) continue;
    const h = howWeKnow(marker.ageMa * 1e6, decayFigures(system));
    byMarker.set(marker.id, `${h.sentence} (${system.citation.split(/[.;]/)[0]})`);
  }
  return { systems: systems.map((s) => ({ id: s.id, label: `${s.parent} → ${s.daughter}` })), byMarker };
}
