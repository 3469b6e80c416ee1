/**
 * Legibility warnings: markers on one spot, markers too close, durations too small to see, insets
 * longer than the exhibit. Each warning names its markers by table number and label (numbering.ts)
 * and carries a stable `key` (its code and the ids it is about) by which it can be acknowledged.
 * See README.md ("Warnings").
 */
import type { DurationResult, InsetResult } from "./compute";
import { formatYears } from "./format";
import {
  crowdedRuns,
  MEDIUM_WORDS,
  suggestInsetForDuration,
  suggestInsetForGroup,
  type Legibility,
  type MediumType,
  type SuggestedInset,
} from "./legibility";
import { compareIds, warningKey } from "./numbering";
import { plainRecord } from "./records";

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

/** What the warnings need of each point. Ids are unique (the request schema checks it). */
export interface WarnedPoint {
  id: string;
  number: number;
  label?: string;
  ageYears: number;
}

export interface WarningInput {
  /** In any order; fastest in table order (numbers 1–N), as computeScale has them for the composer. */
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

/** "12 “Base of the Archean”, 13 “Base of the Eoarchean” and 2 more" (`name`: how one marker is written). */
export function markerNames<M extends Pick<WarningMarker, "number" | "label">>(markers: readonly M[], max = 6, name: (m: M) => string = (m) => `${m.number} “${m.label}”`): string {
  const names = markers.slice(0, max).map(name);
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
  // warnings are written out field by field, not spread: a spread object added to is slow to make (V8)
  const markerWarning = (code: WarningCode, named: Named, message: string, inset?: InsetResult, suggested?: SuggestedInset): ScaleWarning => {
    const w: ScaleWarning = { code, key: warningKey(code, named.ids), message, pointIds: named.ids, markers: named.markers };
    if (inset) {
      w.insetId = inset.id;
      w.insetLabel = inset.label;
    }
    if (suggested) w.suggestedInset = suggested;
    return w;
  };
  const spacingText = `${length(legibility.minSpacingMetres)} needed ${words.spacing}`;
  const n = points.length;

  // One pass: are the points in table order (as computeScale usually has them: then nothing is
  // sorted or copied), in order of distance, and do neighbours share an age; their distances.
  const metres = new Float64Array(n);
  let inTableOrder = true;
  let byDistance = true;
  let sharedAge = false;
  for (let i = 0; i < n; i++) {
    const p = points[i];
    metres[i] = (span.olderYears - p.ageYears) * mpy;
    if (p.number !== i + 1) inTableOrder = false;
    if (i > 0) {
      if (!(metres[i - 1] <= metres[i])) byDistance = false;
      if (p.ageYears === points[i - 1].ageYears) sharedAge = true;
    }
  }

  // Markers of one age: one warning per age, whatever else crowds them (no inset can part them).
  if (sharedAge || !inTableOrder) {
    const inOrder = inTableOrder ? points : [...points].sort((a, b) => a.number - b.number);
    for (let i = 0; i < n; ) {
      const age = inOrder[i].ageYears;
      let j = i + 1;
      while (j < n && inOrder[j].ageYears === age) j++;
      if (j - i > 1) {
        const named = namedMarkers(inOrder, i, j, inTableOrder);
        warnings.push(
          markerWarning(
            "markers-same-age",
            named,
            `Markers ${markerNames(named.markers)} have the same age (${age === 0 ? "the present" : `${formatYears(age, 6)} ago`}) and fall on the same spot; combine them into one marker labelled with every name, or stack their labels.`,
          ),
        );
      }
      i = j;
    }
  }

  // Markers too close: runs of neighbours by distance from the older end (a stable sort).
  let placed: readonly WarnedPoint[] = points;
  if (!byDistance) {
    placed = Array.from(points, (_, i) => i)
      .sort((x, y) => metres[x] - metres[y])
      .map((i) => points[i]);
    for (let k = 0; k < n; k++) metres[k] = (span.olderYears - placed[k].ageYears) * mpy;
  }
  const runs = crowdedRuns(metres, legibility.minSpacingMetres);
  for (let r = 0; r < runs.length; r += 2) {
    const from = runs[r];
    const to = runs[r + 1];
    let minAgeGap = Infinity;
    let oldest = placed[from].ageYears;
    let youngest = oldest;
    for (let k = from + 1; k < to; k++) {
      const a = placed[k].ageYears;
      const dy = Math.abs(a - placed[k - 1].ageYears);
      if (dy > 0) minAgeGap = Math.min(minAgeGap, dy);
      oldest = Math.max(oldest, a);
      youngest = Math.min(youngest, a);
    }
    if (!Number.isFinite(minAgeGap)) continue; // all of one age: said above
    // the most magnified inset that holds the whole group
    let covering: InsetResult | undefined;
    for (const ins of insets) {
      if (oldest <= ins.olderYears && youngest >= ins.youngerYears && (!covering || ins.magnification > covering.magnification)) covering = ins;
    }
    const gap = covering ? minAgeGap * mpy * covering.magnification : 0;
    if (covering && gap >= legibility.minSpacingMetres) continue;
    const named = namedMarkers(placed, from, to, inTableOrder && byDistance);
    // the suggestion keeps its own list of ids, in order of distance (a later suggestion may add to it)
    const ids = named.reordered ? placed.slice(from, to).map((p) => p.id) : named.ids.slice();
    const sug = suggestInsetForGroup({ ids, minAgeGapYears: minAgeGap, oldestYears: oldest, youngestYears: youngest }, span, mpy, legibility.minSpacingMetres);
    if (covering) {
      warnings.push(
        markerWarning(
          "markers-too-close-in-inset",
          named,
          `Even in inset “${covering.label}”, markers ${markerNames(named.markers)} are as little as ${length(gap)} apart, less than the ${spacingText}.${sug ? ` Suggested inset: ${sug.label}.` : ""}`,
          covering,
          sug ? addSuggestion(sug) : undefined,
        ),
      );
      continue;
    }
    warnings.push(
      markerWarning(
        "markers-too-close",
        named,
        `Markers ${markerNames(named.markers)} are as little as ${length(minAgeGap * mpy)} apart, less than the ${spacingText}.${sug ? ` Suggested inset: ${sug.label} (${length(sug.lengthMetres)} long).` : ""}`,
        undefined,
        sug ? addSuggestion(sug) : undefined,
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
    const w: ScaleWarning = {
      code: "duration-too-small",
      key: warningKey("duration-too-small", [d.id]),
      message: `${d.label ?? d.id}: ${formatYears(d.years)} is ${length(d.metres)} on this scale, smaller than the ${length(legibility.minVisibleMetres)} a visitor can see ${words.on}.${notCovered}${sug ? ` Suggested inset: ${sug.label}.` : ""}`,
      pointIds: [],
      markers: [],
      durationIds: [d.id],
    };
    if (sug) w.suggestedInset = addSuggestion(sug);
    warnings.push(w);
  }

  let byId: Map<string, WarnedPoint> | undefined; // only an inset's markers are looked up by id
  for (const ins of insets) {
    if (ins.lengthMetres <= input.totalMetres) continue;
    warnings.push({
      code: "inset-longer-than-medium",
      key: warningKey("inset-longer-than-medium", [ins.id]),
      message: `Inset “${ins.label}” is ${length(ins.lengthMetres)} long, longer than the whole exhibit (${length(input.totalMetres)}).`,
      pointIds: [...ins.pointIds],
      markers: namedMarkers(ins.pointIds.map((id) => (byId ??= new Map(points.map((p) => [p.id, p]))).get(id)!), 0, ins.pointIds.length, false).markers,
      insetId: ins.id,
      insetLabel: ins.label,
    });
  }
  return { warnings, suggestedInsets: suggestions };
}

/** A group's markers in table order, and their ids (a fresh array). */
interface Named {
  markers: WarningMarker[];
  ids: string[];
  /** Did the points have to be put in table order? */
  reordered: boolean;
}

/** A WarningMarker, made by `new` (records.ts: a crowding warning can name every marker, on every keystroke). */
const Marker = plainRecord(
  function (this: WarningMarker, id: string, number: number, label: string) {
    this.id = id;
    this.number = number;
    this.label = label;
  },
  ["", 1, ""],
);

/**
 * Markers as warnings name them, in table order (by number, then id): points[from, to), which
 * `inTableOrder` says are known to be in table order already.
 */
function namedMarkers(points: readonly WarnedPoint[], from: number, to: number, inTableOrder: boolean): Named {
  let sorted = true;
  if (!inTableOrder) for (let i = from + 1; i < to && sorted; i++) sorted = points[i - 1].number < points[i].number;
  const ps = sorted ? points : points.slice(from, to).sort((a, b) => a.number - b.number || compareIds(a.id, b.id));
  const start = sorted ? from : 0;
  const markers: WarningMarker[] = new Array(to - from);
  const ids: string[] = new Array(to - from);
  for (let i = 0; i < to - from; i++) {
    const p = ps[start + i];
    ids[i] = p.id;
    markers[i] = new Marker(p.id, p.number, p.label ?? p.id);
  }
  return { markers, ids, reordered: !sorted };
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
