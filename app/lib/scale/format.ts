/**
 * The one module that rounds and formats: the label rounding rule, the digits of a figure, and the
 * words of lengths, ages, durations and scale statements (English, comma thousands separator), in
 * metric or US customary units.
 *
 * Rounding rule of a distance label (see README.md):
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
 *
 * Speed: the preview formats every marker on every keystroke, so digits are made from integers
 * (no toFixed/toPrecision strings, no regular expressions) whenever the rounding is unambiguous;
 * the few exact ties fall back to the built-ins, so the text is always the same as theirs.
 */
import { METRES_PER_LENGTH_UNIT as UNIT_METRES, pow10, roundScaled, type LengthUnit, type UnitSystem } from "../units";

// ---------- digits ----------

function group(int: string): string {
  const n = int.length;
  if (n <= 3) return int;
  const head = n % 3 || 3;
  let out = int.slice(0, head);
  for (let k = head; k < n; k += 3) out += "," + int.slice(k, k + 3);
  return out;
}

/** |x| × 10^d rounded half up (as toFixed does on the exact value), or −1 when that is an exact tie or too large. */
function scaledInteger(a: number, d: number): number {
  return d > 20 ? -1 : roundScaled(a, d);
}

const ZEROS = ["", "0", "00", "000", "0000", "00000", "000000", "0000000", "00000000", "000000000"];

/**
 * The decimal part of a figure with its unit, ".05 m" for (5, 2, " m"): made once per number of
 * decimals (up to three) and unit, so that a label is one concatenation of whole part and table entry.
 * Suffixes are the few fixed unit words ("" or " m", " ft", …), so the tables stay small.
 */
const FRACTIONS = new Map<string, string[][]>();
function fractionText(f: number, d: number, suffix: string): string {
  let byDecimals = FRACTIONS.get(suffix);
  if (!byDecimals) {
    byDecimals = [];
    FRACTIONS.set(suffix, byDecimals);
  }
  let table = byDecimals[d];
  if (!table) {
    table = Array.from({ length: pow10(d) }, (_, k) => `.${String(k).padStart(d, "0")}${suffix}`);
    byDecimals[d] = table;
  }
  return table[f];
}

/** The text of the integer n / 10^d with d decimals and thousands separators, then `suffix` (few intermediate strings). */
function digits(n: number, d: number, negative: boolean, suffix = ""): string {
  const sign = negative && n !== 0 ? "−" : "";
  if (d === 0) return (n < 1000 ? sign + n : sign + group(String(n))) + suffix;
  const p = pow10(d);
  const i = Math.floor(n / p);
  const f = n - i * p;
  const int = i < 1000 ? String(i) : group(String(i));
  if (d <= 3) return sign + int + fractionText(f, d, suffix);
  if (f >= p / 10) return `${sign}${int}.${f}${suffix}`;
  const frac = String(f);
  return `${sign}${int}.${d - frac.length < ZEROS.length ? ZEROS[d - frac.length] : "0".repeat(d - frac.length)}${frac}${suffix}`;
}

function formatFixedSlow(x: number, d: number): string {
  const s = Math.abs(x).toFixed(d);
  const dot = s.indexOf(".");
  const int = dot < 0 ? s : s.slice(0, dot);
  const sign = x < 0 && Number(s) !== 0 ? "−" : "";
  return sign + (/^\d+$/.test(int) ? group(int) : int) + (dot < 0 ? "" : s.slice(dot));
}

/** Format with a fixed number of decimals and thousands separators: 4501 → "4,501", (0.05, 2) → "0.05". */
export function formatFixed(x: number, decimals: number): string {
  const d = Math.max(0, Math.min(20, Math.round(decimals)));
  const n = scaledInteger(Math.abs(x), d);
  return n >= 0 ? digits(n, d, x < 0) : formatFixedSlow(x, d);
}

/** Round to n significant figures. */
export function roundSig(x: number, n: number): number {
  if (x === 0 || !Number.isFinite(x)) return x;
  const e = Math.floor(Math.log10(Math.abs(x)));
  const f = 10 ** (n - 1 - e);
  return Math.round(x * f) / f;
}

