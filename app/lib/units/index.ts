/**
 * Units of age and length.
 *
 * Ages are years before present. 1 ka = 10³ a, 1 Ma = 10⁶ a, 1 Ga = 10⁹ a (SI prefixes applied to
 * the annus, as used for geologic ages).
 *
 * Lengths: metric by SI prefix; the inch, foot, yard and mile are the international units fixed by
 * the 1959 international yard and pound agreement and listed in NIST SP 811 (Appendix B):
 * 1 yd = 0.9144 m, 1 ft = 0.3048 m, 1 in = 25.4 mm = 0.0254 m, 1 mi = 1,760 yd = 1,609.344 m.
 */

export const AGE_UNITS = ["a", "ka", "Ma", "Ga"] as const;
export type AgeUnit = (typeof AGE_UNITS)[number];

export const LENGTH_UNITS = ["mm", "cm", "m", "km", "in", "ft", "yd", "mi"] as const;
export type LengthUnit = (typeof LENGTH_UNITS)[number];

/** How an exhibit reads lengths: metric (mm, cm, m, km) or US customary (in, ft, mi). */
export const UNIT_SYSTEMS = ["metric", "us"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

/** Years per unit of age. */
export const YEARS_PER_AGE_UNIT: Readonly<Record<AgeUnit, number>> = {
  a: 1,
  ka: 1e3,
  Ma: 1e6,
  Ga: 1e9,
};

/** Metres per unit of length (exact by definition). */
export const METRES_PER_LENGTH_UNIT: Readonly<Record<LengthUnit, number>> = {
  mm: 0.001,
  cm: 0.01,
  m: 1,
  km: 1000,
  in: 0.0254,
  ft: 0.3048,
  yd: 0.9144,
  mi: 1609.344,
};

export const LENGTH_UNIT_NAMES: Readonly<Record<LengthUnit, string>> = {
  mm: "millimetre",
  cm: "centimetre",
  m: "metre",
  km: "kilometre",
  in: "inch",
  ft: "foot",
  yd: "yard",
  mi: "mile",
};

export interface Quantity<U extends string> {
  value: number;
  unit: U;
}

export function isAgeUnit(u: unknown): u is AgeUnit {
  return typeof u === "string" && (AGE_UNITS as readonly string[]).includes(u);
}

export function isLengthUnit(u: unknown): u is LengthUnit {
  return typeof u === "string" && (LENGTH_UNITS as readonly string[]).includes(u);
}

export function unknownAgeUnitMessage(u: unknown): string {
  return `Unknown age unit ${JSON.stringify(u)}: use one of a, ka, Ma, Ga (years before present; 1 Ma = 1,000,000 years).`;
}

export function unknownLengthUnitMessage(u: unknown): string {
  return `Unknown length unit ${JSON.stringify(u)}: use one of mm, cm, m, km, in, ft, yd, mi.`;
}

/** Scale an exact decimal value by a power of ten without binary noise (e.g. 0.05 Ma → 50,000 a). */
function scaleDecimal(value: number, factor: number, divide = false): number {
  const raw = divide ? value / factor : value * factor;
  const c = clean(raw);
  return Math.abs(c - raw) <= Math.abs(raw) * 1e-14 ? c : raw;
}

/** Years before present for an age quantity. Throws RangeError on an unknown unit. */
export function toYears(q: Quantity<string>): number {
  if (!isAgeUnit(q.unit)) throw new RangeError(unknownAgeUnitMessage(q.unit));
  return scaleDecimal(q.value, YEARS_PER_AGE_UNIT[q.unit]);
}

/** Convert years to the given age unit. */
export function fromYears(years: number, unit: AgeUnit): number {
  return scaleDecimal(years, YEARS_PER_AGE_UNIT[unit], true);
}

/** Metres for a length quantity. Throws RangeError on an unknown unit. */
export function toMetres(q: Quantity<string>): number {
  if (!isLengthUnit(q.unit)) throw new RangeError(unknownLengthUnitMessage(q.unit));
  return scaleDecimal(q.value, METRES_PER_LENGTH_UNIT[q.unit]);
}

/** Convert metres to the given length unit. */
export function fromMetres(metres: number, unit: LengthUnit): number {
  return scaleDecimal(metres, METRES_PER_LENGTH_UNIT[unit], true);
}

/** 10^k for k = −30…30, each the double nearest the decimal power (1/10⁴ is exact; 10 ** −4 may not be). */
const POW10 = Array.from({ length: 61 }, (_, i) => (i >= 30 ? 10 ** (i - 30) : 1 / 10 ** (30 - i)));

/** decadeOf's view of a double's bits: EXPONENT[1] >>> 20 is the biased binary exponent of BITS[0] > 0 (little-endian, as every platform Node runs on). */
const BITS = new Float64Array(1);
const EXPONENT = new Uint32Array(BITS.buffer);
/** ⌊(e − 1023)·log10 2⌋ for each biased exponent e: the decade of 2^(e − 1023), so the decade of a number with that exponent or one below it. */
const DECADE_OF_EXPONENT = Int32Array.from({ length: 2048 }, (_, e) => Math.floor((e - 1023) * Math.LOG10E * Math.LN2));

/**
 * The decade of y: the largest k with pow10(k) ≤ y, for 1e-30 ≤ y < 1e30. From y's binary exponent
 * e (2^e ≤ y < 2^(e+1)): ⌊e·log10 2⌋ is the decade or one below it, so one comparison settles it.
 */
export function decadeOf(y: number): number {
  BITS[0] = y;
  const k = DECADE_OF_EXPONENT[EXPONENT[1] >>> 20];
  return y >= POW10[k + 31] ? k + 1 : k;
}

/** 10^k as the double nearest the decimal power. */
export function pow10(k: number): number {
  return k >= -30 && k <= 30 ? POW10[k + 30] : k >= 0 ? 10 ** k : 1 / 10 ** -k;
}

const SPLIT = 134_217_729; // 2^27 + 1 (Veltkamp splitting)

/**
 * a · 10^k (a ≥ 0, 0 ≤ k ≤ 22) rounded to an integer, half up — decided on the exact product, as
 * toFixed and toPrecision decide — or −1 when it is an exact tie or too large to be sure. The
 * product's rounding error is recovered exactly (Dekker's two-product), so no string is built.
 */
export function roundScaled(a: number, k: number): number {
  const b = POW10[k + 30];
  const p = a * b;
  if (!(p < 4e15) || k < 0 || k > 22) return -1;
  const fl = Math.floor(p);
  const d = p - fl - 0.5; // exact
  // fl + ½ is a double (p < 2⁵²) and rounding to nearest is monotonic: when p lies above it (below
  // it) the exact product does too. Only p landing on the half itself needs the exact product.
  if (d !== 0) return d > 0 ? fl + 1 : fl;
  return roundScaledOnHalf(a, b, p, fl);
}

/**
 * roundScaled when a·b rounded to p = fl + ½: the exact product decides (kept apart, so that the
 * common case stays small enough for the engine to inline where labels and walking figures call it).
 */
function roundScaledOnHalf(a: number, b: number, p: number, fl: number): number {
  let t = SPLIT * a;
  const ah = t - (t - a);
  const al = a - ah;
  t = SPLIT * b;
  const bh = t - (t - b);
  const bl = b - bh;
  const err = ah * bh - p + ah * bl + al * bh + al * bl; // exact product = p + err = fl + ½ + err
  if (err > 0) return fl + 1;
  if (err < 0) return fl;
  return -1;
}

/**
 * Round away binary noise: keep 15 significant digits (e.g. 0.0010000000000000002 → 0.001).
 * Same result as Number(x.toPrecision(15)), without building the string: x·10^(14−e) is rounded
 * to an integer on the exact product (roundScaled) and divided back — an exact integer over an
 * exact power of ten, so the double nearest the 15-digit decimal.
 */
export function clean(x: number): number {
  const a = x < 0 ? -x : x;
  if (a >= 1e-7 && a < 1e15) {
    const k = 14 - decadeOf(a); // 0 ≤ k ≤ 21 here, so 10^k is exact
    const n = roundScaled(a, k);
    if (n >= 1e14 && n < 1e15) {
      const r = n / POW10[k + 30];
      return x < 0 ? -r : r;
    }
  }
  return x === 0 || !Number.isFinite(x) ? x : Number(x.toPrecision(15));
}
