// computeWarnings (app/lib/scale/warnings.ts) against its test oracle (tests/unit/scale/oracle/
// warnings-*.ts: warnings.ts, legibility.ts and numbering.ts as they were before they were made
// faster). The whole output must be the same: the same warnings in the same order, keys, messages,
// pointIds, markers, suggested insets — deep equal, with the same key order, and with the same
// arrays and objects shared (a warning's suggestedInset is the entry of suggestedInsets; a
// warning's pointIds is its own array). Compared on the demo exhibits and on random exhibits
// (fixed seed) with crowded groups, shared ages, insets, durations, ids of every kind and points in
// and out of table order.
import { describe, expect, it } from "vitest";
import { computeExhibit, standardDurations } from "../../../app/lib/exhibit/index.ts";
import { formatLengthSig } from "../../../app/lib/scale/format.ts";
import { computeScale, parseScaleRequest, type PreparedRoute, type ScaleRequest, type ScaleResult } from "../../../app/lib/scale/index.ts";
import { clean, toMetres } from "../../../app/lib/units/index.ts";
import { computeWarnings, type WarningInput } from "../../../app/lib/scale/warnings.ts";
import { niceCeil, roundSubSpan } from "../../../app/lib/scale/legibility.ts";
import { warningKey } from "../../../app/lib/scale/numbering.ts";
import { computeWarnings as oracleWarnings } from "./oracle/warnings-warnings.ts";
import { niceCeil as oracleNiceCeil, roundSubSpan as oracleRoundSubSpan } from "./oracle/warnings-legibility.ts";
import { warningKey as oracleWarningKey } from "./oracle/warnings-numbering.ts";
import { demoExhibits } from "./demo-exhibits.ts";

type Output = ReturnType<typeof computeWarnings>;

/** The input computeScale gave computeWarnings, rebuilt from its result (a fresh copy per call). */
function inputOf(r: ScaleResult, request: ScaleRequest, route: PreparedRoute | undefined): WarningInput {
  // the medium's length before rounding for display, as computeScale has it
  const medium = request.medium;
  const totalMetres = route ? route.totalMetres : medium.kind === "length" ? toMetres(medium.length) : NaN;
  const { points, durations, insets } = structuredClone({ points: r.points, durations: r.durations, insets: r.insets });
  return {
    points,
    durations,
    insets,
    span: { olderYears: r.scale.olderYears, youngerYears: r.scale.youngerYears },
    metresPerYear: totalMetres / r.scale.spanYears,
    totalMetres,
    legibility: { minVisibleMetres: r.scale.legibility.minVisibleMetres, minSpacingMetres: r.scale.legibility.minSpacingMetres },
    mediumType: r.scale.mediumType,
    length: (m) => formatLengthSig(m, 3, request.lengthUnit, r.scale.unitSystem),
  };
}

/**
 * Which objects and arrays of an output are one and the same: each node's path, with the path where
 * the same object was first met ("warnings.3.suggestedInset -> suggestedInsets.0").
 */
function sharing(out: Output): string[] {
  const seen = new Map<object, string>();
  const lines: string[] = [];
  const walk = (v: unknown, path: string) => {
    if (v === null || typeof v !== "object") return;
    const first = seen.get(v);
    if (first !== undefined) {
      lines.push(`${path} -> ${first}`);
      return;
    }
    seen.set(v, path);
    for (const [k, x] of Object.entries(v)) walk(x, `${path}.${k}`);
  };
  walk(out.suggestedInsets, "suggestedInsets");
  walk(out.warnings, "warnings");
  return lines;
}

const counts = new Map<string, number>();

function expectSameWarnings(r: ScaleResult, request: ScaleRequest, route: PreparedRoute | undefined, what: string) {
  const mine = computeWarnings(inputOf(r, request, route));
  const theirs = oracleWarnings(inputOf(r, request, route));
  expect(mine, what).toStrictEqual(theirs);
  expect(JSON.stringify(mine), `${what}: key order`).toBe(JSON.stringify(theirs));
  expect(sharing(mine), what).toEqual(sharing(theirs));
  // the engine's own call (computeScale) gives the same, with the suggestions' lengths cleaned
  for (const s of theirs.suggestedInsets) s.lengthMetres = clean(s.lengthMetres);
  expect({ warnings: r.warnings, suggestedInsets: r.suggestedInsets }, what).toStrictEqual(theirs);
  for (const w of theirs.warnings) counts.set(w.code, (counts.get(w.code) ?? 0) + 1);
  counts.set("suggestion", (counts.get("suggestion") ?? 0) + theirs.suggestedInsets.length);
  counts.set("merged suggestion", (counts.get("merged suggestion") ?? 0) + theirs.suggestedInsets.filter((s) => s.durationIds.length + (s.pointIds.length ? 1 : 0) > 1).length);
}

