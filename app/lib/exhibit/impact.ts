// Edition impact: what re-pinning an exhibit to another chart edition would move, and by how much.
import { compare } from "../timescale/compare";
import type { Interval } from "../timescale/types";
import type { ResolvedMarker } from "./types";

export interface ImpactRow {
  markerId: string;
  number: number;
  label: string;
  intervalName: string;
  /** The interval's name in the new edition, when it was renamed. */
  newIntervalName: string | null;
  oldAgeMa: number;
  /** null: the interval is not in the new edition. */
  newAgeMa: number | null;
  shiftMa: number | null;
  /** How far the marker moves along the exhibit (positive: towards the younger end). */
  shiftMetres: number | null;
  oldUncertaintyMa: number | null;
  newUncertaintyMa: number | null;
}

export interface ImpactReport {
  rows: ImpactRow[];
  /** Boundary markers whose interval is in both editions with the same base. */
  unchanged: number;
  missing: number;
}

const EPS = 1e-9;

/**
 * For each boundary marker, its age in the pinned edition and in the other one. Intervals are
 * matched by name, then as renames (compare()). A boundary that moves older sits further from the
 * present: it moves towards the older end by Δage × metres per year.
 */
export function impactReport(markers: ResolvedMarker[], pinned: readonly Interval[], target: readonly Interval[], metresPerYear: number): ImpactReport {
  const renamed = new Map(compare(pinned, target).renamed.map((r) => [r.oldName, r.newName]));
  const byName = new Map(target.map((iv) => [iv.name, iv]));
  const oldByName = new Map(pinned.map((iv) => [iv.name, iv]));
  const rows: ImpactRow[] = [];
  let unchanged = 0;
  let missing = 0;
  for (const m of markers) {
    if (m.kind !== "boundary" || !m.intervalName) continue;
    const newName = byName.has(m.intervalName) ? m.intervalName : renamed.get(m.intervalName) ?? null;
    const next = newName ? byName.get(newName) : undefined;
    const old = oldByName.get(m.intervalName);
    const oldUnc = old?.baseUncertaintyMa ?? null;
    if (!next) {
      missing++;
      rows.push({ markerId: m.id, number: m.number, label: m.label, intervalName: m.intervalName, newIntervalName: null, oldAgeMa: m.ageMa, newAgeMa: null, shiftMa: null, shiftMetres: null, oldUncertaintyMa: oldUnc, newUncertaintyMa: null });
      continue;
    }
    const shiftMa = next.baseMa - m.ageMa;
    const uncChanged = (oldUnc ?? null) !== (next.baseUncertaintyMa ?? null);
    if (Math.abs(shiftMa) < EPS && !uncChanged && newName === m.intervalName) {
      unchanged++;
      continue;
    }
    rows.push({
      markerId: m.id,
      number: m.number,
      label: m.label,
      intervalName: m.intervalName,
      newIntervalName: newName === m.intervalName ? null : newName,
      oldAgeMa: m.ageMa,
      newAgeMa: next.baseMa,
      shiftMa: Math.abs(shiftMa) < EPS ? 0 : shiftMa,
      // older by Δ → further from the younger end, i.e. closer to the older end: −Δ × 10⁶ × m/yr
      shiftMetres: Math.abs(shiftMa) < EPS ? 0 : -shiftMa * 1e6 * metresPerYear,
      oldUncertaintyMa: oldUnc,
      newUncertaintyMa: next.baseUncertaintyMa,
    });
  }
  return { rows, unchanged, missing };
}
