/**
 * Measuring a route once (route.ts has the method): the cumulative distance to every vertex, and
 * for a route queried again and again, the vertex records and block table its searches use.
 */
import { EX, EY, EZ, FRAME, W2, INV_R2_FACTOR, vertexFrame } from "./ecef";
import { geodesicInverse } from "./geodesic";
import { segmentTerms } from "./route-segment";

/** Two vertices' frames (vertexFrame), the previous one and the current one. */
const FRAMES = new Float64Array(2 * FRAME);

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
   * vertex, [cumulative distance, lon, lat, then the terms of the segment it starts] (route-segment.ts:
   * its curvature terms and end bearings), so that a marker's search ends in the memory its placing
   * reads, and placing a marker on a short segment takes a few multiplications.
   */
  vertices?: Float64Array;
  /**
   * cumulative[k · SEARCH_BLOCK] for each k (kept with vertices): a marker's search first finds its
   * block here, in a few kilobytes that stay in cache, and then reads records only inside the block.
   */
  blockStarts?: Float64Array;
}

/** Numbers per vertex in PreparedRoute.vertices: cumulative distance, lon, lat, and the SEGMENT_TERMS of its segment (from VERTEX_TERMS). */
export const VERTEX_RECORD = 8;
/** Offset of the segment's terms in a vertex record. */
export const VERTEX_TERMS = 3;
/** Vertices per entry of blockStarts. */
export const SEARCH_BLOCK = 64;

export interface PrepareOptions {
  /**
   * Keep the vertex records and block table, so that placing markers needs no trigonometry for the
   * segments' ends: for a route queried again and again (the composer's preview), not for a
   * one-off computation, where working out and writing 8 × 8 bytes per vertex costs more than it saves.
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
  // the frames of the previous vertex and this one, taking turns in two slots
  const frames = FRAMES;
  for (let i = 0; i < n; i++) {
    const lo = coords[2 * i];
    const la = coords[2 * i + 1];
    const o = (i & 1) * FRAME;
    const po = FRAME - o;
    vertexFrame(lo, la, frames, o);
    const w2 = frames[o + W2];
    if (i > 0) {
      const dx = frames[o + EX] - frames[po + EX];
      const dy = frames[o + EY] - frames[po + EY];
      const dz = frames[o + EZ] - frames[po + EZ];
      const c2 = dx * dx + dy * dy + dz * dz;
      const c = Math.sqrt(c2);
      let s: number;
      if (c < CHORD_LIMIT_M) {
        // 1/(M·N) = (1 − e² sin²φ)² / (a²(1 − e²)), the mean of the two ends'
        const pw2 = frames[po + W2];
        const q = c2 * 0.5 * (w2 * w2 * INV_R2_FACTOR + pw2 * pw2 * INV_R2_FACTOR);
        s = c * (1 + q * (1 / 24 + q * (3 / 640)));
      } else {
        s = geodesicInverse(coords[2 * i - 1], coords[2 * i - 2], la, lo).s12;
        longSegments++;
      }
      total += s;
      if (vertices !== null) segmentTerms(frames, po, o, vertices, VERTEX_RECORD * (i - 1) + VERTEX_TERMS);
    }
    cumulative[i] = total;
    if (vertices !== null) {
      const k = VERTEX_RECORD * i;
      vertices[k] = total;
      vertices[k + 1] = lo;
      vertices[k + 2] = la;
    }
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