/** Park–Miller generator: the same "random" exhibits on every run. */
function generator(seed: number) {
  let s = seed;
  const next = () => (s = (s * 16807) % 2147483647) / 2147483647;
  const pick = <T,>(xs: readonly T[]) => xs[Math.floor(next() * xs.length)];
  const int = (lo: number, hi: number) => lo + Math.floor(next() * (hi - lo + 1));
  return { next, pick, int };
}
type Gen = ReturnType<typeof generator>;

/** Ids as people and the database make them: "1".."n", database ids, text, or a mix. */
function idsFor(g: Gen, n: number): string[] {
  const kind = g.pick(["sequence", "database", "text", "mixed"] as const);
  const used = new Set<string>();
  return Array.from({ length: n }, (_, i) => {
    for (;;) {
      const id =
        kind === "sequence" ? String(i + 1)
        : kind === "database" ? String(g.int(1, 20 * n))
        : kind === "text" ? `m-${g.int(1, 20 * n).toString(36)}`
        : g.next() < 0.5 ? String(g.int(1, 10 * n)) : g.pick(["a", "b", "base-", "x"]) + g.int(0, 10 * n);
      if (!used.has(id)) {
        used.add(id);
        return id;
      }
    }
  });
}

/** Ages in years: spread over the span, in tight groups, with repeats (markers of one age). */
function agesFor(g: Gen, n: number, older: number, younger: number): number[] {
  const width = older - younger;
  const centres = Array.from({ length: g.int(1, 4) }, () => younger + width * g.next() ** g.pick([1, 2, 4]));
  const ages: number[] = [];
  for (let i = 0; i < n; i++) {
    const r = g.next();
    let a: number;
    if (r < 0.15 && ages.length) a = g.pick(ages); // the same age as another marker
    else if (r < 0.6) a = g.pick(centres) + width * g.pick([1e-6, 1e-5, 1e-4, 1e-3]) * (g.next() - 0.5);
    else a = younger + width * g.next();
    a = Number(a.toPrecision(g.pick([3, 5, 8, 12])));
    ages.push(Math.min(older, Math.max(younger, a)));
  }
  if (g.next() < 0.2) ages[g.int(0, n - 1)] = younger; // a marker at the younger end
  return ages;
}

function randomRequest(g: Gen, big: boolean) {
  const olderYears = g.pick([1e4, 3e5, 66e6, 5.4e8, 4.567e9]) * (0.5 + g.next());
  const older = Number(olderYears.toPrecision(4));
  const younger = g.next() < 0.6 ? 0 : Number(((older * g.next()) / 3).toPrecision(3));
  const n = big ? g.int(100, 1200) : g.int(0, 40);
  const ids = idsFor(g, n);
  const ages = agesFor(g, n, older, younger);
  let points = ids.map((id, i) => ({ id, ...(g.next() < 0.85 ? { label: `Marker ${id}` } : {}), age: { value: ages[i], unit: "a" } }));
  // usually in table order (as the composer sends them), else as given
  if (g.next() < 0.6) points = [...points].sort((p, q) => q.age.value - p.age.value || compareIdsLikeTable(p.id, q.id));
  const insets = Array.from({ length: g.pick([0, 0, 1, 1, 2, 3]) }, (_, k) => {
    const a = younger + (older - younger) * g.next();
    const b = g.next() < 0.3 ? younger : Math.max(younger, a - (older - younger) * g.pick([1e-4, 1e-3, 0.01, 0.1]) * g.next());
    const hi = Number(Math.max(a, b).toPrecision(6));
    const lo = Number(Math.min(a, b).toPrecision(6));
    if (!(hi > lo) || hi > older || lo < younger) return null;
    return { ...(g.next() < 0.7 ? { id: `i${k + 1}` } : {}), older: { value: hi, unit: "a" }, younger: { value: lo, unit: "a" }, magnification: g.pick([2, 10, 100, 1000, 1e4, 1e6]) };
  }).filter((x) => x !== null);
  const durations = Array.from({ length: g.int(0, 5) }, (_, k) => {
    const years = g.pick([67, 80, 5200, 11_700, 300_000, 2e6]);
    const where = g.next();
    const endsAgo = where < 0.5 ? { endsAgo: { value: younger, unit: "a" } } : where < 0.7 ? { endsAgo: { value: Number((younger + (older - younger) * g.next()).toPrecision(4)), unit: "a" } } : {};
    return { id: g.pick(["life", "writing", "holocene", "d"]) + k, ...(g.next() < 0.8 ? { label: `duration ${k}` } : {}), years, ...endsAgo };
  });
  const mediumType = g.pick(["trail", "wall", "rope", "banner", "other"]);
  return {
    span: { older: { value: older, unit: "a" }, younger: { value: younger, unit: "a" } },
    medium: { kind: "length", length: { value: g.pick([0.5, 4.567, 18, 46, 250, 4567]), unit: "m" } },
    mediumType,
    ...(g.next() < 0.2 ? { legibility: { minSpacingMetres: g.pick([0.01, 0.5, 5]) } } : {}),
    ...(g.next() < 0.2 ? { unitSystem: "us" } : {}),
    ...(g.next() < 0.2 ? { lengthUnit: g.pick(["mm", "cm", "m", "in", "ft"]) } : {}),
    points,
    durations,
    insets,
  };
}