/** Format with at most n significant figures, dropping trailing zeros: 3.9400 → "3.94", 1000 → "1,000". */
export function formatSig(x: number, n = 3): string {
  if (x === 0) return "0";
  const r = roundSig(x, n);
  const e = Math.floor(Math.log10(Math.abs(r)));
  let s = formatFixed(r, Math.max(0, n - 1 - e));
  if (s.includes(".")) {
    let end = s.length;
    while (s.charCodeAt(end - 1) === 48) end--; // "0"
    if (s.charCodeAt(end - 1) === 46) end--; // "."
    s = s.slice(0, end);
  }
  return s;
}

const SUPERSCRIPT = "⁰¹²³⁴⁵⁶⁷⁸⁹";

/** Very small figures in scientific words: 3.1e-5 → "3.1 × 10⁻⁵". */
export function formatScientific(x: number, n = 2): string {
  const e = Math.floor(Math.log10(Math.abs(x)));
  const m = roundSig(x / 10 ** e, n);
  const exp = String(Math.abs(e)).split("").map((c) => SUPERSCRIPT[Number(c)]).join("");
  return `${formatSig(m, n)} × 10${e < 0 ? "⁻" : ""}${exp}`;
}

// ---------- the rounding rule ----------

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
  if (y >= 1e-30 && y < 1e30) {
    // binary search in the table of powers (a logarithm costs more and needs correcting anyway)
    let lo = -30;
    let hi = 29; // invariant: pow10(lo) ≤ y < pow10(hi + 1)
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (pow10(mid) <= y) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  }
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
function uncertaintyPlace(x: number): number {
  const k = decadeExponent(x);
  return Math.floor(x / pow10(k) + 1e-9) <= 2 ? k - 1 : k;
}

/**
 * A ± as shown: rounded UP, never down, to one significant figure — two when the leading digit is
 * 1 or 2 — returning [shown value, place of its last figure]. 0.011 → [0.011, 0.001];
 * 0.0113 → [0.012, 0.001]; 0.054 → [0.06, 0.01]; 96 → [100, 10]; 50 → [50, 10].
 */
export function uncertaintyFigures(x: number): [number, number] {
  const k = uncertaintyPlace(x);
  const q = pow10(k);
  // Float noise (0.011 / 0.001 = 10.999999…) must not push a value already on the grid up a step.
  const n = Math.ceil(x / q - 1e-9);
  return [k >= 0 ? n * q : n / pow10(-k), q];
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
  return { stepMetres: RULE[0], basis, uncertaintyMetres: ruleUncertainty() };
}

/** stepRule's figures: [step, shown ± or NaN without one] (a typed array: no number is boxed per marker). */
const RULE = new Float64Array(2);

/** The shown ± stepRule wrote, or null without one. */
const ruleUncertainty = (): number | null => (Number.isNaN(RULE[1]) ? null : RULE[1]);

