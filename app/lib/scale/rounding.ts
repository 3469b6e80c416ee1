/**
 * The rounding rule of a distance label (see README.md) and the powers of ten it works in:
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
import { decadeOf, pow10 } from "../units";

export type RoundingBasis = "uncertainty" | "age-significant-figures" | "medium-resolution";

export interface DisplayStep {
  /** Rounding step in metres (a power of ten). */
  stepMetres: number;
  /** Which part of the rule set the step. */
  basis: RoundingBasis;
  /** Length uncertainty rounded up to its shown figures (see uncertaintyFigures), metres; null without one. */
  uncertaintyMetres: number | null;
}

export { pow10 };

/** Exponent of the largest power of ten ≤ x (x > 0), a value within 1e-12 below a power counting as that power. */
function decadeExponent(x: number): number {
  const y = x * (1 + 1e-12);
  if (y >= 1e-30 && y < 1e30) return decadeOf(y); // from the binary exponent (a logarithm costs more and needs correcting anyway)
  let k = Math.floor(Math.log10(x));
  // guard against log10 rounding (e.g. log10(1000) = 2.9999999999999996)
  if (pow10(k) * 10 <= y) k++;
  if (pow10(k) > y) k--;
  return k;
}

/** Largest power of ten ≤ x (x > 0). */
export function decadeFloor(x: number): number {
  return pow10(decadeExponent(x));
}

/** Round x > 0 to one significant figure, returning [rounded, its decade]. 96 → [100, 100]. */
export function oneSignificantFigure(x: number): [number, number] {
  let k = decadeExponent(x);
  let r = Math.round(x / pow10(k));
  if (r >= 10) {
    k++;
    r = 1;
  }
  return [k >= 0 ? r * pow10(k) : r / pow10(-k), pow10(k)];
}

/** Exponent of the place of a ±'s last shown figure: its decade, one lower when it leads with 1 or 2. */
export function uncertaintyPlace(x: number): number {
  const k = decadeExponent(x);
  if (k >= -30 && k <= 30) return x < LEADS_WITH_3[k + 30] ? k - 1 : k;
  return leadsWith1Or2(x, pow10(k)) ? k - 1 : k;
}

/** The leading-digit test of uncertaintyPlace, on x in the decade of p. */
function leadsWith1Or2(x: number, p: number): boolean {
  return Math.floor(x / p + 1e-9) <= 2;
}

/**
 * LEADS_WITH_3[k + 30]: the least x for which leadsWith1Or2(x, 10^k) is false. The test is monotone
 * in x (a quotient, a sum and a floor, each rounded monotonically), so this one comparison decides
 * exactly as the test's division would (the preview asks it twice per marker); found once, by
 * bisection on the test itself down to neighbouring doubles.
 */
const LEADS_WITH_3 = new Float64Array(61);
for (let k = -30; k <= 30; k++) {
  const p = pow10(k);
  let lo = 2.5 * p; // passes
  let hi = 3.5 * p; // fails
  for (;;) {
    const mid = lo + (hi - lo) / 2;
    if (mid <= lo || mid >= hi) break;
    if (leadsWith1Or2(mid, p)) lo = mid;
    else hi = mid;
  }
  LEADS_WITH_3[k + 30] = hi;
}

/**
 * A ± as shown: rounded UP, never down, to one significant figure — two when the leading digit is
 * 1 or 2 — returning [shown value, place of its last figure]. 0.011 → [0.011, 0.001];
 * 0.0113 → [0.012, 0.001]; 0.054 → [0.06, 0.01]; 96 → [100, 10]; 50 → [50, 10].
 */
export function uncertaintyFigures(x: number): [number, number] {
  const k = uncertaintyPlace(x);
  return [roundUpAtPlace(x, k), pow10(k)];
}

/** x rounded up to a multiple of 10^k (the ± as shown; k from uncertaintyPlace). */
function roundUpAtPlace(x: number, k: number): number {
  const q = pow10(k);
  // Float noise (0.011 / 0.001 = 10.999999…) must not push a value already on the grid up a step.
  const n = Math.ceil(x / q - 1e-9);
  return k >= 0 ? n * q : n / pow10(-k);
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
export function displayStep(ageYears: number, uncertaintyYears: number | null | undefined, metresPerYear: number, resolutionMetres: number): DisplayStep {
  const basis = stepRule(ageYears, uncertaintyYears, metresPerYear, resolutionMetres);
  return { stepMetres: ruleStep(), basis, uncertaintyMetres: ruleUncertainty() };
}

/** stepRule's figures: [step, shown ± or NaN without one, the step's power of ten or NaN] (a typed array: no number is boxed per marker). */
const RULE = new Float64Array(3);

/** The step the last stepRule call set, metres. */
export const ruleStep = (): number => RULE[0];

/** The shown ± the last stepRule call set, or null without one. */
export const ruleUncertainty = (): number | null => (Number.isNaN(RULE[1]) ? null : RULE[1]);

/** The exponent k of the step the last stepRule call set (step = pow10(k)), or NaN when the medium's resolution set a step that is not a power of ten. */
export const ruleStepExponent = (): number => RULE[2];

/**
 * The rounding rule (see displayStep) without a result object, for the per-marker hot path: returns
 * the basis; the step and the shown ± are read with ruleStep() and ruleUncertainty() right after.
 */
export function stepRule(ageYears: number, uncertaintyYears: number | null | undefined, metresPerYear: number, resolutionMetres: number): RoundingBasis {
  let step = 0;
  let exponent = NaN;
  let basis: RoundingBasis = "medium-resolution";
  RULE[1] = NaN;
  if (uncertaintyYears != null && uncertaintyYears > 0) {
    const x = uncertaintyYears * metresPerYear;
    exponent = uncertaintyPlace(x);
    step = pow10(exponent);
    RULE[1] = roundUpAtPlace(x, exponent);
    basis = "uncertainty";
  } else if (ageYears !== 0) {
    const ageStepYears = decadeFloor(Math.abs(ageYears)) / 100; // a unit in the 3rd significant figure
    exponent = decadeExponent(ageStepYears * metresPerYear);
    step = pow10(exponent); // decadeFloor
    basis = "age-significant-figures";
  }
  if (!(step >= resolutionMetres)) {
    step = resolutionMetres;
    exponent = decadeExponent(step);
    if (pow10(exponent) !== step) exponent = NaN;
    basis = "medium-resolution";
  }
  RULE[0] = step;
  RULE[2] = exponent;
  return basis;
}