/** Table order of ids, written out here so the generator does not lean on the code under test. */
function compareIdsLikeTable(a: string, b: string): number {
  const na = /^[0-9]+$/.test(a);
  const nb = /^[0-9]+$/.test(b);
  if (na && nb) return a.length - b.length || (a < b ? -1 : a > b ? 1 : 0);
  if (na !== nb) return na ? -1 : 1;
  return a < b ? -1 : a > b ? 1 : 0;
}

describe("computeWarnings against its oracle", () => {
  it("gives the same warnings on the demo exhibits", () => {
    for (const demo of demoExhibits()) {
      for (const insets of [demo.spec.insets, []]) {
        const spec = { ...demo.spec, insets };
        const r = computeExhibit(spec, demo.markers, standardDurations(80));
        if (!r.ok) throw new Error(`${demo.slug} did not compute`);
        expect(r.result.warnings.length, demo.slug).toBeGreaterThan(0);
        expectSameWarnings(r.result, r.request, r.route, demo.slug);
      }
    }
  });

  it("gives the same warnings on 1,200 random exhibits (fixed seed)", () => {
    counts.clear();
    const g = generator(20261202);
    let compared = 0;
    for (let k = 0; k < 1200; k++) {
      const body = randomRequest(g, k % 40 === 0);
      const parsed = parseScaleRequest(body);
      if (!parsed.ok) throw new Error(`${parsed.error.message} in ${JSON.stringify(body).slice(0, 2000)}`);
      const r = computeScale(parsed.request, { route: parsed.route });
      expectSameWarnings(r, parsed.request, parsed.route, `exhibit ${k}`);
      compared++;
    }
    expect(compared).toBe(1200);
    // every kind of warning occurs, and often
    for (const code of ["markers-same-age", "markers-too-close", "markers-too-close-in-inset", "duration-too-small", "inset-longer-than-medium"]) {
      expect(counts.get(code) ?? 0, code).toBeGreaterThan(50);
    }
    expect(counts.get("suggestion")).toBeGreaterThan(500);
    expect(counts.get("merged suggestion")).toBeGreaterThan(10);
  }, 120_000);

  it("rounds sub-spans and steps to the same figures (whole numbers no longer go through a string)", () => {
    const g = generator(7);
    const span = { olderYears: 4.567e9, youngerYears: 0 };
    const xs = [1, 2, 5, 10, 0.3, 0.07, 1e-7, 999_999_999_999, 1e12, 3e15, 7e21, 160, 11_700, 4.567e9, 0, -0];
    for (let i = 0; i < 5000; i++) xs.push(g.pick([1, 1e-3, 1e3, 1e6, 1e9, 1e13]) * g.next() * 10, g.int(1, 1e6) * g.pick([1, 10, 1e4, 1e7]));
    for (const x of xs) expect(Object.is(niceCeil(x), oracleNiceCeil(x)), `niceCeil(${x})`).toBe(true);
    for (let i = 0; i + 1 < xs.length; i += 2) {
      const [a, b] = [Math.min(xs[i], xs[i + 1], span.olderYears), Math.min(Math.max(xs[i], xs[i + 1]), span.olderYears)];
      for (const s of [span, { olderYears: 4.567e9, youngerYears: -0 }, { olderYears: 66.1e6, youngerYears: Math.min(a, 66e6) }]) {
        const mine = roundSubSpan(a, b, s);
        const theirs = oracleRoundSubSpan(a, b, s);
        expect(Object.is(mine.olderYears, theirs.olderYears) && Object.is(mine.youngerYears, theirs.youngerYears), `roundSubSpan(${a}, ${b})`).toBe(true);
      }
    }
  });

  it("makes the same key again after the ids it was made from change", () => {
    const ids = Array.from({ length: 100 }, (_, i) => String(i + 1));
    expect(warningKey("markers-too-close", ids)).toBe(oracleWarningKey("markers-too-close", ids));
    expect(warningKey("markers-too-close", ids)).toBe(oracleWarningKey("markers-too-close", ids)); // the remembered one
    expect(warningKey("markers-same-age", ids)).toBe(oracleWarningKey("markers-same-age", ids));
    ids[50] = "1000"; // a caller changes the array it was given back as pointIds
    expect(warningKey("markers-same-age", ids)).toBe(oracleWarningKey("markers-same-age", ids));
    expect(warningKey("markers-same-age", ids)).toMatch(/,49,50,52,.*,99,100,1000$/);
    const text = ids.map((id, i) => (i % 3 ? `m-${id}` : id)).reverse();
    expect(warningKey("markers-same-age", text)).toBe(oracleWarningKey("markers-same-age", text));
    expect(warningKey("markers-same-age", ids.slice(0, 99))).toBe(oracleWarningKey("markers-same-age", ids.slice(0, 99)));
  });
});
