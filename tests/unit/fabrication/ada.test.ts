// Character heights against the published tables. Each expected figure is the standard's own
// number or hand-computed from its rule (the arithmetic is written beside it).
import { describe, expect, it } from "vitest";
import { adaMinimumHeight, minimumXHeight, NPS_MIN_FONT_MM } from "~/lib/fabrication/ada";

describe("ADA 2010 §703.5.5 (Table 703.5.5)", () => {
  it("16 mm for a baseline 1015–1780 mm read from under 1830 mm (ADA Table 703.5.5, first row)", () => {
    expect(adaMinimumHeight(1370, 1000).heightMm).toBe(16);
    expect(adaMinimumHeight(1780, 1829).heightMm).toBe(16);
  });
  it("51 mm for a baseline 1780–3050 mm read from under 4570 mm (second row)", () => {
    expect(adaMinimumHeight(1781, 3000).heightMm).toBe(51);
    expect(adaMinimumHeight(3050, 4569).heightMm).toBe(51);
  });
  it("75 mm above 3050 mm read from under 6.4 m (third row)", () => {
    expect(adaMinimumHeight(3051, 6000).heightMm).toBe(75);
  });
  it("adds 3.2 mm per 305 mm beyond the row's distance (hand-computed)", () => {
    // 16 + 3.2 × (3050 − 1830) / 305 = 16 + 3.2 × 4 = 28.8 mm
    expect(adaMinimumHeight(1500, 3050).heightMm).toBeCloseTo(28.8, 9);
    // 51 + 3.2 × (4570 + 305 − 4570) / 305 = 54.2 mm
    expect(adaMinimumHeight(2000, 4875).heightMm).toBeCloseTo(54.2, 9);
    // 75 + 3.2 × (6400 + 610 − 6400) / 305 = 81.4 mm
    expect(adaMinimumHeight(3500, 7010).heightMm).toBeCloseTo(81.4, 9);
    expect(adaMinimumHeight(1500, 3050).text).toContain("16 + 3.2 × 1220 / 305 = 28.8 mm");
  });
  it("a baseline under 1015 mm (a low wayside panel) uses the first row and says so", () => {
    const r = adaMinimumHeight(800, 1000);
    expect(r.heightMm).toBe(16);
    expect(r.notes[0]).toMatch(/below the table/);
  });
});

describe("x-height table (Parks Canada, quoted in the Smithsonian Guidelines)", () => {
  it("gives the table's points: 9 mm at 1 m, 19 mm at 2 m, 28 mm at 3 m", () => {
    expect(minimumXHeight(1000).heightMm).toBe(9);
    expect(minimumXHeight(2000).heightMm).toBe(19);
    expect(minimumXHeight(3000).heightMm).toBe(28);
  });
  it("never under 4.5 mm; straight lines between points (hand-computed)", () => {
    expect(minimumXHeight(300).heightMm).toBe(4.5); // 9 × 0.3 = 2.7 → floor 4.5
    expect(minimumXHeight(1500).heightMm).toBeCloseTo(14, 9); // (9 + 19) / 2
    expect(minimumXHeight(4000).heightMm).toBeCloseTo(37, 9); // 28 + 9 per metre, extrapolated
    expect(minimumXHeight(4000).text).toMatch(/extrapolated/);
  });
  it("NPS 24 pt is 8.47 mm (24 × 25.4 / 72)", () => {
    expect(NPS_MIN_FONT_MM).toBeCloseTo(8.4667, 4);
  });
});
