// The "how we know" helper for marker pages, with the seeded decay systems.
import { describe, expect, it } from "vitest";
import { decaySystemsForMethod, formatPercent, formatScientific, howWeKnow } from "../../../app/lib/decay";
import { SEED_DECAY_SYSTEMS } from "../../../db/data/dated-events/decay-systems.ts";
import { SEED_DATED_EVENTS } from "../../../db/data/dated-events/dated-events.ts";

function system(slug: string) {
  const s = SEED_DECAY_SYSTEMS.find((d) => d.slug === slug)!;
  return {
    parent: s.parent,
    daughter: s.daughter,
    halfLifeYears: Number(s.halfLifeYears),
    halfLifeUncertaintyYears: s.halfLifeUncertaintyYears === null ? null : Number(s.halfLifeUncertaintyYears),
    decayConstantPerYear: Number(s.decayConstantPerYear),
    branchConstantPerYear: s.branchConstantPerYear === null ? null : Number(s.branchConstantPerYear),
  };
}

describe("howWeKnow", () => {
  it("about half of the Solar System's first U-238 is left: 49.24 % after 4567.30 Ma (bc -l e(−1.55125e-10·4567.30e6) = 0.492381)", () => {
    const r = howWeKnow(4567.3e6, system("u238-pb206"));
    expect(r.fractionRemaining.value).toBeCloseTo(0.4923810292628663, 12);
    expect(r.percentText).toBe("49.2 %");
    expect(r.halfLives).toBeCloseTo(1.0222, 3);
    expect(r.sentence).toContain("After 4.567 billion years — 1.02 half-lives of U-238");
    expect(r.sentence).toContain("about 49.2 % of the U-238");
  });

  it("only 1.1 % of the U-235 is left after the same time (bc -l: 0.0111300635)", () => {
    const r = howWeKnow(4567.3e6, system("u235-pb207"));
    expect(r.fractionRemaining.value).toBeCloseTo(0.011130063537953188, 12);
    expect(r.percentText).toBe("1.11 %");
  });

  it("uses the argon branch for K-40 → Ar-40 and says other daughters exist", () => {
    const r = howWeKnow(100e6, system("k40-ar40"));
    expect(r.daughterPerParent).toBeCloseTo(0.005974041029551352, 14);
    expect(r.sentence).toMatch(/Ar-40 and other daughters/);
  });

  it("says when practically none of the parent is left (C-14 at 66 Ma)", () => {
    const r = howWeKnow(66.043e6, system("c14-n14"));
    expect(r.fractionRemaining.value).toBe(0);
    expect(r.percentText).toBe("practically none");
    expect(r.sentence).toMatch(/practically none of the C-14/);
  });

  it("carries the half-life's ± to the fraction (U-238, ± 0.0048 Ga)", () => {
    const r = howWeKnow(4404e6, system("u238-pb206"));
    expect(r.fractionRemaining.uncertainty).toBeGreaterThan(0);
    expect(r.fractionRemaining.uncertainty).toBeLessThan(0.001);
  });

  it("refuses a negative age", () => {
    expect(() => howWeKnow(-1, system("c14-n14"))).toThrow(/age/);
  });
});

describe("formatting", () => {
  it("writes shares and decay constants for people", () => {
    expect(formatPercent(0.5)).toBe("50 %");
    expect(formatPercent(0.4923810292628663)).toBe("49.2 %");
    expect(formatPercent(0.0003)).toBe("0.03 %");
    expect(formatPercent(3.1e-11)).toBe("3.1 × 10⁻⁹ %");
    expect(formatPercent(0.99999)).toBe("more than 99.9 %");
    expect(formatPercent(1)).toBe("100 %");
    expect(formatPercent(0)).toBe("practically none");
    expect(formatScientific(1.55125e-10)).toBe("1.55125 × 10⁻¹⁰");
    expect(formatScientific(5.81e-11)).toBe("5.81 × 10⁻¹¹");
  });
});

describe("decaySystemsForMethod", () => {
  it("finds the clocks behind the library's dating methods", () => {
    expect(decaySystemsForMethod("U–Pb zircon (SHRIMP ion microprobe)")).toEqual(["u238-pb206", "u235-pb207"]);
    expect(decaySystemsForMethod("40Ar/39Ar sanidine")).toEqual(["k40-ar40"]);
    expect(decaySystemsForMethod("Re–Os pyrite")).toEqual(["re187-os187"]);
    expect(decaySystemsForMethod("U and Lu–Hf of lunar zircons")).toEqual(["lu176-hf176"]);
    expect(decaySystemsForMethod("Conodont biostratigraphy (early Eifelian)")).toEqual([]);
    expect(decaySystemsForMethod("Thermoluminescence of heated flint")).toEqual([]);
    expect(decaySystemsForMethod(null)).toEqual([]);
  });

  it("every slug it can answer is a seeded decay system", () => {
    const seeded = new Set(SEED_DECAY_SYSTEMS.map((d) => d.slug));
    const methods = SEED_DATED_EVENTS.map((e) => e.datingMethod);
    for (const m of [...methods, "Rb–Sr isochron", "Sm–Nd", "radiocarbon", "Al–Mg"]) {
      for (const slug of decaySystemsForMethod(m)) expect(seeded.has(slug)).toBe(true);
    }
  });
});

describe("seeded decay systems", () => {
  it("λ·t½ = ln 2 for each, every one has a full citation, and K-40 is the only branched one", () => {
    expect(SEED_DECAY_SYSTEMS.length).toBeGreaterThanOrEqual(7);
    for (const d of SEED_DECAY_SYSTEMS) {
      expect(Math.abs((Number(d.decayConstantPerYear) * Number(d.halfLifeYears)) / Math.LN2 - 1)).toBeLessThan(5e-4);
      expect(d.citation).toMatch(/\(\d{4}\)/);
    }
    expect(SEED_DECAY_SYSTEMS.filter((d) => d.branchConstantPerYear !== null).map((d) => d.slug)).toEqual(["k40-ar40"]);
  });
});
