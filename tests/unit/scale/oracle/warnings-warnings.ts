// TEST ORACLE (test-only): app/lib/scale/warnings.ts as it was before the warnings were made faster (issue 10),
// kept so that computeWarnings' full output can be compared with it (warnings-oracle.test.ts). Do not change.
/**
 * Legibility warnings: markers on one spot, markers too close, durations too small to see, insets
 * longer than the exhibit. Each warning names its markers by table number and label (numbering.ts)
 * and carries a stable `key` (its code and the ids it is about) by which it can be acknowledged.
 * See README.md ("Warnings").
 */
import type { DurationResult, InsetResult } from "../../../../app/lib/scale/compute.ts";
import { formatYears } from "../../../../app/lib/scale/format.ts";
import {
  findCrowded,
  MEDIUM_WORDS,
  suggestInsetForCluster,
  suggestInsetForDuration,
  type Legibility,
  type MediumType,
  type SuggestedInset,
} from "./warnings-legibility.ts";
import { compareIds, warningKey } from "./warnings-numbering.ts";

export const WARNING_CODES = [
  "markers-same-age",
  "markers-too-close",
  "markers-too-close-in-inset",
  "duration-too-small",
  "inset-longer-than-medium",
] as const;
export type WarningCode = (typeof WARNING_CODES)[number];

/** A marker as a warning names it: id (for links to its row), table number and label. */
export interface WarningMarker {
  id: string;
  number: number;
  label: string;
}

export interface ScaleWarning {
  code: WarningCode;
  /**
   * Stable key: the code, a colon and the sorted ids the warning is about — its markers
   * ("markers-same-age:137,140"), its duration for duration-too-small ("duration-too-small:holocene"),
   * its inset for inset-longer-than-medium ("inset-longer-than-medium:inset-3").
   */
  key: string;
  message: string;
  /** Ids of the markers it is about (table order). */
  pointIds: string[];
  /** The same markers with their table numbers and labels. */
  markers: WarningMarker[];
  durationIds?: string[];
  insetId?: string;
  /** The inset's label, when the warning is about one. */
  insetLabel?: string;
  suggestedInset?: SuggestedInset;
}

/** What the warnings need of each point. */
export interface WarnedPoint {
  id: string;
  number: number;
  label?: string;
  ageYears: number;
}

export interface WarningInput {
  points: readonly WarnedPoint[];
  durations: readonly DurationResult[];
  insets: readonly InsetResult[];
  span: { olderYears: number; youngerYears: number };
  metresPerYear: number;
  totalMetres: number;
  legibility: Legibility;
  mediumType: MediumType;
  /** A length as the exhibit's units read it ("5 cm", "2 in"). */
  length: (metres: number) => string;
}

/** "12 “Base of the Archean”, 13 “Base of the Eoarchean” and 2 more". */
export function markerNames(markers: readonly WarningMarker[], max = 6): string {
  const names = markers.slice(0, max).map((m) => `${m.number} “${m.label}”`);
  const rest = markers.length - names.length;
  if (rest > 0) return `${names.join(", ")} and ${rest} more`;
  return names.length > 1 ? `${names.slice(0, -1).join(", ")} and ${names[names.length - 1]}` : names.join("");
}

