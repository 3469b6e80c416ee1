import { describe, expect, it } from "vitest";
import { computeScale, parseScaleRequest, scaleFromJson, type ScaleResult } from "../../../app/lib/scale";
import { niceCeil, readableMagnification, roundSubSpan } from "../../../app/lib/scale/legibility";
import { decadeFloor, displayStep, formatYears, oneSignificantFigure, roundAtStep, scaleStatement, uncertaintyFigures } from "../../../app/lib/scale/format";

function run(body: unknown): ScaleResult {
  const r = scaleFromJson(body);
  if (r.status !== 200) throw new Error(JSON.stringify(r.body));
  return r.body;
}

const eon = { older: { value: 4567, unit: "Ma" }, younger: { value: 0, unit: "Ma" } };

describe("linear scale", () => {
  it("common practice: at 1 km per million years, 4,567 million years is 4,567 km and a 67-year life is 67 mm", () => {
    // common practice figures (time-as-distance exhibits): 1 km ↔ 1 million years
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 4567, unit: "km" } },
      points: [{ id: "kpg", age: { value: 66, unit: "Ma" }, uncertainty: { value: 0.05, unit: "Ma" } }],
      durations: [{ id: "life", years: 67 }],
    });
    expect(r.scale.totalMetres).toBe(4_567_000); // 4,567 km
    expect(r.scale.metresPerYear).toBe(0.001);
    expect(r.scale.yearsPerMetre).toBe(1000);
    expect(r.scale.metresPerMillionYears).toBe(1000);
    expect(r.durations[0].metres).toBe(0.067); // 67 mm
    expect(r.durations[0].text).toBe("67 years = 6.7 cm");
    const kpg = r.points[0];
    expect(kpg.fromOlderEndMetres).toBe(4_501_000); // (4,567 − 66) km
    expect(kpg.fromYoungerEndMetres).toBe(66_000);
    expect(kpg.uncertaintyMetres).toBe(50); // 0.05 Ma × 1 m per 1,000 years
  });

  it("states the scale both ways in readable units", () => {
    // hand-worked: 4.567 km for 4,567 Ma is 1 m per million years, so 1 mm stands for 1,000 years
    expect(scaleStatement(1e-6, 4.567e9)).toEqual({ lengthPerTime: "1 m per million years", timePerLength: "1 mm = 1,000 years" });
    // 18 m wall: 18 / 4,567 = 0.003941 m per million years; 1 mm = 253,722 years
    expect(scaleStatement(18 / 4.567e9, 4.567e9)).toEqual({
      lengthPerTime: "3.94 mm per million years",
      timePerLength: "1 mm = 254,000 years",
    });
    // 46 m rope: 1.007 cm per million years
    expect(scaleStatement(46 / 4.567e9, 4.567e9).lengthPerTime).toBe("1.01 cm per million years");
    // last 10,000 years on 10 m: 1 mm per year
    expect(scaleStatement(1e-3, 1e4)).toEqual({ lengthPerTime: "1 m per thousand years", timePerLength: "1 mm = 1 year" });
    // 100 m per year: a millimetre, centimetre or metre is under a year, so "1 km = 10 years"
    expect(scaleStatement(100, 1000).timePerLength).toBe("1 km = 10 years");
    expect(formatYears(2.5e6)).toBe("2.5 million years");
    expect(formatYears(1)).toBe("1 year");
  });

  it("accepts every length unit and a span that does not end at the present", () => {
    const r = run({
      span: { older: { value: 541, unit: "Ma" }, younger: { value: 251.902, unit: "Ma" } },
      medium: { kind: "length", length: { value: 100, unit: "ft" } },
      points: [{ id: "ptb", age: { value: 251.902, unit: "Ma" } }],
      lengthUnit: "ft",
    });
    expect(r.scale.totalMetres).toBe(30.48); // 100 × 0.3048 m (NIST SP 811)
    expect(r.points[0].fromOlderEndMetres).toBeCloseTo(30.48, 12);
    expect(r.points[0].fromYoungerEndMetres).toBe(0);
    expect(r.points[0].display.fromOlderEnd).toMatch(/ ft$/);
  });

  it("accepts durations given with a unit", () => {
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 4567, unit: "m" } },
      durations: [{ id: "hist", duration: { value: 5, unit: "ka" }, label: "recorded history" }],
    });
    expect(r.durations[0].years).toBe(5000);
    expect(r.durations[0].metres).toBe(0.005); // 5,000 years at 1 m per million years
    expect(r.durations[0].label).toBe("recorded history");
  });
});

