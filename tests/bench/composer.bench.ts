/**
 * Composer preview benchmark: `npx tsx tests/bench/composer.bench.ts` (npm run bench:composer).
 *
 * What the designer's browser does on every keystroke: computeExhibit (validation, scale, labels,
 * legibility, insets, durations) for an exhibit with 1,000 markers — on a 100,000-vertex route
 * prepared once and reused (as the composer does), on a 46 m rope (no route), and re-measuring the
 * route every time. In the same run:
 *  - the baseline: the same 1,000 distances formatted once each with one reused Intl.NumberFormat
 *    (the least any labelled list costs) — targets: route (reused) and rope ≤ 2× the baseline;
 *  - today's code (the test oracle, tests/unit/scale/oracle: the engine before the one formatting
 *    module) on the same inputs — target: the re-measured route ≤ half of today's time.
 * Each figure is timed in blocks of calls, the blocks taking turns (see blocks()); the medians are
 * printed, and the last line is one JSON object. Beside them, apart from the targets, each
 * function's fastest call (`fastestCalls`): on a shared machine the route's median moves with what
 * other programs do to the processor's cache (its 100,000 vertex records, 6.4 MB, are read at a
 * thousand places per call; Intl's formatting reads little memory), the fastest calls much less.
 * `node --expose-gc` (as the npm script runs it) lets each block start after a collection.
 */
import { computeExhibit, routeCacheFor, standardDurations, type ExhibitSpec, type ResolvedMarker } from "../../app/lib/exhibit/index.ts";
import type { PreparedRoute } from "../../app/lib/geo/route.ts";
import { computeExhibit as todayExhibit, standardDurations as todayDurations } from "../unit/scale/oracle/compose.ts";

let seed = 7;
const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;

function path(n: number): number[][] {
  const c: number[][] = [];
  let lat = 54.2, lon = -2.9, h = 70;
  for (let i = 0; i < n; i++) {
    c.push([lon, lat]);
    h += (rand() - 0.5) * 50;
    const step = 2 + 6 * rand();
    lat += (step * Math.cos((h * Math.PI) / 180)) / 111_320;
    lon += (step * Math.sin((h * Math.PI) / 180)) / (111_320 * Math.cos((lat * Math.PI) / 180));
  }
  return c;
}

function markers(n: number): ResolvedMarker[] {
  return Array.from({ length: n }, (_, i) => {
    const ageMa = 4567 * (1 - (i + 0.5) / n) ** 2;
    return { id: String(i + 1), number: i + 1, kind: "custom", label: `Marker ${i + 1}`, text: "", ageMa, uncertaintyMa: ageMa * 0.001, intervalName: null, intervalRank: null, eventName: null, source: "bench", color: "#888888", approximate: false };
  });
}

/**
 * Each function runs in its own block (warm-up, then `runs` timed calls) so that one function's
 * garbage is not collected during another's; the blocks go round `rounds` times (a, b, c, a, b, c …)
 * so that a busy machine slows every figure alike. The figure is the median over all timed calls.
 *
 * Each block starts after a full collection, which leaves V8's young generation small: for the next
 * few dozen calls, a function that allocates a megabyte per call (a 1,000-marker result) runs 1.5–3×
 * slower while the young generation grows back (app/lib/scale/README.md). A designer's typing meets
 * the steady state, so each block warms up for at least 60 calls and 100 ms before it is timed.
 */
function blocks(fs: Record<string, () => unknown>, runs: number, rounds = 5): { median: Record<string, number>; fastest: Record<string, number> } {
  const times: Record<string, number[]> = Object.fromEntries(Object.keys(fs).map((k) => [k, []]));
  for (let r = 0; r < rounds; r++) {
    for (const [k, f] of Object.entries(fs)) {
      (globalThis as { gc?: () => void }).gc?.();
      const warm = performance.now();
      for (let w = 0; w < 60 || performance.now() - warm < 100; w++) f();
      for (let i = 0; i < runs; i++) {
        const s = performance.now();
        f();
        times[k].push(performance.now() - s);
      }
      if (process.env.BENCH_ROUNDS) console.log(r, k, times[k].slice(-runs).sort((a, b) => a - b)[runs >> 1].toFixed(3));
    }
  }
  const sorted = Object.entries(times).map(([k, t]) => [k, t.sort((a, b) => a - b)] as const);
  return {
    median: Object.fromEntries(sorted.map(([k, t]) => [k, t[Math.floor(t.length / 2)]])),
    fastest: Object.fromEntries(sorted.map(([k, t]) => [k, t[0]])),
  };
}

const geometry = { type: "LineString" as const, coordinates: path(100_000) };
const route: ExhibitSpec = {
  spanOlder: { value: 4567, unit: "Ma" }, spanYounger: { value: 0, unit: "Ma" },
  medium: { kind: "route", mediumType: "trail", geometry, lengthMetres: 0, sourceName: null },
  legibility: {}, unitsPreference: "metric", insets: [{ id: "i1", label: "last 10,000 years", olderMa: 0.01, youngerMa: 0, magnification: 1000 }],
};
const rope: ExhibitSpec = { ...route, medium: { kind: "length", mediumType: "rope", length: { value: 46, unit: "m" }, panelWidth: null } };
const durations = standardDurations(80);
const oldDurations = todayDurations(80);
const ms = markers(1000);

