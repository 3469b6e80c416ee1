/**
 * Composer preview benchmark: `npx tsx tests/bench/composer.bench.ts` (npm run bench:composer).
 *
 * What the designer's browser does on every keystroke: computeExhibit (validation, scale, labels,
 * legibility, insets, durations) for an exhibit with N markers on a 100,000-vertex route — with the
 * route prepared once and reused (as the composer does), and, as the baseline in the same run,
 * re-measuring the route every time. Also a 46 m rope with the same markers (no route at all).
 * Medians of several runs; the last line printed is one JSON object.
 */
import { computeExhibit, standardDurations, type ExhibitSpec, type ResolvedMarker } from "../../app/lib/exhibit/index.ts";
import type { PreparedRoute } from "../../app/lib/geo/route.ts";

let seed = 7;
const rand = () => ((seed = (seed * 16807) % 2147483647) / 2147483647);

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

function median(f: () => void, runs: number) {
  const t: number[] = [];
  for (let i = 0; i < runs; i++) {
    const s = performance.now();
    f();
    t.push(performance.now() - s);
  }
  return t.sort((a, b) => a - b)[Math.floor(runs / 2)];
}

const geometry = { type: "LineString" as const, coordinates: path(100_000) };
const route: ExhibitSpec = {
  spanOlder: { value: 4567, unit: "Ma" }, spanYounger: { value: 0, unit: "Ma" },
  medium: { kind: "route", mediumType: "trail", geometry, lengthMetres: 0, sourceName: null },
  legibility: {}, unitsPreference: "metric", insets: [{ id: "i1", label: "last 10,000 years", olderMa: 0.01, youngerMa: 0, magnification: 1000 }],
};
const rope: ExhibitSpec = { ...route, medium: { kind: "length", mediumType: "rope", length: { value: 46, unit: "m" }, panelWidth: null } };
const durations = standardDurations(80);
const out: Record<string, number> = {};
for (const n of [100, 1000]) {
  const ms = markers(n);
  const cache: { route?: PreparedRoute; geometry?: unknown } = {};
  const first = computeExhibit(route, ms, durations, cache);
  if (!first.ok) throw new Error(first.message);
  cache.route = first.route;
  cache.geometry = geometry;
  const cached = median(() => computeExhibit(route, ms, durations, cache), 9);
  const uncached = median(() => computeExhibit(route, ms, durations), 5);
  const length = median(() => computeExhibit(rope, ms, durations), 9);
  console.log(`${n} markers, 100,000-vertex route: ${cached.toFixed(1)} ms per keystroke with the route reused; ${uncached.toFixed(1)} ms re-measuring it (${(uncached / cached).toFixed(1)}×); 46 m rope: ${length.toFixed(1)} ms`);
  out[`route${n}CachedMs`] = Number(cached.toFixed(2));
  out[`route${n}UncachedMs`] = Number(uncached.toFixed(2));
  out[`rope${n}Ms`] = Number(length.toFixed(2));
}
console.log(JSON.stringify(out));
