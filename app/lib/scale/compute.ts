/**
 * computeScale: the linear time-as-distance scale, marker distances and labels, durations,
 * insets, legibility warnings (warnings.ts) and (on routes) coordinates, bearings and walking figures.
 * The result's shape and the per-marker records are in results.ts.
 */
import { parseGeoJsonRoute, parseGpxRoute } from "../geo/parse";
import { positionsInto, prepareRoute, type PreparedRoute } from "../geo/route";
import { clean, toMetres, toYears, type UnitSystem } from "../units";
import { formatLengthSig, formatSig, formatYears, mediumResolution, scaleStatement } from "./format";
import { insetLabel, LEGIBILITY_DEFAULTS, LEGIBILITY_SOURCE, type Legibility, type MediumType } from "./legibility";
import { compareIds } from "./numbering";
import type { ScaleRequest } from "./schema";
import { pointsFor, type Placed } from "./points";
import type { DurationResult, InsetResult, ScaleResult } from "./results";
import { computeWarnings } from "./warnings";
import { DEFAULT_ACCESSIBLE_SPEED_MPS, DEFAULT_STEP_LENGTH_M, DEFAULT_WALKING_SPEED_MPS, STEP_LENGTH_RANGE_M, WALKING_SOURCES, walkingFor, type WalkingSettings } from "./walking";

export * from "./walking";

export type { DistanceLabel } from "./format";
export type { DurationInset, DurationResult, InsetPlacement, InsetResult, PointResult, ScaleResult } from "./results";
export type { ScaleWarning, WarningMarker, WarningCode } from "./warnings";

/** The points' ages and ± in years (NaN: none), in the request's order. */
export interface PointYears {
  ages: Float64Array;
  uncertainties: Float64Array;
}

export interface ComputeOptions {
  /** A route prepared earlier (reuse it across keystrokes: the cumulative distance is the costly part). */
  route?: PreparedRoute;
  /** The points' ages and ± already converted to years (the composer converts its markers once, not on every keystroke). */
  pointYears?: PointYears;
}


const ROUTE_CAUTION =
  "Planning figures, not a survey: walk the route first for hazards and accessibility, get the landowner's and authority's permission, and follow local codes for sign installation.";

/** Table numbers of the request's points: by age, oldest first, then by id. */
function numbersOf(ages: Float64Array, ids: readonly string[]): Int32Array {
  const numbers = new Int32Array(ids.length);
  let sorted = true;
  for (let i = 1; i < ages.length && sorted; i++) sorted = ages[i - 1] > ages[i] || (ages[i - 1] === ages[i] && compareIds(ids[i - 1], ids[i]) < 0);
  if (sorted) {
    for (let i = 0; i < numbers.length; i++) numbers[i] = i + 1;
    return numbers;
  }
  const order = Array.from(ids, (_, i) => i).sort((x, y) => ages[y] - ages[x] || compareIds(ids[x], ids[y]));
  order.forEach((k, i) => (numbers[k] = i + 1));
  return numbers;
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
      const parsed = medium.gpx !== undefined ? parseGpxRoute(medium.gpx, "medium.gpx") : parseGeoJsonRoute(medium.geometry, "medium.geometry");
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
  const system: UnitSystem = request.unitSystem ?? "metric";
  const length = (metres: number) => formatLengthSig(metres, 3, unit, system);

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
      statement: scaleStatement(mpy * m, o - y, system),
      mainFromOlderEndMetres: clean((olderYears - o) * mpy),
      mainToOlderEndMetres: clean((olderYears - y) * mpy),
      pointIds: [],
    };
  });

  // points: distances first (a route places them all in one pass), then one object per point
  // with every field it will have (no property added later)
  const n = request.points.length;
  const given = options.pointYears && options.pointYears.ages.length === n ? options.pointYears : null;
  const ages = given ? given.ages : new Float64Array(n);
  const ids: string[] = new Array(n);
  for (let i = 0; i < n; i++) {
    if (!given) ages[i] = toYears(request.points[i].age);
    ids[i] = request.points[i].id;
  }
  const numbers = numbersOf(ages, ids);

  const walkingSpeed = request.walkingSpeedMps ?? DEFAULT_WALKING_SPEED_MPS;
  const accessibleSpeed = request.accessibleSpeedMps ?? DEFAULT_ACCESSIBLE_SPEED_MPS;
  const stepLength = request.stepLengthM ?? DEFAULT_STEP_LENGTH_M;
  const shortStep = request.stepLengthM ?? STEP_LENGTH_RANGE_M[0];
  const routeStart = request.routeStart ?? "older";
  let placed: Placed | null = null;
  if (route) {
    const speedText = system === "us" ? `${formatSig(accessibleSpeed / 0.3048, 2)} ft/s` : `${accessibleSpeed} m/s`;
    const ds = new Float64Array(n);
    for (let i = 0; i < n; i++) ds[i] = clean(routeStart === "older" ? (olderYears - ages[i]) * mpy : (ages[i] - youngerYears) * mpy);
    const pos = positionsInto(route, ds, { lon: new Float64Array(n), lat: new Float64Array(n), bearing: new Float64Array(n) });
    const speeds: WalkingSettings = { walkingSpeed, accessibleSpeed, stepLength, shortStep, speedText };
    placed = { ds, lon: pos.lon, lat: pos.lat, bearing: pos.bearing, walking: walkingFor(ds, speeds, true) };
  }

  const points = pointsFor({ points: request.points, ages, uncertainties: given ? given.uncertainties : null, numbers, olderYears, youngerYears, metresPerYear: mpy, insets, resolution, unit, system, placed, routeStart });

  // durations: a located span (the last N years) shows only on an inset that contains it; a
  // comparison on any inset's scale, which it names
  const durations: DurationResult[] = request.durations.map((d) => {
    const years = d.years ?? toYears(d.duration!);
    const metres = years * mpy;
    const end = d.endsAgo ? toYears(d.endsAgo) : null;
    const located = end !== null && end >= youngerYears && end + years <= olderYears;
    const out: DurationResult = {
      id: d.id,
      years,
      located,
      endsAgoYears: located ? end : null,
      metres: clean(metres),
      text: `${formatYears(years)} = ${length(metres)}`,
      visible: metres >= legibility.minVisibleMetres,
      insets: insets.map((ins) => {
        const im = metres * ins.magnification;
        const covers = !located || (ins.youngerYears <= end! && ins.olderYears >= end! + years);
        const text = !covers
          ? `not in inset “${ins.label}”, which does not cover ${end === 0 ? `the last ${formatYears(years)}` : "it"}`
          : located
            ? `${length(im)} in inset “${ins.label}”`
            : `${length(im)} at the scale of inset “${ins.label}”`;
        return { insetId: ins.id, insetLabel: ins.label, metres: clean(im), covers, text, visible: covers && im >= legibility.minVisibleMetres };
      }),
    };
    if (d.label !== undefined) out.label = d.label;
    return out;
  });

  const { warnings, suggestedInsets } = computeWarnings({
    points,
    durations,
    insets,
    span: { olderYears, youngerYears },
    metresPerYear: mpy,
    totalMetres,
    legibility,
    mediumType,
    length,
  });
  for (const s of suggestedInsets) s.lengthMetres = clean(s.lengthMetres);

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
      statement: scaleStatement(mpy, spanYears, system),
      mediumKind: medium.kind,
      mediumType,
      unitSystem: system,
      legibility: { ...legibility, source: legibilitySource },
    },
    points,
    durations,
    insets,
    suggestedInsets,
    warnings,
  };
  if (route) {
    result.scale.route = {
      vertexCount: route.vertexCount,
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
