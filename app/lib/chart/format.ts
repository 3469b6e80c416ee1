// Figures as the chart prints them: ages in Ma without float noise, "~" for approximate, "±".
import { fmtMa } from "~/lib/timescale/numbers";
import type { Interval, Rank } from "~/lib/timescale";

export { fmtMa };

export const RANK_LABELS: Record<Rank, string> = {
  eon: "Eon",
  era: "Era",
  period: "Period",
  subperiod: "Sub-period",
  epoch: "Epoch",
  age: "Age",
};

/** "~635", "538.8 ± 0.6", "0.0117". */
export function fmtBase(iv: Pick<Interval, "baseMa" | "baseUncertaintyMa" | "approximate">): string {
  return `${iv.approximate ? "~" : ""}${fmtMa(iv.baseMa)}${iv.baseUncertaintyMa !== null ? ` ± ${fmtMa(iv.baseUncertaintyMa)}` : ""}`;
}

export function fmtGssp(gssp: boolean | null): string {
  return gssp === null ? "Not stated" : gssp ? "Yes" : "No";
}

/**
 * How a base is defined: "GSSP" (a point in a rock section), "GSSA" (a numerical age), "Ratified"
 * when the edition does not say which, "Not ratified", or "Not stated".
 */
export function fmtBoundaryKind(iv: Pick<Interval, "gssp" | "boundaryKind">): string {
  if (iv.gssp === null) return "Not stated";
  if (!iv.gssp) return "Not ratified";
  return iv.boundaryKind ?? "Ratified";
}

/** Signed shift in Ma: "+1.45", "−1.9". */
export function fmtShift(x: number): string {
  const s = fmtMa(Math.abs(x));
  return x > 0 ? `+${s}` : x < 0 ? `−${s}` : "0";
}

export function fmtPercent(x: number): string {
  const r = Math.round(x * 100) / 100;
  return `${r > 0 ? "+" : r < 0 ? "−" : ""}${Math.abs(r).toFixed(2)} %`;
}
