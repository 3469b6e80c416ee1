// The formatting module (app/lib/scale/format.ts and its parts) against the test oracle (tests/unit/scale/oracle:
// the engine as it was before it, with the figures issue's rounding rules): every label, distance,
// statement and duration text identical, on the demo exhibits and on 2,000 random exhibits (fixed
// seed). Deliberate changes are left out and tested in their own files: US customary units (the
// oracle had none), the ± in inches, feet, yards or miles (now rounded up, never down), the
// durations' inset texts and the warnings (now naming markers and insets).
import { describe, expect, it } from "vitest";
import { computeExhibit, standardDurations } from "../../../app/lib/exhibit/index.ts";
import { scaleFromJson, type ScaleResult } from "../../../app/lib/scale/index.ts";
import { computeExhibit as oracleExhibit, standardDurations as oracleDurations } from "./oracle/compose.ts";
import { computeScale as oracleScale, type ScaleResult as OracleResult } from "./oracle/compute.ts";
import { parseScaleRequest as oracleParse } from "./oracle/schema.ts";
import { demoExhibits } from "./demo-exhibits.ts";

const NON_METRIC = / (in|ft|yd|mi)$/;
/** Figures under 0.0001 of the smallest unit are now in scientific words ("4.5 × 10⁻⁶ mm"). */
const tiny = (t: string) => (t.includes("×") && !t.includes("×)") || /\b0\.0000\d/.test(t) ? "(tiny: scientific now)" : t);
const statement = (st: { lengthPerTime: string; timePerLength: string }) => ({ lengthPerTime: tiny(st.lengthPerTime), timePerLength: st.timePerLength });

/**
 * A marker's place on a route and its bearing are compared apart from the labels, within 1e-9 degree
 * (about 0.1 mm) and 1e-7 degree: the route code may compute them differently (tests/unit/geo
 * checks them against GeographicLib to 1 mm); the labels must be identical.
 */
function expectSamePlaces(mine: ScaleResult, theirs: OracleResult, what: string) {
  expect(mine.points.length).toBe(theirs.points.length);
  mine.points.forEach((p, i) => {
    const q = theirs.points[i];
    expect(p.position === undefined, what).toBe(q.position === undefined);
    if (!p.position || !q.position) return;
    expect(Math.abs(p.position.lon - q.position.lon), `${what} marker ${p.id} longitude`).toBeLessThan(1e-9);
    expect(Math.abs(p.position.lat - q.position.lat), `${what} marker ${p.id} latitude`).toBeLessThan(1e-9);
    expect(Math.abs(p.bearing! - q.bearing!), `${what} marker ${p.id} bearing`).toBeLessThan(1e-7);
  });
}

/** The parts both engines compute the same way. */
function comparable(r: ScaleResult | OracleResult) {
  return {
    scale: { ...r.scale, unitSystem: undefined, statement: statement(r.scale.statement), route: r.scale.route && { ...r.scale.route } },
    points: r.points.map((p) => ({
      id: p.id,
      label: p.label,
      ageYears: p.ageYears,
      uncertaintyYears: p.uncertaintyYears,
      fromOlderEndMetres: p.fromOlderEndMetres,
      fromYoungerEndMetres: p.fromYoungerEndMetres,
      uncertaintyMetres: p.uncertaintyMetres,
      display: { ...p.display, uncertainty: p.display.uncertainty && NON_METRIC.test(p.display.uncertainty) ? "(non-metric ±)" : p.display.uncertainty },
      walking: p.walking,
      insets: p.insets.map((x) => ({ ...x, display: { ...x.display, uncertainty: x.display.uncertainty && NON_METRIC.test(x.display.uncertainty) ? "(non-metric ±)" : x.display.uncertainty } })),
    })),
    durations: r.durations.map((d) => ({ id: d.id, years: d.years, metres: d.metres, text: tiny(d.text), visible: d.visible })),
    insets: r.insets.map((i) => ({ ...i, statement: statement(i.statement) })),
  };
}

/** Park–Miller generator: the same "random" exhibits on every run. */
function generator(seed: number) {
  let s = seed;
  const next = () => (s = (s * 16807) % 2147483647) / 2147483647;
  const pick = <T,>(xs: readonly T[]) => xs[Math.floor(next() * xs.length)];
  /** A decimal with a few digits, as people type them (ties and round values included). */
  const decimal = (max: number) => {
    const digits = pick([0, 1, 2, 3, 4, 6]);
    return Number((next() * max).toFixed(digits));
  };
  return { next, pick, decimal };
}

