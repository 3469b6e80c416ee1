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

/** Signed shift in Ma: "+1.45", "−1.9". */
export function fmtShift(x: number): string {
  const s = fmtMa(Math.abs(x));
  return x > 0 ? `+${s}` : x < 0 ? `−${s}` : "0";
}

export function fmtPercent(x: number): string {
  const r = Math.round(x * 100) / 100;
  return `${r > 0 ? "+" : r < 0 ? "−" : ""}${Math.abs(r).toFixed(2)} %`;
}
