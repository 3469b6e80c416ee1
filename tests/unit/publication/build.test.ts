// The publication snapshot builder: markers with their sign numbers, distances, ± lengths, texts,
// panels and images; route positions with interpolated elevations; the edition's intervals in every
// language the chart data carries; cautions and sources; a snapshot that survives JSON unchanged.
import { describe, expect, it } from "vitest";
import { computeExhibit, standardDurations } from "../../../app/lib/exhibit/compose.ts";
import type { ExhibitSpec, ResolvedMarker } from "../../../app/lib/exhibit/types.ts";
import { prepareRoute } from "../../../app/lib/geo/route.ts";
import { buildSnapshot, COORDINATE_DECIMALS, PUBLICATION_CAUTIONS, snapshotIntervals, type SnapshotInput } from "../../../app/lib/publication/build.ts";
import { canonicalJson } from "../../../app/lib/publication/canonical.ts";
import { SNAPSHOT_SCHEMA_VERSION, type SnapshotImage } from "../../../app/lib/publication/types.ts";
import { boundary, custom, EDITION, INTERVALS, numbered, rope } from "../review/fixture.ts";

const jurassic = boundary("1", "Jurassic");
const paleogene = boundary("2", "Paleogene");
const mill = custom("3", "Village mill built", 0.0002, { approximate: true, text: "Built **about 200 years** ago." });
const IMAGE: SnapshotImage = { assetId: 41, alt: "The red-brick mill by the river.", credit: "Drawing: Eonscale test", sizes: [{ width: 480, format: "jpeg", url: "/media/41/480.jpg" }] };

function snapshotOf(spec: ExhibitSpec, list: ResolvedMarker[], fields: Partial<SnapshotInput> = {}) {
  const markers = numbered(list);
  const computed = computeExhibit(spec, markers, standardDurations());
  if (!computed.ok) throw new Error(computed.message);
  return buildSnapshot({
    organisation: { slug: "marrowby", name: "Marrowby Museum" },
    exhibit: { slug: "deep-time-rope", title: "Deep-time rope", revision: 7 },
    spec,
    markers,
    result: computed.result,
    edition: { slug: "ics-2024-12", label: "ICS 2024/12", source: "ICS chart v2024/12", licence: "CC BY 4.0" },
    intervals: INTERVALS,
    html: new Map([["3", "<p>Built <strong>about 200 years</strong> ago.</p>"]]),
    decay: new Map([["1", { system: "U-238 → Pb-206", sentence: "More than 99.9 % of the uranium-238 is still there.", citation: "Jaffey et al. (1971)" }]]),
    images: new Map([["3", IMAGE]]),
    signs: new Map(markers.map((m, i) => [m.id, [4, 1, 2][i] ?? i + 10])),
    retiredSigns: [{ number: 3, label: "Base of the Cretaceous", retiredAtPublication: 2, status: "removed", absorbedBy: null }],
    ...fields,
  });
}

