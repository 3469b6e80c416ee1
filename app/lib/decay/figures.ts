// A decay system as stored (exact decimal strings, or numbers from a database row) → the figures
// the decay equations take. The one mapper behind every "how we know" panel.
import type { DecaySystemFigures } from "./how-we-know";

export interface StoredDecaySystem {
  parent: string;
  daughter: string;
  halfLifeYears: string | number;
  halfLifeUncertaintyYears: string | number | null;
  decayConstantPerYear: string | number | null;
  branchConstantPerYear: string | number | null;
}

const optional = (v: string | number | null) => (v === null ? null : Number(v));

export function decayFigures(s: StoredDecaySystem): DecaySystemFigures {
  return {
    parent: s.parent,
    daughter: s.daughter,
    halfLifeYears: Number(s.halfLifeYears),
    halfLifeUncertaintyYears: optional(s.halfLifeUncertaintyYears),
    decayConstantPerYear: optional(s.decayConstantPerYear),
    branchConstantPerYear: optional(s.branchConstantPerYear),
  };
}
