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
 * radius R — and projected along the ellipsoid normal back onto the surface (Bowring's closed form,
 * exact on the surface and within 1e-15 rad a few metres off it, where a chord point lies). Inside a long
 * segment the direct geodesic problem is solved from the segment start with the exact inverse
 * azimuth. The bearing is the direction of the chord projected onto the local horizontal plane
 * (exact for a sphere, where the chord lies in the plane of the great circle), or the exact
 * geodesic azimuth for long segments.
 *
 * Speed. For a one-off computation prepareRoute keeps only the cumulative distances (fresh memory
 * costs about as much to touch as the arithmetic on it: 24 bytes more per vertex would add a tenth
 * to a 10⁵-vertex route's time), and placing a marker recomputes its segment's two ends in ECEF
 * with the same operations the lengths were measured with. A route prepared for repeated queries
 * (the composer's preview) keeps a record per vertex — its distance, ECEF and degrees side by side —
 * and every 64th distance in a small table, so a marker costs no trigonometry for its segment's ends
 * and its search reads the memory its placing reads. Either way the local frame for the bearing
 * comes from the same terms as the latitude, and the point's longitude and latitude are the first
 * vertex's plus two small angles (geodeticNear).
 */
import { DEG, WGS84_A, WGS84_B, WGS84_E2, WGS84_EP2, normalizeAzimuth, normalizeLon } from "./ellipsoid";
import { geodesicDirect, geodesicInverse } from "./geodesic";

/** Chord length above which a segment is solved with the exact inverse problem. */
export const CHORD_LIMIT_M = 10_000;

const A = WGS84_A;
const E2 = WGS84_E2;
const ONE_MINUS_E2 = 1 - E2;
const INV_R2_FACTOR = 1 / (A * A * ONE_MINUS_E2);
const B = WGS84_B;
const EP2_B = WGS84_EP2 * WGS84_B;
const E2_A = WGS84_E2 * WGS84_A;
const ONE_MINUS_E2_SQ = ONE_MINUS_E2 * ONE_MINUS_E2;

// Module scratch in one typed array (a double written to a module variable would be a new heap
// number each time): geodetic()'s local frame at the point (sin and cos of its latitude and
// longitude), placeAt's result (longitude, latitude, bearing), vertexEcef()'s (x, y, z) and
// bowring()'s terms (p, and tan φ as num / den).
const SCRATCH = new Float64Array(13);
const SIN_LAT = 0;
const COS_LAT = 1;
const SIN_LON = 2;
const COS_LON = 3;
const LON = 4;
const LAT = 5;
const BEARING = 6;
const EX = 7;
const EY = 8;
const EZ = 9;
const P = 10;
const NUM = 11;
const DEN = 12;

/** A route ready for repeated queries: vertices and cumulative geodesic distance. */
export interface PreparedRoute {
  /** Vertex longitudes and latitudes, degrees, interleaved [lon0, lat0, lon1, lat1, …] (the array prepareRoute was given when it was a Float64Array: not copied). */
  coords: Float64Array;
  /** Number of vertices. */
  vertexCount: number;
  /** cumulative[i] = distance from the first vertex to vertex i, metres (cumulative[0] = 0). */
  cumulative: Float64Array;
  /** Total length in metres. */
  totalMetres: number;
  /** Number of segments solved with the exact inverse problem (longer than CHORD_LIMIT_M). */
  longSegments: number;
  /**
   * Kept only for a route prepared for repeated queries: one record of VERTEX_RECORD numbers per
   * vertex, [cumulative distance, x, y, z, lon, lat] — its Earth-centred coordinates (metres, exactly
   * as the segment lengths were computed) beside its distance and degrees, so that a marker's search
   * ends in the memory its placing reads.
   */
  vertices?: Float64Array;
  /**
   * cumulative[k · SEARCH_BLOCK] for each k (kept with vertices): a marker's search first finds its
   * block here, in a few kilobytes that stay in cache, then bisects only inside the block.
   */
  blockStarts?: Float64Array;
}

/** Numbers per vertex in PreparedRoute.vertices: cumulative distance, x, y, z, lon, lat. */
export const VERTEX_RECORD = 6;
/** Vertices per entry of blockStarts. */
export const SEARCH_BLOCK = 64;

export interface PrepareOptions {
  /**
   * Keep every vertex's Earth-centred coordinates, so that placing markers needs no trigonometry
   * for the segments' ends: for a route queried again and again (the composer's preview), not for
   * a one-off computation, where writing the 3 × 8 bytes per vertex costs more than it saves.
   */
  repeatedQueries?: boolean;
}

/**
 * Build a prepared route from interleaved coordinates [lon0, lat0, lon1, lat1, …] (degrees).
 * The coordinates must already be validated (finite, in range). A Float64Array (what the route
 * parsers give) is kept as it is, not copied: a large route's arrays are written once (fresh memory
 * costs about as much to touch as the arithmetic on it), so the caller must not change it afterwards.
 */
export function prepareRoute(input: ArrayLike<number>, options: PrepareOptions = {}): PreparedRoute {
  const coords = input instanceof Float64Array ? input : Float64Array.from(input);
  const n = coords.length >> 1;
  const cumulative = new Float64Array(n);
  const vertices = options.repeatedQueries ? new Float64Array(VERTEX_RECORD * n) : null;
  let longSegments = 0;
  let total = 0;
  let px = 0;
  let py = 0;
  let pz = 0;
  let pInvR2 = 0;
  for (let i = 0; i < n; i++) {
    const lo = coords[2 * i];
    const la = coords[2 * i + 1];
    // vertexEcef(lo, la), written out: through the call this loop measured about a tenth slower
    const phi = la * DEG;
    const lam = lo * DEG;
    const sphi = Math.sin(phi);
    const cphi = Math.cos(phi);
    const clam = Math.cos(lam);
    const slam = Math.sin(lam);
    const w2 = 1 - E2 * sphi * sphi;
    const nRad = A / Math.sqrt(w2);
    const rc = nRad * cphi;
    const x = rc * clam;
    const y = rc * slam;
    const z = nRad * ONE_MINUS_E2 * sphi;
    if (vertices !== null) {
      const k = VERTEX_RECORD * i;
      vertices[k + 1] = x;
      vertices[k + 2] = y;
      vertices[k + 3] = z;
      vertices[k + 4] = lo;
      vertices[k + 5] = la;
    }
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
        s = geodesicInverse(coords[2 * i - 1], coords[2 * i - 2], la, lo).s12;
        longSegments++;
      }
      total += s;
    }
    cumulative[i] = total;
    if (vertices !== null) vertices[VERTEX_RECORD * i] = total;
    px = x;
    py = y;
    pz = z;
    pInvR2 = invR2;
  }
  let blockStarts: Float64Array | undefined;
  if (vertices !== null) {
    blockStarts = new Float64Array(Math.ceil(n / SEARCH_BLOCK));
    for (let k = 0; k < blockStarts.length; k++) blockStarts[k] = cumulative[k * SEARCH_BLOCK];
  }
  return { coords, vertexCount: n, cumulative, totalMetres: total, longSegments, vertices: vertices ?? undefined, blockStarts };
}

