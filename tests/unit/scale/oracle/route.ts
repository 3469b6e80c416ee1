// TEST ORACLE (test-only): app/lib/geo/route.ts as it was when the issue was filed (commit bf92bf6),
// so that the benchmark's "today" figure keeps today's route code. Do not change.
/**
 * Distances and positions along a route (a polyline of lon/lat vertices) on the WGS84 ellipsoid.
 *
 * Segment lengths. A segment's two vertices are turned into Earth-centred (ECEF) coordinates; the
 * straight chord c between them is exact (no polar or antimeridian singularity), and the arc is
 * recovered from the chord as for a curve of radius R:
 *
 *     s = 2R·asin(c / 2R) = c · (1 + c²/(24R²) + 3c⁴/(640R⁴) + …)
 *
 * with R² = M·N, the Gaussian mean radius of curvature at the segment (M meridional, N prime
 * vertical). The direction-dependent radius differs from √(MN) by at most e²/2 ≈ 0.34 %, so the
 * error of the correction term is below 0.7 % of c³/(24R²): under 0.01 mm for a 10 km segment,
 * and the geodesic differs from the normal section by far less. Segments whose chord exceeds
 * CHORD_LIMIT_M (10 km) are solved exactly with geodesicInverse.
 *
 * Positions. A marker at distance d is found by binary search in the cumulative distance array
 * (computed once, Float64Array). Inside a short segment the point is interpolated along the chord —
 * with the chord fraction corrected so that it corresponds to the arc fraction on a curve of
 * radius R — and projected along the ellipsoid normal back onto the surface. Inside a long segment
 * the direct geodesic problem is solved from the segment start with the exact inverse azimuth.
 * The bearing is the direction of the chord projected onto the local horizontal plane (exact for
 * a sphere, where the chord lies in the plane of the great circle), or the exact geodesic azimuth
 * for long segments.
 */
import { DEG, WGS84_A, WGS84_E2, normalizeAzimuth, normalizeLon } from "../../../../app/lib/geo/ellipsoid";
import { geodesicDirect, geodesicInverse } from "../../../../app/lib/geo/geodesic";

/** Chord length above which a segment is solved with the exact inverse problem. */
export const CHORD_LIMIT_M = 10_000;

const A = WGS84_A;
const E2 = WGS84_E2;
const ONE_MINUS_E2 = 1 - E2;
const INV_R2_FACTOR = 1 / (A * A * ONE_MINUS_E2);

/** A route ready for repeated queries: vertices and cumulative geodesic distance. */
export interface PreparedRoute {
  /** Vertex longitudes, degrees. */
  lon: Float64Array;
  /** Vertex latitudes, degrees. */
  lat: Float64Array;
  /** cumulative[i] = distance from the first vertex to vertex i, metres (cumulative[0] = 0). */
  cumulative: Float64Array;
  /** Total length in metres. */
  totalMetres: number;
  /** Number of segments solved with the exact inverse problem (longer than CHORD_LIMIT_M). */
  longSegments: number;
}

/**
 * Build a prepared route from interleaved coordinates [lon0, lat0, lon1, lat1, …] (degrees).
 * The coordinates must already be validated (finite, in range).
 */
