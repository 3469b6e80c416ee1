// How lengths and ages read in the composer and on exports, in the exhibit's units preference.
import type { UnitsPreference } from "./types";
import { formatFixed, formatScientific, withoutTrailingZeros } from "../scale/format";
import { METRES_PER_LENGTH_UNIT, type LengthUnit } from "../units";

/**
 * A length for tables and sentences: metric picks km/m/cm/mm by size; US customary mi/ft/in. Shown
 * to the decimals of `stepMetres` (at most three), but never as a row of zeros: a small non-zero
 * length that would show as 0 keeps two significant figures ("0.0031 in" for an 80-year life on a 4.567 km trail), and
 * below a millionth of the unit it is written in scientific words ("3.1 × 10⁻⁷ in").
 */
export function formatLength(metres: number, units: UnitsPreference, stepMetres = 0.001, trimZeros = false): string {
  const m = Math.abs(metres);
  let unit: LengthUnit;
  if (units === "us") unit = m >= METRES_PER_LENGTH_UNIT.mi ? "mi" : m >= METRES_PER_LENGTH_UNIT.ft ? "ft" : "in";
  else unit = m >= 1000 ? "km" : m >= 1 ? "m" : m >= 0.01 ? "cm" : "mm";
  const v = metres / METRES_PER_LENGTH_UNIT[unit];
  let decimals = decimalsFor(stepMetres / METRES_PER_LENGTH_UNIT[unit], unit === "mm" || unit === "in" ? 2 : 3);
  if (v !== 0 && Math.abs(v) < 1) {
    const twoFigures = 1 - Math.floor(Math.log10(Math.abs(v)));
    if (twoFigures > 6) return `${formatScientific(v, 2)} ${unit}`;
    if (Number(Math.abs(v).toFixed(decimals)) === 0) decimals = Math.max(decimals, twoFigures);
  }
  const figure = formatFixed(v, decimals);
  return `${trimZeros ? withoutTrailingZeros(figure) : figure} ${unit}`;
}

/** formatLength without the fraction's trailing zeros, for a length as it was given or measured: "46 m", "10.776 m", "4.567 km" (not "46.000 m"). */
export function formatLengthAsGiven(metres: number, units: UnitsPreference, stepMetres = 0.001): string {
  return formatLength(metres, units, stepMetres, true);
}

/** Decimals that show a step of this size (in the display unit), at most `max`. */
function decimalsFor(step: number, max = 3) {
  if (!(step > 0)) return max;
  return Math.max(0, Math.min(max, Math.ceil(-Math.log10(step) - 1e-9)));
}

/** An age in Ma the way a label reads: "538.8 Ma", "11.7 ka", "4.567 Ga". */
export function formatAgeMa(ma: number): string {
  if (ma >= 1000) return `${Number((ma / 1000).toPrecision(6))} Ga`;
  if (ma >= 1) return `${Number(ma.toPrecision(7))} Ma`;
  if (ma >= 0.001) return `${Number((ma * 1000).toPrecision(6))} ka`;
  return `${Number((ma * 1e6).toPrecision(6))} a`;
}

/** The younger end of a span or inset: "the present" at age 0, otherwise formatAgeMa ("66 Ma"). */
export function formatSpanEndMa(ma: number): string {
  return ma === 0 ? "the present" : formatAgeMa(ma);
}

/** Text colour (ink or white) with the better contrast on a background colour. */
export function inkOn(hex: string): string {
  const c = hex.replace("#", "");
  const [r, g, b] = [0, 2, 4].map((i) => parseInt(c.slice(i, i + 2), 16) / 255).map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  const L = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  // contrast with #1f2430 (L≈0.017) vs white (1)
  return (L + 0.05) / (0.017 + 0.05) >= (1.05) / (L + 0.05) ? "#1f2430" : "#ffffff";
}
