/**
 * Positions and bearings of markers along a prepared route (route.ts has the method): one at a
 * time, or many at once in one forward pass.
 */
import { normalizeAzimuth, normalizeLon } from "./ellipsoid";
import { GEO, EX, EY, EZ, FRAME, LAT, LON, E2, INV_R2_FACTOR, ONE_MINUS_E2_SQ, chordBearing, geodeticNear, vertexFrame } from "./ecef";
import { geodesicDirect, geodesicInverse } from "./geodesic";
import { CHORD_LIMIT_M, VERTEX_RECORD, VERTEX_TERMS, type PreparedRoute } from "./route-prepare";
import { BEARING_END, BEARING_START, C_BEARING, C_LAT, C_LON, SEGMENT_TERMS, shortWay, segmentTerms } from "./route-segment";
import { cursorState, nextSegment, segmentIndexAt } from "./route-search";

export interface RoutePosition {
  /** Requested distance from the start (clamped to [0, total]), metres. */
  distanceMetres: number;
  lon: number;
  lat: number;
  /** Direction of travel along the route at this point, degrees clockwise from true north. */
  bearing: number;
  /** Index of the segment (its first vertex) holding the point. */
  segment: number;
}

/** Positions for many distances, written into typed arrays (allocation-free but for the sort order when the distances are not monotone). */
export interface RoutePositions {
  lon: Float64Array;
  lat: Float64Array;
  bearing: Float64Array;
  /** Index of the segment holding each point (optional). */
  segment?: Int32Array;
}

/** positionAt's place to write one position. */
const ONE: RoutePositions = { lon: new Float64Array(1), lat: new Float64Array(1), bearing: new Float64Array(1) };

/** Position and bearing at one distance from the route's start. */
export function positionAt(route: PreparedRoute, distanceMetres: number, segmentHint?: number): RoutePosition {
  const d = Math.min(Math.max(distanceMetres, 0), route.totalMetres);
  const i = route.vertexCount === 1 ? 0 : (segmentHint ?? segmentIndexAt(route, d));
  placeAt(route, d, i, ONE, 0);
  return { distanceMetres: d, lon: ONE.lon[0], lat: ONE.lat[0], bearing: ONE.bearing[0], segment: i };
}

/**
 * Positions for many distances at once. Distances are taken in increasing order (sorted once
 * unless already monotone) and the route is walked in a single forward pass (nextSegment).
 * Results are written in input order into `out` (length ≥ distances.length).
 *
 * Two loops: the segments first, then the places. The search's loop is short, so the processor
 * reads ahead for several markers at once; on a long route each marker's records are elsewhere in
 * memory, and when they are not in cache (another program has used it) their reads then overlap
 * instead of waiting one after the other. The places then read records already fetched. Measured
 * on 1,000 markers of a 100,000-vertex route with the cache flushed before each call: 0.19–0.22 ms
 * in one loop, 0.14–0.19 ms in two (0.034 and 0.037 ms when cached).
 */
export function positionsInto(route: PreparedRoute, distances: ArrayLike<number>, out: RoutePositions): RoutePositions {
  const m = distances.length;
  let up = true;
  let down = true;
  for (let k = 1; k < m && (up || down); k++) {
    if (distances[k] < distances[k - 1]) up = false;
    if (distances[k] > distances[k - 1]) down = false;
  }
  let order: Uint32Array | null = null;
  if (!up && !down) {
    const idx = Array.from({ length: m }, (_, k) => k).sort((a, b) => distances[a] - distances[b]);
    order = Uint32Array.from(idx);
  }
  const total = route.totalMetres;
  const state = cursorState();
  const segs = out.segment ?? new Int32Array(m);
  for (let j = 0; j < m; j++) {
    const k = order ? order[j] : up ? j : m - 1 - j;
    segs[k] = nextSegment(route, Math.min(Math.max(distances[k], 0), total), state);
  }
  for (let k = 0; k < m; k++) placeAt(route, Math.min(Math.max(distances[k], 0), total), segs[k], out, k);
  return out;
}

/** Positions for many distances at once (positionsInto, as objects), in input order. */
export function positionsAt(route: PreparedRoute, distances: ArrayLike<number>): RoutePosition[] {
  const m = distances.length;
  const p = positionsInto(route, distances, { lon: new Float64Array(m), lat: new Float64Array(m), bearing: new Float64Array(m), segment: new Int32Array(m) });
  const out = new Array<RoutePosition>(m);
  for (let k = 0; k < m; k++) {
    const d = Math.min(Math.max(distances[k], 0), route.totalMetres);
    out[k] = { distanceMetres: d, lon: p.lon[k], lat: p.lat[k], bearing: p.bearing[k], segment: p.segment![k] };
  }
  return out;
}

const longSegmentCache = new WeakMap<PreparedRoute, Map<number, number>>();

/** The exact starting azimuth of long segment i (kept per route). */
function longSegmentAzimuth(route: PreparedRoute, i: number): number {
  let m = longSegmentCache.get(route);
  if (!m) {
    m = new Map();
    longSegmentCache.set(route, m);
  }
  let azi = m.get(i);
  if (azi === undefined) {
    const c = route.coords;
    azi = geodesicInverse(c[2 * i + 1], c[2 * i], c[2 * i + 3], c[2 * i + 2]).azi1;
    m.set(i, azi);
  }
  return azi;
}

