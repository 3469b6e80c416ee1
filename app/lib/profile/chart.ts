// The slope profile as shapes (for the trailhead board): elevation along the route, the stretches
// that break an ABA limit shaded orange and hatched (pattern as well as colour), stretches over 5 %
// that keep the limits shaded lightly, axes with round ticks. Pure: millimetres.
import { formatLength } from "../exhibit/display";
import type { UnitsPreference } from "../exhibit/types";
import type { Shape } from "../fabrication/draw";
import { rulerTicks } from "../scale/ruler";
import type { SlopeProfile } from "./profile";

export const FLAG_COLOUR = "#e67e22";
export const STEEP_COLOUR = "#f6e0b5";

export function profileChartShapes(profile: SlopeProfile, box: { x: number; y: number; w: number; h: number; units: UnitsPreference }): Shape[] {
  const { samples } = profile;
  const total = profile.totals.lengthMetres || 1;
  const lo = Math.floor(profile.totals.minElevationMetres / 5) * 5;
  const hi = Math.max(lo + 10, Math.ceil(profile.totals.maxElevationMetres / 5) * 5);
  const left = box.x + 14;
  const plotW = box.w - 14;
  const plotH = box.h - 8;
  const sx = (d: number) => left + (d / total) * plotW;
  const sy = (e: number) => box.y + plotH - ((e - lo) / (hi - lo)) * plotH;
  const out: Shape[] = [];
  for (const s of profile.stretches) {
    const x0 = sx(s.fromMetres);
    const w = Math.max(0.4, sx(s.toMetres) - x0);
    out.push({ kind: "rect", x: x0, y: box.y, w, h: plotH, fill: s.rule ? FLAG_COLOUR : STEEP_COLOUR });
    if (s.rule) out.push({ kind: "rect", x: x0, y: box.y, w, h: plotH, fill: null, hatch: true });
  }
  out.push({ kind: "line", x1: left, y1: box.y + plotH, x2: left + plotW, y2: box.y + plotH, stroke: "#1a1a1a", strokeMm: 0.3 });
  out.push({ kind: "line", x1: left, y1: box.y, x2: left, y2: box.y + plotH, stroke: "#1a1a1a", strokeMm: 0.3 });
  const step = Math.max(1, Math.ceil(samples.length / 600));
  for (let i = step; i < samples.length; i += step) {
    const a = samples[i - step];
    const b = samples[i];
    out.push({ kind: "line", x1: sx(a.distanceMetres), y1: sy(a.smoothedMetres), x2: sx(b.distanceMetres), y2: sy(b.smoothedMetres), stroke: "#1f4e79", strokeMm: 0.45 });
  }
  for (const t of rulerTicks(total, box.units, 6).ticks) {
    out.push({ kind: "line", x1: sx(t.metres), y1: box.y + plotH, x2: sx(t.metres), y2: box.y + plotH + 1.5, stroke: "#1a1a1a", strokeMm: 0.25 });
    out.push({ kind: "text", x: sx(t.metres), y: box.y + plotH + 5, text: t.label, sizeMm: 2.8, font: "sans", fill: "#1a1a1a", anchor: "middle" });
  }
  for (const e of [lo, (lo + hi) / 2, hi]) {
    out.push({ kind: "text", x: left - 1.5, y: sy(e) + 1, text: formatLength(e, box.units, 1), sizeMm: 2.6, font: "sans", fill: "#1a1a1a", anchor: "end" });
  }
  return out;
}
