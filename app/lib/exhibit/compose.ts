// Turning an exhibit into a scale-engine request, and the comparisons every exhibit shows.
import { MAX_AGE_YEARS, MAX_POINTS, parseScaleRequest, type ScaleRequest } from "../scale/schema";
import { computeScale, type PointYears, type ScaleResult } from "../scale/compute";
import { prepareRoute, type PreparedRoute } from "../geo/route";
import { parseGeoJsonRoute } from "../geo/parse";
import { intervalsAt } from "../timescale/lookup";
import { toMetres, toYears } from "../units";
import type { Interval, Rank } from "../timescale/types";
import { exhibitProblem } from "./problems";
import type { DurationSpec, ExhibitSpec, LineStringGeometry, ResolvedMarker } from "./types";

/**
 * Comparisons shown on every exhibit. The life span is the visitor's to change in the preview.
 * Each is a located span — the last N years — so it shows only on an inset that contains it.
 */
export function standardDurations(lifeYears = 80): DurationSpec[] {
  return [
    { id: "life", label: `${articleFor(lifeYears)} ${lifeYears}-year life`, years: lifeYears, endsAgoYears: 0 },
    // Oldest writing, about 5,200 years ago (Sumerian cuneiform; common practice figure).
    { id: "writing", label: "recorded history (about 5,200 years)", years: 5200, endsAgoYears: 0 },
    // Holocene base 11,700 years b2k (ICS chart).
    { id: "holocene", label: "the Holocene (11,700 years)", years: 11_700, endsAgoYears: 0 },
    // Earliest Homo sapiens fossils, about 300,000 years (common practice round figure).
    { id: "sapiens", label: "our species (about 300,000 years)", years: 300_000, endsAgoYears: 0 },
  ];
}

/**
 * "a" or "an" before a number read aloud in English: an 8-, 11-, 18-, 80-, 800-year…, a 7-, 100-year…
 * (eight, eleven and eighteen begin with a vowel sound; eleven and eighteen only when they lead a
 * group of thousands: 11, 11,000 but not 110 or 1,100).
 */
export function articleFor(n: number): "a" | "an" {
  const digits = String(Math.trunc(Math.abs(n)));
  if (digits.startsWith("8")) return "an";
  return (digits.startsWith("11") || digits.startsWith("18")) && digits.length % 3 === 2 ? "an" : "a";
}

function pointOf(m: ResolvedMarker) {
  return {
    id: m.id,
    label: m.label,
    age: { value: m.ageMa, unit: "Ma" as const },
    ...(m.uncertaintyMa != null && m.uncertaintyMa > 0 ? { uncertainty: { value: m.uncertaintyMa, unit: "Ma" as const } } : {}),
  };
}

