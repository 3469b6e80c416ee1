// Small exhibits for the review and publication unit tests: the ICS 2024/12 intervals from the
// reference data, markers made the way the server resolves them, and a 54.1 m rope over the
// Phanerozoic (1 m per 10 million years).
import type { ExhibitSpec, ResolvedMarker } from "../../../app/lib/exhibit/types.ts";
import type { Interval } from "../../../app/lib/timescale/types.ts";
import { byName, loadEdition } from "../timescale/helpers.ts";

export const EDITION = loadEdition("ics-2024-12");
export const INTERVALS: readonly Interval[] = EDITION.intervals;
export const PINNED = { id: 7, slug: "ics-2024-12", label: "ICS 2024/12", intervals: INTERVALS };

export function boundary(id: string, name: string, fields: Partial<ResolvedMarker> = {}): ResolvedMarker {
  const iv = byName(INTERVALS, name);
  return { id, number: 0, kind: "boundary", label: `Base of the ${name}`, text: "", ageMa: iv.baseMa, uncertaintyMa: iv.baseUncertaintyMa, intervalName: name, intervalRank: iv.rank, eventName: null, source: "ICS 2024/12", color: iv.color, approximate: false, ...fields };
}

export function custom(id: string, label: string, ageMa: number, fields: Partial<ResolvedMarker> = {}): ResolvedMarker {
  return { id, number: 0, kind: "custom", label, text: "", ageMa, uncertaintyMa: null, intervalName: null, intervalRank: null, eventName: null, source: "Smith, J. (2019) Geology of the Marrow valley. Journal of Invented Places 4: 1–20.", color: "#cccccc", approximate: false, ...fields };
}

/** Table numbers from the older end, as resolveMarkers gives them. */
export function numbered(markers: ResolvedMarker[]): ResolvedMarker[] {
  return [...markers].sort((a, b) => b.ageMa - a.ageMa).map((m, i) => ({ ...m, number: i + 1 }));
}

export function rope(fields: Partial<ExhibitSpec> = {}): ExhibitSpec {
  return {
    spanOlder: { value: 541, unit: "Ma" },
    spanYounger: { value: 0, unit: "Ma" },
    medium: { kind: "length", mediumType: "rope", length: { value: 54.1, unit: "m" }, panelWidth: null },
    legibility: {},
    unitsPreference: "metric",
    insets: [],
    ...fields,
  };
}
