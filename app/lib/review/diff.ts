// The difference between two revisions of an exhibit: markers added, removed, moved (how far, in the
// exhibit's own units) and retitled or rewritten; settings that changed. Pure, over the stored
// revision contents (exhibit_revisions.content).
import { formatAgeMa, formatLength } from "../exhibit/display";
import { toMetres, toYears } from "../units";
import type { RevisionContent, RevisionMarker } from "./types";

export interface MarkerChange {
  id: string;
  label: string;
  /** Words: "moved 12.5 m towards the younger end (66.0 Ma → 66.04 Ma)". */
  changes: string[];
}

export interface RevisionDiff {
  added: { id: string; label: string; ageText: string; position: string }[];
  removed: { id: string; label: string; ageText: string }[];
  changed: MarkerChange[];
  settings: string[];
  unchanged: number;
}

/** Metres from the older end of a marker at `ageMa` on the revision's scale (null when the scale is undefined). */
function positionOf(c: RevisionContent, ageMa: number): number | null {
  const older = toYears(c.spanOlder);
  const span = older - toYears(c.spanYounger);
  const length = c.medium.kind === "route" ? (c.medium.routeLengthM ?? 0) : c.medium.lengthValue != null && c.medium.lengthUnit ? toMetres({ value: c.medium.lengthValue, unit: c.medium.lengthUnit }) : 0;
  if (!(span > 0) || !(length > 0)) return null;
  return ((older - ageMa * 1e6) * length) / span;
}

const ageText = (m: RevisionMarker) => `${formatAgeMa(m.ageMa)}${m.uncertaintyMa ? ` ± ${formatAgeMa(m.uncertaintyMa)}` : ""}`;

function mediumWords(c: RevisionContent): string {
  const m = c.medium;
  if (m.kind === "route") return `route ${m.sourceName ?? ""} (${formatLength(m.routeLengthM ?? 0, c.unitsPreference, 0.01)})`.replace("  ", " ");
  return `${m.lengthValue} ${m.lengthUnit} ${m.mediumType}`;
}

export function diffRevisions(from: RevisionContent, to: RevisionContent): RevisionDiff {
  const before = new Map(from.markers.map((m) => [m.id, m]));
  const after = new Map(to.markers.map((m) => [m.id, m]));
  const units = to.unitsPreference;
  const diff: RevisionDiff = { added: [], removed: [], changed: [], settings: [], unchanged: 0 };
  for (const m of to.markers) {
    const old = before.get(m.id);
    if (!old) {
      const at = positionOf(to, m.ageMa);
      diff.added.push({ id: m.id, label: m.label, ageText: ageText(m), position: at === null ? "" : `${formatLength(at, units, 0.001)} from the older end` });
      continue;
    }
    const changes: string[] = [];
    const a = positionOf(from, old.ageMa);
    const b = positionOf(to, m.ageMa);
    if (a !== null && b !== null && Math.abs(b - a) >= 0.0005) {
      changes.push(`moved ${formatLength(Math.abs(b - a), units, 0.001)} towards the ${b > a ? "younger" : "older"} end (${formatLength(a, units, 0.001)} → ${formatLength(b, units, 0.001)} from the older end)`);
    }
    if (old.ageMa !== m.ageMa || old.uncertaintyMa !== m.uncertaintyMa) changes.push(`age ${ageText(old)} → ${ageText(m)}`);
    if (old.label !== m.label) changes.push(`label “${old.label}” → “${m.label}”`);
    if (old.text !== m.text) changes.push(old.text ? (m.text ? "text rewritten" : "text removed") : "text added");
    if (old.source !== m.source) changes.push(`source “${old.source}” → “${m.source}”`);
    if (old.decaySystemId !== m.decaySystemId) changes.push(m.decaySystemId ? "“how we know” panel changed" : "“how we know” panel removed");
    if (changes.length) diff.changed.push({ id: m.id, label: m.label, changes });
    else diff.unchanged++;
  }
  for (const m of from.markers) if (!after.has(m.id)) diff.removed.push({ id: m.id, label: m.label, ageText: ageText(m) });

  const span = (c: RevisionContent) => `${c.spanOlder.value} ${c.spanOlder.unit} to ${c.spanYounger.value} ${c.spanYounger.unit}`;
  if (from.title !== to.title) diff.settings.push(`title “${from.title}” → “${to.title}”`);
  if (span(from) !== span(to)) diff.settings.push(`span ${span(from)} → ${span(to)}`);
  if (from.edition.slug !== to.edition.slug) diff.settings.push(`chart edition ${from.edition.label} → ${to.edition.label}`);
  if (mediumWords(from) !== mediumWords(to) || from.medium.geometrySha256 !== to.medium.geometrySha256) diff.settings.push(`medium ${mediumWords(from)} → ${mediumWords(to)}`);
  if (from.unitsPreference !== to.unitsPreference) diff.settings.push(`units ${from.unitsPreference} → ${to.unitsPreference}`);
  const insets = (c: RevisionContent) => c.insets.map((i) => i.label).sort().join("; ");
  if (insets(from) !== insets(to)) diff.settings.push(`insets “${insets(from) || "none"}” → “${insets(to) || "none"}”`);
  if (JSON.stringify(from.legibility) !== JSON.stringify(to.legibility)) diff.settings.push("legibility thresholds changed");
  return diff;
}
