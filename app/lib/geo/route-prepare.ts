/**
 * Measuring a route once (route.ts has the method): the cumulative distance to every vertex, and
 * for a route queried again and again, the vertex records and block table its searches use.
 */
import { GEO, EX, EY, EZ, W2, INV_R2_FACTOR, vertexEcef } from "./ecef";
import { geodesicInverse } from "./geodesic";

/** Chord length above which a segment is solved with the exact inverse problem. */
export const CHORD_LIMIT_M = 10_000;

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
   * block here, in a few kilobytes that stay in cache, and then reads records only inside the block.
   */
  blockStarts?: Float64Array;
}

/** Numbers per vertex in PreparedRoute.vertices: cumulative distance, x, y, z, lon, lat. */
export const VERTEX_RECORD = 6;
/** Vertices per entry of blockStarts. */
export const SEARCH_BLOCK = 64;

export interface PrepareOptions {
  /**
   * Keep the vertex records and block table, so that placing markers needs no trigonometry for the
   * segments' ends: for a route queried again and again (the composer's preview), not for a
   * one-off computation, where writing the 6 × 8 bytes per vertex costs more than it saves.
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
    vertexEcef(lo, la);
    const x = GEO[EX];
    const y = GEO[EY];
    const z = GEO[EZ];
    const w2 = GEO[W2];
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
    if (vertices !== null) {
      const k = VERTEX_RECORD * i;
      vertices[k] = total;
      vertices[k + 1] = x;
      vertices[k + 2] = y;
      vertices[k + 3] = z;
      vertices[k + 4] = lo;
      vertices[k + 5] = la;
    }
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

/** Length of one segment by the route's method (chord formula or exact inverse). */
export function segmentLength(lat1: number, lon1: number, lat2: number, lon2: number): number {
  return prepareRoute([lon1, lat1, lon2, lat2]).totalMetres;
}
