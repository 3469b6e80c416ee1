/**
 * Legibility: what a visitor can see on a given medium, crowding and invisibility checks, and
 * suggested magnified insets.
 *
 * The thresholds below are common-practice defaults chosen for this product, not values from a
 * standard; every exhibit may set its own.
 */
import { formatLengthSig, formatMagnification, formatYears, formatAgeAgo } from "./format";

export const MEDIUM_TYPES = ["trail", "wall", "rope", "banner", "other"] as const;
export type MediumType = (typeof MEDIUM_TYPES)[number];

export interface Legibility {
  /** Smallest length a visitor can make out on this medium, metres. */
  minVisibleMetres: number;
  /** Smallest spacing between neighbouring markers (signs, labels, tags), metres. */
  minSpacingMetres: number;
}

/**
 * Common-practice defaults (settable per exhibit):
 * - trail: signs on posts need room to stand and be read one at a time — markers ≥ 2 m apart;
 *   anything under 5 cm disappears at walking distance.
 * - wall: labels read at arm's length — 4 cm between neighbouring labels, 3 mm smallest mark.
 * - rope: clip-on tags — 10 cm between tags, 1 cm smallest mark.
 * - banner: printed, read close up — 3 cm between labels, 2 mm smallest mark.
 * - other: 5 cm between markers, 5 mm smallest mark.
 */
export const LEGIBILITY_DEFAULTS: Readonly<Record<MediumType, Legibility>> = {
  trail: { minVisibleMetres: 0.05, minSpacingMetres: 2 },
  wall: { minVisibleMetres: 0.003, minSpacingMetres: 0.04 },
  rope: { minVisibleMetres: 0.01, minSpacingMetres: 0.1 },
  banner: { minVisibleMetres: 0.002, minSpacingMetres: 0.03 },
  other: { minVisibleMetres: 0.005, minSpacingMetres: 0.05 },
};

/** How warnings speak of each medium: where the spacing is needed, and where a visitor looks. */
export const MEDIUM_WORDS: Readonly<Record<MediumType, { spacing: string; on: string }>> = {
  trail: { spacing: "between signs on a trail", on: "on a trail" },
  wall: { spacing: "between labels on a wall", on: "on a wall" },
  rope: { spacing: "between tags on a rope", on: "on a rope" },
  banner: { spacing: "between labels on a banner", on: "on a banner" },
  other: { spacing: "between neighbouring markers on this exhibit", on: "on this exhibit" },
};

export const LEGIBILITY_SOURCE = "common practice default (not a standard); settable per exhibit";

/** Smallest power of ten ≥ x, at least 10: the readable magnification (10×, 100×, 1,000× …). */
export function readableMagnification(needed: number): number {
  if (!(needed > 1)) return 10;
  let m = 10 ** Math.ceil(Math.log10(needed) - 1e-12);
  if (m < needed) m *= 10;
  return Math.max(10, m);
}

const NICE_STEPS = [1, 2, 5] as const;

/** Smallest of 1, 2, 5 × 10^k that is ≥ x (x > 0). */
export function niceCeil(x: number): number {
  if (!(x > 0)) return 0;
  const e = Math.floor(Math.log10(x));
  for (let k = e - 1; k <= e + 1; k++) {
    for (const m of NICE_STEPS) {
      const v = m * 10 ** k;
      if (v >= x * (1 - 1e-12)) return to12Figures(v);
    }
  }
  return 10 ** (e + 1);
}

/**
 * Number(v.toPrecision(12)): v tidied to 12 significant figures. A whole number under 10¹² (not
 * zero, whose sign the string drops) is its own 12-figure form, and is returned without the string.
 */
function to12Figures(v: number): number {
  return v !== 0 && Number.isInteger(v) && Math.abs(v) < 1e12 ? v : Number(v.toPrecision(12));
}

export interface InsetSpec {
  olderYears: number;
  youngerYears: number;
  magnification: number;
}

export interface SuggestedInset extends InsetSpec {
  /** e.g. "last 10,000 years at 1,000×" */
  label: string;
  /** Length of the inset on the medium: sub-span length × magnification, metres. */
  lengthMetres: number;
  /** Why it is suggested. */
  reason: string;
  pointIds: string[];
  durationIds: string[];
}

/** The standard label of an inset: "last 10,000 years at 1,000×", "252–251 million years ago at 100×". */
export function insetLabel(olderYears: number, youngerYears: number, magnification: number): string {
  const mag = formatMagnification(magnification);
  if (youngerYears === 0) return `last ${formatYears(olderYears, 6)} at ${mag}`;
  return `${formatAgeAgo(olderYears, 6).replace(/ ago$/, "")} to ${formatAgeAgo(youngerYears, 6)} at ${mag}`;
}

