// The strip's label layout (no two labels overlap; leaders cross no label; every marker labelled
// once; crowds become one group) and its ruler (round lengths in the reader's units).
import { describe, expect, it } from "vitest";
import { labelWidth, layoutLabels, type LabelItem, type PlacedLabel } from "../../../app/components/exhibit/label-layout.ts";
import { rulerTicks, scaleBar } from "../../../app/components/exhibit/ruler.ts";

const OPTS = { width: 360, rows: 3, charWidth: 6.6, gap: 3 };

const items = (xs: number[]): LabelItem[] => xs.map((x, i) => ({ id: `m${i + 1}`, text: String(i + 1), x }));

function spanOf(l: PlacedLabel) {
  const w = labelWidth(l.text, OPTS);
  return { left: l.x - w / 2, right: l.x + w / 2 };
}

function checkLayout(placed: PlacedLabel[], all: LabelItem[]) {
  // Every marker in exactly one label.
  expect(placed.flatMap((l) => l.ids).sort()).toEqual(all.map((i) => i.id).sort());
  for (const a of placed) {
    const sa = spanOf(a);
    expect(sa.left).toBeGreaterThanOrEqual(0);
    expect(sa.right).toBeLessThanOrEqual(OPTS.width);
    for (const b of placed) {
      if (a === b) continue;
      const sb = spanOf(b);
      // No two labels in one row overlap.
      if (a.row === b.row) expect(sa.right <= sb.left || sb.right <= sa.left).toBe(true);
      // A leader runs down through the rows below its label: it crosses no label there.
      if (b.row < a.row) expect(a.anchor < sb.left || a.anchor > sb.right).toBe(true);
    }
  }
}

describe("layoutLabels", () => {
  it("keeps well-spaced markers as single labels in the row next to the strip", () => {
    const all = items([20, 80, 140, 200, 260, 320]);
    const placed = layoutLabels(all, OPTS);
    expect(placed.map((l) => [l.text, l.row, l.group])).toEqual([["1", 0, false], ["2", 0, false], ["3", 0, false], ["4", 0, false], ["5", 0, false], ["6", 0, false]]);
  });

  it("staggers markers 10 px apart into alternate rows instead of overprinting them", () => {
    const all = items([100, 110, 120]);
    const placed = layoutLabels(all, OPTS);
    checkLayout(placed, all);
    expect(placed.map((l) => [l.text, l.row])).toEqual([["1", 0], ["2", 1], ["3", 0]]);
  });

  it("groups markers whose leaders would have to cross a neighbour's label (4 px apart)", () => {
    const all = items([100, 104, 108]);
    const placed = layoutLabels(all, OPTS);
    checkLayout(placed, all);
    expect(placed.map((l) => [l.text, l.group])).toEqual([["1–3", true]]);
  });

  it("collapses a crowd of ten markers within 18 px into one group label 1–10", () => {
    const all = items([100, 102, 104, 106, 108, 110, 112, 114, 116, 118]);
    const placed = layoutLabels(all, OPTS);
    checkLayout(placed, all);
    expect(placed.some((l) => l.group)).toBe(true);
    expect(placed.length).toBeLessThan(10);
  });

  it("lays out 42 markers on a 360 px strip with no overlap (the demo trail's crowding at the young end)", () => {
    const xs = [...Array.from({ length: 30 }, (_, i) => 10 + i * 10), ...Array.from({ length: 12 }, (_, i) => 330 + i * 1.5)];
    const all = items(xs);
    checkLayout(layoutLabels(all, OPTS), all);
  });
});

describe("rulerTicks", () => {
  it("puts a 10 ft rope's ticks at round feet, not at 3.3, 6.6, 9.8 ft", () => {
    expect(rulerTicks(3.048, "us", 5).map((t) => t.label)).toEqual(["0", "2 ft", "4 ft", "6 ft", "8 ft", "10 ft"]);
  });
  it("puts a 4.567 km trail's ticks at round kilometres in metric", () => {
    expect(rulerTicks(4567, "metric", 5).map((t) => t.label)).toEqual(["0", "1 km", "2 km", "3 km", "4 km"]);
  });
  it("uses miles for a 4.567 km trail in US units", () => {
    expect(rulerTicks(4567, "us", 4).map((t) => t.label)).toEqual(["0", "1 mi", "2 mi"]);
  });
});

describe("scaleBar", () => {
  it("rounds down to 1, 2 or 5 of a unit", () => {
    expect(scaleBar(370, "metric")).toEqual({ metres: 200, label: "200 m" });
    expect(scaleBar(370, "us")).toEqual({ metres: 1000 * 0.3048, label: "1,000 ft" });
  });
});
