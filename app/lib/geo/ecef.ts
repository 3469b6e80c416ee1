/**
 * Earth-centred (ECEF) coordinates on the WGS84 ellipsoid, both ways, for the route code: a vertex
 * to ECEF with its local frame (vertexFrame), the direction of a chord in such a frame
 * (chordBearing), and a point within a few metres of the surface back to latitude and longitude
 * (geodetic, and geodeticNear for a point of a segment).
 *
 * Results go into one module scratch array, GEO (a double written to a module variable would be a
 * new heap number each time): the ECEF point (EX, EY, EZ) and its 1 − e² sin²φ (W2); the
 * latitude and longitude (LAT, LON) with the local frame at the point (SIN_LAT … COS_LON); and
 * Bowring's terms (P, NUM, DEN). A caller reads them straight after the call.
 */
import { DEG, WGS84_A, WGS84_B, WGS84_E2, WGS84_EP2, normalizeAzimuth, normalizeLon } from "./ellipsoid";

export const A = WGS84_A;
export const E2 = WGS84_E2;
export const ONE_MINUS_E2 = 1 - E2;
/** 1 / (a²(1 − e²)): 1/(M·N) = (1 − e² sin²φ)² · INV_R2_FACTOR. */
export const INV_R2_FACTOR = 1 / (A * A * ONE_MINUS_E2);
export const ONE_MINUS_E2_SQ = ONE_MINUS_E2 * ONE_MINUS_E2;
const B = WGS84_B;
const EP2_B = WGS84_EP2 * WGS84_B;
const E2_A = WGS84_E2 * WGS84_A;

export const GEO = new Float64Array(13);
export const SIN_LAT = 0;
export const COS_LAT = 1;
export const SIN_LON = 2;
export const COS_LON = 3;
export const LON = 4;
export const LAT = 5;
export const EX = 6;
export const EY = 7;
export const EZ = 8;
export const W2 = 9;
const P = 10;
const NUM = 11;
const DEN = 12;

/** Numbers one vertex takes in a frame array (vertexFrame), at the offsets GEO uses for them. */
export const FRAME = 10;

/**
 * A vertex's frame into f[o …]: its Earth-centred coordinates (EX, EY, EZ), 1 − e² sin²φ (W2), its
 * degrees (LON, LAT) and the sines and cosines of φ and λ (SIN_LAT … COS_LON), the local east/north
 * frame there. prepareRoute measures segments with it and placing a marker recomputes a segment's
 * ends with it, so both see the very same numbers.
 */
export function vertexFrame(lon: number, lat: number, f: Float64Array, o: number): void {
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
  f[o + EX] = rc * clam;
  f[o + EY] = rc * slam;
  f[o + EZ] = nRad * ONE_MINUS_E2 * sphi;
  f[o + W2] = w2;
  f[o + LON] = lon;
  f[o + LAT] = lat;
  f[o + SIN_LAT] = sphi;
  f[o + COS_LAT] = cphi;
  f[o + SIN_LON] = slam;
  f[o + COS_LON] = clam;
}

/** Direction of the chord (dx, dy, dz) in the local east/north frame held in f[o …] (vertexFrame or geodetic), degrees clockwise from north. */
export function chordBearing(f: Float64Array, o: number, dx: number, dy: number, dz: number): number {
  const east = -f[o + SIN_LON] * dx + f[o + COS_LON] * dy;
  const north = -f[o + SIN_LAT] * (f[o + COS_LON] * dx + f[o + SIN_LON] * dy) + f[o + COS_LAT] * dz;
  const b = Math.atan2(east, north) / DEG;
  return b < 0 || b >= 360 ? normalizeAzimuth(b) : b;
}

/**
 * ECEF → geodetic latitude and longitude (degrees; longitude in [−180°, 180°], not normalised)
 * into GEO[LAT]/GEO[LON], by Bowring's closed form (1976): the parametric latitude β of the point,
 * tan β = a·z / (b·p), then tan φ = (z + e′²·b·sin³β) / (p − e²·a·cos³β). Exact on the ellipsoid;
 * a few metres off it (a chord shorter than 10 km dips at most 2 m below the surface) the error is
 * below 1e-15 rad (tests/unit/geo/geodetic.test.ts). Leaves sin/cos of φ and λ in GEO[SIN_LAT…COS_LON].
 */
export function geodetic(x: number, y: number, z: number): void {
  bowring(x, y, z);
  GEO[LAT] = Math.atan2(GEO[NUM], GEO[DEN]) / DEG;
  GEO[LON] = Math.atan2(y, x) / DEG;
}

/**
 * Bowring's terms of an ECEF point into GEO: P = √(x² + y²), NUM and DEN with tan φ = NUM / DEN
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
  GEO[P] = p;
  GEO[NUM] = num;
  GEO[DEN] = den;
  GEO[SIN_LAT] = num / h;
  GEO[COS_LAT] = den / h;
  if (p > 0) {
    GEO[SIN_LON] = y / p;
    GEO[COS_LON] = x / p;
  } else {
    const lam = Math.atan2(y, x);
    GEO[SIN_LON] = Math.sin(lam);
    GEO[COS_LON] = Math.cos(lam);
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
 * on the surface), by atanSmall instead of atan2. Falls back to atan2 when an angle is not small
 * (near a pole). Agrees with geodetic to about 1e-15 rad (tests/unit/geo/geodetic.test.ts).
 */
export function geodeticNear(x: number, y: number, z: number, x1: number, y1: number, z1: number, lon1: number, lat1: number): void {
  bowring(x, y, z);
  const p = GEO[P];
  const num = GEO[NUM];
  const den = GEO[DEN];
  // tan(Δλ) and tan(Δφ) from the two points' terms
  const lonCos = x1 * x + y1 * y;
  const tLon = (x1 * y - y1 * x) / lonCos;
  const den1 = ONE_MINUS_E2 * Math.sqrt(x1 * x1 + y1 * y1);
  const latCos = den * den1 + num * z1;
  const tLat = (num * den1 - den * z1) / latCos;
  if (p > 0 && lonCos > 0 && latCos > 0 && tLon < SMALL_TAN && tLon > -SMALL_TAN && tLat < SMALL_TAN && tLat > -SMALL_TAN) {
    GEO[LAT] = lat1 + atanSmall(tLat) / DEG;
    GEO[LON] = lon1 + atanSmall(tLon) / DEG;
  } else {
    GEO[LAT] = Math.atan2(num, den) / DEG;
    GEO[LON] = Math.atan2(y, x) / DEG;
  }
}

/** Geodetic latitude and longitude (degrees) of an Earth-centred point within a few metres of the WGS84 surface (Bowring's closed form). */
export function ecefToGeodetic(x: number, y: number, z: number): { lat: number; lon: number } {
  geodetic(x, y, z);
  return { lat: GEO[LAT], lon: normalizeLon(GEO[LON]) };
}

/** geodeticNear for a point near the surface vertex (lon1, lat1) degrees: what placing a marker uses inside a short segment (exported for its tests). */
export function ecefToGeodeticNear(x: number, y: number, z: number, lon1: number, lat1: number): { lat: number; lon: number } {
  vertexFrame(lon1, lat1, GEO, 0);
  geodeticNear(x, y, z, GEO[EX], GEO[EY], GEO[EZ], lon1, lat1);
  return { lat: GEO[LAT], lon: normalizeLon(GEO[LON]) };
}
