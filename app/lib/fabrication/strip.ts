// The whole straight exhibit at 1:1 as shapes in exhibit millimetres (x from the older end, y from
// the top of the printed area): interval bands in the standard chart colours with their names,
// marker ticks and labels, insets as magnified call-outs with their scale statements, a ruler along
// the bottom, and the title block with a scale bar at the older end. Panels (panel-page.ts) cut
// windows out of it. Pure.
import { textOn } from "../chart/colour";
import type { PublicationSnapshot } from "../publication/types";
import { rulerTicks } from "../scale/ruler";
import { RANKS } from "../timescale/types";
import { roughMeasure, wrapText, type Measure, type Shape } from "./draw";

export const INK = "#1a1a1a";
export const PAPER = "#ffffff";

export interface StripLayout {
  lengthMm: number;
  heightMm: number;
  shapes: Shape[];
  /** Marker ticks: marker id → x, mm from the older end (the engine's distance). */
  ticks: Map<string, number>;
  /** Where each band row sits, for tests and the location map. */
  rows: { rank: string; y: number; h: number }[];
}

/** Distance of an age from the older end, mm, by the engine's metres per year. */
export function mmAtAge(snapshot: PublicationSnapshot, ageMa: number): number {
  return (snapshot.exhibit.span.olderMa - ageMa) * 1e6 * snapshot.scale.metresPerYear * 1000;
}

/** The coarsest ranks whose bands are wide enough to read (half of them ≥ 20 mm), at most three rows. */
export function bandRanks(snapshot: PublicationSnapshot): string[] {
  const { olderMa, youngerMa } = snapshot.exhibit.span;
  const chosen: string[] = [];
  for (const rank of RANKS) {
    const widths = snapshot.edition.intervals
      .filter((iv) => iv.rank === rank)
      .map((iv) => mmAtAge(snapshot, Math.max(youngerMa, iv.topMa)) - mmAtAge(snapshot, Math.min(olderMa, iv.baseMa)));
    if (widths.length === 0) continue;
    const wide = widths.filter((w) => w >= 20).length;
    if (wide * 2 < widths.length && chosen.length > 0) break;
    chosen.push(rank);
    if (chosen.length === 3) break;
  }
  return chosen;
}

export interface StripOptions {
  heightMm: number;
  measure?: Measure;
  /** "Publication 1 (revision 4, …)" or the draft notice. */
  status: string;
}

