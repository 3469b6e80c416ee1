// ABA §1017 running-slope flags on hand-made profiles (hand-computed cases, labelled as such: no
// published surveyed profile was at hand). Distances are exact (the core takes distance and
// elevation lists); sampling 1 m with no smoothing so each ramp's length is exact.
import { describe, expect, it } from "vitest";
import { routeProfile, slopeProfileOf } from "~/lib/profile/profile";

const EXACT = { sampleMetres: 1, windowMetres: 1 };

/** Flat, then ramps of [percent, metres] each followed by 20 m flat: vertices every metre. */
function profile(ramps: [number, number][], leadMetres = 20) {
  const d: number[] = [0];
  const e: number[] = [100];
  const push = (metres: number, percent: number) => {
    for (let i = 0; i < metres; i++) {
      d.push(d[d.length - 1] + 1);
      e.push(e[e.length - 1] + percent / 100);
    }
  };
  push(leadMetres, 0);
  for (const [p, m] of ramps) {
    push(m, p);
    push(20, 0);
  }
  return slopeProfileOf(d, e, EXACT);
}

const rulesOf = (p: ReturnType<typeof profile>) => p.stretches.map((s) => s.ruleId);

describe("ABA §1017 limits, just under and just over (hand-computed)", () => {
  it("5 % any length: 5.0 % for 200 m is not a stretch over 5 %", () => {
    expect(profile([[5, 200]]).stretches).toEqual([]);
  });
  it("over 5 % for at most 61 m: 8.3 % for 61 m passes, 62 m breaks it", () => {
    expect(rulesOf(profile([[8.3, 61]]))).toEqual([null]);
    expect(rulesOf(profile([[8.3, 62]]))).toEqual(["aba-5-61m"]);
    expect(profile([[8.3, 62]]).stretches[0].rule).toBe("ABA §1017: steeper than 5 % for at most 61 m");
  });
  it("over 8.33 % for at most 9 m: 8.4 % for 9 m passes, 10 m breaks it", () => {
    expect(rulesOf(profile([[8.4, 9]]))).toEqual([null]);
    expect(rulesOf(profile([[8.4, 10]]))).toEqual(["aba-8.33-9m"]);
  });
  it("over 10 % for at most 3 m: 10.1 % for 3 m passes, 4 m breaks it", () => {
    expect(rulesOf(profile([[10.1, 3]]))).toEqual([null]);
    expect(rulesOf(profile([[10.1, 4]]))).toEqual(["aba-10-3m"]);
  });
  it("never over 12.5 %: 12.4 % for 2 m passes, 12.6 % for 2 m breaks it", () => {
    expect(rulesOf(profile([[12.4, 2]]))).toEqual([null]);
    expect(rulesOf(profile([[12.6, 2]]))).toEqual(["aba-12.5"]);
  });
  it("at most 30 % of the length over 8.33 %: 29 m of 100 m passes, 31 m of 100 m breaks it", () => {
    const d = Array.from({ length: 101 }, (_, i) => i);
    // Exact layout: 100 m, pieces of ≤ 8 m at 9 % separated by flat steps.
    const layout = (overMetres: number) => {
      const e = [100];
      let left = overMetres;
      for (let i = 0; i < 100; i++) {
        const inPiece = i % 10 < 8 && left > 0;
        if (inPiece) left--;
        e.push(e[i] + (inPiece ? 0.09 : 0));
      }
      return slopeProfileOf(d, e, EXACT);
    };
    expect(layout(29).totals).toMatchObject({ over833Metres: 29, over833Percent: 29, rule: null });
    expect(layout(31).totals).toMatchObject({ over833Metres: 31, over833Percent: 31, rule: "ABA §1017: no more than 30 % of the trail's length steeper than 8.33 %" });
  });
  it("resting points at the bottom and the top of every stretch over 5 %", () => {
    const s = profile([[8.3, 30]]).stretches[0];
    expect(s).toMatchObject({ fromMetres: 20, toMetres: 50, lengthMetres: 30, direction: "up", runningSlopePercent: 8.3 });
    expect(s.restingPoints).toEqual([
      { at: "bottom", distanceMetres: 20, elevationMetres: 100 },
      { at: "top", distanceMetres: 50, elevationMetres: 102.49 },
    ]);
  });
  it("ascent and descent: up 10 m and down 4 m (hand-computed)", () => {
    const d = [0, 100, 200, 300];
    const p = slopeProfileOf(d, [50, 55, 60, 56], EXACT);
    expect(p.totals).toMatchObject({ lengthMetres: 300, ascentMetres: 10, descentMetres: 4, maxSlopePercent: 5 });
  });
});

describe("smoothing and resolution", () => {
  it("GPS-like noise of ±2 m every 5 m on a flat route gives no stretch after a 30 m moving average", () => {
    const d = Array.from({ length: 201 }, (_, i) => i * 5);
    const e = d.map((_, i) => 40 + (i % 2 === 0 ? 2 : -2));
    const raw = slopeProfileOf(d, e, { sampleMetres: 5, windowMetres: 5 });
    expect(raw.stretches.length).toBeGreaterThan(50); // ±80 % "slopes" every step without smoothing
    const smooth = slopeProfileOf(d, e);
    expect(smooth.stretches).toEqual([]);
    expect(smooth.method.text).toMatch(/moving average over 30 m/);
  });
  it("a 10.5 % step of 4 m is below the 30 m resolution: noted for a site survey, not judged", () => {
    const d = Array.from({ length: 301 }, (_, i) => i);
    const e = d.map((x) => (x < 150 ? 0 : x < 154 ? (x - 150) * 0.105 : 0.42));
    const p = slopeProfileOf(d, e, { sampleMetres: 1, windowMetres: 30 });
    expect(p.stretches.every((s) => s.rule === null)).toBe(true);
    expect(p.notes.join(" ")).toMatch(/site survey/);
  });
  it("routes: [lon, lat, elevation] vertices along a meridian; none without elevations", () => {
    // 0.001° of latitude at the equator ≈ 110.57 m (WGS84 meridian arc, from memory); 10 m rise → about 9 %.
    const p = routeProfile([[0, 0, 0], [0, 0.001, 10], [0, 0.002, 10]], { sampleMetres: 5, windowMetres: 5 })!;
    expect(p.totals.lengthMetres).toBeCloseTo(221.1, 0);
    expect(p.totals.ascentMetres).toBeCloseTo(10, 6);
    expect(routeProfile([[0, 0], [0, 0.001]])).toBeNull();
  });
});
