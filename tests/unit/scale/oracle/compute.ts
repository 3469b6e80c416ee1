// TEST ORACLE (test-only): the scale engine as it was before the single formatter module (issue 10),
// with the figures issue's rounding rules. Labels of app/lib/scale are compared with it. Do not change.
/**
 * computeScale: the linear time-as-distance scale, marker distances and labels, durations,
 * insets, legibility warnings and (on routes) coordinates, bearings and walking figures.
 */
import { parseGeoJsonRoute, parseGpxRoute } from "./geo-parse";
import { positionsAt, prepareRoute, type PreparedRoute } from "./route";
import { clean, toMetres, toYears, type LengthUnit } from "./units";
import { formatDuration, formatFixed, formatLengthSig, formatYears, scaleStatement, type ScaleStatement } from "./format";
import {
  findCrowded,
  insetLabel,
  LEGIBILITY_DEFAULTS,
  LEGIBILITY_SOURCE,
  suggestInsetForCluster,
  suggestInsetForDuration,
  type Legibility,
  type MediumType,
  type SuggestedInset,
} from "./legibility";
import { displayStep, labelUnit, mediumResolution, roundAtStep, uncertaintyFigures, type RoundingBasis } from "./rounding";
import type { ScaleRequest } from "./schema";

/** FHWA-RD-98-107: 1.2 m/s walking design speed. */
export const DEFAULT_WALKING_SPEED_MPS = 1.2;
/** MUTCD §4E.06: 0.9 m/s (3 ft/s) check for slower walkers. */
export const DEFAULT_ACCESSIBLE_SPEED_MPS = 0.9;
/**
 * Common practice (not a standard): a step is about 0.66 m (women) to 0.76 m (men). Step counts
 * are shown as that range; `steps` keeps the lower count (the long step), `stepsUpTo` the higher.
 */
export const STEP_LENGTH_RANGE_M = [0.66, 0.76] as const;
export const DEFAULT_STEP_LENGTH_M = STEP_LENGTH_RANGE_M[1];

export const WALKING_SOURCES = {
  walkingSpeed: "FHWA-RD-98-107: 1.2 m/s pedestrian design walking speed",
  accessibleSpeed: "MUTCD §4E.06: 0.9 m/s (3 ft/s) slow-walker check",
  stepLength: "common practice: about 0.66–0.76 m per step (not a standard)",
} as const;

export interface DistanceLabel {
  fromOlderEnd: string;
  fromYoungerEnd: string;
  /** "± 0.05 km", or null without an uncertainty. */
  uncertainty: string | null;
  stepMetres: number;
  basis: RoundingBasis;
}

export interface InsetPlacement {
  insetId: string;
  fromOlderEndMetres: number;
  fromYoungerEndMetres: number;
  uncertaintyMetres: number | null;
  display: DistanceLabel;
}

export interface Walking {
  distanceFromStartMetres: number;
  seconds: number;
  accessibleSeconds: number;
  /** Steps at the long step length (the lower count). */
  steps: number;
  /** Steps at the short step length of the common-practice range (equal to `steps` when a single step length was asked for). */
  stepsUpTo: number;
  /** e.g. "12 min walk (16 min at 0.9 m/s), about 1,100–1,300 steps" */
  text: string;
}

export interface PointResult {
  id: string;
  label?: string;
  ageYears: number;
  uncertaintyYears: number | null;
  fromOlderEndMetres: number;
  fromYoungerEndMetres: number;
  uncertaintyMetres: number | null;
  display: DistanceLabel;
  position?: { lon: number; lat: number };
  /** Direction of travel along the route at the marker, degrees clockwise from true north. */
  bearing?: number;
  walking?: Walking;
  insets: InsetPlacement[];
}

export interface DurationResult {
  id: string;
  label?: string;
  years: number;
  metres: number;
  text: string;
  visible: boolean;
  insets: { insetId: string; metres: number; text: string; visible: boolean }[];
}

