// TEST ORACLE (test-only): the scale engine as it was before the single formatter module (issue 10),
// with the figures issue's rounding rules. Labels of app/lib/scale are compared with it. Do not change.
/**
 * Human-readable numbers, lengths, ages and scale statements (English, comma thousands separator).
 */
import { METRES_PER_LENGTH_UNIT, type LengthUnit } from "./units";

/** Format with a fixed number of decimals and thousands separators: 4501 → "4,501", (0.05, 2) → "0.05". */
export function formatFixed(x: number, decimals: number): string {
  const d = Math.max(0, Math.min(20, Math.round(decimals)));
  const s = Math.abs(x).toFixed(d);
  const [int, frac] = s.split(".");
  const withSep = int.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  const sign = x < 0 && Number(s) !== 0 ? "−" : "";
  return sign + withSep + (frac ? `.${frac}` : "");
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
  const decimals = Math.max(0, n - 1 - e);
  let s = formatFixed(r, decimals);
  if (s.includes(".")) s = s.replace(/\.?0+$/, "");
  return s;
}

/** A metric unit that reads well for a length (km from 10 km, m from 1 m, cm from 1 cm, else mm). */
export function autoMetricUnit(metres: number): LengthUnit {
  const m = Math.abs(metres);
  if (m >= 10_000) return "km";
  if (m >= 1) return "m";
  if (m >= 0.01) return "cm";
  return "mm";
}

/** A length with up to n significant figures in a readable metric unit: 0.067 → "6.7 cm". */
export function formatLengthSig(metres: number, n = 3, unit?: LengthUnit): string {
  let u = unit ?? autoMetricUnit(metres);
  if (!unit && u === "km" && Math.abs(metres) < 1000) u = "m";
  return `${formatSig(metres / METRES_PER_LENGTH_UNIT[u], n)} ${u}`;
}

/** Readable length for statements: picks the unit so that the number is between 1 and 1,000. */
export function formatLengthReadable(metres: number, n = 3): string {
  const m = Math.abs(metres);
  let u: LengthUnit;
  if (m >= 1000) u = "km";
  else if (m >= 1) u = "m";
  else if (m >= 0.01) u = "cm";
  else u = "mm";
  return `${formatSig(metres / METRES_PER_LENGTH_UNIT[u], n)} ${u}`;
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
  return `${h} h ${String(m).padStart(2, "0")} min`;
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
 * years, else a year); "time per length" uses the smallest of mm, cm, m, km that stands for at
 * least one year.
 */
export function scaleStatement(metresPerYear: number, spanYears: number): ScaleStatement {
  let step = TIME_STEPS[TIME_STEPS.length - 1];
  if (spanYears >= 1e10) step = TIME_STEPS[0];
  else if (spanYears >= 1e7) step = TIME_STEPS[1];
  else if (spanYears >= 1e4) step = TIME_STEPS[2];
  else if (spanYears >= 1e3) step = TIME_STEPS[3];
  const lengthPerTime = `${formatLengthReadable(metresPerYear * step.years)} per ${step.words}`;

  const units: LengthUnit[] = ["mm", "cm", "m", "km"];
  let chosen: LengthUnit = "km";
  for (const u of units) {
    if (METRES_PER_LENGTH_UNIT[u] / metresPerYear >= 1) {
      chosen = u;
      break;
    }
  }
  const timePerLength = `1 ${chosen} = ${formatYears(METRES_PER_LENGTH_UNIT[chosen] / metresPerYear)}`;
  return { lengthPerTime, timePerLength };
}
