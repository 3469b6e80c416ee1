// Combining same-age markers into one, as a sign would show them: the demo's shared boundaries are
// one marker on the coarsest interval, labelled with every name ("Base of the Archean and
// Eoarchean"). Pure: the server checks, then keeps the chosen marker and deletes the others.
import type { ResolvedMarker } from "./types";

const RANK_ORDER = ["eon", "era", "period", "subperiod", "epoch", "age"];
const KIND_ORDER = ["boundary", "event", "custom"];
export const MAX_LABEL = 200;

export type CombinePlan =
  | { ok: true; keepId: string; removeIds: string[]; label: string; text: string }
  | { ok: false; message: string };

/** "A", "A and B", "A, B and C". */
export function listWords(names: readonly string[]): string {
  return names.length <= 1 ? (names[0] ?? "") : `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}`;
}

const BASE = "Base of the ";

/** The interval names a boundary marker stands for: its interval, and every name its label gives ("Base of the A, B and C"). */
export function boundaryNames(m: Pick<ResolvedMarker, "label" | "intervalName">): string[] {
  const names = m.intervalName ? [m.intervalName] : [];
  if (m.label.startsWith(BASE)) for (const n of m.label.slice(BASE.length).split(/, | and |; /)) if (n.trim() && !names.includes(n.trim())) names.push(n.trim());
  return names.length ? names : [m.label];
}

/**
 * What combining these markers makes: the marker kept (a boundary before an event before a custom
 * age; the coarsest rank; then the lowest table number), its label naming every one, and their
 * texts one after another. Refused unless there are at least two, all of one age.
 */
export function planCombine(markers: readonly ResolvedMarker[]): CombinePlan {
  if (markers.length < 2) return { ok: false, message: "Choose at least two markers of the same age to combine." };
  const age = markers[0].ageMa;
  const other = markers.find((m) => m.ageMa !== age);
  if (other) {
    return { ok: false, message: `Only markers of the same age can be combined: marker ${markers[0].number} (“${markers[0].label}”) and marker ${other.number} (“${other.label}”) differ.` };
  }
  const rank = (m: ResolvedMarker) => (m.kind === "boundary" ? RANK_ORDER.indexOf(m.intervalRank ?? "age") : RANK_ORDER.length);
  const ordered = [...markers].sort((a, b) => KIND_ORDER.indexOf(a.kind) - KIND_ORDER.indexOf(b.kind) || rank(a) - rank(b) || a.number - b.number);
  const keep = ordered[0];
  const bases: string[] = [];
  const others: string[] = [];
  for (const m of ordered) {
    const into = m.kind === "boundary" ? bases : others;
    for (const n of m.kind === "boundary" ? boundaryNames(m) : [m.label]) if (!into.includes(n)) into.push(n);
  }
  const label = [bases.length ? `${BASE}${listWords(bases)}` : "", ...others].filter(Boolean).join("; ");
  if (label.length > MAX_LABEL) {
    return { ok: false, message: `The combined label would be ${label.length} characters, over the ${MAX_LABEL} a label may have (“${label.slice(0, 60)}…”); shorten the markers' labels first.` };
  }
  const text = ordered.map((m) => m.text.trim()).filter(Boolean).join("\n\n");
  return { ok: true, keepId: keep.id, removeIds: ordered.slice(1).map((m) => m.id), label, text };
}