export function computeWarnings(input: WarningInput): { warnings: ScaleWarning[]; suggestedInsets: SuggestedInset[] } {
  const { points, durations, insets, span, legibility, mediumType, length } = input;
  const mpy = input.metresPerYear;
  const words = MEDIUM_WORDS[mediumType];
  const warnings: ScaleWarning[] = [];
  const suggestions: SuggestedInset[] = [];
  const addSuggestion = (s: SuggestedInset): SuggestedInset => {
    const same = suggestions.find((x) => x.olderYears === s.olderYears && x.youngerYears === s.youngerYears && x.magnification === s.magnification);
    if (!same) {
      suggestions.push(s);
      return s;
    }
    if (same === s) return s;
    const points = new Set(same.pointIds);
    for (const id of s.pointIds) if (!points.has(id)) same.pointIds.push(id);
    for (const id of s.durationIds) if (!same.durationIds.includes(id)) same.durationIds.push(id);
    return same;
  };
  const byId = new Map(points.map((p) => [p.id, p]));
  const named = (ids: readonly string[]): WarningMarker[] => {
    const ps = ids.map((id) => byId.get(id)!);
    let sorted = true;
    for (let i = 1; i < ps.length && sorted; i++) sorted = ps[i - 1].number < ps[i].number;
    if (!sorted) ps.sort((a, b) => a.number - b.number || compareIds(a.id, b.id));
    return ps.map((p) => ({ id: p.id, number: p.number, label: p.label ?? p.id }));
  };
  const markerWarning = (code: WarningCode, ms: WarningMarker[], message: string, extra: Partial<ScaleWarning> = {}): ScaleWarning => ({
    code,
    key: warningKey(code, ms.map((m) => m.id)),
    message,
    pointIds: ms.map((m) => m.id),
    markers: ms,
    ...extra,
  });
  const spacingText = `${length(legibility.minSpacingMetres)} needed ${words.spacing}`;

  // Markers of one age: one warning per age, whatever else crowds them (no inset can part them).
  const inOrder = [...points].sort((a, b) => a.number - b.number);
  for (let i = 0; i < inOrder.length; ) {
    let j = i + 1;
    while (j < inOrder.length && inOrder[j].ageYears === inOrder[i].ageYears) j++;
    const age = inOrder[i].ageYears;
    const ids = j - i > 1 ? inOrder.slice(i, j).map((p) => p.id) : null;
    i = j;
    if (!ids) continue;
    const ms = named(ids);
    warnings.push(
      markerWarning(
        "markers-same-age",
        ms,
        `Markers ${markerNames(ms)} have the same age (${age === 0 ? "the present" : `${formatYears(age, 6)} ago`}) and fall on the same spot; combine them into one marker labelled with every name, or stack their labels.`,
      ),
    );
  }

  const placed = points.map((p) => ({ id: p.id, ageYears: p.ageYears, metres: (span.olderYears - p.ageYears) * mpy }));
  for (const cl of findCrowded(placed, legibility.minSpacingMetres)) {
    if (!Number.isFinite(cl.minAgeGapYears)) continue; // all of one age: said above
    const ms = named(cl.ids);
    // the most magnified inset that holds the whole group
    let covering: InsetResult | undefined;
    for (const ins of insets) {
      if (cl.ages.every((a) => a <= ins.olderYears && a >= ins.youngerYears) && (!covering || ins.magnification > covering.magnification)) covering = ins;
    }
    const sug = suggestInsetForCluster(cl, span, mpy, legibility.minSpacingMetres);
    if (covering) {
      const gap = cl.minAgeGapYears * mpy * covering.magnification;
      if (gap >= legibility.minSpacingMetres) continue;
      warnings.push(
        markerWarning(
          "markers-too-close-in-inset",
          ms,
          `Even in inset “${covering.label}”, markers ${markerNames(ms)} are as little as ${length(gap)} apart, less than the ${spacingText}.${sug ? ` Suggested inset: ${sug.label}.` : ""}`,
          { insetId: covering.id, insetLabel: covering.label, ...(sug ? { suggestedInset: addSuggestion(sug) } : {}) },
        ),
      );
      continue;
    }
    warnings.push(
      markerWarning(
        "markers-too-close",
        ms,
        `Markers ${markerNames(ms)} are as little as ${length(cl.minAgeGapYears * mpy)} apart, less than the ${spacingText}.${sug ? ` Suggested inset: ${sug.label} (${length(sug.lengthMetres)} long).` : ""}`,
        sug ? { suggestedInset: addSuggestion(sug) } : {},
      ),
    );
  }

  for (const d of durations) {
    if (d.visible || d.insets.some((x) => x.visible)) continue;
    const place = durationPlace(d);
    // an inset already suggested may be enough — if it covers a located span
    const fits = suggestions.find((x) => x.magnification * d.metres >= legibility.minVisibleMetres && covers(x, place, d.years));
    const sug = fits ?? suggestInsetForDuration({ id: d.id, years: d.years, endsAgoYears: place }, span, mpy, legibility.minVisibleMetres);
    if (fits && !fits.durationIds.includes(d.id)) fits.durationIds.push(d.id);
    const wrongPlace = d.insets.filter((x) => !x.covers && x.metres >= legibility.minVisibleMetres);
    const notCovered = wrongPlace.length
      ? ` ${wrongPlace.map((x) => `Inset “${x.insetLabel}”`).join(" and ")} ${wrongPlace.length === 1 ? "magnifies" : "magnify"} enough but ${wrongPlace.length === 1 ? "does" : "do"} not cover ${place === 0 ? `the last ${formatYears(d.years)}` : "it"}.`
      : "";
    warnings.push({
      code: "duration-too-small",
      key: warningKey("duration-too-small", [d.id]),
      message: `${d.label ?? d.id}: ${formatYears(d.years)} is ${length(d.metres)} on this scale, smaller than the ${length(legibility.minVisibleMetres)} a visitor can see ${words.on}.${notCovered}${sug ? ` Suggested inset: ${sug.label}.` : ""}`,
      pointIds: [],
      markers: [],
      durationIds: [d.id],
      ...(sug ? { suggestedInset: addSuggestion(sug) } : {}),
    });
  }

  for (const ins of insets) {
    if (ins.lengthMetres <= input.totalMetres) continue;
    warnings.push({
      code: "inset-longer-than-medium",
      key: warningKey("inset-longer-than-medium", [ins.id]),
      message: `Inset “${ins.label}” is ${length(ins.lengthMetres)} long, longer than the whole exhibit (${length(input.totalMetres)}).`,
      pointIds: [...ins.pointIds],
      markers: named(ins.pointIds),
      insetId: ins.id,
      insetLabel: ins.label,
    });
  }
  return { warnings, suggestedInsets: suggestions };
}

/** Where a duration sits on the exhibit: its younger end (years ago) when it is a located span, else null (a comparison). */
export function durationPlace(d: Pick<DurationResult, "located" | "endsAgoYears">): number | null {
  return d.located ? d.endsAgoYears : null;
}

/** Does a sub-span show a duration: a located span only inside it, a comparison anywhere. */
export function covers(sub: { olderYears: number; youngerYears: number }, endsAgoYears: number | null, years: number): boolean {
  if (endsAgoYears === null) return sub.olderYears - sub.youngerYears >= years;
  return sub.youngerYears <= endsAgoYears && sub.olderYears >= endsAgoYears + years;
}
