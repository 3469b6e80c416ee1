// compare(a, b): what changed from edition a (older) to edition b (newer).
//
// Intervals are matched by name first. The rest are matched as renames by rank and position:
// same rank, a parent that corresponds (same name or itself matched), the same place among its
// siblings, and the largest overlap in time. Ranks are matched from eon down to age, so a renamed
// parent is known before its children are looked at. Whatever is left is added (only in b) or
// removed (only in a).
//
// For every matched pair the report lists: a moved base (shift in Ma and in % of the old base;
// positive = older), a changed ± or "~", a changed colour, a changed GSSP flag, a changed parent
// or rank. Lists are in b's chart order (removed: a's). Numbers are compared to 1e-9 Ma.

import { round9, sameMa } from "./numbers";
import { RANKS, type Interval, type Rank } from "./types";

export interface IntervalRef {
  name: string;
  rank: Rank;
  baseMa: number;
  topMa: number;
}

/** `name` is the name in b; `oldName` is present when the interval was renamed. */
interface Named {
  name: string;
  oldName?: string;
  rank: Rank;
}

export interface BoundaryMove extends Named {
  oldBaseMa: number;
  newBaseMa: number;
  /** newBaseMa − oldBaseMa (positive: the base is now older). */
  shiftMa: number;
  /** shiftMa as a percentage of oldBaseMa. */
  shiftPercent: number;
}

export interface UncertaintyChange extends Named {
  oldUncertaintyMa: number | null;
  newUncertaintyMa: number | null;
  oldApproximate: boolean;
  newApproximate: boolean;
}

export interface Rename {
  oldName: string;
  newName: string;
  rank: Rank;
  oldBaseMa: number;
  newBaseMa: number;
}

export interface ColourChange extends Named {
  oldColor: string;
  newColor: string;
}

export interface GsspChange extends Named {
  oldGssp: boolean | null;
  newGssp: boolean | null;
}

export interface ParentChange extends Named {
  oldParent: string | null;
  newParent: string | null;
}

export interface RankChange {
  name: string;
  oldName?: string;
  oldRank: Rank;
  newRank: Rank;
}

export interface EditionComparison {
  moved: BoundaryMove[];
  uncertaintyChanged: UncertaintyChange[];
  added: IntervalRef[];
  removed: IntervalRef[];
  renamed: Rename[];
  colourChanged: ColourChange[];
  /** GSSP flag changed between two stated values (true ↔ false). */
  gsspChanged: GsspChange[];
  /** GSSP flag stated on one side only (null = the edition says nothing). */
  gsspStated: GsspChange[];
  parentChanged: ParentChange[];
  rankChanged: RankChange[];
  /** Pairs matched old → new (by name or as renames), in b's chart order. */
  matched: Array<{ oldName: string; newName: string }>;
}

const ref = (iv: Interval): IntervalRef => ({ name: iv.name, rank: iv.rank, baseMa: iv.baseMa, topMa: iv.topMa });

function overlapScore(a: Interval, b: Interval): number {
  const lo = Math.max(a.topMa, b.topMa);
  const hi = Math.min(a.baseMa, b.baseMa);
  const inter = Math.max(0, hi - lo);
  const union = Math.max(a.baseMa, b.baseMa) - Math.min(a.topMa, b.topMa);
  return union > 0 ? inter / union : 0;
}

function siblingIndex(list: readonly Interval[]): Map<Interval, number> {
  const groups = new Map<string, Interval[]>();
  for (const iv of list) {
    const k = iv.parent ?? "\u0000root";
    const g = groups.get(k);
    if (g) g.push(iv);
    else groups.set(k, [iv]);
  }
  const out = new Map<Interval, number>();
  for (const g of groups.values()) {
    g.sort((x, y) => y.baseMa - x.baseMa || x.order - y.order);
    g.forEach((iv, i) => out.set(iv, i));
  }
  return out;
}

