import { describe, expect, it } from "vitest";
import { panelCount, parsePanelOptions, tilePanels, ROLL_PRESETS } from "~/lib/fabrication/panels";
import { qrSize, qrRuns } from "~/lib/fabrication/qr";
import { checkLabelLength, plainText, sentencesOf } from "~/lib/fabrication/label-length";

describe("panel tiling", () => {
  it("a 46 m banner at 600 mm panels with 20 mm overlap is 80 panels (hand-computed: ⌈(46000 − 20) / 580⌉ = ⌈79.28⌉)", () => {
    const panels = tilePanels(46000, { widthMm: 600, overlapMm: 20 });
    expect(panels).toHaveLength(80);
    expect(panelCount(46000, { widthMm: 600, overlapMm: 20 })).toBe(80);
    expect(panels[2]).toMatchObject({ number: 3, count: 80, startMm: 1160, endMm: 1760, overlapBeforeMm: 20, overlapAfterMm: 20 });
    expect(panels[79].startMm).toBe(79 * 580);
    expect(panels[79].endMm).toBeGreaterThanOrEqual(46000);
    expect(panels[78].endMm).toBeLessThan(46000);
  });
  it("consecutive panels share exactly the overlap", () => {
    const p = tilePanels(18000, { widthMm: 914.4, overlapMm: 20 });
    for (let i = 1; i < p.length; i++) expect(p[i - 1].endMm - p[i].startMm).toBeCloseTo(20, 9);
  });
  it("an exact fit needs no extra panel", () => {
    expect(tilePanels(1180, { widthMm: 600, overlapMm: 20 })).toHaveLength(2);
  });
  it("roll presets are whole inches at 25.4 mm", () => {
    expect(ROLL_PRESETS.map((p) => p.widthMm)).toEqual([609.6, 914.4, 1117.6, 1371.6, 1524, 1625.6]);
  });
  it("options: defaults, the medium's panel width, and refusals that name the field", () => {
    expect(parsePanelOptions({})).toEqual({ ok: true, value: { widthMm: 914.4, heightMm: 500, overlapMm: 20, bleedMm: 3 } });
    expect(parsePanelOptions({}, 1200)).toMatchObject({ ok: true, value: { widthMm: 1200 } });
    expect(parsePanelOptions({ width: "abc" })).toEqual({ ok: false, errors: { width: "width: a number of millimetres" } });
    expect(parsePanelOptions({ width: "50" })).toEqual({ ok: false, errors: { width: "width: at least 100 mm" } });
    expect(parsePanelOptions({ width: "600", overlap: "300" })).toMatchObject({ ok: false, errors: { overlap: expect.stringMatching(/less than half/) } });
    expect(parsePanelOptions({ colour: "red" })).toEqual({ ok: false, errors: { colour: "colour: not a parameter of this file" } });
  });
});

describe("QR size (rule of thumb: width ≥ distance / 10, modules ≥ 0.5 mm; ISO/IEC 18004 quiet zone 4 modules)", () => {
  it("a 29-module code scanned from 500 mm is 50 mm wide plus 8 modules of quiet zone (hand-computed)", () => {
    const q = qrSize(29, 500);
    expect(q.symbolMm).toBeCloseTo(50, 9);
    expect(q.moduleMm).toBeCloseTo(50 / 29, 9);
    expect(q.totalMm).toBeCloseTo((50 / 29) * 37, 9);
  });
  it("close up the 0.5 mm module floor wins: 25 modules from 100 mm → 12.5 mm", () => {
    expect(qrSize(25, 100).symbolMm).toBeCloseTo(12.5, 9);
  });
  it("runs cover exactly the dark modules", () => {
    const grid = ["1101", "0000", "1111", "0110"];
    const runs = qrRuns(4, (r, c) => grid[r][c] === "1");
    expect(runs).toEqual([
      { row: 0, col: 0, length: 2 },
      { row: 0, col: 3, length: 1 },
      { row: 2, col: 0, length: 4 },
      { row: 3, col: 1, length: 2 },
    ]);
  });
});

describe("label length (Smithsonian Guidelines: sentences ≤ 25 words, labels ≤ 75–100 words)", () => {
  it("strips Markdown and keeps decimals inside sentences", () => {
    expect(plainText("**Trilobites** appear [here](/x). About 4.5 m further.")).toBe("Trilobites appear here. About 4.5 m further.");
    expect(sentencesOf("It began 538.8 Ma ago. Life changed.")).toEqual(["It began 538.8 Ma ago.", "Life changed."]);
  });
  it("25 words pass, 26 warn; 100 words pass, 101 warn", () => {
    const words = (n: number) => Array.from({ length: n }, (_, i) => `w${i}`).join(" ");
    expect(checkLabelLength(`${words(25)}.`, "Sign 1").warnings).toEqual([]);
    expect(checkLabelLength(`${words(26)}.`, "Sign 1").warnings[0]).toMatch(/a sentence of 26 words/);
    const ok = Array.from({ length: 10 }, () => `${words(10)}.`).join(" ").replace(/\bw0\b/g, "Wa");
    expect(checkLabelLength(ok, "Sign 1").words).toBe(100);
    expect(checkLabelLength(ok, "Sign 1").warnings).toEqual([]);
    expect(checkLabelLength(`${ok} Extra.`, "Sign 1").warnings[0]).toMatch(/101 words/);
  });
});
