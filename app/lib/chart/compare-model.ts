// Group a comparison by boundary: the Cretaceous, the Early Cretaceous and the Berriasian share one
// base, so one moved boundary is one row (named by its intervals, shallowest first).
import { rankDepth, type BoundaryMove, type Interval, type Rank, type UncertaintyChange } from "~/lib/timescale";
import { round9 } from "~/lib/timescale/numbers";

export interface MovedBoundary {
  key: string;
  names: string[];
  oldNames: (string | undefined)[];
  rank: Rank;
  color: string;
  oldBaseMa: number;
  newBaseMa: number;
  shiftMa: number;
  shiftPercent: number;
  oldUncertaintyMa: number | null;
  newUncertaintyMa: number | null;
}

export function groupMoves(moved: readonly BoundaryMove[], newer: readonly Interval[], older: readonly Interval[]): MovedBoundary[] {
  const inNew = new Map(newer.map((iv) => [iv.name, iv] as const));
  const inOld = new Map(older.map((iv) => [iv.name, iv] as const));
  const groups = new Map<string, MovedBoundary>();
  const sorted = [...moved].sort((a, b) => rankDepth(a.rank) - rankDepth(b.rank));
  for (const m of sorted) {
    const key = `${round9(m.oldBaseMa)}|${round9(m.newBaseMa)}`;
    const g = groups.get(key);
    if (g) {
      g.names.push(m.name);
      g.oldNames.push(m.oldName);
      continue;
    }
    const n = inNew.get(m.name);
    const o = inOld.get(m.oldName ?? m.name);
    groups.set(key, {
      key,
      names: [m.name],
      oldNames: [m.oldName],
      rank: m.rank,
      color: n?.color ?? "#cccccc",
      oldBaseMa: m.oldBaseMa,
      newBaseMa: m.newBaseMa,
      shiftMa: m.shiftMa,
      shiftPercent: m.shiftPercent,
      oldUncertaintyMa: o?.baseUncertaintyMa ?? null,
      newUncertaintyMa: n?.baseUncertaintyMa ?? null,
    });
  }
  return [...groups.values()].sort((a, b) => a.newBaseMa - b.newBaseMa);
}

export interface UncertaintyGroup {
  key: string;
  names: string[];
  baseMa: number;
  change: UncertaintyChange;
}

export function groupUncertainty(changes: readonly UncertaintyChange[], newer: readonly Interval[]): UncertaintyGroup[] {
  const inNew = new Map(newer.map((iv) => [iv.name, iv] as const));
  const groups = new Map<string, UncertaintyGroup>();
  for (const c of [...changes].sort((a, b) => rankDepth(a.rank) - rankDepth(b.rank))) {
    const base = inNew.get(c.name)?.baseMa ?? NaN;
    const key = `${round9(base)}|${c.oldUncertaintyMa}|${c.newUncertaintyMa}|${c.oldApproximate}|${c.newApproximate}`;
    const g = groups.get(key);
    if (g) g.names.push(c.name);
    else groups.set(key, { key, names: [c.name], baseMa: base, change: c });
  }
  return [...groups.values()].sort((a, b) => a.baseMa - b.baseMa);
}
