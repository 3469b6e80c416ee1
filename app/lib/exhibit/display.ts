// How lengths and ages read in the composer and on exports, in the exhibit's units preference.
import type { UnitsPreference } from "./types";

function fmt(x: number, decimals: number) {
  return x.toLocaleString("en-GB", { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
}

/** A length for tables: metric picks km/m/cm/mm by size; US customary picks mi/ft/in. */
export function formatLength(metres: number, units: UnitsPreference, stepMetres = 0.001): string {
  const m = Math.abs(metres);
  if (units === "us") {
    if (m >= 1609.344) return `${fmt(metres / 1609.344, decimalsFor(stepMetres / 1609.344))} mi`;
    if (m >= 0.3048) return `${fmt(metres / 0.3048, decimalsFor(stepMetres / 0.3048))} ft`;
    return `${fmt(metres / 0.0254, decimalsFor(stepMetres / 0.0254, 2))} in`;
  }
  if (m >= 1000) return `${fmt(metres / 1000, decimalsFor(stepMetres / 1000))} km`;
  if (m >= 1) return `${fmt(metres, decimalsFor(stepMetres))} m`;
  if (m >= 0.01) return `${fmt(metres * 100, decimalsFor(stepMetres * 100))} cm`;
  return `${fmt(metres * 1000, decimalsFor(stepMetres * 1000, 2))} mm`;
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

/** Text colour (ink or white) with the better contrast on a background colour. */
export function inkOn(hex: string): string {
  const c = hex.replace("#", "");
  const [r, g, b] = [0, 2, 4].map((i) => parseInt(c.slice(i, i + 2), 16) / 255).map((v) => (v <= 0.03928 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4));
  const L = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  // contrast with #1f2430 (L≈0.017) vs white (1)
  return (L + 0.05) / (0.017 + 0.05) >= (1.05) / (L + 0.05) ? "#1f2430" : "#ffffff";
}
