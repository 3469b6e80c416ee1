/**
 * The one entry for rounding and formatting (app/lib/scale): the label rounding rule
 * (rounding.ts), distance labels (labels.ts), the digits of a figure (digits.ts), and here the
 * words of lengths, ages, durations and scale statements (English, comma thousands separator), in
 * metric or US customary units. Import from this module; the others are its parts.
 */
import { METRES_PER_LENGTH_UNIT as UNIT_METRES, type LengthUnit, type UnitSystem } from "../units";
import { digits, formatFixed, formatScientific, formatSig } from "./digits";
import { autoMetricUnit, autoUsUnit, METRIC, US } from "./labels";

export * from "./digits";
export * from "./rounding";
export * from "./labels";

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