export function prepareRoute(coords: ArrayLike<number>): PreparedRoute {
  const n = coords.length >> 1;
  const lon = new Float64Array(n);
  const lat = new Float64Array(n);
  const cumulative = new Float64Array(n);
  let longSegments = 0;
  let total = 0;
  let px = 0;
  let py = 0;
  let pz = 0;
  let pInvR2 = 0;
  for (let i = 0; i < n; i++) {
    const lo = coords[2 * i];
    const la = coords[2 * i + 1];
    lon[i] = lo;
    lat[i] = la;
    const phi = la * DEG;
    const lam = lo * DEG;
    const sphi = Math.sin(phi);
    const cphi = Math.cos(phi);
    const w2 = 1 - E2 * sphi * sphi;
    const nRad = A / Math.sqrt(w2);
    const rc = nRad * cphi;
    const x = rc * Math.cos(lam);
    const y = rc * Math.sin(lam);
    const z = nRad * ONE_MINUS_E2 * sphi;
    // 1/(M·N) = (1 − e² sin²φ)² / (a²(1 − e²))
    const invR2 = w2 * w2 * INV_R2_FACTOR;
    if (i > 0) {
      const dx = x - px;
      const dy = y - py;
      const dz = z - pz;
      const c2 = dx * dx + dy * dy + dz * dz;
      const c = Math.sqrt(c2);
      let s: number;
      if (c < CHORD_LIMIT_M) {
        const q = c2 * 0.5 * (invR2 + pInvR2);
        s = c * (1 + q * (1 / 24 + q * (3 / 640)));
      } else {
        s = geodesicInverse(lat[i - 1], lon[i - 1], la, lo).s12;
        longSegments++;
      }
      total += s;
    }
    cumulative[i] = total;
    px = x;
    py = y;
    pz = z;
    pInvR2 = invR2;
  }
  return { lon, lat, cumulative, totalMetres: total, longSegments };
}

/** Length of one segment by the route's method (chord formula or exact inverse). */
export function segmentLength(lat1: number, lon1: number, lat2: number, lon2: number): number {
  return prepareRoute([lon1, lat1, lon2, lat2]).totalMetres;
}

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

function ecef(lat: number, lon: number): [number, number, number] {
  const phi = lat * DEG;
  const lam = lon * DEG;
  const sphi = Math.sin(phi);
  const cphi = Math.cos(phi);
  const nRad = A / Math.sqrt(1 - E2 * sphi * sphi);
  return [nRad * cphi * Math.cos(lam), nRad * cphi * Math.sin(lam), nRad * ONE_MINUS_E2 * sphi];
}

/** ECEF → geodetic latitude/longitude (degrees) for points within a few metres of the surface. */
function geodetic(x: number, y: number, z: number): [number, number] {
  const p = Math.hypot(x, y);
  const lon = Math.atan2(y, x);
  let phi = Math.atan2(z, p * ONE_MINUS_E2);
  for (let i = 0; i < 3; i++) {
    const sphi = Math.sin(phi);
    const cphi = Math.cos(phi);
    const nRad = A / Math.sqrt(1 - E2 * sphi * sphi);
    const h = p * cphi + z * sphi - A * Math.sqrt(1 - E2 * sphi * sphi);
    phi = Math.atan2(z, p * (1 - (E2 * nRad) / (nRad + h)));
  }
  return [phi / DEG, lon / DEG];
}

/** Index i of the segment [i, i+1] holding distance d (binary search; cumulative is non-decreasing). */
export function segmentIndexAt(route: PreparedRoute, d: number): number {
  const cum = route.cumulative;
  const last = cum.length - 1;
  if (last <= 0) return 0;
  if (d <= 0) return 0;
  if (d >= cum[last]) {
    // last segment with positive length
    let i = last - 1;
    while (i > 0 && cum[i] === cum[last]) i--;
    return i;
  }
  let lo = 0;
  let hi = last; // invariant: cum[lo] <= d < cum[hi]
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (cum[mid] <= d) lo = mid;
    else hi = mid;
  }
  return lo;
}

const longSegmentCache = new WeakMap<PreparedRoute, Map<number, number>>();

function longSegmentAzimuth(route: PreparedRoute, i: number): number {
  let m = longSegmentCache.get(route);
  if (!m) {
    m = new Map();
    longSegmentCache.set(route, m);
  }
  let azi = m.get(i);
  if (azi === undefined) {
    azi = geodesicInverse(route.lat[i], route.lon[i], route.lat[i + 1], route.lon[i + 1]).azi1;
    m.set(i, azi);
  }
  return azi;
}