describe("buildSnapshot on a rope", () => {
  const s = snapshotOf(rope(), [jurassic, paleogene, mill]);

  it("says what it is: schema version, organisation, exhibit, scale, medium", () => {
    expect(s.schemaVersion).toBe(SNAPSHOT_SCHEMA_VERSION);
    expect(s.organisation).toEqual({ slug: "marrowby", name: "Marrowby Museum" });
    expect(s.exhibit).toEqual({ slug: "deep-time-rope", title: "Deep-time rope", revision: 7, unitsPreference: "metric", span: { older: { value: 541, unit: "Ma" }, younger: { value: 0, unit: "Ma" }, olderMa: 541, youngerMa: 0 } });
    expect(s.scale.totalMetres).toBe(54.1);
    expect(s.scale.metresPerMillionYears).toBeCloseTo(0.1, 12); // 54.1 m over 541 million years
    expect(s.medium).toEqual({ kind: "length", mediumType: "rope", length: { value: 54.1, unit: "m" }, lengthMetres: 54.1, panelWidth: null });
  });

  it("markers in table order with their sign numbers, ages in words, distances, texts, panels and images", () => {
    expect(s.markers.map((m) => [m.order, m.id, m.signNumber])).toEqual([[1, "1", 4], [2, "2", 1], [3, "3", 2]]);
    const [j, p, mi] = s.markers;
    expect(j).toMatchObject({ kind: "boundary", label: "Base of the Jurassic", ageMa: 201.4, uncertaintyMa: 0.2, ageText: "201.4 ± 0.2 Ma", intervalName: "Jurassic", intervalRank: "period", source: "ICS 2024/12", color: jurassic.color });
    // (541 − 201.4) Ma at 0.1 m per million years; ± 0.2 Ma = ± 2 cm.
    expect(j.distance.fromOlderEndMetres).toBe(33.96);
    expect(j.distance.fromYoungerEndMetres).toBe(20.14);
    expect(j.distance.uncertaintyMetres).toBe(0.02);
    expect(j.within.slice(0, 3)).toEqual(["Phanerozoic", "Mesozoic", "Jurassic"]);
    expect(j.decay).toEqual({ system: "U-238 → Pb-206", sentence: "More than 99.9 % of the uranium-238 is still there.", citation: "Jaffey et al. (1971)" });
    expect(j.image).toBeNull();
    expect(j.position).toBeNull();
    expect(j.walking).toBeNull();
    expect(p.ageText).toBe("66 Ma");
    expect(p.distance.uncertaintyMetres).toBeNull();
    expect(mi.ageText).toBe("about 200 a");
    expect(mi.text).toEqual({ markdown: "Built **about 200 years** ago.", html: "<p>Built <strong>about 200 years</strong> ago.</p>" });
    expect(mi.distance.fromYoungerEndMetres).toBe(0); // 200 years = 0.02 mm: rounded to 0.1 mm
    expect(mi.image).toEqual(IMAGE);
    expect(p.text.html).toBe("");
  });

  it("the edition's intervals over the span with their colours and every name the chart data carries", () => {
    expect(s.edition).toMatchObject({ slug: "ics-2024-12", label: "ICS 2024/12", source: "ICS chart v2024/12", licence: "CC BY 4.0" });
    expect(s.edition.languages).toContain("en");
    expect(s.edition.languages).toContain("de");
    expect(s.edition.languages).toEqual([...s.edition.languages].sort());
    const cambrian = s.edition.intervals.find((i) => i.name === "Cambrian")!;
    expect(cambrian.names.en).toBe("Cambrian");
    expect(cambrian.names.fr).toBe("Cambrien");
    expect(cambrian.color).toMatch(/^#[0-9A-Fa-f]{6}$/);
    expect(s.edition.intervals.some((i) => i.name === "Ediacaran")).toBe(true); // 635–538.8 Ma overlaps 541–0 Ma
    expect(s.edition.intervals.some((i) => i.name === "Cryogenian")).toBe(false); // older than the span
  });

  it("durations, retired signs, cautions and sources", () => {
    expect(s.durations.map((d) => d.id)).toEqual(["life", "writing", "holocene", "sapiens"]);
    expect(s.durations[0]).toMatchObject({ years: 80, visible: false });
    expect(s.retiredSigns).toEqual([{ number: 3, label: "Base of the Cretaceous", retiredAtPublication: 2, status: "removed", absorbedBy: null }]);
    expect(s.cautions).toEqual([PUBLICATION_CAUTIONS.ages, PUBLICATION_CAUTIONS.edition("ICS 2024/12")]);
    expect(Object.keys(s.sources)).toEqual(["legibility"]);
  });

  it("survives JSON (what JSONB keeps is what was hashed): no undefined, no NaN", () => {
    expect(JSON.parse(canonicalJson(s))).toEqual(s);
  });

  it("refuses a marker without a sign number, or one the engine did not place", () => {
    expect(() => snapshotOf(rope(), [jurassic, paleogene], { signs: new Map([["1", 1]]) })).toThrow("buildSnapshot: marker 2 has no sign number");
    const markers = numbered([jurassic]);
    const computed = computeExhibit(rope(), markers, []);
    if (!computed.ok) throw new Error(computed.message);
    const extra = { ...paleogene, number: 2 };
    expect(() => buildSnapshot({ ...baseInput(), markers: [...markers, extra], result: computed.result, signs: new Map([["1", 1], ["2", 2]]) })).toThrow("buildSnapshot: marker 2 was not computed");
  });
});

function baseInput(): SnapshotInput {
  return {
    organisation: { slug: "o", name: "O" },
    exhibit: { slug: "e", title: "E", revision: 1 },
    spec: rope(),
    markers: [],
    result: undefined as never,
    edition: { slug: "ics-2024-12", label: "ICS 2024/12", source: "", licence: "" },
    intervals: INTERVALS,
    html: new Map(),
    decay: new Map(),
    images: new Map(),
    signs: new Map(),
    retiredSigns: [],
  };
}

describe("buildSnapshot on a route with elevations", () => {
  // Three vertices eastwards along 54° N, climbing 100 m → 110 m → 130 m (invented).
  const coordinates = [[-1.5, 54, 100], [-1.49, 54, 110], [-1.48, 54, 130]];
  const total = prepareRoute(coordinates.flatMap((c) => [c[0], c[1]])).totalMetres;
  const spec: ExhibitSpec = rope({ spanOlder: { value: 100, unit: "Ma" }, medium: { kind: "route", mediumType: "trail", geometry: { type: "LineString", coordinates }, lengthMetres: total, sourceName: "hill.gpx" } });
  const start = custom("10", "Start", 100);
  const quarter = custom("11", "A quarter of the way", 75);
  const middle = custom("12", "Halfway", 50);
  const s = snapshotOf(spec, [start, quarter, middle]);

  it("keeps the geometry (7 decimals) with elevations, walking figures and sources", () => {
    if (s.medium.kind !== "route") throw new Error("not a route");
    expect(s.medium.geometry).toEqual({ type: "LineString", coordinates });
    expect(s.medium).toMatchObject({ vertexCount: 3, hasElevations: true, sourceName: "hill.gpx", start: "older" });
    expect(s.medium.walking.speedMps).toBe(1.2);
    expect(s.medium.walking.seconds).toBeCloseTo(total / 1.2, 1);
    expect(s.cautions[0]).toBe(PUBLICATION_CAUTIONS.route);
    expect(s.sources.walkingSpeed).toMatch(/^FHWA-RD-98-107/);
  });

  it("places each marker on the route with its elevation interpolated along it", () => {
    const [a, b, c] = s.markers;
    expect(a.position).toMatchObject({ lon: -1.5, lat: 54, elevationMetres: 100 });
    // A quarter of the way is halfway along the first segment (the two are about equally long): about 105 m.
    expect(b.position!.elevationMetres).toBeCloseTo(105, 0);
    // Halfway is the middle vertex: 110 m.
    expect(c.position!.elevationMetres).toBeCloseTo(110, 0);
    expect(c.position!.lon).toBeCloseTo(-1.49, 4);
    for (const m of s.markers) {
      expect(String(m.position!.lon).split(".")[1]?.length ?? 0).toBeLessThanOrEqual(COORDINATE_DECIMALS);
      expect(m.walking!.fromStartMetres).toBeCloseTo(m.distance.fromOlderEndMetres, 3);
      expect(m.walking!.text).toMatch(/walk/);
    }
  });

  it("a route without elevations gives none", () => {
    const flat = rope({ spanOlder: { value: 100, unit: "Ma" }, medium: { kind: "route", mediumType: "trail", geometry: { type: "LineString", coordinates: coordinates.map((c) => [c[0], c[1]]) }, lengthMetres: total, sourceName: null } });
    const snap = snapshotOf(flat, [start, middle]);
    expect(snap.medium.kind === "route" && snap.medium.hasElevations).toBe(false);
    expect(snap.markers.map((m) => m.position!.elevationMetres)).toEqual([null, null]);
  });
});

describe("snapshotIntervals", () => {
  it("keeps the intervals overlapping the span (not those only touching its ends), English name first among the names", () => {
    const list = snapshotIntervals(EDITION.intervals, 66, 23.04);
    const names = list.map((i) => i.name);
    expect(names).toContain("Paleogene");
    expect(names).toContain("Cenozoic");
    expect(names).not.toContain("Cretaceous"); // ends at 66 Ma: touches the span's older end only
    expect(names).not.toContain("Neogene"); // begins at 23.04 Ma: touches the younger end only
    for (const iv of list) expect(iv.names.en).toBe(iv.name);
  });
});