// The setup keeps no whole result, only what it needs (a kept result teaches V8 to allocate the
// results' objects in the old generation: app/lib/scale/README.md, "Allocation sites").
const check = <T extends { ok: boolean }>(r: T): T & { ok: true } => {
  if (!r.ok) throw new Error((r as unknown as { message: string }).message);
  return r as T & { ok: true };
};
check(computeExhibit(route, ms, durations));
// the composer's route cache (composer.tsx): the route measured once, for repeated queries
const cache: { route?: PreparedRoute; geometry?: unknown } | undefined = routeCacheFor(geometry);
if (!cache) throw new Error("the bench route did not parse");
// today's code reuses a route prepared by today's code
const todayCache = { route: check(todayExhibit(route, ms, oldDurations)).route, geometry };
// the baseline's distances: the rope's 1,000 marker distances, each formatted once
const distances = Float64Array.from(check(computeExhibit(rope, ms, durations)).result.points, (p) => p.fromOlderEndMetres);
const nf = new Intl.NumberFormat("en-GB", { maximumFractionDigits: 3 });
let sink = 0;
const baseline = () => {
  for (const d of distances) sink += nf.format(d).length;
};

// warm up every path, then measure the fast ones together and the slow ones together
for (let i = 0; i < 30; i++) {
  baseline();
  computeExhibit(route, ms, durations, cache);
  computeExhibit(rope, ms, durations);
  todayExhibit(route, ms, oldDurations, todayCache);
  todayExhibit(rope, ms, oldDurations);
}
const { median: fast, fastest: fastestFast } = blocks(
  {
    format1000BaselineMs: baseline,
    route1000CachedMs: () => computeExhibit(route, ms, durations, cache),
    rope1000Ms: () => computeExhibit(rope, ms, durations),
    todayRoute1000CachedMs: () => todayExhibit(route, ms, oldDurations, todayCache),
    todayRope1000Ms: () => todayExhibit(rope, ms, oldDurations),
  },
  40,
);
const { median: slow } = blocks(
  {
    route1000UncachedMs: () => computeExhibit(route, ms, durations),
    todayRoute1000UncachedMs: () => todayExhibit(route, ms, oldDurations),
  },
  4,
);
const round = (x: number) => Number(x.toFixed(3));
const out = {
  ...Object.fromEntries(Object.entries({ ...fast, ...slow }).map(([k, v]) => [k, round(v)])),
  route1000CachedVsBaseline: round(fast.route1000CachedMs / fast.format1000BaselineMs),
  rope1000VsBaseline: round(fast.rope1000Ms / fast.format1000BaselineMs),
  route1000UncachedVsToday: round(slow.route1000UncachedMs / slow.todayRoute1000UncachedMs),
  targets: { cachedAndRopeVsBaseline: 2, uncachedVsToday: 0.5 },
  // not the targets' figures (those are the medians above): each function's fastest call, whose
  // ratios change little with what else the machine is doing
  fastestCalls: {
    format1000BaselineMs: round(fastestFast.format1000BaselineMs),
    route1000CachedMs: round(fastestFast.route1000CachedMs),
    rope1000Ms: round(fastestFast.rope1000Ms),
    route1000CachedVsBaseline: round(fastestFast.route1000CachedMs / fastestFast.format1000BaselineMs),
    rope1000VsBaseline: round(fastestFast.rope1000Ms / fastestFast.format1000BaselineMs),
  },
};
console.log(`baseline: 1,000 distances through one Intl.NumberFormat: ${fast.format1000BaselineMs.toFixed(2)} ms`);
console.log(`1,000 markers, 100,000-vertex route reused: ${fast.route1000CachedMs.toFixed(2)} ms (${out.route1000CachedVsBaseline}× the baseline; today ${fast.todayRoute1000CachedMs.toFixed(2)} ms)`);
console.log(`1,000 markers, 46 m rope: ${fast.rope1000Ms.toFixed(2)} ms (${out.rope1000VsBaseline}× the baseline; today ${fast.todayRope1000Ms.toFixed(2)} ms)`);
console.log(`1,000 markers, route re-measured: ${slow.route1000UncachedMs.toFixed(2)} ms (today ${slow.todayRoute1000UncachedMs.toFixed(2)} ms: ${out.route1000UncachedVsToday}×)`);
console.log(`fastest calls (not the targets' figures): route ${out.fastestCalls.route1000CachedVsBaseline}×, rope ${out.fastestCalls.rope1000VsBaseline}× the baseline's fastest`);
if (sink < 0) console.log(sink);
console.log(JSON.stringify(out));