describe("label rounding", () => {
  it("keeps two figures of a ± whose first digit is 1 or 2, and never rounds a ± down", () => {
    expect(uncertaintyFigures(0.011)).toEqual([0.011, 0.001]); // not 0.01: that would understate it by 9 %
    expect(uncertaintyFigures(0.0113)).toEqual([0.012, 0.001]); // up, not to 0.011
    expect(uncertaintyFigures(25)).toEqual([25, 1]);
    expect(uncertaintyFigures(0.054)).toEqual([0.06, 0.01]); // one figure, rounded up
    expect(uncertaintyFigures(50)).toEqual([50, 10]);
    expect(uncertaintyFigures(96)).toEqual([100, 10]);
    expect(uncertaintyFigures(0.00034)).toEqual([0.0004, 0.0001]);
    for (const x of [0.011, 0.0113, 0.0199, 0.29, 3.01, 96, 0.00034, 1234]) expect(uncertaintyFigures(x)[0]).toBeGreaterThanOrEqual(x);
    // The end-Cretaceous figure: 66.043 ± 0.011 Ma at 1 km per Ma → ± 11 m, shown as ± 0.011 km (was ± 0.01 km).
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 4567, unit: "km" } },
      points: [{ id: "kpg", age: { value: 66.043, unit: "Ma" }, uncertainty: { value: 0.011, unit: "Ma" } }],
    });
    expect(r.points[0].uncertaintyMetres).toBeCloseTo(11, 9);
    expect(r.points[0].display.uncertainty).toBe("± 0.011 km");
    expect(r.points[0].display.stepMetres).toBe(1);
    expect(r.points[0].display.fromOlderEnd).toBe("4,500.957 km");
  });

  it("rounds the uncertainty to one significant figure and shows the distance at its decade", () => {
    expect(oneSignificantFigure(50)).toEqual([50, 10]);
    expect(oneSignificantFigure(0.096)).toEqual([0.1, 0.1]); // 96 mm rounds up to 0.1 m
    expect(oneSignificantFigure(0.00034)).toEqual([0.0003, 0.0001]);
    expect(decadeFloor(1000)).toBe(1000);
    expect(decadeFloor(0.05)).toBe(0.01);
    // hand-worked: 66 ± 0.05 Ma at 1 km per Ma → ± 50 m → shown to 10 m
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 4567, unit: "km" } },
      points: [{ id: "kpg", age: { value: 66, unit: "Ma" }, uncertainty: { value: 0.05, unit: "Ma" } }],
    });
    expect(r.points[0].display).toEqual({
      fromOlderEnd: "4,501.00 km",
      fromYoungerEnd: "66.00 km",
      uncertainty: "± 0.05 km",
      stepMetres: 10,
      basis: "uncertainty",
    });
  });

  it("without an uncertainty, takes the age to three significant figures", () => {
    // hand-worked: 66 Ma → good to 0.1 Ma → 0.1 m at 1 m per Ma → "4,501.0 m"
    const s = displayStep(66e6, null, 1e-6, 0.01);
    expect(s).toEqual({ stepMetres: 0.1, basis: "age-significant-figures", uncertaintyMetres: null });
    const r = run({
      span: eon,
      medium: { kind: "route", geometry: marrowbyRoute },
      points: [{ id: "kpg", age: { value: 66, unit: "Ma" } }],
    });
    // the invented route is about 2.2 km: 0.1 Ma × (2.2 km / 4,567 Ma) ≈ 0.048 m → shown to 0.01 m
    expect(r.points[0].display.stepMetres).toBe(0.01);
    expect(r.points[0].display.basis).toBe("age-significant-figures");
    expect(r.points[0].display.fromOlderEnd).toMatch(/^[\d,]+\.\d\d m$/);
  });

  it("never shows more than the medium's resolution", () => {
    // the present has no age-based step: the trail's resolution (decade below 5 cm = 1 cm) applies
    expect(displayStep(0, null, 1e-6, 0.01)).toEqual({ stepMetres: 0.01, basis: "medium-resolution", uncertaintyMetres: null });
    // 252.16 ± 0.06 Ma on an 18 m wall: ± 0.24 mm is finer than the wall's 1 mm resolution
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 18, unit: "m" } },
      mediumType: "wall",
      points: [{ id: "ptb", age: { value: 252.16, unit: "Ma" }, uncertainty: { value: 0.06, unit: "Ma" } }],
    });
    const d = r.points[0].display;
    expect(d.stepMetres).toBe(0.001);
    expect(d.basis).toBe("medium-resolution");
    // (4,567 − 252.16) / 4,567 × 18 m = 17.00614 m
    expect(d.fromOlderEnd).toBe("17.006 m");
    // ± 0.06 Ma × 18 m / 4,567 Ma = 0.000236 m: first digit 2, so two figures, rounded up
    expect(d.uncertainty).toBe("± 0.00024 m");
  });

  it("rounds in imperial units without implying extra precision", () => {
    // 1 cm is 0.0328 ft: one decimal of a foot (≈ 3 cm) is the finest honest step
    expect(roundAtStep(10.2, 0.01, "ft").text).toBe("33.5 ft");
    // 10 m is 32.8 ft: round to 100 ft, not 10 ft
    expect(roundAtStep(1000, 10, "ft").text).toBe("3,300 ft");
    expect(roundAtStep(4_501_000, 10, "km").text).toBe("4,501.00 km");
  });
});

