// Chart order: depth-first, oldest first. Roots (eons) from the oldest to the youngest; under
// each interval its children from the oldest to the youngest, each followed by its own
// descendants. So Hadean = 1, Archean = 2, Eoarchean = 3, …, Meghalayan last.
// Ties (equal bases) go to the shallower rank, then to the name.
// Intervals that cannot be reached from a root (a missing parent, a loop) follow at the end,
// oldest first.

import { isRank, rankDepth, type Interval } from "./types";

function olderFirst(a: Interval, b: Interval): number {
  return (
    b.baseMa - a.baseMa ||
    (isRank(a.rank) && isRank(b.rank) ? rankDepth(a.rank) - rankDepth(b.rank) : 0) ||
    (a.name < b.name ? -1 : a.name > b.name ? 1 : 0)
  );
}

/** A copy of the intervals in chart order with `order` set to 1, 2, 3, … */
export function inChartOrder(intervals: readonly Interval[]): Interval[] {
  return chartOrderIndex(intervals).map((idx, i) => ({ ...intervals[idx], order: i + 1 }));
}

/** Indices into `intervals`, in chart order. */
export function chartOrderIndex(intervals: readonly Interval[]): number[] {
  const byName = new Map<string, Interval>();
  for (const iv of intervals) if (!byName.has(iv.name)) byName.set(iv.name, iv);
  const children = new Map<string, Interval[]>();
  const roots: Interval[] = [];
  for (const iv of intervals) {
    if (iv.parent !== null && byName.has(iv.parent) && iv.parent !== iv.name) {
      const list = children.get(iv.parent);
      if (list) list.push(iv);
      else children.set(iv.parent, [iv]);
    } else {
      roots.push(iv);
    }
  }
  const indexOf = new Map<Interval, number>();
  intervals.forEach((iv, i) => indexOf.set(iv, i));
  const out: number[] = [];
  const placed = new Set<Interval>();
  const visit = (iv: Interval) => {
    if (placed.has(iv)) return;
    placed.add(iv);
    out.push(indexOf.get(iv)!);
    const kids = children.get(iv.name);
    if (kids && byName.get(iv.name) === iv) for (const k of [...kids].sort(olderFirst)) visit(k);
  };
  for (const r of [...roots].sort(olderFirst)) visit(r);
  for (const iv of [...intervals].sort(olderFirst)) if (!placed.has(iv)) visit(iv);
  return out;
}
