// TEST ORACLE (test-only): the scale engine as it was before the single formatter module (issue 10),
// with the figures issue's rounding rules. Labels of app/lib/scale are compared with it. Do not change.
/**
 * Display rounding of distances: a label never shows more precision than the age supports.
 *
 * Rule (see README.md):
 *  1. With an uncertainty: the length uncertainty u = (age uncertainty) × (metres per year) is
 *     rounded UP (a ± is never shown smaller than it is) to one significant figure, or to two
 *     when the first digit is 1 or 2 (one figure would misstate it by up to 50 %: ± 0.011 km is
 *     not "± 0.01 km"); the distance is shown to the place of that last figure (u = 50 m →
 *     nearest 10 m; u = 11 m → nearest 1 m; u = 0.3 mm → nearest 0.1 mm), the uncertainty beside it.
 *  2. Without an uncertainty: the age is taken as good to three significant figures (66 Ma → to
 *     0.1 Ma); that step is converted to a length and the distance is shown to its decade. An age
 *     of exactly zero (the present) has no such step.
 *  3. Never finer than the medium's resolution: the decade at or below its smallest visible length
 *     (trail 0.05 m → 0.01 m; wall 3 mm → 1 mm).
 * The step actually used is the coarsest of these.
 */
import { METRES_PER_LENGTH_UNIT, type LengthUnit } from "./units";
import { autoMetricUnit, formatFixed } from "./format";

export type RoundingBasis = "uncertainty" | "age-significant-figures" | "medium-resolution";

export interface DisplayStep {
  /** Rounding step in metres (a power of ten). */
  stepMetres: number;
  /** Which part of the rule set the step. */
  basis: RoundingBasis;
  /** Length uncertainty rounded up to its shown figures (see uncertaintyFigures), metres; null without one. */
  uncertaintyMetres: number | null;
}

/** Largest power of ten ≤ x (x > 0). */
export function pow10(k: number): number {
  return k >= 0 ? 10 ** k : 1 / 10 ** -k; // 1/10⁴ is exactly rounded; 10 ** −4 may not be
}

export function decadeFloor(x: number): number {
  let d = pow10(Math.floor(Math.log10(x)));
  // guard against log10 rounding (e.g. log10(1000) = 2.9999999999999996)
  if (d * 10 <= x * (1 + 1e-12)) d = Number((d * 10).toPrecision(1));
  if (d > x * (1 + 1e-12)) d = Number((d / 10).toPrecision(1));
  return d;
}

/** Round x > 0 to one significant figure, returning [rounded, its decade]. 96 → [100, 100]. */
export function oneSignificantFigure(x: number): [number, number] {
  let q = decadeFloor(x);
  let r = Math.round(x / q);
  if (r >= 10) {
    q = Number((q * 10).toPrecision(1));
    r = 1;
  }
  return [Number((r * q).toPrecision(1)), q];
}

/**
 * A ± as shown: rounded UP, never down, to one significant figure — two when the leading digit is
 * 1 or 2 — returning [shown value, place of its last figure]. 0.011 → [0.011, 0.001];
 * 0.0113 → [0.012, 0.001]; 0.054 → [0.06, 0.01]; 96 → [100, 10]; 50 → [50, 10].
 */
export function uncertaintyFigures(x: number): [number, number] {
  const d = decadeFloor(x);
  const lead = Math.floor(x / d + 1e-9);
  const q = lead <= 2 ? Number((d / 10).toPrecision(1)) : d;
  // Float noise (0.011 / 0.001 = 10.999999…) must not push a value already on the grid up a step.
  const n = Math.ceil(x / q - 1e-9);
  return [Number((n * q).toPrecision(15)), q];
}

/** Decade at or below the smallest visible length: the medium's resolution. */
export function mediumResolution(minVisibleMetres: number): number {
  return decadeFloor(minVisibleMetres);
}

/**
 * The display step for one point.
 * @param ageYears age of the point (years before present)
 * @param uncertaintyYears ± age uncertainty in years (omit or null if none)
 * @param metresPerYear the scale
 * @param resolutionMetres the medium's resolution (see mediumResolution)
 */
export function displayStep(
  ageYears: number,
  uncertaintyYears: number | null | undefined,
  metresPerYear: number,
  resolutionMetres: number,
): DisplayStep {
  let step = 0;
  let basis: RoundingBasis = "medium-resolution";
  let uncertaintyMetres: number | null = null;
  if (uncertaintyYears != null && uncertaintyYears > 0) {
    const [u1, q] = uncertaintyFigures(uncertaintyYears * metresPerYear);
    uncertaintyMetres = u1;
    step = q;
    basis = "uncertainty";
  } else if (ageYears !== 0) {
    const ageStepYears = decadeFloor(Math.abs(ageYears)) / 100; // a unit in the 3rd significant figure
    step = decadeFloor(ageStepYears * metresPerYear);
    basis = "age-significant-figures";
  }
  if (!(step >= resolutionMetres)) {
    step = resolutionMetres;
    basis = "medium-resolution";
  }
  return { stepMetres: step, basis, uncertaintyMetres };
}

export interface DisplayLength {
  /** The rounded value in metres. */
  metres: number;
  /** The rounded value in the display unit. */
  value: number;
  unit: LengthUnit;
  decimals: number;
  /** e.g. "4,501.00 km" */
  text: string;
}

/** Unit for a label: the requested one, or a metric unit chosen from the size of the distance. */
export function labelUnit(metres: number, stepMetres: number, unit?: LengthUnit): LengthUnit {
  if (unit) return unit;
  const order: LengthUnit[] = ["mm", "cm", "m", "km"];
  let k = order.indexOf(autoMetricUnit(Math.max(Math.abs(metres), stepMetres)));
  // no more than three decimals: step down a unit while the step needs more (4,567.000000 km → 4,567,000.000 m)
  while (k > 0 && stepMetres / METRES_PER_LENGTH_UNIT[order[k]] < 1e-3 * (1 - 1e-9)) k--;
  // a step of a centimetre or more is not shown in millimetres
  if (order[k] === "mm" && stepMetres >= 0.01) k = 1;
  return order[k];
}

/** Round a distance at a step and express it in a unit without implying more precision than the step. */
export function roundAtStep(metres: number, stepMetres: number, unit: LengthUnit): DisplayLength {
  const uf = METRES_PER_LENGTH_UNIT[unit];
  const stepInUnit = stepMetres / uf;
  const decimals = Math.max(0, Math.floor(-Math.log10(stepInUnit) + 1e-9));
  let value: number;
  if (decimals > 0) {
    value = Number((metres / uf).toFixed(decimals));
  } else {
    // step in the unit is ≥ 1: round to a multiple of its decade (metric) or to whole units
    let q = decadeFloor(Math.max(1, stepInUnit));
    if (q < stepInUnit * (1 - 1e-9)) q *= 10; // non-metric units: the next decade up, never finer
    value = Math.round(metres / uf / q) * q;
  }
  if (Object.is(value, -0)) value = 0;
  return { metres: value * uf, value, unit, decimals, text: `${formatFixed(value, decimals)} ${unit}` };
}
