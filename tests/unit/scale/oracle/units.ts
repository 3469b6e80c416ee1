// TEST ORACLE (test-only): the scale engine as it was before the single formatter module (issue 10),
// with the figures issue's rounding rules. Labels of app/lib/scale are compared with it. Do not change.
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
  const clean = Number(raw.toPrecision(15));
  return Math.abs(clean - raw) <= Math.abs(raw) * 1e-14 ? clean : raw;
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

/** Round away binary noise: keep 15 significant digits (e.g. 0.0010000000000000002 → 0.001). */
export function clean(x: number): number {
  if (!Number.isFinite(x) || x === 0) return x;
  return Number(x.toPrecision(15));
}
