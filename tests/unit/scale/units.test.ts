import { describe, expect, it } from "vitest";
import { METRES_PER_LENGTH_UNIT, YEARS_PER_AGE_UNIT, clean, fromMetres, fromYears, isAgeUnit, isLengthUnit, toMetres, toYears } from "../../../app/lib/units";

describe("length units", () => {
  it("uses the exact international definitions", () => {
    // NIST SP 811 (2008), Appendix B.8, and the international yard and pound agreement (1959)
    expect(METRES_PER_LENGTH_UNIT.yd).toBe(0.9144); // 1 yd = 0.9144 m exactly
    expect(METRES_PER_LENGTH_UNIT.ft).toBe(0.3048); // 1 ft = 0.3048 m exactly
    expect(METRES_PER_LENGTH_UNIT.in).toBe(0.0254); // 1 in = 2.54 cm exactly
    expect(METRES_PER_LENGTH_UNIT.mi).toBe(1609.344); // 1 mi = 5,280 ft = 1,609.344 m exactly
    expect(METRES_PER_LENGTH_UNIT.ft * 3).toBeCloseTo(METRES_PER_LENGTH_UNIT.yd, 15); // 3 ft = 1 yd (1959 agreement)
    expect(METRES_PER_LENGTH_UNIT.ft * 5280).toBeCloseTo(METRES_PER_LENGTH_UNIT.mi, 10); // 5,280 ft = 1 mi
    // SI prefixes (NIST SP 811 §4)
    expect(METRES_PER_LENGTH_UNIT.mm).toBe(0.001);
    expect(METRES_PER_LENGTH_UNIT.cm).toBe(0.01);
    expect(METRES_PER_LENGTH_UNIT.km).toBe(1000);
  });

  it("converts without binary noise", () => {
    expect(toMetres({ value: 4567, unit: "km" })).toBe(4567000);
    expect(toMetres({ value: 1, unit: "mi" })).toBe(1609.344);
    expect(toMetres({ value: 60, unit: "ft" })).toBe(18.288); // 60 × 0.3048 (NIST SP 811)
    expect(fromMetres(0.3048, "ft")).toBe(1);
    expect(fromMetres(1609.344, "mi")).toBe(1);
    expect(clean(0.1 + 0.2)).toBe(0.3);
  });

  it("rejects unknown units with a clear message", () => {
    expect(() => toMetres({ value: 1, unit: "furlong" })).toThrow(/Unknown length unit "furlong": use one of mm, cm, m, km, in, ft, yd, mi/);
    expect(() => toYears({ value: 1, unit: "Myr" })).toThrow(/Unknown age unit "Myr": use one of a, ka, Ma, Ga/);
    expect(isLengthUnit("M")).toBe(false);
    expect(isAgeUnit("ma")).toBe(false); // case matters: Ma is mega-annum
  });
});

describe("age units", () => {
  it("uses SI prefixes on the annus (years before present)", () => {
    expect(YEARS_PER_AGE_UNIT).toEqual({ a: 1, ka: 1e3, Ma: 1e6, Ga: 1e9 });
    expect(toYears({ value: 66, unit: "Ma" })).toBe(66_000_000);
    expect(toYears({ value: 0.05, unit: "Ma" })).toBe(50_000);
    expect(toYears({ value: 4.567, unit: "Ga" })).toBe(4_567_000_000);
    expect(toYears({ value: 11.7, unit: "ka" })).toBe(11_700);
    expect(fromYears(252_160_000, "Ma")).toBe(252.16);
  });
});