describe("legibility and insets", () => {
  it("rounds magnifications to powers of ten and sub-spans to 1, 2, 5", () => {
    expect(readableMagnification(746)).toBe(1000);
    expect(readableMagnification(1000)).toBe(1000);
    expect(readableMagnification(2)).toBe(10);
    expect(niceCeil(11_700)).toBe(20_000);
    expect(niceCeil(10_000)).toBe(10_000);
    expect(niceCeil(134)).toBe(200);
    // a group far from the present: 66.00–66.05 Ma → 66.0–66.1 Ma
    expect(roundSubSpan(66e6, 66.05e6, { olderYears: 4.567e9, youngerYears: 0 })).toEqual({ olderYears: 66.1e6, youngerYears: 66e6 });
  });

  it("reports crowded markers on a trail and proposes an inset (hand-worked)", () => {
    // 4.567 km trail at 1 m per Ma; markers at 11.7 ka, 2 ka and now are millimetres apart.
    // Smallest gap 2,000 years = 2 mm; 2 m spacing needs 1,000×; group reaches 11,700 years → last 20,000 years.
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 4.567, unit: "km" } },
      mediumType: "trail",
      points: [
        { id: "holocene", age: { value: 11.7, unit: "ka" } },
        { id: "rome", age: { value: 2000, unit: "a" } },
        { id: "now", age: { value: 0, unit: "a" } },
        { id: "kpg", age: { value: 66, unit: "Ma" } },
      ],
    });
    expect(r.warnings).toHaveLength(1);
    const w = r.warnings[0];
    expect(w.code).toBe("markers-too-close");
    expect(w.pointIds).toEqual(["holocene", "rome", "now"]);
    expect(w.suggestedInset).toMatchObject({
      olderYears: 20_000,
      youngerYears: 0,
      magnification: 1000,
      label: "last 20,000 years at 1,000×",
      lengthMetres: 20, // 20,000 years × 1 mm per 1,000 years × 1,000
    });
    expect(w.message).toContain("2 mm apart");
    expect(r.suggestedInsets).toHaveLength(1);
  });

  it("accepts an inset that spreads them, and places points on the inset's own scale", () => {
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 4.567, unit: "km" } },
      mediumType: "trail",
      points: [
        { id: "a", age: { value: 10, unit: "ka" } },
        { id: "b", age: { value: 5, unit: "ka" } },
        { id: "c", age: { value: 2, unit: "ka" } },
        { id: "now", age: { value: 0, unit: "a" } },
      ],
      insets: [{ id: "recent", older: { value: 10, unit: "ka" }, younger: { value: 0, unit: "a" }, magnification: 1000 }],
    });
    expect(r.warnings).toEqual([]); // gaps of 2,000 years become 2 m at 1,000×
    expect(r.insets[0]).toMatchObject({
      id: "recent",
      label: "last 10,000 years at 1,000×",
      lengthMetres: 10, // 10,000 years × 1e-6 m/yr × 1,000
      metresPerYear: 0.001,
      pointIds: ["a", "b", "c", "now"],
    });
    expect(r.insets[0].statement.timePerLength).toBe("1 mm = 1 year");
    const b = r.points[1].insets[0];
    expect(b.insetId).toBe("recent");
    expect(b.fromOlderEndMetres).toBe(5); // (10,000 − 5,000) years × 1 mm per year
    expect(b.fromYoungerEndMetres).toBe(5);
  });

  it("warns when an inset is still too crowded, and when markers share an age", () => {
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 4.567, unit: "km" } },
      mediumType: "trail",
      points: [
        { id: "a", age: { value: 5, unit: "ka" } },
        { id: "b", age: { value: 4, unit: "ka" } },
        { id: "c", age: { value: 4, unit: "ka" } },
      ],
      insets: [{ older: { value: 10, unit: "ka" }, younger: { value: 0, unit: "a" }, magnification: 10 }],
    });
    const codes = r.warnings.map((w) => w.code).sort();
    expect(codes).toEqual(["markers-same-age", "markers-too-close-in-inset"]);
    const same = r.warnings.find((w) => w.code === "markers-same-age")!;
    expect(same.pointIds.sort()).toEqual(["b", "c"]);
    const inset = r.warnings.find((w) => w.code === "markers-too-close-in-inset")!;
    expect(inset.insetId).toBe("inset-1");
    // 1,000-year gap = 1 mm; 2 m needs 2,000× → 10,000×
    expect(inset.suggestedInset?.magnification).toBe(10_000);
  });

  it("uses per-medium spacing: 4 cm on a wall", () => {
    const body = (mediumType: string) => ({
      span: eon,
      medium: { kind: "length", length: { value: 18, unit: "m" } },
      mediumType,
      // 10 Ma apart = 3.9 cm on an 18 m wall
      points: [
        { id: "x", age: { value: 100, unit: "Ma" } },
        { id: "y", age: { value: 90, unit: "Ma" } },
      ],
    });
    expect(run(body("wall")).warnings.map((w) => w.code)).toEqual(["markers-too-close"]);
    expect(run(body("banner")).warnings).toEqual([]); // banner default: 3 cm
    const custom = run({ ...body("wall"), legibility: { minSpacingMetres: 0.01 } });
    expect(custom.warnings).toEqual([]);
    expect(custom.scale.legibility.minSpacingMetres).toBe(0.01);
    expect(custom.scale.legibility.minVisibleMetres).toBe(0.003); // wall default kept
  });

  it("reports durations too small to see, with an inset that shows them", () => {
    // 4.567 km trail: 67 years = 0.067 mm; 5 cm needs 746× → 1,000×; last 200 years (2 × 67 → 200)
    // recorded history, 5,000 years = 5 mm → 10× → last 10,000 years at 10× (10 cm long)
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 4567, unit: "m" } },
      mediumType: "trail",
      durations: [
        { id: "life", years: 67 },
        { id: "history", years: 5000 },
      ],
    });
    expect(r.warnings.map((w) => [w.code, w.durationIds])).toEqual([
      ["duration-too-small", ["life"]],
      ["duration-too-small", ["history"]],
    ]);
    expect(r.warnings[0].suggestedInset).toMatchObject({ label: "last 200 years at 1,000×", magnification: 1000 });
    expect(r.warnings[1].suggestedInset).toMatchObject({ label: "last 10,000 years at 10×", lengthMetres: 0.1 });
    expect(r.durations.map((d) => d.visible)).toEqual([false, false]);
  });
});

