/**
 * Route benchmark: `npx tsx tests/bench/scale.bench.ts` (npm run bench:scale).
 *
 * A 100,000-vertex wandering path (a synthetic riverside walk, steps of 2–8 m) and 1,000 markers.
 * Each method is timed several times in this one run and the median is reported:
 *   ours          — prepareRoute (cumulative WGS84 length) + positionsAt for all 1,000 markers
 *   turf length   — one spherical (haversine) length pass with @turf/length: the floor
 *   turf along    — @turf/along once per marker: the naive way
 *   GeographicLib — Geodesic.WGS84.Inverse per segment: the accurate slow way
 * Accuracy is measured against GeographicLib (total length error in mm per km; marker positions as
 * the GeographicLib distance from the point found by GeographicLib's own Direct on the segment).
 * The last line printed is one JSON object.
 */
import { along } from "@turf/along";
import { lineString } from "@turf/helpers";
import { length as turfLength } from "@turf/length";
import geodesic from "geographiclib-geodesic";
import { positionsAt, prepareRoute } from "../../app/lib/geo/route";

const N_VERTICES = 100_000;
const N_MARKERS = 1_000;

// deterministic pseudo-random numbers (Park–Miller)
let seed = 20240601;
const rand = () => {
  seed = (seed * 16807) % 2147483647;
  return seed / 2147483647;
};

function wanderingPath(n: number): number[][] {
  const coords: number[][] = [];
  let lat = 54.2;
  let lon = -2.9;
  let heading = 70;
  for (let i = 0; i < n; i++) {
    coords.push([lon, lat]);
    heading += (rand() - 0.5) * 50;
    const step = 2 + 6 * rand();
    const h = (heading * Math.PI) / 180;
    lat += (step * Math.cos(h)) / 111_320;
    lon += (step * Math.sin(h)) / (111_320 * Math.cos((lat * Math.PI) / 180));
  }
  return coords;
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2;
}

function time<T>(runs: number, fn: () => T): { ms: number; result: T } {
  let result!: T;
  const times: number[] = [];
  for (let r = 0; r < runs; r++) {
    const t0 = performance.now();
    result = fn();
    times.push(performance.now() - t0);
  }
  return { ms: median(times), result };
}

const coords = wanderingPath(N_VERTICES);
const flat = new Float64Array(N_VERTICES * 2);
coords.forEach(([lo, la], i) => {
  flat[2 * i] = lo;
  flat[2 * i + 1] = la;
});
const line = lineString(coords);
const g = geodesic.Geodesic.WGS84;

// warm up the JIT for every method
for (let w = 0; w < 3; w++) {
  prepareRoute(flat);
  turfLength(line, { units: "kilometers" });
}

const ref = time(5, () => {
  const cum = new Float64Array(N_VERTICES);
  const azi = new Float64Array(N_VERTICES);
  for (let i = 1; i < N_VERTICES; i++) {
    const r = g.Inverse(coords[i - 1][1], coords[i - 1][0], coords[i][1], coords[i][0]);
    cum[i] = cum[i - 1] + r.s12!;
    azi[i - 1] = r.azi1!;
  }
  return { cum, azi };
});
const totalRef = ref.result.cum[N_VERTICES - 1];
const markerDistances = Array.from({ length: N_MARKERS }, (_, k) => ((k + 0.5) / N_MARKERS) * totalRef);

const ours = time(15, () => {
  const route = prepareRoute(flat);
  const pos = positionsAt(route, markerDistances);
  return { route, pos };
});
const turfLen = time(15, () => turfLength(line, { units: "kilometers" }));
const turfAlong = time(3, () => markerDistances.map((d) => along(line, d / 1000, { units: "kilometers" })));

// accuracy
const ourTotal = ours.result.route.totalMetres;
const maxErrorMmPerKm = (Math.abs(ourTotal - totalRef) / (totalRef / 1000)) * 1000;
let maxMarkerErrorM = 0;
for (let k = 0; k < N_MARKERS; k++) {
  const d = markerDistances[k];
  let lo = 0;
  let hi = N_VERTICES - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (ref.result.cum[mid] <= d) lo = mid;
    else hi = mid;
  }
  const r = g.Direct(coords[lo][1], coords[lo][0], ref.result.azi[lo], d - ref.result.cum[lo]);
  const p = ours.result.pos[k];
  maxMarkerErrorM = Math.max(maxMarkerErrorM, g.Inverse(r.lat2!, r.lon2!, p.lat, p.lon).s12!);
}
const turfErrMmPerKm = (Math.abs(turfLen.result * 1000 - totalRef) / (totalRef / 1000)) * 1000;

const f = (x: number) => x.toFixed(2);
console.log(`route: ${N_VERTICES.toLocaleString("en-US")} vertices, ${(totalRef / 1000).toFixed(3)} km; ${N_MARKERS} markers`);
console.log(`ours (WGS84 cumulative length + ${N_MARKERS} marker positions): ${f(ours.ms)} ms`);
console.log(`@turf/length (one spherical length pass):                   ${f(turfLen.ms)} ms`);
console.log(`@turf/along per marker (${N_MARKERS} calls):                     ${f(turfAlong.ms)} ms`);
console.log(`GeographicLib Inverse per segment:                          ${f(ref.ms)} ms`);
console.log(`ratio ours / turf length:     ${(ours.ms / turfLen.ms).toFixed(3)} (target ≤ 1.5)`);
console.log(`ratio turf along / ours:      ${(turfAlong.ms / ours.ms).toFixed(1)}× (target ≥ 100×)`);
console.log(`ratio GeographicLib / ours:   ${(ref.ms / ours.ms).toFixed(1)}×`);
console.log(`accuracy vs GeographicLib: length ${maxErrorMmPerKm.toExponential(2)} mm/km; markers max ${(maxMarkerErrorM * 1000).toExponential(2)} mm`);
console.log(`(spherical turf length differs from the WGS84 length by ${turfErrMmPerKm.toFixed(0)} mm/km)`);
console.log(
  JSON.stringify({
    oursMs: Number(ours.ms.toFixed(3)),
    turfLengthMs: Number(turfLen.ms.toFixed(3)),
    turfAlongMs: Number(turfAlong.ms.toFixed(3)),
    geographiclibMs: Number(ref.ms.toFixed(3)),
    maxErrorMmPerKm,
    maxMarkerErrorMm: maxMarkerErrorM * 1000,
  }),
);
