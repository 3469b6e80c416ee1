/**
 * Finding the segment that holds a distance along a prepared route: one look-up by bisection, or
 * many increasing distances in one forward pass (SegmentCursor).
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
 */
export class SegmentCursor {
  private seg = 0;
  private block = 0;
  private readonly cum: Float64Array;
  private readonly last: number;
  private readonly blocks: Float64Array | undefined;
  /** Where the search reads distances: the vertex records when kept (it then ends in the memory the placing reads), else the cumulative array. */
  private readonly keys: Float64Array;
  private readonly stride: number;

  constructor(private readonly route: PreparedRoute) {
    this.cum = route.cumulative;
    this.last = this.cum.length - 1;
    this.blocks = route.blockStarts;
    this.keys = route.vertices ?? this.cum;
    this.stride = route.vertices !== undefined ? VERTEX_RECORD : 1;
  }

  /** The segment holding d (clamped to the route), d not less than the previous call's. */
  next(d: number): number {
    const { cum, last } = this;
    if (last <= 0) return 0;
    if (d >= cum[last]) return segmentIndexAt(this.route, d);
    // from the last segment (cum[seg] <= d < cum[last] here) to the last vertex with cum <= d
    this.seg = this.blocks !== undefined ? this.inBlocks(d, this.blocks) : this.galloping(d);
    return this.seg;
  }

  /**
   * The block holding d, from the small table; inside it a guess in proportion to distance, then a
   * step or two to the segment: the vertex records read are next to each other, where a bisection
   * would read one record in each of several places (each one a cache miss).
   */
  private inBlocks(d: number, blocks: Float64Array): number {
    const { keys, stride, last } = this;
    while (this.block + 1 < blocks.length && blocks[this.block + 1] <= d) this.block++;
    const start = this.block * SEARCH_BLOCK;
    // the block's end, cum[end] > d: the next block's start (from the table, not the records)
    const inside = start + SEARCH_BLOCK < last;
    const end = inside ? start + SEARCH_BLOCK : last;
    const from = blocks[this.block];
    const to = inside ? blocks[this.block + 1] : this.cum[last];
    let g = start + Math.floor(((d - from) / (to - from)) * (end - start));
    if (g < this.seg) g = this.seg;
    if (g >= end) g = end - 1;
    if (keys[stride * g] <= d) {
      while (keys[stride * (g + 1)] <= d) g++;
    } else {
      while (keys[stride * g] > d) g--;
    }
    return g;
  }

  /** Gallop forward from the last segment, then bisect the window: the search stays near the previous marker in memory. */
  private galloping(d: number): number {
    const { cum, last } = this;
    let lo = this.seg;
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
}
