/**
 * The per-marker part of computeScale: each marker's distances from both ends, its label on the
 * rounding rule's grid, its place on each inset that shows it, and on a route its place, bearing and
 * walking figures (worked out for all the markers at once beforehand: compute.ts). A loop of its
 * own, apart from the rest of the scale, so that the engine compiles it as one small function.
 */
import { clean, toYears, type LengthUnit, type UnitSystem } from "../units";
import { markerLabel } from "./format";
import { LonLat, NO_INSETS, Placement, Point, type InsetPlacement, type InsetResult, type PointResult } from "./results";
import type { ScaleRequest } from "./schema";
import type { Walking } from "./walking";

/** On a route: each marker's distance from the route's start (clean()ed), place, bearing and walking figures. */
export interface Placed {
  ds: Float64Array;
  lon: Float64Array;
  lat: Float64Array;
  bearing: Float64Array;
  walking: Walking[];
}

export interface MarkerInputs {
  points: ScaleRequest["points"];
  /** Ages in years, in the request's order. */
  ages: Float64Array;
  /** ± in years (NaN: none), when the caller converted them; null: read from the points. */
  uncertainties: Float64Array | null;
  /** Table numbers (computeScale's numbersOf). */
  numbers: Int32Array;
  olderYears: number;
  youngerYears: number;
  metresPerYear: number;
  /** The insets: each one's pointIds is filled in here. */
  insets: InsetResult[];
  /** The medium's resolution, metres (rounding.ts). */
  resolution: number;
  unit: LengthUnit | undefined;
  system: UnitSystem;
  /** null on a length. */
  placed: Placed | null;
  routeStart: "older" | "younger";
}

/** Every marker's result, in the request's order. */
export function pointsFor(m: MarkerInputs): PointResult[] {
  const { points: requested, ages, uncertainties, numbers, olderYears, youngerYears, metresPerYear: mpy, insets, resolution, unit, system, placed } = m;
  const fromStart = placed !== null && m.routeStart === "older";
  const n = requested.length;
  const points: PointResult[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const p = requested[i];
    const a = ages[i];
    const uy = uncertainties !== null ? uncertainties[i] : p.uncertainty ? toYears(p.uncertainty) : null;
    const uncYears = uy !== null && uy > 0 ? uy : null;
    const fromOlder = (olderYears - a) * mpy;
    const fromYounger = (a - youngerYears) * mpy;
    let placements: InsetPlacement[] | null = null;
    for (const ins of insets) {
      if (a <= ins.olderYears && a >= ins.youngerYears) {
        placements ??= [];
        const impy = mpy * ins.magnification;
        const fo = (ins.olderYears - a) * impy;
        const fy = (a - ins.youngerYears) * impy;
        placements.push(new Placement(ins.id, clean(fo), clean(fy), uncYears !== null ? clean(uncYears * impy) : null, markerLabel(fo, fy, a, uncYears, impy, resolution, unit, system)));
        ins.pointIds.push(p.id);
      }
    }
    const display = markerLabel(fromOlder, fromYounger, a, uncYears, mpy, resolution, unit, system);
    const uncertaintyMetres = uncYears !== null ? clean(uncYears * mpy) : null;
    points[i] =
      placed !== null
        ? // a marker's distance from the route's start is one of the two, already clean()ed
          new Point(p.id, numbers[i], a, uncYears, fromStart ? placed.ds[i] : clean(fromOlder), fromStart ? clean(fromYounger) : placed.ds[i], uncertaintyMetres, display, placements ?? NO_INSETS, new LonLat(placed.lon[i], placed.lat[i]), Math.round(placed.bearing[i] * 1e6) / 1e6, placed.walking[i], p.label)
        : new Point(p.id, numbers[i], a, uncYears, clean(fromOlder), clean(fromYounger), uncertaintyMetres, display, placements ?? NO_INSETS, undefined, 0, undefined, p.label);
  }
  return points;
}