// An invented riverside route for the Marrowby Museum of the Earth (demo scenario), about 2.2 km.
const marrowbyRoute = {
  type: "Feature",
  properties: { name: "Marrowby riverside trail (invented)" },
  geometry: {
    type: "LineString",
    coordinates: [
      [-2.9, 54.2],
      [-2.895, 54.2015],
      [-2.889, 54.2022],
      [-2.882, 54.2041],
      [-2.876, 54.2049],
      [-2.87, 54.2068],
    ],
  },
};

describe("routes", () => {
  it("places markers with coordinates, bearing, walking time and steps", () => {
    const parsed = parseScaleRequest({
      span: eon,
      medium: { kind: "route", geometry: marrowbyRoute },
      points: [
        { id: "start", age: { value: 4567, unit: "Ma" } },
        { id: "mid", age: { value: 2283.5, unit: "Ma" } },
        { id: "end", age: { value: 0, unit: "Ma" } },
      ],
    });
    if (!parsed.ok) throw new Error(parsed.error.message);
    const route = parsed.route!;
    const r = computeScale(parsed.request, { route });
    const L = route.totalMetres;
    expect(L).toBeGreaterThan(2000);
    expect(r.scale.totalMetres).toBeCloseTo(L, 9);
    expect(r.scale.route?.vertexCount).toBe(6);
    const [start, mid, end] = r.points;
    expect(start.position).toEqual({ lon: -2.9, lat: 54.2 });
    expect(end.position!.lon).toBeCloseTo(-2.87, 10);
    expect(end.position!.lat).toBeCloseTo(54.2068, 10);
    expect(mid.walking!.distanceFromStartMetres).toBeCloseTo(L / 2, 6);
    // FHWA-RD-98-107: 1.2 m/s; MUTCD §4E.06: 0.9 m/s; common practice: 0.66–0.76 m per step
    expect(mid.walking!.seconds).toBeCloseTo(L / 2 / 1.2, 6);
    expect(mid.walking!.accessibleSeconds).toBeCloseTo(L / 2 / 0.9, 6);
    expect(mid.walking!.steps).toBe(Math.round(L / 2 / 0.76));
    expect(mid.walking!.stepsUpTo).toBe(Math.round(L / 2 / 0.66));
    const twoFigures = (n: number) => Number(n.toPrecision(2)).toLocaleString("en-GB");
    expect(mid.walking!.text).toContain(`about ${twoFigures(Math.round(L / 2 / 0.76))}–${twoFigures(Math.round(L / 2 / 0.66))} steps`);
    expect(r.scale.route!.stepLengthRangeM).toEqual([0.66, 0.76]);
    expect(mid.bearing).toBeGreaterThan(0);
    expect(mid.bearing).toBeLessThan(90); // the route heads east-north-east
    expect(r.scale.route?.sources.walkingSpeed).toMatch(/FHWA-RD-98-107/);
  });

  it("supports settable walking speed, step length and a route that starts at the younger end", () => {
    const r = run({
      span: eon,
      medium: { kind: "route", geometry: marrowbyRoute },
      walkingSpeedMps: 1,
      stepLengthM: 0.5,
      routeStart: "younger",
      points: [{ id: "now", age: { value: 0, unit: "a" } }],
    });
    expect(r.points[0].position).toEqual({ lon: -2.9, lat: 54.2 });
    expect(r.points[0].walking!.seconds).toBe(0);
    expect(r.scale.route!.steps).toBe(Math.round(r.scale.totalMetres / 0.5));
    expect(r.scale.route!.stepsUpTo).toBe(r.scale.route!.steps); // one step length asked for: no range
    expect(r.scale.route!.stepLengthRangeM).toEqual([0.5, 0.5]);
    expect(r.scale.route!.walkingSeconds).toBeCloseTo(r.scale.totalMetres, 6);
  });

  it("gives a route's markers the same distances from both ends whichever end the route starts at", () => {
    // (the engine takes the end the route starts from as the marker's walking distance, already
    // rounded clean, and works out the other: both ways must give the same figures)
    const points = Array.from({ length: 60 }, (_, i) => ({ id: `p${i}`, age: { value: Number((4567 * ((i + 0.37) / 60) ** 2).toPrecision(6)), unit: "Ma" as const } }));
    const fromOlder = run({ span: eon, medium: { kind: "route", geometry: marrowbyRoute }, routeStart: "older", points });
    const fromYounger = run({ span: eon, medium: { kind: "route", geometry: marrowbyRoute }, routeStart: "younger", points });
    fromOlder.points.forEach((p, i) => {
      const q = fromYounger.points[i];
      expect(p.fromOlderEndMetres, p.id).toBe(q.fromOlderEndMetres);
      expect(p.fromYoungerEndMetres, p.id).toBe(q.fromYoungerEndMetres);
      expect(p.walking!.distanceFromStartMetres).toBe(p.fromOlderEndMetres);
      expect(q.walking!.distanceFromStartMetres).toBe(q.fromYoungerEndMetres);
      expect(p.fromOlderEndMetres).toBe(Number(p.fromOlderEndMetres.toPrecision(15)));
    });
  });

  it("reads a GPX track", () => {
    const gpx = `<?xml version="1.0"?><gpx version="1.1" creator="test" xmlns="http://www.topografix.com/GPX/1/1"><trk><trkseg>
      <trkpt lat="54.2" lon="-2.9"/><trkpt lat="54.21" lon="-2.9"/></trkseg></trk></gpx>`;
    const r = run({ span: eon, medium: { kind: "route", gpx }, points: [] });
    expect(r.scale.totalMetres).toBeGreaterThan(1112);
    expect(r.scale.totalMetres).toBeLessThan(1114); // 0.01° of latitude ≈ 1,113 m at 54° N
  });
});
