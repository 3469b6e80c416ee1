// The decay equations against published values and hand-checked worked examples. Each expected
// figure says where it comes from: a published value, a definition, or our own arithmetic checked
// independently with `bc -l` (arbitrary precision) — never copied from a textbook page we could not
// read. The equations are the standard ones (Faure, G. & Mensing, T.M. (2005) Isotopes: Principles
// and Applications, 3rd ed., Wiley — from memory for chapter numbers).
import { describe, expect, it } from "vitest";
import {
  ageFromRatio,
  ageFromRatioWithUncertainty,
  branchedAgeFromRatio,
  branchedDaughterParentRatio,
  daughterParentRatio,
  decayConstant,
  fractionDecayed,
  fractionRemaining,
  fractionRemainingWithUncertainty,
  halfLifeFromDecayConstant,
  kArAge,
  meanLife,
  timeForFractionRemaining,
} from "../../../app/lib/decay";

/** Relative closeness: |a − b| ≤ tol·|b|. */
function near(actual: number, expected: number, tol: number) {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(tol * Math.abs(expected));
}

describe("definitions", () => {
  it("leaves exactly half after one half-life, a quarter after two, an eighth after three", () => {
    // Definition of the half-life.
    for (const t12 of [5730, 4.4683e9, 1]) {
      near(fractionRemaining(t12, t12), 0.5, 1e-15);
      near(fractionRemaining(2 * t12, t12), 0.25, 1e-15);
      near(fractionRemaining(3 * t12, t12), 0.125, 1e-15);
      near(fractionDecayed(t12, t12), 0.5, 1e-15);
    }
    expect(fractionRemaining(0, 5730)).toBe(1);
    expect(daughterParentRatio(0, 5730)).toBe(0);
  });

  it("C-14 after 11,460 years: 25 % left (two Cambridge half-lives of 5730 a, Godwin 1962, Nature 195: 984)", () => {
    near(fractionRemaining(11460, 5730), 0.25, 1e-15);
    // And one daughter atom per remaining parent after one half-life, three after two.
    near(daughterParentRatio(5730, 5730), 1, 1e-15);
    near(daughterParentRatio(11460, 5730), 3, 1e-15);
  });

  it("the Libby half-life 5568 a has the mean life 8033 a of conventional radiocarbon ages (Stuiver & Polach 1977, Radiocarbon 19: 355–363)", () => {
    expect(Math.round(meanLife(5568))).toBe(8033); // 5568 / ln 2 = 8032.926 (bc -l)
    // Conventional age t = −8033 ln F: F = 0.5 is one Libby half-life.
    near(timeForFractionRemaining(0.5, 5568), 5568, 1e-15);
    near(-8033 * Math.log(0.25), timeForFractionRemaining(0.25, 5568), 1e-5);
  });
});

describe("decay constants as published (λ = ln 2 / t½)", () => {
  it("U-238: t½ 4.4683 Ga ↔ λ 1.55125 × 10⁻¹⁰ a⁻¹ (Jaffey et al. 1971; Steiger & Jäger 1977)", () => {
    near(decayConstant(4.4683e9), 1.55125e-10, 5e-6);
  });
  it("U-235: t½ 0.70381 Ga ↔ λ 9.8485 × 10⁻¹⁰ a⁻¹ (Jaffey et al. 1971; Steiger & Jäger 1977)", () => {
    near(decayConstant(7.0381e8), 9.8485e-10, 5e-6);
  });
  it("Rb-87: t½ 49.61 Ga ↔ λ 1.3972 × 10⁻¹¹ a⁻¹ (Villa et al. 2015)", () => {
    near(decayConstant(49.61e9), 1.3972e-11, 1e-5);
  });
  it("K-40: total λ 5.543 × 10⁻¹⁰ a⁻¹ ↔ t½ 1.2505 Ga (Steiger & Jäger 1977; 1250491034.7 a by bc -l)", () => {
    near(halfLifeFromDecayConstant(5.543e-10), 1250491034.7464285, 1e-12);
  });
  it("Sm-147: λ 6.54 × 10⁻¹² a⁻¹ ↔ t½ ≈ 106 Ga (Lugmair & Marti 1978)", () => {
    expect(Math.round(halfLifeFromDecayConstant(6.54e-12) / 1e9)).toBe(106);
  });
  it("refuses a half-life that is not positive", () => {
    expect(() => decayConstant(0)).toThrow(/positive/);
    expect(() => decayConstant(-1)).toThrow(/positive/);
    expect(() => decayConstant(Number.NaN)).toThrow(/positive/);
    expect(() => fractionRemaining(-1, 5730)).toThrow(/time/);
    expect(() => ageFromRatio(-0.1, 5730)).toThrow(/ratio/);
  });
});

