// Warnings that name markers, insets and durations that tell the truth, same-age markers, US
// customary units and the words per medium (issue 10). Expected values are hand-worked in the comments.
import { describe, expect, it } from "vitest";
import { formatLength, formatLengthAsGiven } from "../../../app/lib/exhibit/display.ts";
import { scaleFromJson, rulerTicks, warningKey, tableNumbers, type ScaleResult } from "../../../app/lib/scale/index.ts";

function run(body: unknown): ScaleResult {
  const r = scaleFromJson(body);
  if (r.status !== 200) throw new Error(JSON.stringify(r.body));
  return r.body;
}

const eon = { older: { value: 4567, unit: "Ma" }, younger: { value: 0, unit: "Ma" } };
// 4,567 m for 4,567 million years: 1 m per million years, 1 mm per 1,000 years
const trail = { span: eon, medium: { kind: "length", length: { value: 4567, unit: "m" } }, mediumType: "trail" };
const lastYears = (id: string, years: number) => ({ id, label: id, years, endsAgo: { value: 0, unit: "a" } });
const durations = [lastYears("life", 80), lastYears("writing", 5200), lastYears("holocene", 11_700), lastYears("sapiens", 300_000)];

describe("warnings name markers by table number and label", () => {
  it("numbers markers by age, oldest first, equal ages by id — the same numbers in the table and the warnings", () => {
    const points = [
      { id: "140", label: "Base of the Eoarchean", age: { value: 4031, unit: "Ma" } },
      { id: "9", label: "Base of the Hadean", age: { value: 4567, unit: "Ma" } },
      { id: "137", label: "Base of the Archean", age: { value: 4031, unit: "Ma" } },
    ];
    const r = run({ ...trail, points });
    expect(r.points.map((p) => [p.id, p.number])).toEqual([["140", 3], ["9", 1], ["137", 2]]);
    const n = tableNumbers(points, (p) => p.age.value, (p) => p.id);
    expect([...n.entries()]).toEqual([["9", 1], ["137", 2], ["140", 3]]);
    const same = r.warnings.find((w) => w.code === "markers-same-age")!;
    expect(same.key).toBe("markers-same-age:137,140");
    expect(same.markers).toEqual([
      { id: "137", number: 2, label: "Base of the Archean" },
      { id: "140", number: 3, label: "Base of the Eoarchean" },
    ]);
    expect(same.message).toMatch(/^Markers 2 “Base of the Archean” and 3 “Base of the Eoarchean” have the same age \(4\.031 billion years ago\)/);
    expect(same.message).not.toMatch(/\b1[34]\d\b/); // no database ids in the words
    expect(warningKey("markers-too-close", ["140", "9", "137"])).toBe("markers-too-close:9,137,140");
  });

  it("gives one same-age warning per age, and a crowding warning for the rest", () => {
    // 46 m rope: 1.007 cm per million years; 4031 and 4030 Ma are 1 cm apart (< 10 cm between tags)
    const r = run({
      span: eon,
      medium: { kind: "length", length: { value: 46, unit: "m" } },
      mediumType: "rope",
      points: [
        { id: "1", label: "A", age: { value: 4031, unit: "Ma" } },
        { id: "2", label: "B", age: { value: 4031, unit: "Ma" } },
        { id: "3", label: "C", age: { value: 4030, unit: "Ma" } },
        { id: "4", label: "D", age: { value: 2500, unit: "Ma" } },
        { id: "5", label: "E", age: { value: 2500, unit: "Ma" } },
      ],
    });
    expect(r.warnings.map((w) => w.key)).toEqual(["markers-same-age:1,2", "markers-same-age:4,5", "markers-too-close:1,2,3"]);
    expect(r.warnings[2].message).toContain("less than the 10 cm needed between tags on a rope");
  });

  it("has words for every medium type (never “for a other”)", () => {
    const close = (mediumType: string) =>
      run({ span: eon, medium: { kind: "length", length: { value: 4.567, unit: "m" } }, mediumType, points: [{ id: "a", age: { value: 100, unit: "Ma" } }, { id: "b", age: { value: 99.9, unit: "Ma" } }] }).warnings[0].message;
    // 4.567 m: 1 mm per million years, so 0.1 Ma is 0.1 mm — too close on every medium
    expect(close("trail")).toContain("needed between signs on a trail");
    expect(close("wall")).toContain("needed between labels on a wall");
    expect(close("rope")).toContain("needed between tags on a rope");
    expect(close("banner")).toContain("needed between labels on a banner");
    expect(close("other")).toContain("needed between neighbouring markers on this exhibit");
    for (const t of ["trail", "wall", "rope", "banner", "other"]) expect(close(t)).not.toMatch(/for a other|a other/);
  });
});

