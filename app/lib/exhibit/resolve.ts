// A marker row's age comes from where it points: a boundary from the pinned edition's interval, an
// event from the library, a custom age from the designer's own figure and source. Nothing here is
// stored as a copy, so a re-pin or a library correction flows through to every exhibit.
import type { Interval, Rank } from "../timescale/types";
import { colourAt } from "./compose";
import type { LineStringGeometry, MarkerKind, MediumSpec, ResolvedMarker } from "./types";
import type { LengthUnit } from "../units";
import type { MediumType } from "../scale/legibility";
import { sortByTableOrder } from "../scale/numbering";

/** The stored fields of a marker that resolving reads (a database row fits this shape). */
export interface MarkerRecord {
  id: number;
  kind: MarkerKind;
  label: string;
  text: string;
  intervalId: number | null;
  datedEventId: number | null;
  ageMa: string | number | null;
  uncertaintyMa: string | number | null;
  source: string | null;
}

/** A library event as a marker needs it. */
export interface EventAge {
  name: string;
  ageMa: number;
  uncertaintyMa: number | null;
  citation: string;
}

const num = (v: string | number | null | undefined) => (v == null ? null : Number(v));

/**
 * Resolves every marker's age, source and colour, and numbers them from the older end of the
 * exhibit (marker 1 is the first a visitor reaches; equal ages keep the order they were added in) —
 * the same table numbers the scale engine gives its points and warnings (scale/numbering.ts).
 */
export function resolveMarkers(
  rows: readonly MarkerRecord[],
  intervalIds: ReadonlyMap<number, Interval>,
  events: ReadonlyMap<number, EventAge>,
  intervals: readonly Interval[],
  edition: { slug: string; label: string },
): ResolvedMarker[] {
  const resolved = rows.map((m): ResolvedMarker => {
    let ageMa: number;
    let uncertaintyMa: number | null;
    let intervalName: string | null = null;
    let intervalRank: Rank | null = null;
    let eventName: string | null = null;
    let source: string;
    let approximate = false;
    if (m.kind === "boundary") {
      const iv = intervalIds.get(m.intervalId!);
      if (!iv) throw new Error(`marker ${m.id}: interval ${m.intervalId} is not in ${edition.slug}`);
      ageMa = iv.baseMa;
      uncertaintyMa = iv.baseUncertaintyMa;
      intervalName = iv.name;
      intervalRank = iv.rank;
      approximate = iv.approximate;
      // A ratified base says how it is defined: a GSSP, or a GSSA (the Precambrian boundaries defined by age).
      source = `${edition.label}: base of the ${iv.name}${iv.gssp ? ` (${iv.boundaryKind ?? "ratified"})` : ""}`;
    } else if (m.kind === "event") {
      const ev = events.get(m.datedEventId!);
      if (!ev) throw new Error(`marker ${m.id}: event ${m.datedEventId} not found`);
      ageMa = ev.ageMa;
      uncertaintyMa = ev.uncertaintyMa;
      eventName = ev.name;
      source = ev.citation;
    } else {
      ageMa = Number(m.ageMa);
      uncertaintyMa = num(m.uncertaintyMa);
      source = m.source ?? "";
    }
    return { id: String(m.id), number: 0, kind: m.kind, label: m.label, text: m.text, ageMa, uncertaintyMa, intervalName, intervalRank, eventName, source, color: colourAt(intervals, ageMa), approximate };
  });
  sortByTableOrder(resolved, (m) => m.ageMa, (m) => m.id);
  resolved.forEach((m, i) => (m.number = i + 1));
  return resolved;
}

/** The stored fields of an exhibit's medium (a database row fits this shape). */
export interface MediumRecord {
  kind: "length" | "route";
  mediumType: MediumType;
  lengthValue: string | number | null;
  lengthUnit: LengthUnit | null;
  panelWidthValue: string | number | null;
  panelWidthUnit: LengthUnit | null;
  geometry: LineStringGeometry | null;
  routeLengthM: number | null;
  sourceName: string | null;
}

export function mediumSpecOf(m: MediumRecord): MediumSpec {
  if (m.kind === "route") {
    return { kind: "route", mediumType: m.mediumType, geometry: m.geometry!, lengthMetres: m.routeLengthM ?? 0, sourceName: m.sourceName };
  }
  return {
    kind: "length",
    mediumType: m.mediumType,
    length: { value: Number(m.lengthValue), unit: m.lengthUnit! },
    panelWidth: m.panelWidthValue == null ? null : { value: Number(m.panelWidthValue), unit: m.panelWidthUnit! },
  };
}
