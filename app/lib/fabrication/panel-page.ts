// One print panel as a page: a window of the 1:1 strip (strip.ts) with the bleed around it, crop
// marks in the bleed, and along the bottom of the panel its number ("3 of 12"), the stretch of the
// exhibit it shows, where the overlaps are, and a small map of all panels. Pure.
import type { Page, Shape, Measure } from "./draw";
import { extentX, roughMeasure, translate } from "./draw";
import type { Panel, PanelOptions } from "./panels";
import { INK, type StripLayout } from "./strip";

/** The band along the bottom of every panel for its number, stretch and map, mm. */
export function chromeHeightMm(heightMm: number): number {
  return Math.min(30, Math.max(12, 0.07 * heightMm));
}

/** The height of the exhibit drawing inside a panel of `heightMm`. */
export function artHeightMm(heightMm: number): number {
  return heightMm - chromeHeightMm(heightMm);
}

export interface PanelIndex {
  /** Shapes sorted by their left edge, with their extents, for cutting windows quickly. */
  items: { x0: number; x1: number; shape: Shape }[];
  /** The widest shape, mm: a window search starts this far to the left. */
  maxWidth: number;
}

/** Sort the strip's shapes once so each of many panels finds its own in O(log n + k). */
export function indexStrip(strip: StripLayout, measure: Measure = roughMeasure): PanelIndex {
  const items = strip.shapes.map((shape) => {
    const [x0, x1] = extentX(shape, measure);
    return { x0, x1, shape };
  });
  items.sort((a, b) => a.x0 - b.x0);
  return { items, maxWidth: items.reduce((m, i) => Math.max(m, i.x1 - i.x0), 0) };
}

function shapesIn(index: PanelIndex, from: number, to: number): Shape[] {
  const { items } = index;
  let lo = 0;
  let hi = items.length;
  const start = from - index.maxWidth;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (items[mid].x0 < start) lo = mid + 1;
    else hi = mid;
  }
  const out: Shape[] = [];
  for (let i = lo; i < items.length && items[i].x0 <= to; i++) if (items[i].x1 >= from) out.push(items[i].shape);
  return out;
}

function fmtMm(x: number): string {
  return x.toLocaleString("en-GB", { minimumFractionDigits: 1, maximumFractionDigits: 1 });
}

export interface PanelPageOptions extends PanelOptions {
  /** Written across every page when the file is made from the working copy. */
  watermark: string | null;
  exhibitTitle: string;
  measure?: Measure;
}