describe("insets and durations tell the truth", () => {
  const kpgInset = { id: "kpg", label: "66.05 to 66 million years ago at 100×", older: { value: 66.05, unit: "Ma" }, younger: { value: 66, unit: "Ma" }, magnification: 100 };

  it("the issue's example: a 66.05–66 Ma inset at 100× does not clear the Holocene or recorded history", () => {
    const without = run({ ...trail, durations });
    // life 0.08 mm, writing 5.2 mm, Holocene 11.7 mm: under the trail's 5 cm; our species 30 cm is fine
    expect(without.warnings.map((w) => w.key)).toEqual(["duration-too-small:life", "duration-too-small:writing", "duration-too-small:holocene"]);
    const withKpg = run({ ...trail, durations, insets: [kpgInset] });
    expect(withKpg.warnings.map((w) => w.key)).toEqual(["duration-too-small:life", "duration-too-small:writing", "duration-too-small:holocene"]);
    const holocene = withKpg.durations.find((d) => d.id === "holocene")!;
    expect(holocene.located).toBe(true);
    // 11,700 years × 1 mm per 1,000 years × 100 = 1.17 m: big enough, but at the wrong place
    expect(holocene.insets[0]).toMatchObject({ insetId: "kpg", covers: false, visible: false, metres: 1.17 });
    expect(holocene.insets[0].text).toBe("not in inset “66.05 to 66 million years ago at 100×”, which does not cover the last 11,700 years");
    const w = withKpg.warnings.find((x) => x.key === "duration-too-small:holocene")!;
    expect(w.message).toContain("Inset “66.05 to 66 million years ago at 100×” magnifies enough but does not cover the last 11,700 years.");
    // the suggestion covers the last 11,700 years: last 20,000 years at 10× (1.17 cm × 10 = 11.7 cm ≥ 5 cm)
    expect(w.suggestedInset).toMatchObject({ olderYears: 20_000, youngerYears: 0, magnification: 10 });
  });

  it("an inset that contains the last 11,700 years shows the Holocene, and says which inset", () => {
    const r = run({ ...trail, durations, insets: [{ id: "recent", label: "last 20,000 years at 100×", older: { value: 20, unit: "ka" }, younger: { value: 0, unit: "a" }, magnification: 100 }] });
    const holocene = r.durations.find((d) => d.id === "holocene")!;
    expect(holocene.insets[0]).toMatchObject({ covers: true, visible: true, text: "1.17 m in inset “last 20,000 years at 100×”" });
    expect(r.warnings.map((w) => w.key)).toEqual(["duration-too-small:life"]); // 0.08 mm × 100 = 8 mm, still under 5 cm
  });

  it("a pure comparison may use any inset's scale, and names it", () => {
    const r = run({ ...trail, durations: [{ id: "as-long-as", label: "as long as the Holocene", years: 11_700 }], insets: [kpgInset] });
    expect(r.durations[0]).toMatchObject({ located: false, endsAgoYears: null });
    expect(r.durations[0].insets[0]).toMatchObject({ covers: true, visible: true, text: "1.17 m at the scale of inset “66.05 to 66 million years ago at 100×”" });
    expect(r.warnings).toEqual([]);
  });

  it("suggested insets cover what they are suggested for", () => {
    const inside = (s: { olderYears: number; youngerYears: number }, older: number, younger: number) => s.youngerYears <= younger && s.olderYears >= older;
    const r = run({
      ...trail,
      points: [
        // a group at the present: 11.7 ka, 2 ka, now (2 mm apart at most)
        { id: "h", age: { value: 11.7, unit: "ka" } },
        { id: "r", age: { value: 2, unit: "ka" } },
        { id: "n", age: { value: 0, unit: "a" } },
        // a group far from the present: 66.05, 66.02, 66.0 Ma (2 cm apart at most)
        { id: "k1", age: { value: 66.05, unit: "Ma" } },
        { id: "k2", age: { value: 66.02, unit: "Ma" } },
        { id: "k3", age: { value: 66, unit: "Ma" } },
      ],
      durations: [
        ...durations,
        // a located span away from the present: 50,000 years ending 66 million years ago
        { id: "aftermath", years: 50_000, endsAgo: { value: 66, unit: "Ma" } },
        // a comparison
        { id: "compare", years: 3000 },
      ],
    });
    const age = new Map(r.points.map((p) => [p.id, p.ageYears]));
    const located = new Map(r.durations.map((d) => [d.id, d]));
    expect(r.suggestedInsets.map((s) => s.label)).toEqual(["66.1 million years to 66 million years ago at 100×", "last 20,000 years at 1,000×"]);
    for (const s of r.suggestedInsets) {
      for (const id of s.pointIds) expect(inside(s, age.get(id)!, age.get(id)!), `${s.label} for ${id}`).toBe(true);
      for (const id of s.durationIds) {
        const d = located.get(id)!;
        if (d.located) expect(inside(s, d.endsAgoYears! + d.years, d.endsAgoYears!), `${s.label} for ${id}`).toBe(true);
        else expect(s.olderYears - s.youngerYears).toBeGreaterThanOrEqual(d.years);
        expect(d.metres * s.magnification).toBeGreaterThanOrEqual(0.05);
      }
    }
    // the 66 Ma group's inset (66.0–66.1 Ma) is long enough for 11,700 years but is not offered for the Holocene
    const kpg = r.suggestedInsets.find((s) => s.pointIds.includes("k1"))!;
    expect(kpg).toMatchObject({ olderYears: 66.1e6, youngerYears: 66e6 });
    expect(kpg.durationIds).not.toContain("holocene");
    expect(kpg.durationIds).toContain("aftermath");
  });
});

