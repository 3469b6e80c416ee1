// Sign numbers: a marker gets its number at its first publication and keeps it; numbers of markers
// that are gone are retired, never reused — pointing to the marker that absorbed them (combined
// markers: the one left at the same age) or saying the sign was removed. Pure: the server stores
// the result in marker_signs.
import type { RetiredSign } from "./types";

export interface StoredSign {
  number: number;
  markerId: string;
  label: string;
  retiredAtPublication: number | null;
  absorbedByNumber: number | null;
}

export interface SignPlan {
  /** Marker id → sign number, for every marker of the publication. */
  numbers: Map<string, number>;
  /** Signs to create (markers published for the first time), numbered after every number ever used. */
  created: { markerId: string; number: number; label: string }[];
  /** Signs whose marker is gone, retired at this publication. */
  retired: { number: number; absorbedByNumber: number | null }[];
  /** Every retired sign (earlier ones too), for the snapshot. */
  retiredSigns: RetiredSign[];
}

/**
 * `markers` in table order (from the older end) with their ages; `signs` every sign the exhibit
 * ever had. A gone marker's sign is absorbed by a remaining marker at the same age (within 1e-9 Ma),
 * else removed.
 */
export function planSigns(markers: readonly { id: string; label: string; ageMa: number }[], signs: readonly StoredSign[], publication: number, goneAges: ReadonlyMap<string, number> = new Map()): SignPlan {
  const numbers = new Map<string, number>();
  const byMarker = new Map(signs.map((s) => [s.markerId, s]));
  let next = signs.reduce((max, s) => Math.max(max, s.number), 0) + 1;
  const created: SignPlan["created"] = [];
  for (const m of markers) {
    const sign = byMarker.get(m.id);
    if (sign && sign.retiredAtPublication === null) numbers.set(m.id, sign.number);
    else if (!sign) {
      numbers.set(m.id, next);
      created.push({ markerId: m.id, number: next, label: m.label });
      next++;
    } else numbers.set(m.id, sign.number); // a retired sign's marker cannot come back with another number
  }
  const present = new Set(markers.map((m) => m.id));
  const retired: SignPlan["retired"] = [];
  const retiredSigns: RetiredSign[] = [];
  for (const s of signs) {
    if (s.retiredAtPublication !== null) {
      retiredSigns.push({ number: s.number, label: s.label, retiredAtPublication: s.retiredAtPublication, status: s.absorbedByNumber ? "absorbed" : "removed", absorbedBy: s.absorbedByNumber });
      continue;
    }
    if (present.has(s.markerId)) continue;
    const age = goneAges.get(s.markerId);
    const absorber = age === undefined ? undefined : markers.find((m) => Math.abs(m.ageMa - age) < 1e-9);
    const absorbedByNumber = absorber ? numbers.get(absorber.id)! : null;
    retired.push({ number: s.number, absorbedByNumber });
    retiredSigns.push({ number: s.number, label: s.label, retiredAtPublication: publication, status: absorbedByNumber ? "absorbed" : "removed", absorbedBy: absorbedByNumber });
  }
  retiredSigns.sort((a, b) => a.number - b.number);
  return { numbers, created, retired, retiredSigns };
}