/** The rounding rule (see displayStep): writes the step and the shown ± into RULE and returns the basis. */
function stepRule(ageYears: number, uncertaintyYears: number | null | undefined, metresPerYear: number, resolutionMetres: number): RoundingBasis {
  let step = 0;
  let basis: RoundingBasis = "medium-resolution";
  RULE[1] = NaN;
  if (uncertaintyYears != null && uncertaintyYears > 0) {
    const x = uncertaintyYears * metresPerYear;
    const k = uncertaintyPlace(x);
    step = pow10(k);
    // as uncertaintyFigures: float noise (0.011 / 0.001 = 10.999999…) must not push a value already on the grid up a step
    const n = Math.ceil(x / step - 1e-9);
    RULE[1] = k >= 0 ? n * step : n / pow10(-k);
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
  RULE[0] = step;
  return basis;
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

const METRIC: readonly LengthUnit[] = ["mm", "cm", "m", "km"];
const US: readonly LengthUnit[] = ["in", "ft", "mi"];

/** A metric unit that reads well for a length (km from 10 km, m from 1 m, cm from 1 cm, else mm). */
export function autoMetricUnit(metres: number): LengthUnit {
  const m = Math.abs(metres);
  if (m >= 10_000) return "km";
  if (m >= 1) return "m";
  if (m >= 0.01) return "cm";
  return "mm";
}

/** A US customary unit that reads well for a length (mi from 10 mi, ft from 1 ft, else in). */
export function autoUsUnit(metres: number): LengthUnit {
  const m = Math.abs(metres);
  if (m >= 10 * UNIT_METRES.mi) return "mi";
  if (m >= UNIT_METRES.ft) return "ft";
  return "in";
}

const METRIC_METRES = METRIC.map((u) => UNIT_METRES[u]);
const US_METRES = US.map((u) => UNIT_METRES[u]);

/** Index in METRIC (or US) of the unit a label of this size and step is written in (see labelUnit). */
function labelUnitIndex(size: number, stepMetres: number, us: boolean): number {
  const f = us ? US_METRES : METRIC_METRES;
  let k = us ? (size >= 10 * UNIT_METRES.mi ? 2 : size >= UNIT_METRES.ft ? 1 : 0) : size >= 10_000 ? 3 : size >= 1 ? 2 : size >= 0.01 ? 1 : 0;
  // no more than three decimals: step down a unit while the step needs more (4,567.000000 km → 4,567,000.000 m)
  while (k > 0 && stepMetres / f[k] < 1e-3 * (1 - 1e-9)) k--;
  // a step of a centimetre or more is not shown in millimetres
  if (!us && k === 0 && stepMetres >= 0.01) k = 1;
  return k;
}

/** Unit for a label: the requested one, or one of the unit system chosen from the size of the distance. */
export function labelUnit(metres: number, stepMetres: number, unit?: LengthUnit, system: UnitSystem = "metric"): LengthUnit {
  if (unit) return unit;
  const us = system === "us";
  const k = labelUnitIndex(Math.max(Math.abs(metres), stepMetres), stepMetres, us);
  return us ? US[k] : METRIC[k];
}

/** 10^(1e-9): decimalsFor's tolerance, as a factor. */
const DECIMALS_TOLERANCE = 10 ** 1e-9;

/**
 * Decimals that show a step in a unit: 0 when the step is a whole unit or more. The same as
 * max(0, floor(−log10(step) + 1e-9)) — the largest d ≥ 0 with step ≤ 10^−d·10^(1e-9) — found
 * by comparison with the table of powers, without a logarithm.
 */
function decimalsFor(stepInUnit: number): number {
  let d = 0;
  while (d < 30 && stepInUnit <= pow10(-(d + 1)) * DECIMALS_TOLERANCE) d++;
  return d;
}

/** With no decimals: the multiple a value is rounded to — the step's decade (metric), or the next decade up (inches, feet, yards, miles), never finer. */
function wholeStep(stepInUnit: number): number {
  const q = decadeFloor(Math.max(1, stepInUnit));
  return q < stepInUnit * (1 - 1e-9) ? q * 10 : q;
}

/**
 * A distance rounded on a grid of the unit (y = metres in the unit; `decimals`, or the multiple `q`
 * when there are none): its value in the unit. `up` rounds up instead of to the nearest (a ±
 * converted to feet is never shown smaller).
 */
function gridValue(y: number, decimals: number, q: number, up: boolean): number {
  let value: number;
  if (decimals > 0) {
    const p = pow10(decimals);
    const n = up ? Math.ceil(Math.abs(y) * p - 1e-9) : scaledInteger(Math.abs(y), decimals);
    value = n >= 0 ? (y < 0 ? -n : n) / p : Number(y.toFixed(decimals));
  } else {
    value = (up ? Math.ceil(y / q - 1e-9) : Math.round(y / q)) * q;
  }
  return value === 0 ? 0 : value;
}

/** The same distance's text, with thousands separators ("4,501.00"), then `suffix` (" km"). */
function gridText(y: number, decimals: number, q: number, up: boolean, suffix = ""): string {
  if (decimals > 0) {
    const n = up ? Math.ceil(Math.abs(y) * pow10(decimals) - 1e-9) : scaledInteger(Math.abs(y), decimals);
    if (n >= 0) return digits(n, decimals, y < 0, suffix);
  }
  return formatFixed(gridValue(y, decimals, q, up), decimals) + suffix;
}

/** Round a distance at a step and express it in a unit without implying more precision than the step. */
export function roundAtStep(metres: number, stepMetres: number, unit: LengthUnit): DisplayLength {
  const uf = UNIT_METRES[unit];
  const decimals = decimalsFor(stepMetres / uf);
  const q = decimals > 0 ? 1 : wholeStep(stepMetres / uf);
  const value = gridValue(metres / uf, decimals, q, false);
  return { metres: value * uf, value, unit, decimals, text: `${gridText(metres / uf, decimals, q, false)} ${unit}` };
}

export interface DistanceLabel {
  fromOlderEnd: string;
  fromYoungerEnd: string;
  /** "± 0.05 km", or null without an uncertainty. */
  uncertainty: string | null;
  stepMetres: number;
  basis: RoundingBasis;
}

const IS_METRIC: Readonly<Record<LengthUnit, boolean>> = { mm: true, cm: true, m: true, km: true, in: false, ft: false, yd: false, mi: false };

const UNIT_SUFFIX: Readonly<Record<LengthUnit, string>> = { mm: " mm", cm: " cm", m: " m", km: " km", in: " in", ft: " ft", yd: " yd", mi: " mi" };

/** The labels of a distance from both ends, with its ± — all in one unit, on one grid. */
export function distanceLabel(fromOlder: number, fromYounger: number, step: DisplayStep, unit?: LengthUnit, system: UnitSystem = "metric"): DistanceLabel {
  return labelOnGrid(fromOlder, fromYounger, step.stepMetres, step.basis, step.uncertaintyMetres, unit, system);
}

/**
 * distanceLabel(fromOlder, fromYounger, displayStep(age, ±, scale, resolution), unit, system) in one
 * call, without the intermediate step object (the preview labels every marker on every keystroke).
 */
export function markerLabel(
  fromOlder: number,
  fromYounger: number,
  ageYears: number,
  uncertaintyYears: number | null,
  metresPerYear: number,
  resolutionMetres: number,
  unit?: LengthUnit,
  system: UnitSystem = "metric",
): DistanceLabel {
  const basis = stepRule(ageYears, uncertaintyYears, metresPerYear, resolutionMetres);
  return labelOnGrid(fromOlder, fromYounger, RULE[0], basis, ruleUncertainty(), unit, system);
}

function labelOnGrid(
  fromOlder: number,
  fromYounger: number,
  stepMetres: number,
  basis: RoundingBasis,
  uncertaintyMetres: number | null,
  unit: LengthUnit | undefined,
  system: UnitSystem,
): DistanceLabel {
  let u: LengthUnit;
  let uf: number;
  if (unit) {
    u = unit;
    uf = UNIT_METRES[u];
  } else {
    const us = system === "us";
    const larger = Math.abs(fromOlder > fromYounger ? fromOlder : fromYounger);
    const k = labelUnitIndex(larger > stepMetres ? larger : stepMetres, stepMetres, us);
    u = us ? US[k] : METRIC[k];
    uf = us ? US_METRES[k] : METRIC_METRES[k];
  }
  const suffix = UNIT_SUFFIX[u];
  const stepInUnit = stepMetres / uf;
  const decimals = decimalsFor(stepInUnit);
  const q = decimals > 0 ? 1 : wholeStep(stepInUnit);
  let unc: string | null = null;
  if (uncertaintyMetres !== null) {
    // the ± keeps its own figures (rounded up) even when the medium's resolution is coarser;
    // converted to inches, feet or miles it is rounded up again, never down
    const place = pow10(uncertaintyPlace(uncertaintyMetres));
    const uStep = (place < stepMetres ? place : stepMetres) / uf;
    const uDecimals = decimalsFor(uStep);
    unc = "± " + gridText(uncertaintyMetres / uf, uDecimals, uDecimals > 0 ? 1 : wholeStep(uStep), !IS_METRIC[u], suffix);
  }
  return {
    fromOlderEnd: gridText(fromOlder / uf, decimals, q, false, suffix),
    fromYoungerEnd: gridText(fromYounger / uf, decimals, q, false, suffix),
    uncertainty: unc,
    // a step is a power of ten from pow10: already the double nearest it (what clean() would give)
    stepMetres,
    basis,
  };
}

// ---------- words ----------

/** A length with up to n significant figures in a readable unit of the system: 0.067 → "6.7 cm"; tiny ones in scientific words. */
export function formatLengthSig(metres: number, n = 3, unit?: LengthUnit, system: UnitSystem = "metric"): string {
  const u = unit ?? (system === "us" ? autoUsUnit(metres) : autoMetricUnit(metres));
  const v = metres / UNIT_METRES[u];
  return `${v !== 0 && Math.abs(v) < 1e-4 ? formatScientific(v, Math.min(n, 2)) : formatSig(v, n)} ${u}`;
}

/** Readable length for statements: the unit that puts the number between 1 and 1,000 (1 and 5,280 feet in US units). */
export function formatLengthReadable(metres: number, n = 3, system: UnitSystem = "metric"): string {
  const m = Math.abs(metres);
  let u: LengthUnit;
  if (system === "us") u = m >= UNIT_METRES.mi ? "mi" : m >= UNIT_METRES.ft ? "ft" : "in";
  else u = m >= 1000 ? "km" : m >= 1 ? "m" : m >= 0.01 ? "cm" : "mm";
  return formatLengthSig(metres, n, u);
}

/** Years as words: 1000 → "1,000 years", 2.5e6 → "2.5 million years", 1 → "1 year". */
export function formatYears(years: number, n = 3): string {
  const y = Math.abs(years);
  if (y >= 1e9) return `${formatSig(years / 1e9, n)} billion years`;
  if (y >= 1e6) return `${formatSig(years / 1e6, n)} million years`;
  const s = formatSig(years, n);
  return `${s} ${s === "1" ? "year" : "years"}`;
}

/** An age before present as words: 66e6 → "66 million years ago", 0 → "the present". */
export function formatAgeAgo(years: number, n = 4): string {
  if (years === 0) return "the present";
  return `${formatYears(years, n)} ago`;
}

/** "10×", "1,000×". */
export function formatMagnification(m: number): string {
  return `${formatSig(m, 6)}×`;
}

/** Walking time: "45 s", "12 min", "1 h 05 min". */
export function formatDuration(seconds: number): string {
  if (seconds < 60) return `${Math.round(seconds)} s`;
  const minutes = Math.round(seconds / 60);
  if (minutes < 60) return `${minutes} min`;
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return `${h} h ${m < 10 ? "0" : ""}${m} min`;
}

/** A count to two significant figures from 100 up (a range is not more precise): 6,009 → "6,000". */
export function formatCountTwoFigures(n: number): string {
  if (n < 100 || !Number.isSafeInteger(n)) return formatFixed(n, 0);
  let p = 1;
  while (n >= p * 100) p *= 10; // n has two more digits than p has zeros
  return digits(Math.round(n / p) * p, 0, false);
}

export interface ScaleStatement {
  /** e.g. "1 m per million years" */
  lengthPerTime: string;
  /** e.g. "1 mm = 1,000 years" */
  timePerLength: string;
}

const TIME_STEPS: { years: number; words: string }[] = [
  { years: 1e9, words: "billion years" },
  { years: 1e6, words: "million years" },
  { years: 1e3, words: "thousand years" },
  { years: 100, words: "century" },
  { years: 1, words: "year" },
];

/**
 * The scale stated both ways. The time unit of "length per time" follows the span (million years
 * for spans of 10 million years or more, thousand years from 10,000 years, a century from 1,000
 * years, else a year); "time per length" uses the smallest of mm, cm, m, km (in US units: in, ft,
 * mi) that stands for at least one year.
 */
export function scaleStatement(metresPerYear: number, spanYears: number, system: UnitSystem = "metric"): ScaleStatement {
  let step = TIME_STEPS[TIME_STEPS.length - 1];
  if (spanYears >= 1e10) step = TIME_STEPS[0];
  else if (spanYears >= 1e7) step = TIME_STEPS[1];
  else if (spanYears >= 1e4) step = TIME_STEPS[2];
  else if (spanYears >= 1e3) step = TIME_STEPS[3];
  const lengthPerTime = `${formatLengthReadable(metresPerYear * step.years, 3, system)} per ${step.words}`;
  const units = system === "us" ? US : METRIC;
  let chosen = units[units.length - 1];
  for (const u of units) {
    if (UNIT_METRES[u] / metresPerYear >= 1) {
      chosen = u;
      break;
    }
  }
  return { lengthPerTime, timePerLength: `1 ${chosen} = ${formatYears(UNIT_METRES[chosen] / metresPerYear)}` };
}