/** The page of one panel: (width + 2 bleed) × (height + 2 bleed) mm. */
export function panelPage(strip: StripLayout, index: PanelIndex, panel: Panel, o: PanelPageOptions): Page {
  const B = o.bleedMm;
  const W = o.widthMm;
  const H = o.heightMm;
  const pageW = W + 2 * B;
  const pageH = H + 2 * B;
  const A = artHeightMm(H);
  const C = H - A;
  const shapes: Shape[] = [];
  // The drawing, shifted so the panel's start sits at the trim's left edge; clipped to the art area and bleed.
  shapes.push({ kind: "clip-start", x: 0, y: 0, w: pageW, h: B + A });
  shapes.push(...translate(shapesIn(index, panel.startMm - B, panel.endMm + B), B - panel.startMm, B));
  const endX = B + strip.lengthMm - panel.startMm;
  if (endX < pageW) {
    shapes.push({ kind: "rect", x: Math.max(endX, 0), y: 0, w: pageW - Math.max(endX, 0), h: B + A, fill: "#ffffff", hatch: true, stroke: undefined });
    shapes.push({ kind: "line", x1: endX, y1: B, x2: endX, y2: B + A, stroke: INK, strokeMm: 0.35, dashMm: [3, 2] });
  }
  shapes.push({ kind: "clip-end" });

  // The panel's own band: number, stretch, overlaps, map.
  const y0 = B + A;
  const text = Math.min(C * 0.32, 7);
  shapes.push({ kind: "line", x1: B, y1: y0, x2: B + W, y2: y0, stroke: INK, strokeMm: 0.2 });
  shapes.push({ kind: "text", x: B + 4, y: y0 + C * 0.45, text: `Panel ${panel.number} of ${panel.count} — ${o.exhibitTitle}`, sizeMm: text, font: "sans-bold", fill: INK, anchor: "start" });
  const overlaps = [panel.overlapBeforeMm > 0 ? `first ${fmtMm(panel.overlapBeforeMm)} mm under panel ${panel.number - 1}` : "", panel.overlapAfterMm > 0 ? `last ${fmtMm(panel.overlapAfterMm)} mm under panel ${panel.number + 1}` : ""].filter(Boolean);
  const stretch = `${fmtMm(panel.startMm)}–${fmtMm(panel.endMm)} mm from the older end · panel ${fmtMm(W)} × ${fmtMm(H)} mm, bleed ${fmtMm(B)} mm${overlaps.length ? ` · overlap: ${overlaps.join(", ")}` : ""}`;
  shapes.push({ kind: "text", x: B + 4, y: y0 + C * 0.85, text: stretch, sizeMm: text * 0.8, font: "sans", fill: INK, anchor: "start" });
  if (panel.overlapBeforeMm > 0) overlapMark(shapes, B + panel.overlapBeforeMm, y0, C);
  if (panel.overlapAfterMm > 0) overlapMark(shapes, B + W - panel.overlapAfterMm, y0, C);
  locationMap(shapes, panel, { x: B + W - Math.min(120, W * 0.3) - 6, y: y0 + C * 0.25, w: Math.min(120, W * 0.3), h: C * 0.4 });

  cropMarks(shapes, B, W, H);
  if (o.watermark) watermark(shapes, o.watermark, pageW, pageH);
  return { widthMm: pageW, heightMm: pageH, shapes, trim: { x: B, y: B, w: W, h: H } };
}

/** A dashed line in the panel's band where the neighbouring panel's edge lies. */
function overlapMark(shapes: Shape[], x: number, y0: number, C: number) {
  shapes.push({ kind: "line", x1: x, y1: y0, x2: x, y2: y0 + C, stroke: INK, strokeMm: 0.25, dashMm: [1.5, 1], role: "overlap" });
}

/** All panels as small boxes, this one filled. */
function locationMap(shapes: Shape[], panel: Panel, box: { x: number; y: number; w: number; h: number }) {
  const cell = box.w / panel.count;
  for (let i = 0; i < panel.count; i++) {
    const here = i + 1 === panel.number;
    shapes.push({ kind: "rect", x: box.x + i * cell, y: box.y, w: cell, h: box.h, fill: here ? INK : "#e6e6e6", stroke: panel.count <= 40 ? "#ffffff" : undefined, strokeMm: 0.15 });
  }
}

/** Crop marks at the trim corners, in the bleed (cut away with it), black over a white keyline. */
function cropMarks(shapes: Shape[], B: number, W: number, H: number) {
  if (B <= 0.5) return;
  const len = B - 0.5;
  const corners: [number, number, number, number][] = [
    [B, B, -1, -1],
    [B + W, B, 1, -1],
    [B, B + H, -1, 1],
    [B + W, B + H, 1, 1],
  ];
  for (const [cx, cy, sx, sy] of corners) {
    for (const [stroke, width] of [["#ffffff", 0.5], [INK, 0.15]] as const) {
      shapes.push({ kind: "line", x1: cx, y1: cy + sy * 0.5, x2: cx, y2: cy + sy * (0.5 + len), stroke, strokeMm: width, role: "crop" });
      shapes.push({ kind: "line", x1: cx + sx * 0.5, y1: cy, x2: cx + sx * (0.5 + len), y2: cy, stroke, strokeMm: width, role: "crop" });
    }
  }
}

/** "DRAFT — not checked" across the page, and again small along the top so a cut panel keeps it. */
export function watermark(shapes: Shape[], text: string, pageW: number, pageH: number) {
  const size = Math.min(pageH * 0.12, (pageW / Math.max(8, text.length)) * 1.4);
  shapes.push({ kind: "text", x: pageW / 2, y: pageH / 2, text, sizeMm: size, font: "sans-bold", fill: "#c0392b", anchor: "middle", rotate: -20, opacity: 0.35 });
}
