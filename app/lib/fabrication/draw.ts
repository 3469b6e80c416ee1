// A drawing as a list of shapes in millimetres (x to the right, y down, from the page's top-left
// corner). The same list is written as SVG (svg.ts) and as PDF (server/exports/pdf), so the two
// never disagree. Pure.

export type FontName = "sans" | "sans-bold" | "serif";

export type Shape =
  | { kind: "rect"; x: number; y: number; w: number; h: number; fill: string | null; stroke?: string; strokeMm?: number; hatch?: boolean }
  | { kind: "line"; x1: number; y1: number; x2: number; y2: number; stroke: string; strokeMm: number; dashMm?: [number, number]; role?: "tick" | "crop" | "ruler" | "leader" | "overlap" }
  | { kind: "text"; x: number; y: number; text: string; sizeMm: number; font: FontName; fill: string; anchor: "start" | "middle" | "end"; rotate?: number; opacity?: number }
  | { kind: "image"; x: number; y: number; w: number; h: number; ref: string }
  | { kind: "clip-start"; x: number; y: number; w: number; h: number }
  | { kind: "clip-end" };

export interface Page {
  widthMm: number;
  heightMm: number;
  shapes: Shape[];
  /** The trim box inside the page (bleed around it), mm. */
  trim?: { x: number; y: number; w: number; h: number };
}

/** Width of `text` at font size `sizeMm` (em), mm. The server passes the embedded font's metrics. */
export type Measure = (text: string, sizeMm: number, font: FontName) => number;

/** Without font metrics: about 0.55 em a character (a sans-serif's average, common practice). */
export const roughMeasure: Measure = (text, sizeMm, font) => text.length * sizeMm * (font === "sans-bold" ? 0.58 : 0.53);

/** Greedy line breaking at spaces; a word longer than the width stands on its own line. */
export function wrapText(text: string, widthMm: number, sizeMm: number, font: FontName, measure: Measure): string[] {
  const lines: string[] = [];
  for (const paragraph of text.split(/\n+/)) {
    let line = "";
    for (const word of paragraph.split(/\s+/).filter(Boolean)) {
      const candidate = line ? `${line} ${word}` : word;
      if (line && measure(candidate, sizeMm, font) > widthMm) {
        lines.push(line);
        line = word;
      } else line = candidate;
    }
    if (line) lines.push(line);
  }
  return lines;
}

/** Shapes moved by (dx, dy). */
export function translate(shapes: readonly Shape[], dx: number, dy: number): Shape[] {
  return shapes.map((s): Shape => {
    switch (s.kind) {
      case "line":
        return { ...s, x1: s.x1 + dx, x2: s.x2 + dx, y1: s.y1 + dy, y2: s.y2 + dy };
      case "clip-end":
        return s;
      default:
        return { ...s, x: s.x + dx, y: s.y + dy };
    }
  });
}

/** The horizontal extent of a shape (text: from its anchor, with the measured width). */
export function extentX(s: Shape, measure: Measure): [number, number] {
  switch (s.kind) {
    case "line":
      return [Math.min(s.x1, s.x2), Math.max(s.x1, s.x2)];
    case "clip-end":
      return [-Infinity, Infinity];
    case "text": {
      const w = measure(s.text, s.sizeMm, s.font);
      if (s.rotate) return [s.x - w, s.x + w];
      return s.anchor === "start" ? [s.x, s.x + w] : s.anchor === "end" ? [s.x - w, s.x] : [s.x - w / 2, s.x + w / 2];
    }
    default:
      return [s.x, s.x + s.w];
  }
}
