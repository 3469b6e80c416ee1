// Pure parts of the input limits: control characters, slugs from any script, GeoJSON depth.
import { describe, expect, it } from "vitest";
import { z } from "zod";
import { DEPTH_MESSAGE, nestingExceeds, parseGeoJsonRoute } from "../../app/lib/geo/parse";
import { MAX_GEOJSON_DEPTH } from "../../app/lib/limits";
import { slugify } from "../../app/lib/slug";
import { controlCharacterPath, parseForm } from "../../app/lib/validation";
import { intervalSchema } from "../../app/lib/timescale/schema";

function nested(depth: number): unknown {
  let v: unknown = [0, 0];
  for (let i = 0; i < depth; i++) v = [v];
  return v;
}

describe("control characters", () => {
  it("a NUL (or any C0/C1 control but tab, LF, CR) is refused with the field named", () => {
    const r = parseForm(z.object({ label: z.string() }), { label: "Cambrian\u0000base" });
    expect(r).toEqual({ ok: false, fieldErrors: { label: expect.stringMatching(/^label contains a control character/) }, formError: expect.stringMatching(/label/) });
    for (const c of ["\u0001", "\u001b", "\u007f", "\u0085"]) expect(controlCharacterPath({ a: { b: [`x${c}`] } })).toBe("a.b.0");
  });

  it("tabs and line breaks are text", () => {
    expect(controlCharacterPath({ source: "line one\r\nline\ttwo" })).toBeNull();
    expect(parseForm(z.object({ s: z.string() }), { s: "a\nb" }).ok).toBe(true);
  });

  it("an interval name with NUL or over the column's 120 characters is refused", () => {
    const base = { rank: "age", parent: null, baseMa: 2, baseUncertaintyMa: null, topMa: 1, color: "#ffffff", gssp: null, approximate: false, order: 1, names: {}, boundaryKind: null };
    expect(intervalSchema.safeParse({ ...base, name: "A\u0000" }).success).toBe(false);
    expect(intervalSchema.safeParse({ ...base, name: "A".repeat(121) }).success).toBe(false);
    expect(intervalSchema.safeParse({ ...base, name: "A", order: 99999999999 }).success).toBe(false);
  });
});

describe("slugify from any script", () => {
  it.each([
    ["Зачелмие", "zachelmie"],
    ["Ζάκυνθος", "zakynthos"],
    ["Đồng Văn Karst", "dong-van-karst"],
  ])("%s → %s", (text, slug) => expect(slugify(text)).toBe(slug));

  it("Japanese falls back to a stable id, never empty", () => {
    const a = slugify("付加体の年代", 80, "event");
    expect(a).toMatch(/^event-[0-9a-z]{7}$/);
    expect(slugify("付加体の年代", 80, "event")).toBe(a);
    expect(slugify("四万十帯", 80, "event")).not.toBe(a);
    expect(slugify("  ---  ")).toBe("");
  });
});