/** The strip at 1:1 for a straight exhibit. */
export function layoutStrip(snapshot: PublicationSnapshot, options: StripOptions): StripLayout {
  const measure = options.measure ?? roughMeasure;
  const L = snapshot.scale.totalMetres * 1000;
  const A = options.heightMm;
  const shapes: Shape[] = [];
  const { olderMa, youngerMa } = snapshot.exhibit.span;

  // Interval bands.
  const ranks = bandRanks(snapshot);
  const bandTop = 0.16 * A;
  const bandBottom = 0.44 * A;
  const rowH = (bandBottom - bandTop) / Math.max(1, ranks.length);
  const rows = ranks.map((rank, i) => ({ rank, y: bandTop + i * rowH, h: rowH }));
  for (const row of rows) {
    const nameSize = Math.min(row.h * 0.42, 40);
    for (const iv of snapshot.edition.intervals.filter((x) => x.rank === row.rank)) {
      const x0 = mmAtAge(snapshot, Math.min(olderMa, iv.baseMa));
      const x1 = mmAtAge(snapshot, Math.max(youngerMa, iv.topMa));
      if (x1 - x0 <= 0) continue;
      shapes.push({ kind: "rect", x: x0, y: row.y, w: x1 - x0, h: row.h, fill: iv.color, stroke: INK, strokeMm: 0.2 });
      let size = nameSize;
      while (size > 4 && measure(iv.name, size, "sans") + 4 > x1 - x0) size *= 0.85;
      const w = measure(iv.name, size, "sans");
      if (w + 4 > x1 - x0) continue;
      // Long bands repeat their name about every half metre, so every print panel carries it.
      const copies = Math.max(1, Math.floor((x1 - x0) / Math.max(500, 3 * w)));
      for (let k = 0; k < copies; k++) {
        shapes.push({ kind: "text", x: x0 + ((k + 0.5) * (x1 - x0)) / copies, y: row.y + row.h / 2 + size * 0.35, text: iv.name, sizeMm: size, font: "sans", fill: textOn(iv.color), anchor: "middle" });
      }
    }
  }

  // Marker ticks and labels (rows of labels that never overlap, leader lines from the ticks).
  const ticks = new Map<string, number>();
  const tickTop = bandTop - 0.03 * A;
  const tickBottom = 0.5 * A;
  const labelSize = Math.min(0.026 * A, 16);
  const labelRows = 5;
  const rowEnds = new Array<number>(labelRows).fill(-Infinity);
  for (const m of snapshot.markers) {
    const x = m.distance.fromOlderEndMetres * 1000;
    ticks.set(m.id, x);
    shapes.push({ kind: "line", x1: x, y1: tickTop, x2: x, y2: tickBottom, stroke: INK, strokeMm: 0.5, role: "tick" });
    const text = `${m.signNumber} · ${m.label}`;
    const sub = m.ageText;
    const w = Math.max(measure(text, labelSize, "sans-bold"), measure(sub, labelSize * 0.85, "sans"));
    let r = rowEnds.findIndex((end) => end + labelSize < x);
    if (r < 0) r = rowEnds.indexOf(Math.min(...rowEnds));
    rowEnds[r] = x + w;
    const y = tickBottom + labelSize * 1.4 + r * labelSize * 2.5;
    if (r > 0) shapes.push({ kind: "line", x1: x, y1: tickBottom, x2: x, y2: y - labelSize, stroke: INK, strokeMm: 0.25, role: "leader" });
    shapes.push({ kind: "text", x: x + 1, y, text, sizeMm: labelSize, font: "sans-bold", fill: INK, anchor: "start" });
    shapes.push({ kind: "text", x: x + 1, y: y + labelSize * 1.05, text: sub, sizeMm: labelSize * 0.85, font: "sans", fill: INK, anchor: "start" });
  }

  // Insets: a magnified call-out below the labels, leader lines from where its sub-span sits.
  const insetTop = 0.8 * A;
  const insetH = 0.07 * A;
  const insetText = Math.min(0.018 * A, 10);
  snapshot.insets.forEach((inset, i) => {
    const from = inset.mainFromOlderEndMetres * 1000;
    const to = inset.mainToOlderEndMetres * 1000;
    const len = inset.lengthMetres * 1000;
    const x0 = Math.max(0, Math.min(from, L - len));
    const letter = String.fromCharCode(65 + (i % 26));
    shapes.push({ kind: "line", x1: from, y1: bandBottom, x2: x0, y2: insetTop, stroke: INK, strokeMm: 0.25, dashMm: [2, 1.5], role: "leader" });
    shapes.push({ kind: "line", x1: to, y1: bandBottom, x2: x0 + len, y2: insetTop, stroke: INK, strokeMm: 0.25, dashMm: [2, 1.5], role: "leader" });
    shapes.push({ kind: "rect", x: x0, y: insetTop, w: len, h: insetH, fill: "#f2efe6", stroke: INK, strokeMm: 0.35 });
    for (const m of snapshot.markers) {
      const p = m.insets.find((q) => q.insetId === inset.id);
      if (!p) continue;
      const x = x0 + p.fromOlderEndMetres * 1000;
      shapes.push({ kind: "line", x1: x, y1: insetTop, x2: x, y2: insetTop + insetH, stroke: INK, strokeMm: 0.4, role: "leader" });
      shapes.push({ kind: "text", x: x + 0.8, y: insetTop + insetH * 0.6, text: String(m.signNumber), sizeMm: insetText, font: "sans-bold", fill: INK, anchor: "start" });
    }
    shapes.push({ kind: "text", x: x0, y: insetTop - insetText * 0.5, text: `Inset ${letter}: ${inset.label} — ${inset.statement.lengthPerTime}`, sizeMm: insetText, font: "sans", fill: INK, anchor: "start" });
  });

  // Ruler along the bottom: round lengths of the exhibit's unit system.
  const rulerY = 0.955 * A;
  const ruler = rulerTicks(snapshot.scale.totalMetres, snapshot.exhibit.unitsPreference, Math.max(2, Math.round(snapshot.scale.totalMetres * 2)));
  const rulerText = Math.min(0.016 * A, 8);
  shapes.push({ kind: "line", x1: 0, y1: rulerY, x2: L, y2: rulerY, stroke: INK, strokeMm: 0.3, role: "ruler" });
  for (const t of ruler.ticks) {
    const x = t.metres * 1000;
    shapes.push({ kind: "line", x1: x, y1: rulerY - 0.015 * A, x2: x, y2: rulerY, stroke: INK, strokeMm: 0.3, role: "ruler" });
    shapes.push({ kind: "text", x: x + 0.8, y: rulerY - 0.018 * A, text: t.label, sizeMm: rulerText, font: "sans", fill: INK, anchor: "start" });
  }

  shapes.push(...titleBlock(snapshot, options.status, A, measure));
  return { lengthMm: L, heightMm: A, shapes, ticks, rows };
}