/**
 * A vertex's Earth-centred coordinates into SCRATCH[EX], [EY], [EZ]: placeAt recomputes a marker's two segment
 * ends with the same operations prepareRoute measured the segment with (written out there), so
 * both see the very same numbers.
 */
function vertexEcef(lon: number, lat: number): void {
  const phi = lat * DEG;
  const lam = lon * DEG;
  // the four calls first: fewer values live across them
  const sphi = Math.sin(phi);
  const cphi = Math.cos(phi);
  const clam = Math.cos(lam);
  const slam = Math.sin(lam);
  const w2 = 1 - E2 * sphi * sphi;
  const nRad = A / Math.sqrt(w2);
  const rc = nRad * cphi;
  SCRATCH[EX] = rc * clam;
  SCRATCH[EY] = rc * slam;
  SCRATCH[EZ] = nRad * ONE_MINUS_E2 * sphi;
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

/**
 * ECEF → geodetic latitude and longitude (degrees; longitude in [−180°, 180°], not normalised)
 * into SCRATCH[LAT]/SCRATCH[LON], by Bowring's closed form (1976): the parametric latitude β of the point,
 * tan β = a·z / (b·p), then tan φ = (z + e′²·b·sin³β) / (p − e²·a·cos³β). Exact on the ellipsoid;
 * a few metres off it (a chord shorter than 10 km dips at most 2 m below the surface) the error is
 * below 1e-15 rad (tests/unit/geo/geodetic.test.ts). Leaves sin/cos of φ and λ in SCRATCH[SIN_LAT…COS_LON].
 */
function geodetic(x: number, y: number, z: number): void {
  bowring(x, y, z);
  SCRATCH[LAT] = Math.atan2(SCRATCH[NUM], SCRATCH[DEN]) / DEG;
  SCRATCH[LON] = Math.atan2(y, x) / DEG;
}

/**
 * Bowring's terms of an ECEF point into SCRATCH: P = √(x² + y²), NUM and DEN with tan φ = NUM / DEN
 * (see geodetic), and the local frame at the point (sin and cos of φ and λ).
 */
function bowring(x: number, y: number, z: number): void {
  const p = Math.sqrt(x * x + y * y);
  const az = A * z;
  const bp = B * p;
  const r = Math.sqrt(az * az + bp * bp);
  const sb = az / r;
  const cb = bp / r;
  const num = z + EP2_B * sb * sb * sb;
  const den = p - E2_A * cb * cb * cb;
  const h = Math.sqrt(num * num + den * den);
  SCRATCH[P] = p;
  SCRATCH[NUM] = num;
  SCRATCH[DEN] = den;
  SCRATCH[SIN_LAT] = num / h;
  SCRATCH[COS_LAT] = den / h;
  if (p > 0) {
    SCRATCH[SIN_LON] = y / p;
    SCRATCH[COS_LON] = x / p;
  } else {
    const lam = Math.atan2(y, x);
    SCRATCH[SIN_LON] = Math.sin(lam);
    SCRATCH[COS_LON] = Math.cos(lam);
  }
}

/** |tan| below which atanSmall's series is exact to a double: t⁹/9 < 6e-17 (and a 10 km chord spans at most 0.0016 rad of latitude). */
const SMALL_TAN = 0.02;

/** atan(t) for |t| < SMALL_TAN, by its series t − t³/3 + t⁵/5 − t⁷/7 (the next term is below 6e-17 rad). */
function atanSmall(t: number): number {
  const t2 = t * t;
  return t * (1 - t2 * (1 / 3 - t2 * (1 / 5 - t2 / 7)));
}

/**
 * geodetic(x, y, z) for a point near a vertex (x1, y1, z1) on the surface at (lon1, lat1) degrees —
 * a point of the vertex's segment: its longitude and latitude as the vertex's plus the small angles
 * between the two, whose tangents come from the same ECEF terms (the vertex's tan φ1 = z1 / ((1 − e²)·p1)
 * on the surface), by atanSmall instead of atan2. Falls back to geodetic when an angle is not small
 * (near a pole). Agrees with geodetic to about 1e-15 rad (tests/unit/geo/geodetic.test.ts).
 */
function geodeticNear(x: number, y: number, z: number, x1: number, y1: number, z1: number, lon1: number, lat1: number): void {
  bowring(x, y, z);
  const p = SCRATCH[P];
  const num = SCRATCH[NUM];
  const den = SCRATCH[DEN];
  // tan(Δλ) and tan(Δφ) from the two points' terms
  const lonCos = x1 * x + y1 * y;
  const tLon = (x1 * y - y1 * x) / lonCos;
  const den1 = ONE_MINUS_E2 * Math.sqrt(x1 * x1 + y1 * y1);
  const latCos = den * den1 + num * z1;
  const tLat = (num * den1 - den * z1) / latCos;
  if (p > 0 && lonCos > 0 && latCos > 0 && tLon < SMALL_TAN && tLon > -SMALL_TAN && tLat < SMALL_TAN && tLat > -SMALL_TAN) {
    SCRATCH[LAT] = lat1 + atanSmall(tLat) / DEG;
    SCRATCH[LON] = lon1 + atanSmall(tLon) / DEG;
  } else {
    SCRATCH[LAT] = Math.atan2(num, den) / DEG;
    SCRATCH[LON] = Math.atan2(y, x) / DEG;
  }
}

/** Geodetic latitude and longitude (degrees) of an Earth-centred point within a few metres of the WGS84 surface (Bowring's closed form). */
export function ecefToGeodetic(x: number, y: number, z: number): { lat: number; lon: number } {
  geodetic(x, y, z);
  return { lat: SCRATCH[LAT], lon: normalizeLon(SCRATCH[LON]) };
}

/** geodeticNear for a point near the surface vertex (lon1, lat1) degrees: what placeAt uses inside a short segment (exported for its tests). */
export function ecefToGeodeticNear(x: number, y: number, z: number, lon1: number, lat1: number): { lat: number; lon: number } {
  vertexEcef(lon1, lat1);
  geodeticNear(x, y, z, SCRATCH[EX], SCRATCH[EY], SCRATCH[EZ], lon1, lat1);
  return { lat: SCRATCH[LAT], lon: normalizeLon(SCRATCH[LON]) };
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
    const c = route.coords;
    azi = geodesicInverse(c[2 * i + 1], c[2 * i], c[2 * i + 3], c[2 * i + 2]).azi1;
    m.set(i, azi);
  }
  return azi;
}

