/**
 * A segment's terms, worked out once from its two ends: the chord's bearing at each end, and for a
 * short segment the curvature terms that place a marker inside it by a few multiplications instead
 * of the Earth-centred round trip (route.ts has the method). prepareRoute keeps them in a route's
 * vertex records; a one-off route works them out for the segment a marker falls in.
 *
 * Position on a short segment: the geodesic's latitude and longitude as functions of the distance
 * along it, to second order — φ(u) = φ1 + u·Δφ + C_φ·u(u − 1) at the fraction u of its length s, and
 * the same for λ. Both ends are exact, and C = s²/2 times the second derivative that the geodesic
 * equations of the ellipsoid (metric ds² = M²dφ² + N²cos²φ dλ²) give:
 *   φ'' = −(3e²·sinφ·cosφ / w²)·φ'² − (N/M)·sinφ·cosφ·λ'²,   λ'' = 2·(M/N)·tanφ·φ'·λ'
 * (w² = 1 − e² sin²φ, N/M = w²/(1 − e²)), taken at the segment's middle with φ' = Δφ/s, λ' = Δλ/s
 * (s cancels out). What is left is of third order, (s/R)³ times a factor that grows towards the
 * poles: under 1e-12 degree for segments shorter than SHORT_SEGMENT_M between ±SHORT_LAT_LIMIT
 * (tests/unit/geo/route-segment.test.ts, against the Earth-centred method). A longer segment, or
 * one nearer a pole, gets NaN terms and is placed the Earth-centred way.
 *
 * Bearing: the direction of the segment's chord in the local east/north frame, as the Earth-centred
 * method gives it — exactly at the ends, and in between by the parabola through the ends and the
 * middle, b(u) = b1 + u·Δb + C_b·u(u − 1), the middle's bearing taken in the frame at the middle
 * point. (Along the segment the frame turns and tilts; a straight line between the ends' bearings
 * would be off by up to 2e-7 degree on a 200 m segment at 80°, the parabola by under 1e-11.)
 */
import { COS_LAT, E2, EX, EY, EZ, FRAME, LAT, LON, ONE_MINUS_E2, SIN_LAT, W2, chordBearing, vertexFrame } from "./ecef";
import { DEG } from "./ellipsoid";

/** Longest chord whose segment is placed by its terms, metres. */
export const SHORT_SEGMENT_M = 100;
/** Latitude (degrees, north or south) beyond which no segment is placed by its terms. */
export const SHORT_LAT_LIMIT = 80;

/** Offsets of a segment's terms (segmentTerms): curvature terms (degrees; NaN for a segment that is not short), bearings at the ends. */
export const C_LAT = 0;
export const C_LON = 1;
export const C_BEARING = 2;
export const BEARING_START = 3;
export const BEARING_END = 4;
/** Numbers in a segment's terms. */
export const SEGMENT_TERMS = 5;

/** The frame at a short segment's middle point. */
const MIDDLE = new Float64Array(FRAME);

const SHORT_SQ = SHORT_SEGMENT_M * SHORT_SEGMENT_M;

/**
 * The terms of the segment from the vertex whose frame is f[o1 …] to the one at f[o2 …]
 * (vertexFrame), into out[k …] at the offsets above.
 */
export function segmentTerms(f: Float64Array, o1: number, o2: number, out: Float64Array, k: number): void {
  const dx = f[o2 + EX] - f[o1 + EX];
  const dy = f[o2 + EY] - f[o1 + EY];
  const dz = f[o2 + EZ] - f[o1 + EZ];
  const c2 = dx * dx + dy * dy + dz * dz;
  // a zero-length segment has no direction: 0°, as at a repeated vertex
  const b1 = c2 > 0 ? chordBearing(f, o1, dx, dy, dz) : 0;
  const b2 = c2 > 0 ? chordBearing(f, o2, dx, dy, dz) : 0;
  out[k + BEARING_START] = b1;
  out[k + BEARING_END] = b2;
  const lat1 = f[o1 + LAT];
  const lat2 = f[o2 + LAT];
  if (!(c2 < SHORT_SQ && Math.abs(lat1) <= SHORT_LAT_LIMIT && Math.abs(lat2) <= SHORT_LAT_LIMIT)) {
    out[k + C_LAT] = NaN;
    out[k + C_LON] = NaN;
    out[k + C_BEARING] = NaN;
    return;
  }
  const dLat = lat2 - lat1;
  const dLon = shortWay(f[o2 + LON] - f[o1 + LON]);
  // the middle's sin φ, cos φ and w² as the ends' means (their error is of second order in s/R)
  const s = 0.5 * (f[o1 + SIN_LAT] + f[o2 + SIN_LAT]);
  const c = 0.5 * (f[o1 + COS_LAT] + f[o2 + COS_LAT]);
  const w2 = 0.5 * (f[o1 + W2] + f[o2 + W2]);
  const sc = s * c;
  // in degrees: C(rad) / DEG with Δ(rad) = Δ(deg)·DEG, so one factor DEG remains
  const cLat = -0.5 * DEG * sc * (((3 * E2) / w2) * dLat * dLat + (w2 / ONE_MINUS_E2) * dLon * dLon);
  const cLon = DEG * (ONE_MINUS_E2 / w2) * (s / c) * dLat * dLon;
  out[k + C_LAT] = cLat;
  out[k + C_LON] = cLon;
  // the bearing's parabola through the middle: b(½) = b1 + Δb/2 − C_b/4
  vertexFrame(f[o1 + LON] + 0.5 * dLon - 0.25 * cLon, lat1 + 0.5 * dLat - 0.25 * cLat, MIDDLE, 0);
  const middle = c2 > 0 ? chordBearing(MIDDLE, 0, dx, dy, dz) : 0;
  out[k + C_BEARING] = 2 * shortWay(b2 - b1) - 4 * shortWay(middle - b1);
}

/** A difference of longitudes or bearings (degrees) taken the short way round, in [−180, 180]. */
export function shortWay(d: number): number {
  return d > 180 ? d - 360 : d < -180 ? d + 360 : d;
}