function randomRequest(g: ReturnType<typeof generator>) {
  const ageUnit = g.pick(["a", "ka", "Ma", "Ga"] as const);
  const per = { a: 1, ka: 1e3, Ma: 1e6, Ga: 1e9 }[ageUnit];
  const olderYears = g.pick([1e3, 2e4, 5.4e8, 4.567e9, 66e6, 3e5]) * (0.5 + g.next());
  const older = Number((olderYears / per).toPrecision(g.pick([2, 4, 6])));
  const younger = g.next() < 0.6 ? 0 : Number(((older * g.next()) / 3).toPrecision(3));
  const lengthUnit = g.pick(["mm", "cm", "m", "km", "in", "ft", "yd", "mi"] as const);
  const lengthValue = g.decimal(g.pick([1, 50, 1000, 5000])) || 1.5;
  const n = 1 + Math.floor(g.next() * 40);
  const points = Array.from({ length: n }, (_, i) => {
    const age = younger + (older - younger) * g.next() ** g.pick([1, 3]);
    const value = Math.min(older, Math.max(younger, Number(age.toFixed(g.pick([0, 1, 2, 3, 5])))));
    const unc = g.next() < 0.5 ? { value: Number((value * g.pick([0.001, 0.01, 0.05, 0.0002]) * g.next()).toPrecision(2)), unit: ageUnit } : undefined;
    return { id: String(i + 1), label: `m${i + 1}`, age: { value, unit: ageUnit }, ...(unc && unc.value > 0 ? { uncertainty: unc } : {}) };
  });
  const insets = g.next() < 0.5 ? [] : [{ id: "i1", older: { value: older, unit: ageUnit }, younger: { value: Number((older - (older - younger) * g.next()).toPrecision(4)), unit: ageUnit }, magnification: g.pick([10, 100, 1000, 25]) }];
  const validInsets = insets.filter((i) => i.younger.value < i.older.value && i.younger.value >= younger);
  return {
    span: { older: { value: older, unit: ageUnit }, younger: { value: younger, unit: ageUnit } },
    medium: { kind: "length", length: { value: lengthValue, unit: lengthUnit } },
    mediumType: g.pick(["trail", "wall", "rope", "banner", "other"]),
    points,
    durations: [{ id: "life", years: g.pick([67, 80, 5200, 11_700]) }],
    insets: validInsets,
    ...(g.next() < 0.4 ? { lengthUnit: g.pick(["mm", "cm", "m", "km", "in", "ft", "yd", "mi"]) } : {}),
  };
}

describe("the one formatting module against the oracle", () => {
  it("gives identical labels on the demo exhibits", () => {
    for (const demo of demoExhibits()) {
      const mine = computeExhibit(demo.spec, demo.markers, standardDurations(80));
      const theirs = oracleExhibit(demo.spec, demo.markers, oracleDurations(80));
      if (!mine.ok || !theirs.ok) throw new Error(`${demo.slug} did not compute`);
      expect(mine.result.points.length).toBeGreaterThan(10);
      expect(comparable(mine.result), demo.slug).toEqual(comparable(theirs.result));
      expectSamePlaces(mine.result, theirs.result, demo.slug);
    }
  });

  it("gives identical labels on 2,000 random exhibits (fixed seed)", () => {
    const g = generator(20261201);
    let compared = 0;
    let labels = 0;
    for (let k = 0; k < 2000; k++) {
      const body = randomRequest(g);
      const theirs = oracleParse(body);
      const mine = scaleFromJson(body);
      expect(mine.status === 200, JSON.stringify(body)).toBe(theirs.ok);
      if (!theirs.ok || mine.status !== 200) continue;
      const expected = comparable(oracleScale(theirs.request, { route: theirs.route }));
      const actual = comparable(mine.body);
      if (JSON.stringify(actual) !== JSON.stringify(expected)) expect(actual, JSON.stringify(body)).toEqual(expected);
      compared++;
      labels += actual.points.length;
    }
    expect(compared).toBeGreaterThan(1700);
    expect(labels).toBeGreaterThan(25_000);
  }, 120_000);
});