/** Title, scale statement, scale bar, chart edition and status, at the older end above the bands. */
function titleBlock(snapshot: PublicationSnapshot, status: string, A: number, measure: Measure): Shape[] {
  const out: Shape[] = [];
  const x = 8;
  const titleSize = Math.min(0.045 * A, 36);
  const small = Math.min(0.017 * A, 9);
  out.push({ kind: "text", x, y: 0.02 * A + titleSize, text: snapshot.exhibit.title, sizeMm: titleSize, font: "serif", fill: INK, anchor: "start" });
  const line2 = `${snapshot.scale.statement.lengthPerTime} · ${snapshot.scale.statement.timePerLength} · ${snapshot.organisation.name}`;
  out.push({ kind: "text", x, y: 0.02 * A + titleSize + small * 1.6, text: line2, sizeMm: small, font: "sans", fill: INK, anchor: "start" });
  const line3 = `${snapshot.edition.label} · ${status}`;
  const wrapped = wrapText(line3, Math.max(300, measure(line2, small, "sans")), small * 0.9, "sans", measure);
  wrapped.forEach((t, i) => out.push({ kind: "text", x, y: 0.02 * A + titleSize + small * (2.9 + i * 1.2), text: t, sizeMm: small * 0.9, font: "sans", fill: INK, anchor: "start" }));
  // Scale bar: 100 mm in ten 10 mm segments, and what 100 mm of exhibit stands for.
  const barX = x + Math.max(measure(snapshot.exhibit.title, titleSize, "serif"), measure(line2, small, "sans")) + 15;
  const barY = 0.02 * A + titleSize * 0.6;
  const barH = Math.min(0.012 * A, 5);
  for (let i = 0; i < 10; i++) out.push({ kind: "rect", x: barX + i * 10, y: barY, w: 10, h: barH, fill: i % 2 === 0 ? INK : PAPER, stroke: INK, strokeMm: 0.2 });
  const years = 0.1 / snapshot.scale.metresPerYear;
  out.push({ kind: "text", x: barX, y: barY + barH + small * 1.2, text: `100 mm = ${formatYears(years)}`, sizeMm: small, font: "sans", fill: INK, anchor: "start" });
  return out;
}

function formatYears(years: number): string {
  const v = (x: number) => Number(x.toPrecision(4)).toLocaleString("en-GB");
  if (years >= 1e9) return `${v(years / 1e9)} billion years`;
  if (years >= 1e6) return `${v(years / 1e6)} million years`;
  return `${v(years)} years`;
}