/** Position and bearing at one distance from the route's start. */
export function positionAt(route: PreparedRoute, distanceMetres: number, segmentHint?: number): RoutePosition {
  const d = Math.min(Math.max(distanceMetres, 0), route.totalMetres);
  const i = route.vertexCount === 1 ? 0 : (segmentHint ?? segmentIndexAt(route, d));
  placeAt(route, d, i);
  return { distanceMetres: d, lon: SCRATCH[LON], lat: SCRATCH[LAT], bearing: SCRATCH[BEARING], segment: i };
}

/** Position and bearing at distance d (already clamped) inside segment i, into SCRATCH[LON]/SCRATCH[LAT]/SCRATCH[BEARING]. */
function placeAt(route: PreparedRoute, d: number, i: number): void {
  const c = route.coords;
  if (route.vertexCount === 1) {
    SCRATCH[LON] = c[0];
    SCRATCH[LAT] = c[1];
    SCRATCH[BEARING] = 0;
    return;
  }
  // the segment's start and end distances, the first vertex's degrees and both ends' ECEF, exactly
  // as prepareRoute computed them: kept in the vertex records, or computed again
  const v = route.vertices;
  let segStart: number, segEnd: number, lon1: number, lat1: number;
  let x1: number, y1: number, z1: number, dx: number, dy: number, dz: number;
  if (v !== undefined) {
    const k = VERTEX_RECORD * i;
    const k2 = k + VERTEX_RECORD;
    segStart = v[k];
    segEnd = v[k2];
    x1 = v[k + 1];
    y1 = v[k + 2];
    z1 = v[k + 3];
    lon1 = v[k + 4];
    lat1 = v[k + 5];
    dx = v[k2 + 1] - x1;
    dy = v[k2 + 2] - y1;
    dz = v[k2 + 3] - z1;
  } else {
    segStart = route.cumulative[i];
    segEnd = route.cumulative[i + 1];
    lon1 = c[2 * i];
    lat1 = c[2 * i + 1];
    vertexEcef(c[2 * i + 2], c[2 * i + 3]);
    const x2 = SCRATCH[EX];
    const y2 = SCRATCH[EY];
    const z2 = SCRATCH[EZ];
    vertexEcef(c[2 * i], c[2 * i + 1]);
    x1 = SCRATCH[EX];
    y1 = SCRATCH[EY];
    z1 = SCRATCH[EZ];
    dx = x2 - x1;
    dy = y2 - y1;
    dz = z2 - z1;
  }
  const segLen = segEnd - segStart;
  const along = d - segStart;
  const c2 = dx * dx + dy * dy + dz * dz;
  if (along <= 0) {
    SCRATCH[LON] = lon1;
    SCRATCH[LAT] = lat1;
    SCRATCH[BEARING] = vertexBearing(SCRATCH[LAT], SCRATCH[LON], dx, dy, dz, c2);
    return;
  }
  if (along >= segLen) {
    SCRATCH[LON] = c[2 * i + 2];
    SCRATCH[LAT] = c[2 * i + 3];
    SCRATCH[BEARING] = vertexBearing(SCRATCH[LAT], SCRATCH[LON], dx, dy, dz, c2);
    return;
  }
  if (Math.sqrt(c2) >= CHORD_LIMIT_M) {
    // the test prepareRoute made on the same numbers: a segment it solved exactly
    const azi1 = longSegmentAzimuth(route, i);
    const r = geodesicDirect(lat1, lon1, azi1, along);
    SCRATCH[LON] = r.lon2;
    SCRATCH[LAT] = r.lat2;
    SCRATCH[BEARING] = r.azi2;
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
  const t = (u * (1 + u2m1 * th2 * (1 / 3 + ((6 * u * u + 1) * th2) / 45)) + 1) / 2;
  geodeticNear(x1 + t * dx, y1 + t * dy, z1 + t * dz, x1, y1, z1, lon1, lat1);
  if (SCRATCH[LON] > 180 || SCRATCH[LON] <= -180) SCRATCH[LON] = normalizeLon(SCRATCH[LON]);
  SCRATCH[BEARING] = frameBearing(dx, dy, dz);
}

/** Direction of the chord (dx, dy, dz) in the local east/north frame held in SCRATCH, degrees from north. */
function frameBearing(dx: number, dy: number, dz: number): number {
  const east = -SCRATCH[SIN_LON] * dx + SCRATCH[COS_LON] * dy;
  const north = -SCRATCH[SIN_LAT] * (SCRATCH[COS_LON] * dx + SCRATCH[SIN_LON] * dy) + SCRATCH[COS_LAT] * dz;
  const b = Math.atan2(east, north) / DEG;
  return b < 0 || b >= 360 ? normalizeAzimuth(b) : b;
}

/** Direction of the chord (dx, dy, dz; squared length c2) at a vertex (lat, lon), degrees from north. */
function vertexBearing(lat: number, lon: number, dx: number, dy: number, dz: number, c2: number): number {
  if (!(c2 > 0)) return 0;
  SCRATCH[SIN_LAT] = Math.sin(lat * DEG);
  SCRATCH[COS_LAT] = Math.cos(lat * DEG);
  SCRATCH[SIN_LON] = Math.sin(lon * DEG);
  SCRATCH[COS_LON] = Math.cos(lon * DEG);
  return frameBearing(dx, dy, dz);
}

/** Positions for many distances, written into typed arrays (allocation-free but for the sort order when the distances are not monotone). */
export interface RoutePositions {
  lon: Float64Array;
  lat: Float64Array;
  bearing: Float64Array;
  /** Index of the segment holding each point (optional). */
  segment?: Int32Array;
}

/**
 * Positions for many distances at once. Distances are taken in increasing order (sorted once
 * unless already monotone) and the route is walked in a single forward pass (no per-marker scan
 * of the route). Results are written in input order into `out` (length ≥ distances.length).
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
  const cum = route.cumulative;
  const last = cum.length - 1;
  const total = route.totalMetres;
  const blocks = route.blockStarts;
  // with vertex records the search reads their distances: it ends where placing the marker reads
  const keys = route.vertices !== undefined ? route.vertices : cum;
  const stride = route.vertices !== undefined ? VERTEX_RECORD : 1;
  let seg = 0;
  let block = 0;
  for (let j = 0; j < m; j++) {
    const k = order ? order[j] : up ? j : m - 1 - j;
    const d = Math.min(Math.max(distances[k], 0), total);
    let i: number;
    if (last <= 0) i = 0;
    else if (d >= cum[last]) i = segmentIndexAt(route, d);
    else {
      // advance from the last segment (d only grows; cum[seg] <= d < cum[last] here) to the last
      // vertex lo with cum[lo] <= d
      let lo = seg;
      if (blocks !== undefined) {
        // the block holding d, from the small table; inside it a guess in proportion to distance,
        // then a step or two to the segment: the vertex records read are next to each other, where a
        // bisection would read one record in each of several places (each one a cache miss)
        while (block + 1 < blocks.length && blocks[block + 1] <= d) block++;
        const start = block * SEARCH_BLOCK;
        // the block's end, cum[end] > d: the next block's start (from the table, not the records)
        const inside = start + SEARCH_BLOCK < last;
        const end = inside ? start + SEARCH_BLOCK : last;
        const from = blocks[block];
        const to = inside ? blocks[block + 1] : cum[last];
        let g = start + Math.floor(((d - from) / (to - from)) * (end - start));
        if (g < lo) g = lo;
        if (g >= end) g = end - 1;
        if (keys[stride * g] <= d) {
          while (keys[stride * (g + 1)] <= d) g++;
        } else {
          while (keys[stride * g] > d) g--;
        }
        lo = g;
      } else {
        // gallop forward, so that the search stays near the previous marker in memory
        let hi = seg + 1;
        let step = 1;
        while (hi < last && cum[hi] <= d) {
          lo = hi;
          step *= 2;
          hi = lo + step;
        }
        if (hi > last) hi = last;
        while (hi - lo > 1) {
          const mid = (lo + hi) >> 1;
          if (cum[mid] <= d) lo = mid;
          else hi = mid;
        }
      }
      seg = lo;
      i = seg;
    }
    placeAt(route, d, i);
    out.lon[k] = SCRATCH[LON];
    out.lat[k] = SCRATCH[LAT];
    out.bearing[k] = SCRATCH[BEARING];
    if (out.segment) out.segment[k] = i;
  }
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