export interface InsetResult {
  id: string;
  label: string;
  olderYears: number;
  youngerYears: number;
  magnification: number;
  /** Sub-span length × magnification, metres. */
  lengthMetres: number;
  metresPerYear: number;
  statement: ScaleStatement;
  /** Where the sub-span sits on the main scale (distance from the older end), metres. */
  mainFromOlderEndMetres: number;
  mainToOlderEndMetres: number;
  pointIds: string[];
}

export interface ScaleWarning {
  code:
    | "markers-too-close"
    | "markers-too-close-in-inset"
    | "markers-same-age"
    | "duration-too-small"
    | "inset-longer-than-medium";
  message: string;
  pointIds: string[];
  durationIds?: string[];
  insetId?: string;
  suggestedInset?: SuggestedInset;
}

export interface ScaleResult {
  scale: {
    olderYears: number;
    youngerYears: number;
    spanYears: number;
    totalMetres: number;
    metresPerYear: number;
    yearsPerMetre: number;
    metresPerMillionYears: number;
    yearsPerMillimetre: number;
    statement: ScaleStatement;
    mediumKind: "length" | "route";
    mediumType: MediumType;
    legibility: Legibility & { source: string };
    route?: {
      vertexCount: number;
      lengthMetres: number;
      start: "older" | "younger";
      walkingSpeedMps: number;
      accessibleSpeedMps: number;
      stepLengthM: number;
      /** The common-practice range of step lengths the counts span (both equal when one was asked for). */
      stepLengthRangeM: [number, number];
      walkingSeconds: number;
      accessibleWalkingSeconds: number;
      steps: number;
      stepsUpTo: number;
      sources: typeof WALKING_SOURCES;
      caution: string;
    };
  };
  points: PointResult[];
  durations: DurationResult[];
  insets: InsetResult[];
  suggestedInsets: SuggestedInset[];
  warnings: ScaleWarning[];
}

export interface ComputeOptions {
  /** A route prepared earlier (reuse it across keystrokes: the cumulative distance is the costly part). */
  route?: PreparedRoute;
}

const ROUTE_CAUTION =
  "Planning figures, not a survey: walk the route first for hazards and accessibility, get the landowner's and authority's permission, and follow local codes for sign installation.";

function label(
  fromOlder: number,
  fromYounger: number,
  step: ReturnType<typeof displayStep>,
  unit: LengthUnit | undefined,
): DistanceLabel {
  const u = labelUnit(Math.max(fromOlder, fromYounger), step.stepMetres, unit);
  const a = roundAtStep(fromOlder, step.stepMetres, u);
  const b = roundAtStep(fromYounger, step.stepMetres, u);
  let unc: string | null = null;
  if (step.uncertaintyMetres !== null) {
    // the uncertainty keeps its own figures (rounded up) even when the medium's resolution is coarser
    unc = `± ${roundAtStep(step.uncertaintyMetres, Math.min(step.stepMetres, uncertaintyFigures(step.uncertaintyMetres)[1]), u).text}`;
  }
  return { fromOlderEnd: a.text, fromYoungerEnd: b.text, uncertainty: unc, stepMetres: clean(step.stepMetres), basis: step.basis };
}

function idsText(ids: string[], max = 6): string {
  const shown = ids.slice(0, max).join(", ");
  return ids.length > max ? `${shown} and ${ids.length - max} more` : shown;
}