/** A one-off route's two segment ends (vertexFrame) and the segment's terms, worked out for each marker. */
const ENDS = new Float64Array(2 * FRAME);
const TERMS = new Float64Array(SEGMENT_TERMS);

/** Position and bearing at distance d (already clamped) inside segment i, into out.lon[k], out.lat[k], out.bearing[k]. */
function placeAt(route: PreparedRoute, d: number, i: number, out: RoutePositions, k: number): void {
  const c = route.coords;
  if (route.vertexCount === 1) {
    out.lon[k] = c[0];
    out.lat[k] = c[1];
    out.bearing[k] = 0;
    return;
  }
  // the segment's start and end distances and degrees, and its terms (route-segment.ts): kept in
  // the vertex records, or worked out from the two ends, by the same function on the same numbers
  const v = route.vertices;
  let segStart: number, segEnd: number, lon1: number, lat1: number, lon2: number, lat2: number;
  let t: Float64Array, tk: number;
  if (v !== undefined) {
    const r1 = VERTEX_RECORD * i;
    const r2 = r1 + VERTEX_RECORD;
    segStart = v[r1];
    lon1 = v[r1 + 1];
    lat1 = v[r1 + 2];
    segEnd = v[r2];
    lon2 = v[r2 + 1];
    lat2 = v[r2 + 2];
    t = v;
    tk = r1 + VERTEX_TERMS;
  } else {
    segStart = route.cumulative[i];
    segEnd = route.cumulative[i + 1];
    lon1 = c[2 * i];
    lat1 = c[2 * i + 1];
    lon2 = c[2 * i + 2];
    lat2 = c[2 * i + 3];
    vertexFrame(lon1, lat1, ENDS, 0);
    vertexFrame(lon2, lat2, ENDS, FRAME);
    segmentTerms(ENDS, 0, FRAME, TERMS, 0);
    t = TERMS;
    tk = 0;
  }
  const segLen = segEnd - segStart;
  const along = d - segStart;
  if (along <= 0) {
    out.lon[k] = lon1;
    out.lat[k] = lat1;
    out.bearing[k] = t[tk + BEARING_START];
    return;
  }
  if (along >= segLen) {
    out.lon[k] = lon2;
    out.lat[k] = lat2;
    out.bearing[k] = t[tk + BEARING_END];
    return;
  }
  const cLat = t[tk + C_LAT];
  if (cLat === cLat) {
    // a short segment: by its terms
    const u = along / segLen;
    const lon = lon1 + u * (shortWay(lon2 - lon1) + (u - 1) * t[tk + C_LON]);
    out.lon[k] = lon > 180 || lon <= -180 ? normalizeLon(lon) : lon;
    out.lat[k] = lat1 + u * (lat2 - lat1 + (u - 1) * cLat);
    const b1 = t[tk + BEARING_START];
    const b = b1 + u * (shortWay(t[tk + BEARING_END] - b1) + (u - 1) * t[tk + C_BEARING]);
    out.bearing[k] = b < 0 || b >= 360 ? normalizeAzimuth(b) : b;
    return;
  }
  // a longer segment, or one near a pole: Earth-centred (a kept route's ends are worked out again)
  if (v !== undefined) {
    vertexFrame(lon1, lat1, ENDS, 0);
    vertexFrame(lon2, lat2, ENDS, FRAME);
  }
  const x1 = ENDS[EX];
  const y1 = ENDS[EY];
  const z1 = ENDS[EZ];
  const dx = ENDS[FRAME + EX] - x1;
  const dy = ENDS[FRAME + EY] - y1;
  const dz = ENDS[FRAME + EZ] - z1;
  const c2 = dx * dx + dy * dy + dz * dz;
  if (Math.sqrt(c2) >= CHORD_LIMIT_M) {
    // the test prepareRoute made on the same numbers: a segment it solved exactly
    const azi1 = longSegmentAzimuth(route, i);
    const r = geodesicDirect(lat1, lon1, azi1, along);
    out.lon[k] = r.lon2;
    out.lat[k] = r.lat2;
    out.bearing[k] = r.azi2;
    return;
  }
  // chord fraction corresponding to arc fraction t on a curve of radius R, R² = M·N at the chord's
  // middle (sin²φ from ECEF: tan φ = z / ((1 − e²)·p) on the surface), by the series of
  // tan(uθ)/tan θ = u·(1 + (u² − 1)θ²/3 + (u² − 1)(6u² + 1)θ⁴/45 + O(θ⁶)), θ = s/2R ≤ 8e-4
  const xm = x1 + 0.5 * dx;
  const ym = y1 + 0.5 * dy;
  const zm = z1 + 0.5 * dz;
  const zz = zm * zm;
  const w2 = 1 - (E2 * zz) / (zz + (xm * xm + ym * ym) * ONE_MINUS_E2_SQ);
  const th2 = segLen * segLen * 0.25 * w2 * w2 * INV_R2_FACTOR;
  const u = (2 * along) / segLen - 1;
  const u2m1 = u * u - 1;
  const f = (u * (1 + u2m1 * th2 * (1 / 3 + ((6 * u * u + 1) * th2) / 45)) + 1) / 2;
  geodeticNear(x1 + f * dx, y1 + f * dy, z1 + f * dz, x1, y1, z1, lon1, lat1);
  const lon = GEO[LON];
  out.lon[k] = lon > 180 || lon <= -180 ? normalizeLon(lon) : lon;
  out.lat[k] = GEO[LAT];
  out.bearing[k] = chordBearing(GEO, 0, dx, dy, dz);
}