describe("the age equation t = ln(1 + D/P) / λ", () => {
  it("inverts the daughter growth for every system and age", () => {
    for (const t12 of [5730, 7.0381e8, 4.4683e9, 49.61e9]) {
      for (const t of [1, 1e3, 1e6, 66.043e6, 4567.3e6].filter((x) => x <= 50 * t12)) {
        near(ageFromRatio(daughterParentRatio(t, t12), t12), t, 1e-12);
      }
    }
  });

  it("keeps full precision for young ages on long-lived clocks (log1p/expm1)", () => {
    // 1 year on the Rb-87 clock: D/P = λ·1 a to first order, 1.3972e-11.
    near(daughterParentRatio(1, 49.61e9), decayConstant(49.61e9), 1e-10);
    near(ageFromRatio(1.3972e-11, 49.61e9), 1, 1e-4);
  });

  it("a Rb–Sr worked example: ⁸⁷Sr*/⁸⁷Rb = 0.0142 gives 993.0 Ma with the 1977 λ and 1009.2 Ma with Villa et al. 2015", () => {
    // Our own example, checked with bc -l: l(1.0142)/1.42e-11 = 992966505.548; l(1.0142)/1.3972e-11 = 1009170081.505.
    near(ageFromRatio(0.0142, halfLifeFromDecayConstant(1.42e-11)), 992966505.548, 1e-10);
    near(ageFromRatio(0.0142, halfLifeFromDecayConstant(1.3972e-11)), 1009170081.505, 1e-10);
    // The two conventions differ by 1.6 % (λ ratio 1.42 / 1.3972), as the decay-system notes say.
    near(ageFromRatio(0.0142, 49.61e9) / ageFromRatio(0.0142, halfLifeFromDecayConstant(1.42e-11)), 1.42 / 1.3972, 1e-4);
  });

  it("a U–Pb worked example: after 1 Ga, ²⁰⁶Pb*/²³⁸U = e^(λ·1 Ga) − 1 = 0.16780 (λ 1.55125e-10; bc -l 0.167803927)", () => {
    near(daughterParentRatio(1e9, halfLifeFromDecayConstant(1.55125e-10)), 0.1678039274729712, 1e-12);
    near(ageFromRatio(0.1678039274729712, halfLifeFromDecayConstant(1.55125e-10)), 1e9, 1e-12);
  });

  it("propagates the half-life's uncertainty: ∂t/∂t½ = t/t½", () => {
    // D/P = 1 means exactly one half-life, so the age is t½ and its ± is the half-life's ±
    // (U-238, ± 0.0048 Ga at 2σ, Jaffey et al. 1971).
    const r = ageFromRatioWithUncertainty(1, 4.4683e9, { halfLifeUncertainty: 4.8e6 });
    near(r.value, 4.4683e9, 1e-12);
    near(r.uncertainty, 4.8e6, 1e-12);
    // With the ratio's uncertainty as well, in quadrature: ∂t/∂R = 1/(λ(1 + R)).
    const both = ageFromRatioWithUncertainty(1, 4.4683e9, { halfLifeUncertainty: 4.8e6, ratioUncertainty: 0.001 });
    const fromRatio = 0.001 / (decayConstant(4.4683e9) * 2);
    near(both.uncertainty, Math.hypot(4.8e6, fromRatio), 1e-12);
    // A finite-difference check of the half-life term.
    const h = 1e3;
    const numeric = (ageFromRatio(0.3, 4.4683e9 + h) - ageFromRatio(0.3, 4.4683e9 - h)) / (2 * h);
    near(ageFromRatioWithUncertainty(0.3, 4.4683e9, { halfLifeUncertainty: 1 }).uncertainty, numeric, 1e-6);
  });

  it("propagates the half-life's uncertainty to the fraction left", () => {
    const t = 66.043e6;
    const h = 1e3;
    const numeric = (fractionRemaining(t, 1.2505e9 + h) - fractionRemaining(t, 1.2505e9 - h)) / (2 * h);
    near(fractionRemainingWithUncertainty(t, 1.2505e9, 1).uncertainty, numeric, 1e-6);
    expect(fractionRemainingWithUncertainty(t, 1.2505e9).uncertainty).toBe(0);
  });
});

describe("branched decay: K–Ar", () => {
  const SJ = { total: 5.543e-10, branch: 0.581e-10 }; // Steiger & Jäger 1977

  it("after 100 Ma, ⁴⁰Ar*/⁴⁰K = (λₑ/λ)(e^(λt) − 1) = 0.0059740 (bc -l 0.005974041029551)", () => {
    near(branchedDaughterParentRatio(100e6, SJ), 0.005974041029551352, 1e-12);
    near(kArAge(0.005974041029551352, SJ), 100e6, 1e-12);
  });

  it("inverts for ages from 1 ka to 4.5 Ga and agrees with the plain equation when all decays give the daughter", () => {
    for (const t of [1e3, 1e6, 66.043e6, 1e9, 4.5e9]) near(branchedAgeFromRatio(branchedDaughterParentRatio(t, SJ), SJ), t, 1e-12);
    const t12 = halfLifeFromDecayConstant(SJ.total);
    near(branchedAgeFromRatio(0.2, { total: SJ.total, branch: SJ.total }), ageFromRatio(0.2, t12), 1e-14);
  });

  it("ignoring the branching would make a K–Ar age far too young", () => {
    // Treating all of ⁴⁰K's decays as argon-producing reads the same ratio as a much younger age;
    // the correct equation scales the ratio by λ/λₑ ≈ 9.54.
    const r = branchedDaughterParentRatio(66.043e6, SJ);
    expect(ageFromRatio(r, halfLifeFromDecayConstant(SJ.total))).toBeLessThan(66.043e6 / 9);
  });

  it("refuses a branch larger than the total", () => {
    expect(() => branchedAgeFromRatio(0.01, { total: 1e-10, branch: 2e-10 })).toThrow(/cannot exceed/);
  });
});