/** Compute the scale for a validated request (see parseScaleRequest). */
export function computeScale(request: ScaleRequest, options: ComputeOptions = {}): ScaleResult {
  const olderYears = toYears(request.span.older);
  const youngerYears = toYears(request.span.younger);
  const spanYears = olderYears - youngerYears;
  const medium = request.medium;

  let route: PreparedRoute | undefined;
  let totalMetres: number;
  if (medium.kind === "route") {
    route = options.route;
    if (!route) {
      const parsed =
        medium.gpx !== undefined
          ? parseGpxRoute(medium.gpx, "medium.gpx")
          : parseGeoJsonRoute(medium.geometry, "medium.geometry");
      if (!parsed.ok) throw new RangeError(parsed.issues[0].message);
      route = prepareRoute(parsed.coords);
    }
    totalMetres = route.totalMetres;
  } else {
    totalMetres = toMetres(medium.length);
  }

  const mpy = totalMetres / spanYears;
  const mediumType: MediumType = request.mediumType ?? (medium.kind === "route" ? "trail" : "other");
  const defaults = LEGIBILITY_DEFAULTS[mediumType];
  const legibility: Legibility = {
    minVisibleMetres: request.legibility?.minVisibleMetres ?? defaults.minVisibleMetres,
    minSpacingMetres: request.legibility?.minSpacingMetres ?? defaults.minSpacingMetres,
  };
  const legibilitySource =
    request.legibility?.minVisibleMetres !== undefined || request.legibility?.minSpacingMetres !== undefined
      ? "set for this exhibit (unset values: common practice default)"
      : LEGIBILITY_SOURCE;
  const resolution = mediumResolution(legibility.minVisibleMetres);
  const unit = request.lengthUnit;

  // insets
  const insets: InsetResult[] = request.insets.map((ins, i) => {
    const o = toYears(ins.older);
    const y = toYears(ins.younger);
    const m = ins.magnification;
    return {
      id: ins.id ?? `inset-${i + 1}`,
      label: ins.label ?? insetLabel(o, y, m),
      olderYears: o,
      youngerYears: y,
      magnification: m,
      lengthMetres: clean((o - y) * mpy * m),
      metresPerYear: clean(mpy * m),
      statement: scaleStatement(mpy * m, o - y),
      mainFromOlderEndMetres: clean((olderYears - o) * mpy),
      mainToOlderEndMetres: clean((olderYears - y) * mpy),
      pointIds: [],
    };
  });

  // points
  const points: PointResult[] = request.points.map((p) => {
    const a = toYears(p.age);
    const uy = p.uncertainty ? toYears(p.uncertainty) : null;
    const uncYears = uy !== null && uy > 0 ? uy : null;
    const fromOlder = (olderYears - a) * mpy;
    const fromYounger = (a - youngerYears) * mpy;
    const step = displayStep(a, uncYears, mpy, resolution);
    const placements: InsetPlacement[] = [];
    for (const ins of insets) {
      if (a <= ins.olderYears && a >= ins.youngerYears) {
        const impy = mpy * ins.magnification;
        const st = displayStep(a, uncYears, impy, resolution);
        const fo = (ins.olderYears - a) * impy;
        const fy = (a - ins.youngerYears) * impy;
        placements.push({
          insetId: ins.id,
          fromOlderEndMetres: clean(fo),
          fromYoungerEndMetres: clean(fy),
          uncertaintyMetres: uncYears !== null ? clean(uncYears * impy) : null,
          display: label(fo, fy, st, unit),
        });
        ins.pointIds.push(p.id);
      }
    }
    const out: PointResult = {
      id: p.id,
      ageYears: a,
      uncertaintyYears: uncYears,
      fromOlderEndMetres: clean(fromOlder),
      fromYoungerEndMetres: clean(fromYounger),
      uncertaintyMetres: uncYears !== null ? clean(uncYears * mpy) : null,
      display: label(fromOlder, fromYounger, step, unit),
      insets: placements,
    };
    if (p.label !== undefined) out.label = p.label;
    return out;
  });

  // route positions and walking figures
  const walkingSpeed = request.walkingSpeedMps ?? DEFAULT_WALKING_SPEED_MPS;
  const accessibleSpeed = request.accessibleSpeedMps ?? DEFAULT_ACCESSIBLE_SPEED_MPS;
  const stepLength = request.stepLengthM ?? DEFAULT_STEP_LENGTH_M;
  const shortStep = request.stepLengthM ?? STEP_LENGTH_RANGE_M[0];
  // A range is not more precise than two figures: 6,009–6,919 steps reads "6,000–6,900".
  const twoFigures = (n: number) => (n >= 100 ? Number(n.toPrecision(2)) : n);
  const stepsText = (low: number, high: number) =>
    low === high ? `about ${formatFixed(twoFigures(low), 0)} steps` : `about ${formatFixed(twoFigures(low), 0)}–${formatFixed(twoFigures(high), 0)} steps`;
  const routeStart = request.routeStart ?? "older";
  const walkingFor = (d: number): Walking => {
    const seconds = d / walkingSpeed;
    const accessibleSeconds = d / accessibleSpeed;
    const steps = Math.round(d / stepLength);
    const stepsUpTo = Math.round(d / shortStep);
    return {
      distanceFromStartMetres: clean(d),
      seconds: clean(seconds),
      accessibleSeconds: clean(accessibleSeconds),
      steps,
      stepsUpTo,
      text: `${formatDuration(seconds)} walk (${formatDuration(accessibleSeconds)} at ${accessibleSpeed} m/s), ${stepsText(steps, stepsUpTo)}`,
    };
  };
  if (route) {
    const ds = points.map((p) => (routeStart === "older" ? p.fromOlderEndMetres : p.fromYoungerEndMetres));
    const pos = positionsAt(route, ds);
    points.forEach((p, k) => {
      p.position = { lon: pos[k].lon, lat: pos[k].lat };
      p.bearing = Math.round(pos[k].bearing * 1e6) / 1e6;
      p.walking = walkingFor(ds[k]);
    });
  }

  // durations
  const durations: DurationResult[] = request.durations.map((d) => {
    const years = d.years ?? toYears(d.duration!);
    const metres = years * mpy;
    const out: DurationResult = {
      id: d.id,
      years,
      metres: clean(metres),
      text: `${formatYears(years)} = ${formatLengthSig(metres, 3, unit)}`,
      visible: metres >= legibility.minVisibleMetres,
      insets: insets.map((ins) => {
        const im = metres * ins.magnification;
        return { insetId: ins.id, metres: clean(im), text: formatLengthSig(im, 3, unit), visible: im >= legibility.minVisibleMetres };
      }),
    };
    if (d.label !== undefined) out.label = d.label;
    return out;
  });

  // legibility warnings and suggested insets
  const warnings: ScaleWarning[] = [];
  const suggestions: SuggestedInset[] = [];
  const addSuggestion = (s: SuggestedInset): SuggestedInset => {
    const same = suggestions.find(
      (x) => x.olderYears === s.olderYears && x.youngerYears === s.youngerYears && x.magnification === s.magnification,
    );
    if (same) {
      for (const id of s.pointIds) if (!same.pointIds.includes(id)) same.pointIds.push(id);
      for (const id of s.durationIds) if (!same.durationIds.includes(id)) same.durationIds.push(id);
      return same;
    }
    suggestions.push(s);
    return s;
  };
  const span = { olderYears, youngerYears };
  const spacingText = `${formatLengthSig(legibility.minSpacingMetres)} minimum spacing for a ${mediumType}`;
  const placed = points.map((p) => ({ id: p.id, ageYears: p.ageYears, metres: (olderYears - p.ageYears) * mpy }));
  for (const cl of findCrowded(placed, legibility.minSpacingMetres)) {
    if (cl.sameAge.length > 0) {
      warnings.push({
        code: "markers-same-age",
        message: `Markers ${idsText(cl.sameAge)} have the same age and fall on the same spot; combine them into one marker or stack their labels.`,
        pointIds: cl.sameAge,
      });
      if (!Number.isFinite(cl.minAgeGapYears)) continue;
    }
    // does an inset already spread them?
    const covering = insets.find(
      (ins) => cl.ages.every((a) => a <= ins.olderYears && a >= ins.youngerYears),
    );
    if (covering) {
      const gap = cl.minAgeGapYears * mpy * covering.magnification;
      if (gap >= legibility.minSpacingMetres) continue;
      const sug = suggestInsetForCluster(cl, span, mpy, legibility.minSpacingMetres);
      warnings.push({
        code: "markers-too-close-in-inset",
        message: `Even on inset "${covering.label}", markers ${idsText(cl.ids)} are as little as ${formatLengthSig(gap)} apart (less than the ${spacingText}).${sug ? ` Suggested inset: ${sug.label}.` : ""}`,
        pointIds: cl.ids,
        insetId: covering.id,
        ...(sug ? { suggestedInset: addSuggestion(sug) } : {}),
      });
      continue;
    }
    const sug = suggestInsetForCluster(cl, span, mpy, legibility.minSpacingMetres);
    warnings.push({
      code: "markers-too-close",
      message: `Markers ${idsText(cl.ids)} are as little as ${formatLengthSig(cl.minAgeGapYears * mpy)} apart, less than the ${spacingText}.${sug ? ` Suggested inset: ${sug.label} (${formatLengthSig(sug.lengthMetres)} long).` : ""}`,
      pointIds: cl.ids,
      ...(sug ? { suggestedInset: addSuggestion(sug) } : {}),
    });
  }
  for (const d of durations) {
    if (d.visible) continue;
    if (d.insets.some((x) => x.visible)) continue;
    // an inset already suggested for crowded markers may be enough
    const fits = suggestions.find(
      (x) => x.magnification * d.metres >= legibility.minVisibleMetres && x.olderYears - x.youngerYears >= d.years,
    );
    const sug = fits ?? suggestInsetForDuration({ id: d.id, years: d.years }, span, mpy, legibility.minVisibleMetres);
    if (fits && !fits.durationIds.includes(d.id)) fits.durationIds.push(d.id);
    warnings.push({
      code: "duration-too-small",
      message: `${d.label ?? d.id}: ${formatYears(d.years)} is ${formatLengthSig(d.metres)} on this scale, smaller than the ${formatLengthSig(legibility.minVisibleMetres)} a visitor can see on a ${mediumType}.${sug ? ` Suggested inset: ${sug.label}.` : ""}`,
      pointIds: [],
      durationIds: [d.id],
      ...(sug ? { suggestedInset: addSuggestion(sug) } : {}),
    });
  }
  for (const ins of insets) {
    if (ins.lengthMetres > totalMetres) {
      warnings.push({
        code: "inset-longer-than-medium",
        message: `Inset "${ins.label}" is ${formatLengthSig(ins.lengthMetres)} long, longer than the whole exhibit (${formatLengthSig(totalMetres)}).`,
        pointIds: ins.pointIds,
        insetId: ins.id,
      });
    }
  }
  for (const s of suggestions) s.lengthMetres = clean(s.lengthMetres);

  const result: ScaleResult = {
    scale: {
      olderYears,
      youngerYears,
      spanYears,
      totalMetres: clean(totalMetres),
      metresPerYear: clean(mpy),
      yearsPerMetre: clean(1 / mpy),
      metresPerMillionYears: clean(mpy * 1e6),
      yearsPerMillimetre: clean(0.001 / mpy),
      statement: scaleStatement(mpy, spanYears),
      mediumKind: medium.kind,
      mediumType,
      legibility: { ...legibility, source: legibilitySource },
    },
    points,
    durations,
    insets,
    suggestedInsets: suggestions,
    warnings,
  };
  if (route) {
    result.scale.route = {
      vertexCount: route.lon.length,
      lengthMetres: clean(route.totalMetres),
      start: routeStart,
      walkingSpeedMps: walkingSpeed,
      accessibleSpeedMps: accessibleSpeed,
      stepLengthM: stepLength,
      stepLengthRangeM: request.stepLengthM === undefined ? [...STEP_LENGTH_RANGE_M] : [stepLength, stepLength],
      walkingSeconds: clean(route.totalMetres / walkingSpeed),
      accessibleWalkingSeconds: clean(route.totalMetres / accessibleSpeed),
      steps: Math.round(route.totalMetres / stepLength),
      stepsUpTo: Math.round(route.totalMetres / shortStep),
      sources: WALKING_SOURCES,
      caution: ROUTE_CAUTION,
    };
  }
  return result;
}
