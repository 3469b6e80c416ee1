// Look-ups on the intervals of one edition.
//
// Containment: an interval contains the ages from its base (inclusive) to its top (exclusive):
// 66.0 Ma is in the Paleogene (the instant it begins), not in the Cretaceous. The present (0 Ma)
// belongs to the youngest intervals, whose top is 0. Ages outside the chart contain nothing.

import { round9 } from "./numbers";
import { RANKS, rankDepth, type BoundaryKind, type Interval, type Rank } from "./types";

function contains(iv: Interval, ageMa: number): boolean {
  const a = round9(ageMa);
  const base = round9(iv.baseMa);
  const top = round9(iv.topMa);
  return a <= base && (a > top || (a === 0 && top === 0));
}

/** The interval containing `ageMa` at each rank ("subperiod" only inside the Carboniferous;
 *  a rank is absent where the chart does not divide that far, e.g. ages before the Cambrian). */
export function intervalsAt(intervals: readonly Interval[], ageMa: number): Partial<Record<Rank, Interval>> {
  const out: Partial<Record<Rank, Interval>> = {};
  if (!Number.isFinite(ageMa)) return out;
  for (const iv of intervals) {
    if (out[iv.rank] === undefined && contains(iv, ageMa)) out[iv.rank] = iv;
  }
  return out;
}

/** The chain from the eon down to the deepest interval containing `ageMa` (eon → … → age),
 *  following parents; empty outside the chart. */
export function chainAt(intervals: readonly Interval[], ageMa: number): Interval[] {
  const at = intervalsAt(intervals, ageMa);
  let deepest: Interval | undefined;
  for (const r of RANKS) if (at[r]) deepest = at[r];
  if (!deepest) return [];
  const byName = new Map(intervals.map((iv) => [iv.name, iv] as const));
  const chain: Interval[] = [];
  const seen = new Set<Interval>();
  for (let cur: Interval | undefined = deepest; cur && !seen.has(cur); cur = cur.parent === null ? undefined : byName.get(cur.parent)) {
    seen.add(cur);
    chain.push(cur);
  }
  return chain.sort((a, b) => rankDepth(a.rank) - rankDepth(b.rank));
}

export interface Boundary {
  name: string;
  rank: Rank;
  baseMa: number;
  baseUncertaintyMa: number | null;
  approximate: boolean;
  gssp: boolean | null;
  /** GSSP or GSSA where the base is ratified and the edition says which; else null. */
  boundaryKind: BoundaryKind | null;
}

/** The base of the named interval (exact name first, then case- and space-insensitive), or null. */
export function baseOf(intervals: readonly Interval[], name: string): Boundary | null {
  let iv = intervals.find((i) => i.name === name);
  if (!iv) {
    const key = normalise(name);
    iv = intervals.find((i) => normalise(i.name) === key);
  }
  if (!iv) return null;
  return {
    name: iv.name,
    rank: iv.rank,
    baseMa: iv.baseMa,
    baseUncertaintyMa: iv.baseUncertaintyMa,
    approximate: iv.approximate,
    gssp: iv.gssp,
    boundaryKind: iv.boundaryKind ?? null,
  };
}

function normalise(s: string): string {
  return s.trim().replace(/\s+/g, " ").toLowerCase();
}
