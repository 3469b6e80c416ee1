// markerLabel reads a step's grid (unit, decimals, multiple) from tables by the step's power of ten;
// distanceLabel(displayStep(…)) works it out from the step itself (labelUnitIndex, decimalsFor,
// wholeStep). Both must give the same label for every power of ten the rule can give, in both unit
// systems, with and without a ±, and for a resolution that is not a power of ten.
import { describe, expect, it } from "vitest";
import { displayStep, distanceLabel, markerLabel, ruleStepExponent, stepRule, uncertaintyPlace } from "../../../app/lib/scale/format";

let seed = 99;
const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;

describe("a label on a power-of-ten step", () => {
  it("is the same from the tables as worked out from the step, for steps 1e-30 … 1e30 m", () => {
    let checked = 0;
    for (const system of ["metric", "us"] as const) {
      for (let e = -33; e <= 33; e++) {
        for (let j = 0; j < 40; j++) {
          // a metres-per-year that makes the rule's step land near 10^e, and distances of many sizes
          const age = 10 ** (rand() * 10);
          const unc = j % 3 === 0 ? null : age * 10 ** (-1 - 4 * rand());
          const mpy = 10 ** (e + 2 - Math.floor(Math.log10(unc ?? age / 100)) + (rand() - 0.5));
          const total = 10 ** (e + 1 + 8 * rand());
          const fromOlder = total * rand();
          const resolution = [1e-3, 0.01, 0.05, 2e-4][j % 4];
          const step = displayStep(age, unc, mpy, resolution);
          const fast = markerLabel(fromOlder, total - fromOlder, age, unc, mpy, resolution, undefined, system);
          const slow = distanceLabel(fromOlder, total - fromOlder, step, undefined, system);
          expect(fast, `${system} e=${e} j=${j}`).toEqual(slow);
          checked++;
        }
      }
    }
    expect(checked).toBe(2 * 67 * 40);
  });

  it("knows the step's power of ten, or that it has none (a resolution of 0.05 m)", () => {
    stepRule(66e6, 5e5, 1e-6, 0.001);
    expect(ruleStepExponent()).toBe(-1); // ± 0.5 m → a step of 0.1 m
    stepRule(66e6, 1e5, 1e-6, 0.001);
    expect(ruleStepExponent()).toBe(-2); // ± 0.10 m (two figures when the first is 1) → 0.01 m
    stepRule(0, null, 1e-6, 0.05);
    expect(ruleStepExponent()).toBeNaN(); // the medium's 0.05 m: not a power of ten
    stepRule(0, null, 1e-6, 0.01);
    expect(ruleStepExponent()).toBe(-2);
  });
});

describe("the ±'s last place", () => {
  /** uncertaintyPlace as it was: the decade, and the leading digit by a division. */
  const byDivision = (x: number) => {
    const k = Math.floor(Math.log10(x * (1 + 1e-12)));
    const kk = 10 ** (k + 1) <= x * (1 + 1e-12) ? k + 1 : 10 ** k > x * (1 + 1e-12) ? k - 1 : k;
    const p = kk >= 0 ? 10 ** kk : 1 / 10 ** -kk;
    return Math.floor(x / p + 1e-9) <= 2 ? kk - 1 : kk;
  };

  it("is decided by a comparison exactly as by the division, at and next to every threshold and at random", () => {
    const xs: number[] = [];
    for (let k = -30; k <= 30; k++) {
      const p = k >= 0 ? 10 ** k : 1 / 10 ** -k;
      // the values around 3 × 10^k, each a double step apart
      let x = 3 * p * (1 - 4e-9);
      for (let j = 0; j < 64; j++) {
        xs.push(x, 3 * p, 3 * p * (1 - 1e-9), 2.999999999 * p, 1 * p, 2 * p, 9.999 * p);
        x = Math.min(3 * p * (1 + 4e-9), x + x * 1.3e-10);
      }
      for (let j = 0; j < 200; j++) xs.push(p * (1 + 9 * rand()));
    }
    for (const x of xs) expect(uncertaintyPlace(x), `x = ${x}`).toBe(byDivision(x));
    expect(uncertaintyPlace(0.011)).toBe(-3); // leads with 1: two figures
    expect(uncertaintyPlace(0.054)).toBe(-2);
    expect(uncertaintyPlace(2.9999999999)).toBe(0); // within 1e-9 of 3: counts as 3, one figure
  });
});