export function compare(a: readonly Interval[], b: readonly Interval[]): EditionComparison {
  const bByName = new Map(b.map((iv) => [iv.name, iv] as const));
  const oldToNew = new Map<Interval, Interval>();
  const newToOld = new Map<Interval, Interval>();
  for (const o of a) {
    const n = bByName.get(o.name);
    if (n && !newToOld.has(n)) {
      oldToNew.set(o, n);
      newToOld.set(n, o);
    }
  }

  // Renames, rank by rank from the top.
  const aByName = new Map(a.map((iv) => [iv.name, iv] as const));
  const mappedParent = (o: Interval): string | null | undefined => {
    if (o.parent === null) return null;
    const p = aByName.get(o.parent);
    const np = p ? oldToNew.get(p) : undefined;
    return np ? np.name : undefined; // undefined: parent not matched
  };
  const sibA = siblingIndex(a);
  const sibB = siblingIndex(b);
  for (const rank of RANKS) {
    const olds = a.filter((iv) => iv.rank === rank && !oldToNew.has(iv));
    const news = b.filter((iv) => iv.rank === rank && !newToOld.has(iv));
    if (!olds.length || !news.length) continue;
    const candidates: Array<{ o: Interval; n: Interval; key: [number, number, number] }> = [];
    for (const o of olds) {
      const mp = mappedParent(o);
      for (const n of news) {
        const score = overlapScore(o, n);
        const sameParent = mp !== undefined && mp === n.parent ? 1 : 0;
        const samePlace = sameParent && sibA.get(o) === sibB.get(n) ? 1 : 0;
        // Position: same parent and place among siblings with some overlap, or a clear overlap.
        if ((sameParent && score > 0) || score >= 0.5) candidates.push({ o, n, key: [sameParent, samePlace, score] });
      }
    }
    candidates.sort((x, y) => y.key[0] - x.key[0] || y.key[1] - x.key[1] || y.key[2] - x.key[2]);
    for (const { o, n } of candidates) {
      if (oldToNew.has(o) || newToOld.has(n)) continue;
      oldToNew.set(o, n);
      newToOld.set(n, o);
    }
  }

  const result: EditionComparison = {
    moved: [],
    uncertaintyChanged: [],
    added: [],
    removed: [],
    renamed: [],
    colourChanged: [],
    gsspChanged: [],
    gsspStated: [],
    parentChanged: [],
    rankChanged: [],
    matched: [],
  };

  const bOrdered = [...b].sort((x, y) => x.order - y.order);
  for (const n of bOrdered) {
    const o = newToOld.get(n);
    if (!o) {
      result.added.push(ref(n));
      continue;
    }
    result.matched.push({ oldName: o.name, newName: n.name });
    const named: Named = o.name === n.name ? { name: n.name, rank: n.rank } : { name: n.name, oldName: o.name, rank: n.rank };
    if (o.name !== n.name) {
      result.renamed.push({ oldName: o.name, newName: n.name, rank: n.rank, oldBaseMa: o.baseMa, newBaseMa: n.baseMa });
    }
    if (o.rank !== n.rank) {
      result.rankChanged.push({ name: n.name, ...(o.name !== n.name ? { oldName: o.name } : {}), oldRank: o.rank, newRank: n.rank });
    }
    if (!sameMa(o.baseMa, n.baseMa)) {
      const shift = n.baseMa - o.baseMa;
      result.moved.push({
        ...named,
        oldBaseMa: o.baseMa,
        newBaseMa: n.baseMa,
        shiftMa: round9(shift),
        shiftPercent: round9((shift / o.baseMa) * 100),
      });
    }
    const uo = o.baseUncertaintyMa;
    const un = n.baseUncertaintyMa;
    const uncertaintyDiffers = (uo === null) !== (un === null) || (uo !== null && un !== null && !sameMa(uo, un));
    if (uncertaintyDiffers || o.approximate !== n.approximate) {
      result.uncertaintyChanged.push({
        ...named,
        oldUncertaintyMa: uo,
        newUncertaintyMa: un,
        oldApproximate: o.approximate,
        newApproximate: n.approximate,
      });
    }
    if (o.color.toUpperCase() !== n.color.toUpperCase()) {
      result.colourChanged.push({ ...named, oldColor: o.color, newColor: n.color });
    }
    if (o.gssp !== n.gssp) {
      const entry = { ...named, oldGssp: o.gssp, newGssp: n.gssp };
      if (o.gssp === null || n.gssp === null) result.gsspStated.push(entry);
      else result.gsspChanged.push(entry);
    }
    const mp = mappedParent(o);
    const parentSame = o.parent === null ? n.parent === null : mp !== undefined ? mp === n.parent : o.parent === n.parent;
    if (!parentSame) result.parentChanged.push({ ...named, oldParent: o.parent, newParent: n.parent });
  }
  for (const o of [...a].sort((x, y) => x.order - y.order)) if (!oldToNew.has(o)) result.removed.push(ref(o));
  return result;
}