/** The scale-engine request for an exhibit (not yet validated: run it through parseScaleRequest). */
export function scaleRequestFor(spec: ExhibitSpec, markers: ResolvedMarker[], durations: DurationSpec[] = []): unknown {
  return {
    span: { older: spec.spanOlder, younger: spec.spanYounger },
    medium: spec.medium.kind === "length" ? { kind: "length", length: spec.medium.length } : { kind: "route", geometry: spec.medium.geometry },
    mediumType: spec.medium.mediumType,
    legibility: spec.legibility,
    unitSystem: spec.unitsPreference,
    points: markers.map(pointOf),
    durations: durations.map((d) => ({ id: d.id, label: d.label, years: d.years, ...(d.endsAgoYears !== undefined ? { endsAgo: { value: d.endsAgoYears, unit: "a" } } : {}) })),
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

/** The markers as request points, with their ages and ± in years, and the range of ages. */
interface MarkerPoints {
  points: ScaleRequest["points"];
  years: PointYears;
  oldest: number;
  youngest: number;
}

const checkedMarkers = new WeakMap<readonly ResolvedMarker[], MarkerPoints | null>();

/** Is a remembered markers array still what it was (the same markers, ids, labels, ages and ±)? A caller may have changed it in place. */
function unchanged(known: MarkerPoints | null, markers: readonly ResolvedMarker[]): boolean {
  if (known === null) return false; // refused before: check again, it may have been fixed
  if (known.points.length !== markers.length) return false;
  for (let i = 0; i < markers.length; i++) {
    const m = markers[i];
    const p = known.points[i];
    if (p.id !== m.id || p.label !== m.label || p.age.value !== m.ageMa) return false;
    const u = m.uncertaintyMa != null && m.uncertaintyMa > 0 ? m.uncertaintyMa : undefined;
    if (p.uncertainty?.value !== u) return false;
  }
  return true;
}

/**
 * The markers as request points, when every one passes what the request schema checks of a point
 * (a finite age ≥ 0, an id and label of sensible length, no id twice, a ± ≥ 0; the span is checked
 * by the caller); null otherwise — the full schema then says what is wrong. Worked out once per
 * markers array (the preview passes the same array on every keystroke); a remembered array is
 * compared with its markers first, so one changed in place is worked out again.
 */
function markerPoints(markers: readonly ResolvedMarker[]): MarkerPoints | null {
  const known = checkedMarkers.get(markers);
  if (known !== undefined && unchanged(known, markers)) return known;
  let out: MarkerPoints | null = null;
  if (markers.length <= MAX_POINTS) {
    const seen = new Set<string>();
    const points: ScaleRequest["points"] = new Array(markers.length);
    const ages = new Float64Array(markers.length);
    const uncertainties = new Float64Array(markers.length);
    let oldest = -Infinity;
    let youngest = Infinity;
    let ok = true;
    for (let i = 0; i < markers.length && ok; i++) {
      const m = markers[i];
      const a = m.ageMa;
      const u = m.uncertaintyMa;
      ok =
        typeof a === "number" && a >= 0 && a <= MAX_AGE_YEARS &&
        typeof m.id === "string" && m.id.length >= 1 && m.id.length <= 200 && !seen.has(m.id) &&
        typeof m.label === "string" && m.label.length <= 500 &&
        (u == null || (typeof u === "number" && u >= 0 && u < Infinity));
      if (!ok) break;
      seen.add(m.id);
      points[i] = pointOf(m);
      ages[i] = toYears(points[i].age);
      uncertainties[i] = points[i].uncertainty ? toYears(points[i].uncertainty!) : NaN;
      if (ages[i] > oldest) oldest = ages[i];
      if (ages[i] < youngest) youngest = ages[i];
    }
    if (ok) out = { points, years: { ages, uncertainties }, oldest, youngest };
  }
  checkedMarkers.set(markers, out);
  return out;
}

/**
 * Validate and compute an exhibit. Pass `route` (from an earlier call) to skip re-measuring the
 * route on every keystroke in the preview. The exhibit's settings go through the request schema;
 * the markers (already stored, so already checked) through a quick check of the same rules, and
 * through the schema only when one fails it, for its message.
 */
export function computeExhibit(spec: ExhibitSpec, markers: ResolvedMarker[], durations: DurationSpec[] = [], cache?: { route?: PreparedRoute; geometry?: unknown }): ExhibitComputation {
  const reuse = Boolean(cache?.route && spec.medium.kind === "route" && cache.geometry === spec.medium.geometry);
  // a reused route goes through the schema as its measured length
  const measured = (b: unknown) => (reuse ? { ...(b as object), medium: { kind: "length", length: { value: cache!.route!.totalMetres, unit: "m" } } } : b);
  const finish = (request: ScaleRequest, parsedRoute?: PreparedRoute, pointYears?: PointYears): ExhibitComputation => {
    const route = reuse ? cache!.route : parsedRoute;
    const req = reuse ? ({ ...request, medium: { kind: "route", geometry: (spec.medium as { geometry: unknown }).geometry } } as ScaleRequest) : request;
    return { ok: true, request: req, route, result: computeScale(req, { route, pointYears }) };
  };
  const head = parseScaleRequest(measured(scaleRequestFor(spec, [], durations)));
  const mp = head.ok ? markerPoints(markers) : null;
  if (head.ok && mp && (markers.length === 0 || (mp.oldest <= toYears(head.request.span.older) && mp.youngest >= toYears(head.request.span.younger)))) {
    return finish({ ...head.request, points: mp.points }, head.route, mp.years);
  }
  const full = parseScaleRequest(measured(scaleRequestFor(spec, markers, durations)));
  // the engine's issues keep their request paths; the message is in the composer's words
  if (!full.ok) return { ok: false, message: exhibitProblem(spec, markers, full.error.issues), issues: full.error.issues };
  return finish(full.request, full.route);
}

/**
 * computeExhibit's route cache for a saved route: measured once (10⁴–10⁵ points), then reused on
 * every keystroke of the preview (so it keeps what makes placing markers quicker). Undefined for a
 * length medium or a geometry the engine refuses.
 */
export function routeCacheFor(geometry: LineStringGeometry | null): { route: PreparedRoute; geometry: LineStringGeometry } | undefined {
  if (!geometry) return undefined;
  const parsed = parseGeoJsonRoute(geometry, "medium.geometry");
  return parsed.ok ? { route: prepareRoute(parsed.coords, { repeatedQueries: true }), geometry } : undefined;
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
