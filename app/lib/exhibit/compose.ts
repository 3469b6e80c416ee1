// Turning an exhibit into a scale-engine request, and the comparisons every exhibit shows.
import { parseScaleRequest, type ScaleRequest } from "../scale/schema";
import { computeScale, type ScaleResult } from "../scale/compute";
import { prepareRoute, type PreparedRoute } from "../geo/route";
import { parseGeoJsonRoute } from "../geo/parse";
import { intervalsAt } from "../timescale/lookup";
import { toMetres, toYears } from "../units";
import type { Interval, Rank } from "../timescale/types";
import type { DurationSpec, ExhibitSpec, LineStringGeometry, ResolvedMarker } from "./types";

/** Comparisons shown on every exhibit. The life span is the visitor's to change in the preview. */
export function standardDurations(lifeYears = 80): DurationSpec[] {
  return [
    { id: "life", label: `a ${lifeYears}-year life`, years: lifeYears },
    // Oldest writing, about 5,200 years ago (Sumerian cuneiform; common practice figure).
    { id: "writing", label: "recorded history (about 5,200 years)", years: 5200 },
    // Holocene base 11,700 years b2k (ICS chart).
    { id: "holocene", label: "the Holocene (11,700 years)", years: 11_700 },
    // Earliest Homo sapiens fossils, about 300,000 years (common practice round figure).
    { id: "sapiens", label: "our species (about 300,000 years)", years: 300_000 },
  ];
}

/** The scale-engine request for an exhibit (not yet validated: run it through parseScaleRequest). */
export function scaleRequestFor(spec: ExhibitSpec, markers: ResolvedMarker[], durations: DurationSpec[] = []): unknown {
  return {
    span: { older: spec.spanOlder, younger: spec.spanYounger },
    medium: spec.medium.kind === "length" ? { kind: "length", length: spec.medium.length } : { kind: "route", geometry: spec.medium.geometry },
    mediumType: spec.medium.mediumType,
    legibility: spec.legibility,
    points: markers.map((m) => ({
      id: m.id,
      label: m.label,
      age: { value: m.ageMa, unit: "Ma" },
      ...(m.uncertaintyMa != null && m.uncertaintyMa > 0 ? { uncertainty: { value: m.uncertaintyMa, unit: "Ma" } } : {}),
    })),
    durations: durations.map((d) => ({ id: d.id, label: d.label, years: d.years })),
    insets: spec.insets.map((i) => ({
      id: i.id,
      label: i.label,
      older: { value: i.olderMa, unit: "Ma" },
      younger: { value: i.youngerMa, unit: "Ma" },
      magnification: i.magnification,
    })),
  };
}

export type ExhibitComputation =
  | { ok: true; request: ScaleRequest; route?: PreparedRoute; result: ScaleResult }
  | { ok: false; message: string; issues: { path: string; message: string }[] };

/**
 * Validate and compute an exhibit. Pass `route` (from an earlier call) to skip re-measuring the
 * route on every keystroke in the preview.
 */
export function computeExhibit(spec: ExhibitSpec, markers: ResolvedMarker[], durations: DurationSpec[] = [], cache?: { route?: PreparedRoute; geometry?: unknown }): ExhibitComputation {
  const body = scaleRequestFor(spec, markers, durations) as { medium: { kind: string; geometry?: unknown } };
  const reuse = cache?.route && spec.medium.kind === "route" && cache.geometry === spec.medium.geometry;
  const parsed = parseScaleRequest(reuse ? { ...body, medium: { kind: "length", length: { value: cache!.route!.totalMetres, unit: "m" } } } : body);
  if (!parsed.ok) return { ok: false, message: parsed.error.message, issues: parsed.error.issues };
  if (reuse) {
    const request = { ...parsed.request, medium: body.medium } as ScaleRequest;
    return { ok: true, request, route: cache!.route, result: computeScale(request, { route: cache!.route }) };
  }
  return { ok: true, request: parsed.request, route: parsed.route, result: computeScale(parsed.request, { route: parsed.route }) };
}

/**
 * computeExhibit's route cache for a saved route: measured once (10⁴–10⁵ points), then reused on
 * every keystroke of the preview. Undefined for a length medium or a geometry the engine refuses.
 */
export function routeCacheFor(geometry: LineStringGeometry | null): { route: PreparedRoute; geometry: LineStringGeometry } | undefined {
  if (!geometry) return undefined;
  const parsed = parseGeoJsonRoute(geometry, "medium.geometry");
  return parsed.ok ? { route: prepareRoute(parsed.coords), geometry } : undefined;
}

/** Metres per year of an exhibit from its stored figures (a route's length was measured on upload). */
export function metresPerYearOf(spec: ExhibitSpec): number {
  const metres = spec.medium.kind === "route" ? spec.medium.lengthMetres : toMetres(spec.medium.length);
  return metres / (toYears(spec.spanOlder) - toYears(spec.spanYounger));
}

const COLOUR_RANKS: Rank[] = ["age", "epoch", "subperiod", "period", "era", "eon"];

/** The standard chart colour at an age: the finest interval of the edition that contains it. */
export function colourAt(intervals: readonly Interval[], ageMa: number, finest: Rank = "period"): string {
  const at = intervalsAt(intervals, ageMa);
  const start = COLOUR_RANKS.indexOf(finest);
  for (const rank of COLOUR_RANKS.slice(start)) {
    const iv = at[rank];
    if (iv) return iv.color;
  }
  return "#cccccc";
}