describe("GeoJSON nesting depth", () => {
  it("20,000 levels are refused without recursion", () => {
    expect(nestingExceeds(nested(20000), MAX_GEOJSON_DEPTH)).toBe(true);
    const r = parseGeoJsonRoute({ type: "LineString", coordinates: nested(20000) }, "medium.geometry");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.issues[0]).toEqual({ path: "medium.geometry", message: expect.stringMatching(/nested more than 32 levels/) });
  });

  it("counts a position (a leaf array) as a level: exactly the limit passes, one more is refused", () => {
    // nested(d) is d arrays around a position [0, 0]: d + 1 levels
    expect(nestingExceeds(nested(MAX_GEOJSON_DEPTH - 1), MAX_GEOJSON_DEPTH)).toBe(false);
    expect(nestingExceeds(nested(MAX_GEOJSON_DEPTH), MAX_GEOJSON_DEPTH)).toBe(true);
    expect(nestingExceeds({ a: nested(MAX_GEOJSON_DEPTH - 2) }, MAX_GEOJSON_DEPTH)).toBe(false);
    expect(nestingExceeds({ a: nested(MAX_GEOJSON_DEPTH - 1) }, MAX_GEOJSON_DEPTH)).toBe(true);
    expect(nestingExceeds([[], {}, [1, null, "x"]], 2)).toBe(false);
    expect(nestingExceeds([[[]]], 2)).toBe(true);
  });

  it("the route's positions are checked as they are read, with the same answer as the whole-input check", () => {
    const line = (extra: unknown, at = 1) => ({ type: "LineString", coordinates: [[0, 0], at === 1 ? [0, 0.01, extra] : [0, 0.01], [0, 0.02, ...(at === 2 ? [extra] : [])]] });
    const wrap = (g: unknown, levels: number): unknown => (levels === 0 ? g : { type: "Feature", properties: null, geometry: wrap(g, levels - 1) });
    const cases: unknown[] = [];
    // a LineString's position is level 3: its third element may hold 32 − 3 more levels, not one more
    for (const d of [MAX_GEOJSON_DEPTH - 5, MAX_GEOJSON_DEPTH - 4, MAX_GEOJSON_DEPTH - 3, MAX_GEOJSON_DEPTH - 2]) cases.push(line(nested(d)), line(nested(d), 2));
    // the same inside Features, a FeatureCollection and a MultiLineString
    for (const levels of [0, 1, 5, 13, 14, 15]) {
      cases.push(wrap(line(nested(4)), levels), wrap({ type: "MultiLineString", coordinates: [[[0, 0], [1, 1, nested(MAX_GEOJSON_DEPTH - 6 - levels)]]] }, levels));
      cases.push({ type: "FeatureCollection", features: [wrap(line(nested(MAX_GEOJSON_DEPTH - 6 - 2 * levels)), levels)] });
    }
    // deep properties beside a good line; a deep position after 25 bad ones; a too-long route with a deep position
    cases.push({ type: "Feature", properties: { a: nested(MAX_GEOJSON_DEPTH - 3) }, geometry: line(1) }, { type: "Feature", properties: { a: nested(MAX_GEOJSON_DEPTH - 2) }, geometry: line(1) });
    cases.push({ type: "LineString", coordinates: [...Array.from({ length: 25 }, () => [500, 0]), [0, 0, nested(40)]] });
    cases.push({ type: "LineString", coordinates: [...Array.from({ length: 25 }, () => [500, 0]), [0, 0, nested(20)]] });
    let deep = 0;
    for (const c of cases) {
      const r = parseGeoJsonRoute(c, "g", { maxVertices: 20 });
      const refused = !r.ok && r.issues.length === 1 && r.issues[0].message === DEPTH_MESSAGE;
      expect(refused, JSON.stringify(c).slice(0, 200)).toBe(nestingExceeds(c, MAX_GEOJSON_DEPTH));
      if (refused) deep++;
    }
    expect(deep).toBeGreaterThanOrEqual(6);
    expect(cases.length - deep).toBeGreaterThan(8);
  });

  it("20,000 levels of Features are refused without recursion", () => {
    let g: unknown = { type: "LineString", coordinates: [[0, 0], [0, 1]] };
    for (let i = 0; i < 20_000; i++) g = { type: "Feature", properties: null, geometry: g };
    const r = parseGeoJsonRoute(g, "g");
    expect(r).toEqual({ ok: false, issues: [{ path: "g", message: DEPTH_MESSAGE }] });
  });

  it("a FeatureCollection of MultiLineStrings is well within the bound", () => {
    const fc = { type: "FeatureCollection", features: [{ type: "Feature", properties: {}, geometry: { type: "MultiLineString", coordinates: [[[0, 0], [0, 0.01]]] } }] };
    expect(nestingExceeds(fc, MAX_GEOJSON_DEPTH)).toBe(false);
    expect(parseGeoJsonRoute(fc).ok).toBe(true);
  });
});