describe("US customary units", () => {
  const us = { ...trail, unitSystem: "us" };

  it("labels, ± and statements in feet, inches and miles, with the ± never rounded down", () => {
    const r = run({ ...us, points: [{ id: "kpg", age: { value: 66, unit: "Ma" }, uncertainty: { value: 0.05, unit: "Ma" } }], durations });
    // ± 0.05 Ma = 5 cm, which sets a 1 cm step = 0.0328 ft → shown to 0.1 ft (the next decade up, never finer)
    // 4,501 m = 14,767.06 ft → 14,767.1 ft; 66 m = 216.54 ft → 216.5 ft; ± 5 cm = 0.164 ft, rounded UP → 0.2 ft
    expect(r.points[0].display).toMatchObject({ fromOlderEnd: "14,767.1 ft", fromYoungerEnd: "216.5 ft", uncertainty: "± 0.2 ft" });
    // 1 m per million years = 3.28 ft; 1 in = 0.0254 m = 25,400 years
    expect(r.scale.statement).toEqual({ lengthPerTime: "3.28 ft per million years", timePerLength: "1 in = 25,400 years" });
    expect(r.scale.unitSystem).toBe("us");
    // 80 years = 0.08 mm = 0.00315 in: never "0.00 in"
    expect(r.durations[0].text).toBe("80 years = 0.00315 in");
    expect(r.warnings[0].message).toContain("smaller than the 1.97 in a visitor can see on a trail"); // 5 cm = 1.97 in
  });

  it("rounds a ± up, never down, once converted to feet", () => {
    // ± 0.04 Ma = 4 cm = 0.131 ft at a 0.1 ft step: up to 0.2 ft (the nearest, 0.1 ft, would understate it)
    const r = run({ ...us, points: [{ id: "x", age: { value: 1000, unit: "Ma" }, uncertainty: { value: 0.04, unit: "Ma" } }] });
    expect(r.points[0].display.uncertainty).toBe("± 0.2 ft");
  });

  it("walking speeds in feet per second on a route", () => {
    const geometry = { type: "LineString", coordinates: [[-2.9, 54.2], [-2.9, 54.21]] };
    const r = run({ span: eon, medium: { kind: "route", geometry }, unitSystem: "us", points: [{ id: "mid", age: { value: 2283.5, unit: "Ma" } }] });
    // MUTCD §4E.06: 0.9 m/s = 2.95 ft/s → "3 ft/s" (the manual's own figure is 3 ft/s)
    expect(r.points[0].walking!.text).toContain("at 3 ft/s)");
  });

  it("a length as given or measured keeps its figures without trailing zeros (lists, the preview's heading)", () => {
    expect(formatLengthAsGiven(46, "metric", 46 / 1e5)).toBe("46 m"); // not "46.000 m"
    expect(formatLengthAsGiven(10.776, "metric", 10.776 / 1e5)).toBe("10.776 m");
    expect(formatLengthAsGiven(4567.03, "metric", 4567.03 / 1e5)).toBe("4.567 km");
    expect(formatLengthAsGiven(4560, "metric", 4560 / 1e5)).toBe("4.56 km");
    expect(formatLengthAsGiven(1000, "metric", 1000 / 1e5)).toBe("1 km");
    expect(formatLengthAsGiven(1500, "metric", 1)).toBe("1.5 km");
    expect(formatLengthAsGiven(18.288, "us", 18.288 / 1e5)).toBe("60 ft"); // 18.288 m = 60 ft exactly (0.3048 m per ft)
    expect(formatLengthAsGiven(8.06e-10, "us", 8.06e-13)).toBe("3.2 × 10⁻⁸ in");
  });

  it("an 80-year life never reads 0.00 in", () => {
    // 80 years at 1 m per million years = 0.00008 m = 0.00315 in
    expect(formatLength(0.00008, "us", 0.00008 / 1000)).toBe("0.0031 in");
    expect(formatLength(0.00008, "metric", 0.00008 / 1000)).toBe("0.08 mm");
    // 80 years on a 46 m rope: 46 / 4.567e9 × 80 = 8.06e-7 m = 3.2 × 10⁻⁵ in
    expect(formatLength(8.06e-7, "us", 8.06e-10)).toBe("0.000032 in");
    expect(formatLength(8.06e-10, "us", 8.06e-13)).toBe("3.2 × 10⁻⁸ in");
    expect(formatLength(4567, "us", 0.01)).toBe("2.838 mi"); // 4,567 m = 2.8378 mi
  });

  it("ruler ticks at round feet, inches or miles — not at converted metres", () => {
    // 18 m = 59.06 ft: about 8 ticks → every 10 ft
    const wall = rulerTicks(18, "us");
    expect(wall.ticks.map((t) => t.label)).toEqual(["0 ft", "10 ft", "20 ft", "30 ft", "40 ft", "50 ft"]);
    expect(wall.ticks[1].metres).toBeCloseTo(3.048, 12);
    // 4,567 m = 2.84 mi → every half mile
    expect(rulerTicks(4567, "us").ticks.map((t) => t.label)).toEqual(["0.0 mi", "0.5 mi", "1.0 mi", "1.5 mi", "2.0 mi", "2.5 mi"]);
    // a 1 m banner = 39.4 in → every 6 in
    expect(rulerTicks(1, "us").ticks.map((t) => t.label)).toEqual(["0 in", "6 in", "12 in", "18 in", "24 in", "30 in", "36 in"]);
    // metric: 46 m rope → every 10 m
    expect(rulerTicks(46, "metric").ticks.map((t) => t.label)).toEqual(["0 m", "10 m", "20 m", "30 m", "40 m"]);
  });
});
