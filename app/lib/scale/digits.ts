/**
 * The digits of a figure: fixed decimals with thousands separators, significant figures and
 * scientific words ("3.1 × 10⁻⁵"), in English (comma separator, "−" for minus).
 *
 * Speed: the preview formats every marker on every keystroke, so digits are made from integers
 * (no toFixed/toPrecision strings, no regular expressions) whenever the rounding is unambiguous;
 * the few exact ties fall back to the built-ins, so the text is always the same as theirs.
 */
import { pow10, roundScaled } from "../units";

function group(int: string): string {
  const n = int.length;
  if (n <= 3) return int;
  const head = n % 3 || 3;
  let out = int.slice(0, head);
  for (let k = head; k < n; k += 3) out += "," + int.slice(k, k + 3);
  return out;
}

/** |x| × 10^d rounded half up (as toFixed does on the exact value), or −1 when that is an exact tie or too large. */
export function scaledInteger(a: number, d: number): number {
  return d > 20 ? -1 : roundScaled(a, d);
}

/** ".05 m": the decimal part f of a figure with d decimals, its leading zeros, then the suffix. */
function decimalText(f: number, d: number, suffix: string): string {
  return "." + String(f).padStart(d, "0") + suffix;
}

/**
 * decimalText, kept: up to three decimals, each number of decimals and unit word has its table, so
 * that a label is one concatenation of whole part and table entry (from four decimals, the few
 * values below FEW_FIGURES, as they come). Suffixes are the few fixed unit
 * words ("" or " m", " ft", …), found by a short scan (they are the same string objects every time,
 * so each comparison is one check), not a hash lookup; past 16 of them, the text is written afresh.
 */
const FRACTION_SUFFIXES: string[] = [];
const FRACTION_TABLES: string[][][] = [];
const MAX_SUFFIXES = 16;
/** Decimal parts of 4 to MANY_DECIMALS decimals are kept below FEW_FIGURES (a ± has one or two figures). */
const MANY_DECIMALS = 12;
const FEW_FIGURES = 1000;
function fractionText(f: number, d: number, suffix: string): string {
  if (d > MANY_DECIMALS || (d > 3 && f >= FEW_FIGURES)) return decimalText(f, d, suffix);
  let s = 0;
  while (s < FRACTION_SUFFIXES.length && FRACTION_SUFFIXES[s] !== suffix) s++;
  if (s === FRACTION_SUFFIXES.length) {
    if (s >= MAX_SUFFIXES) return decimalText(f, d, suffix);
    FRACTION_SUFFIXES.push(suffix);
    FRACTION_TABLES.push([]);
  }
  const byDecimals = FRACTION_TABLES[s];
  if (d > 3) {
    // a ± far finer than the step ("± 0.000005 m"): few figures after many zeros, kept as they come
    const few = (byDecimals[d] ??= new Array<string>(FEW_FIGURES));
    return (few[f] ??= decimalText(f, d, suffix));
  }
  const table = (byDecimals[d] ??= Array.from({ length: pow10(d) }, (_, k) => decimalText(k, d, suffix)));
  return table[f];
}

/**
 * The whole part of a figure with its thousands separators, "4,501" (or "± 4,501"), for
 * 0 ≤ i < WHOLE_CACHED: made once per value and kept (the labels on one medium share a few hundred
 * whole parts, so a label is one concatenation of two kept strings).
 */
const WHOLE_CACHED = 100_000;
const WHOLE_TEXT: (string | undefined)[] = [];
const PLUS_MINUS_WHOLE_TEXT: (string | undefined)[] = [];
function wholeText(i: number, plusMinus: boolean): string {
  if (i >= WHOLE_CACHED) return plusMinus ? "± " + group(String(i)) : group(String(i));
  const table = plusMinus ? PLUS_MINUS_WHOLE_TEXT : WHOLE_TEXT;
  const known = table[i];
  if (known !== undefined) return known;
  while (table.length < i) table.push(undefined); // filled in order: the array stays dense
  const text = group(String(i));
  return (table[i] = plusMinus ? "± " + text : text);
}

/**
 * The text of the integer n / 10^d with d decimals and thousands separators, then `suffix` (few
 * intermediate strings); `plusMinus` puts "± " before it (an uncertainty, never negative).
 */
export function digits(n: number, d: number, negative: boolean, suffix = "", plusMinus = false): string {
  const sign = negative && n !== 0 ? "−" : "";
  if (d === 0) return (plusMinus ? "± " : "") + sign + group(String(n)) + suffix;
  if (n < 2_147_483_648 && d <= 9) {
    // in 32-bit integers (no number here is boxed when passed on)
    const p = POW10_INT[d];
    const i = (n / p) | 0;
    return joined(sign, plusMinus, wholeText(i, plusMinus && sign === ""), fractionText((n | 0) - i * p, d, suffix));
  }
  const p = pow10(d);
  const i = Math.floor(n / p);
  return joined(sign, plusMinus, wholeText(i, plusMinus && sign === ""), fractionText(n - i * p, d, suffix));
}

/** 10^d for 0 ≤ d ≤ 9, as 32-bit integers. */
const POW10_INT = Int32Array.from({ length: 10 }, (_, d) => 10 ** d);

/** A figure's parts joined: the sign (rare: no concatenation with an empty one), the whole part (with its "± " when there is no sign), the decimals and unit. */
function joined(sign: string, plusMinus: boolean, whole: string, tail: string): string {
  if (sign === "") return whole + tail;
  return (plusMinus ? "± " + sign : sign) + whole + tail;
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
  return withoutTrailingZeros(formatFixed(r, Math.max(0, n - 1 - e)));
}

/** A figure's decimals without their trailing zeros, and without the point when none is left: "3.9400" → "3.94", "46.000" → "46". */
export function withoutTrailingZeros(s: string): string {
  if (!s.includes(".")) return s;
  let end = s.length;
  while (s.charCodeAt(end - 1) === 48) end--; // "0"
  if (s.charCodeAt(end - 1) === 46) end--; // "."
  return s.slice(0, end);
}

const SUPERSCRIPT = "⁰¹²³⁴⁵⁶⁷⁸⁹";

/** Very small figures in scientific words: 3.1e-5 → "3.1 × 10⁻⁵". */
export function formatScientific(x: number, n = 2): string {
  const e = Math.floor(Math.log10(Math.abs(x)));
  const m = roundSig(x / 10 ** e, n);
  const exp = String(Math.abs(e)).split("").map((c) => SUPERSCRIPT[Number(c)]).join("");
  return `${formatSig(m, n)} × 10${e < 0 ? "⁻" : ""}${exp}`;
}
