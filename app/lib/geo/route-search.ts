/**
 * Finding the segment that holds a distance along a prepared route: one look-up by bisection, or
 * many increasing distances in one forward pass (nextSegment).
 */
import { SEARCH_BLOCK, VERTEX_RECORD, type PreparedRoute } from "./route-prepare";

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

/**
 * The segments of distances taken in increasing order, in one forward pass from the last one found
 * (no per-marker search of the whole route). A route kept for repeated queries is searched through
 * its block table and vertex records; a one-off route by galloping forward in its cumulative array.
 * The pass's place is two integers (cursorState), not an object: an object made per pass gets a map
 * that dies with it, and the engine then drops the code compiled for it at the next full collection.
 */
export function cursorState(): Int32Array {
  return new Int32Array(2);
}
const SEG = 0;
const BLOCK = 1;

/** The segment holding d (clamped to the route), d not less than the previous call's with this state. */
export function nextSegment(route: PreparedRoute, d: number, state: Int32Array): number {
  const cum = route.cumulative;
  const last = cum.length - 1;
  if (last <= 0) return 0;
  if (d >= cum[last]) return segmentIndexAt(route, d);
  // from the last segment (cum[seg] <= d < cum[last] here) to the last vertex with cum <= d
  const v = route.vertices;
  const blocks = route.blockStarts;
  const seg = v !== undefined && blocks !== undefined ? inBlocks(v, blocks, cum, last, d, state) : galloping(cum, last, d, state[SEG]);
  state[SEG] = seg;
  return seg;
}

/**
 * The block holding d, from the small table; inside it a guess in proportion to distance, then a
 * step or two to the segment: the vertex records read are next to each other, where a bisection
 * would read one record in each of several places (each one a cache miss).
 */
function inBlocks(v: Float64Array, blocks: Float64Array, cum: Float64Array, last: number, d: number, state: Int32Array): number {
  let block = state[BLOCK];
  while (block + 1 < blocks.length && blocks[block + 1] <= d) block++;
  state[BLOCK] = block;
  const start = block * SEARCH_BLOCK;
  // the block's end, cum[end] > d: the next block's start (from the table, not the records)
  const inside = start + SEARCH_BLOCK < last;
  const end = inside ? start + SEARCH_BLOCK : last;
  const from = blocks[block];
  const to = inside ? blocks[block + 1] : cum[last];
  let g = start + Math.floor(((d - from) / (to - from)) * (end - start));
  if (g < state[SEG]) g = state[SEG];
  if (g >= end) g = end - 1;
  if (v[VERTEX_RECORD * g] <= d) {
    while (v[VERTEX_RECORD * (g + 1)] <= d) g++;
  } else {
    while (v[VERTEX_RECORD * g] > d) g--;
  }
  return g;
}

/** Gallop forward from the last segment, then bisect the window: the search stays near the previous marker in memory. */
function galloping(cum: Float64Array, last: number, d: number, from: number): number {
  let lo = from;
  let hi = lo + 1;
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
  return lo;
}
