// The chart-colour bands drawn behind an exhibit's scale strip.
import type { Rank } from "../timescale/types";

export interface Band {
  name: string;
  rank: string;
  baseMa: number;
  topMa: number;
  color: string;
}

/** Colour bands for the strip: every rank from eon down that has at most `max` intervals in the span (three ranks at most). */
export function bandsFor(intervals: readonly { name: string; rank: Rank; baseMa: number; topMa: number; color: string }[], olderMa: number, youngerMa: number, max = 40): Band[] {
  const bands: Band[] = [];
  for (const rank of ["eon", "era", "period", "epoch", "age"] as Rank[]) {
    const inSpan = intervals.filter((i) => i.rank === rank && i.baseMa > youngerMa && i.topMa < olderMa);
    if (inSpan.length === 0 || inSpan.length > max) continue;
    bands.push(...inSpan.map(({ name, baseMa, topMa, color }) => ({ name, rank, baseMa, topMa, color })));
    if (new Set(bands.map((b) => b.rank)).size === 3) break;
  }
  return bands;
}
