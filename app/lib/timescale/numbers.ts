// Numbers as written on the chart are compared exactly, after rounding to 1e-9 Ma
// (a millisecond of geologic time is far below any chart precision; the rounding only removes
// floating-point noise such as 0.1 + 0.2).

const SCALE = 1e9;

/** Round to 1e-9 (Ma). */
export function round9(x: number): number {
  const r = Math.round(x * SCALE) / SCALE;
  return r === 0 ? 0 : r; // no "-0"
}

/** Equal as written (to 1e-9). */
export function sameMa(a: number, b: number): boolean {
  return round9(a) === round9(b);
}

/** Format an age for messages: "23.03", "0.0117", "4567". */
export function fmtMa(x: number): string {
  if (!Number.isFinite(x)) return String(x);
  const r = round9(x);
  const s = String(r);
  return s.includes("e") ? r.toFixed(9).replace(/0+$/, "").replace(/\.$/, "") : s;
}

export function fmtUncertainty(u: number | null): string {
  return u === null ? "none" : `± ${fmtMa(u)} Ma`;
}