/**
 * Runs of neighbours closer than minSpacing in distances sorted ascending (chained: a–b and b–c
 * close makes one run a, b, c): [start, end) index pairs, flat, runs of two or more only.
 */
export function crowdedRuns(sortedMetres: ArrayLike<number>, minSpacingMetres: number): number[] {
  const runs: number[] = [];
  let start = 0;
  for (let i = 1; i <= sortedMetres.length; i++) {
    if (i < sortedMetres.length && !(sortedMetres[i] - sortedMetres[i - 1] >= minSpacingMetres)) continue;
    if (i - start >= 2) runs.push(start, i);
    start = i;
  }
  return runs;
}

/** A crowded group as a suggestion needs it: its ids, smallest non-zero age gap and age range. */
export interface CrowdedGroup {
  ids: string[];
  minAgeGapYears: number;
  oldestYears: number;
  youngestYears: number;
}

/**
 * An inset that spreads a crowded group to at least minSpacing between neighbours; its pointIds is
 * group.ids. Returns null when the markers share one age (no magnification separates them).
 */
export function suggestInsetForGroup(
  group: CrowdedGroup,
  span: { olderYears: number; youngerYears: number },
  metresPerYear: number,
  minSpacingMetres: number,
): SuggestedInset | null {
  if (!Number.isFinite(group.minAgeGapYears)) return null;
  const magnification = readableMagnification(minSpacingMetres / (group.minAgeGapYears * metresPerYear));
  const sub = roundSubSpan(group.youngestYears, group.oldestYears, span);
  const lengthMetres = (sub.olderYears - sub.youngerYears) * metresPerYear * magnification;
  // written out, not spread: an object spread and then added to is slow to make (V8)
  return {
    olderYears: sub.olderYears,
    youngerYears: sub.youngerYears,
    magnification,
    label: insetLabel(sub.olderYears, sub.youngerYears, magnification),
    lengthMetres,
    reason: `spreads ${group.ids.length} crowded markers to at least ${formatLengthSig(minSpacingMetres)} apart`,
    pointIds: group.ids,
    durationIds: [],
  };
}

/** A readable sub-span around [aMin, aMax], anchored at the span's younger end when close to it. */
export function roundSubSpan(
  aMin: number,
  aMax: number,
  span: { olderYears: number; youngerYears: number },
): { olderYears: number; youngerYears: number } {
  const young = span.youngerYears;
  const width = aMax - aMin;
  let older: number;
  let younger: number;
  if (aMin - young <= Math.max(width, 0)) {
    // near the younger end: "the last N years"
    younger = young;
    older = young + niceCeil(aMax - young);
  } else {
    let g = 10 ** Math.ceil(Math.log10(width || 1));
    if (g / 2 >= width && width > 0) g /= 2;
    older = Math.ceil(aMax / g) * g;
    younger = Math.floor(aMin / g) * g;
    if (older === aMax) older += g;
    if (older === younger) older += g;
  }
  older = Math.min(to12Figures(older), span.olderYears);
  younger = Math.max(to12Figures(younger), young);
  return { olderYears: older, youngerYears: younger };
}

/**
 * An inset that makes a duration at least minVisible long. A located span (`endsAgoYears` set: the
 * span from endsAgoYears + years to endsAgoYears) gets a sub-span that contains it; a comparison
 * (null) one at the exhibit's younger end. At the younger end the sub-span is twice the duration,
 * rounded up to 1, 2 or 5 × 10^k ("last 200 years" for 67 years).
 */
export function suggestInsetForDuration(
  duration: { id: string; years: number; endsAgoYears?: number | null },
  span: { olderYears: number; youngerYears: number },
  metresPerYear: number,
  minVisibleMetres: number,
): SuggestedInset | null {
  if (!(duration.years > 0)) return null;
  const magnification = readableMagnification(minVisibleMetres / (duration.years * metresPerYear));
  const end = duration.endsAgoYears ?? span.youngerYears;
  let sub: { olderYears: number; youngerYears: number };
  if (end === span.youngerYears) {
    sub = { olderYears: Math.min(span.olderYears, end + niceCeil(2 * duration.years)), youngerYears: end };
  } else {
    sub = roundSubSpan(end, end + duration.years, span);
  }
  const lengthMetres = (sub.olderYears - sub.youngerYears) * metresPerYear * magnification;
  // written out, not spread: an object spread and then added to is slow to make (V8)
  return {
    olderYears: sub.olderYears,
    youngerYears: sub.youngerYears,
    magnification,
    label: insetLabel(sub.olderYears, sub.youngerYears, magnification),
    lengthMetres,
    reason: `makes ${formatYears(duration.years)} at least ${formatLengthSig(minVisibleMetres)} long`,
    pointIds: [],
    durationIds: [duration.id],
  };
}