/** Position and bearing at one distance from the route's start. */
export function positionAt(route: PreparedRoute, distanceMetres: number, segmentHint?: number): RoutePosition {
  const total = route.totalMetres;
  const d = Math.min(Math.max(distanceMetres, 0), total);
  const n = route.lon.length;
  if (n === 1) return { distanceMetres: 0, lon: route.lon[0], lat: route.lat[0], bearing: 0, segment: 0 };
  const i = segmentHint ?? segmentIndexAt(route, d);
  const lat1 = route.lat[i];
  const lon1 = route.lon[i];
  const lat2 = route.lat[i + 1];
  const lon2 = route.lon[i + 1];
  const segLen = route.cumulative[i + 1] - route.cumulative[i];
  const along = d - route.cumulative[i];
  const [x1, y1, z1] = ecef(lat1, lon1);
  const [x2, y2, z2] = ecef(lat2, lon2);
  const dx = x2 - x1;
  const dy = y2 - y1;
  const dz = z2 - z1;
  const c = Math.hypot(dx, dy, dz);
  if (along <= 0) return { distanceMetres: d, lon: lon1, lat: lat1, bearing: chordBearing(lat1, lon1, dx, dy, dz, c), segment: i };
  if (along >= segLen) return { distanceMetres: d, lon: lon2, lat: lat2, bearing: chordBearing(lat2, lon2, dx, dy, dz, c), segment: i };
  if (c >= CHORD_LIMIT_M) {
    const azi1 = longSegmentAzimuth(route, i);
    const r = geodesicDirect(lat1, lon1, azi1, along);
    return { distanceMetres: d, lon: r.lon2, lat: r.lat2, bearing: r.azi2, segment: i };
  }
  let t = segLen > 0 ? along / segLen : 0;
  // chord fraction corresponding to arc fraction t on a curve of radius R
  const sphi = Math.sin(((lat1 + lat2) / 2) * DEG);
  const w2 = 1 - E2 * sphi * sphi;
  const R = 1 / Math.sqrt(w2 * w2 * INV_R2_FACTOR);
  const theta = segLen / (2 * R);
  if (theta > 1e-9) {
    const u = 2 * t - 1;
    t = (Math.tan(u * theta) / Math.tan(theta) + 1) / 2;
  }
  const [lat, lonRaw] = geodetic(x1 + t * dx, y1 + t * dy, z1 + t * dz);
  return { distanceMetres: d, lon: normalizeLon(lonRaw), lat, bearing: chordBearing(lat, lonRaw, dx, dy, dz, c), segment: i };
}

/** Direction of the chord (dx, dy, dz) in the local east/north frame at (lat, lon), degrees from north. */
function chordBearing(lat: number, lon: number, dx: number, dy: number, dz: number, c: number): number {
  if (!(c > 0)) return 0;
  const phi = lat * DEG;
  const lam = lon * DEG;
  const sp = Math.sin(phi);
  const cp = Math.cos(phi);
  const sl = Math.sin(lam);
  const cl = Math.cos(lam);
  const east = -sl * dx + cl * dy;
  const north = -sp * cl * dx - sp * sl * dy + cp * dz;
  return normalizeAzimuth(Math.atan2(east, north) / DEG);
}

/**
 * Positions for many distances at once. Distances are sorted once and the route is walked in a
 * single forward pass (no per-marker scan of the route). Results come back in input order.
 */
export function positionsAt(route: PreparedRoute, distances: ArrayLike<number>): RoutePosition[] {
  const m = distances.length;
  const order = new Array<number>(m);
  for (let k = 0; k < m; k++) order[k] = k;
  order.sort((a, b) => distances[a] - distances[b]);
  const out = new Array<RoutePosition>(m);
  const cum = route.cumulative;
  const last = cum.length - 1;
  let seg = 0;
  for (const k of order) {
    const d = Math.min(Math.max(distances[k], 0), route.totalMetres);
    if (last <= 0) {
      out[k] = positionAt(route, d);
      continue;
    }
    if (d >= cum[last]) {
      out[k] = positionAt(route, d);
      continue;
    }
    // advance: far jumps by binary search, short ones by stepping
    if (seg + 8 < last && cum[seg + 8] <= d) seg = segmentIndexAt(route, d);
    while (seg + 1 < last && cum[seg + 1] <= d) seg++;
    out[k] = positionAt(route, d, seg);
  }
  return out;
}
