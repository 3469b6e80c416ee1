/**
 * Interval names in dated events: an event whose name, summary or dating method names a chart
 * interval ("Middle Devonian", "late Carnian", "Ediacaran", "Kreide") must fall inside that
 * interval on a given edition. Pure (no React, no database): the library page runs it for the
 * organisation's current edition and the review checks run it for an exhibit's pinned edition.
 *
 * How a text is read:
 *  - every name the edition carries for an interval is looked for: the English name and each
 *    translation in `names` (the chart's own labels), case-insensitively, as whole words, longest
 *    first ("Late Devonian" before "Devonian"); labels under four characters and labels that are
 *    only the start of the English name (a place: "Greenland" for the Greenlandian) are skipped;
 *  - a qualifier just before the name narrows it: "early"/"lower"/"earliest" = the older half,
 *    "late"/"upper"/"latest" = the younger half, "middle"/"mid" = the central half;
 *  - "X–Y" (dash or slash between two interval names), "between the X and Y", "base/start/
 *    beginning/onset of the X" and "end of the X"/"end-X" name a boundary: the age must lie
 *    within the uncertainties (the event's ±, the boundary's ±, and 0.5 % of the age for
 *    rounding) of that boundary — for "end" the event may also lie in the younger half;
 *  - an age with a ± counts as inside when its range overlaps the interval (or the part).
 */
import type { Interval } from "./timescale/types";

export interface NamedEvent {
  id?: number | string;
  slug?: string;
  name: string;
  summary?: string | null;
  datingMethod?: string | null;
  /** Ma (number or exact decimal string). */
  ageMa: number | string;
  uncertaintyMa?: number | string | null;
}

export type Qualifier = "early" | "middle" | "late";

export interface IntervalMention {
  /** The text as written in the event ("late Carnian", "Kreide"). */
  text: string;
  interval: Interval;
  qualifier: Qualifier | null;
  /** "base" = the interval's base is meant; "end" = its top (or its last half). */
  boundary: "base" | "end" | null;
  /** Which field of the event named it. */
  field: "name" | "summary" | "datingMethod";
}

export interface IntervalWarning {
  eventId: number | string | null;
  eventSlug: string | null;
  eventName: string;
  ageMa: number;
  uncertaintyMa: number | null;
  /** English name of the interval named. */
  interval: string;
  /** As written in the event. */
  mentioned: string;
  qualifier: Qualifier | null;
  boundary: "base" | "end" | null;
  field: IntervalMention["field"];
  /** The span checked against (the whole interval, or the qualified part), Ma. */
  fromMa: number;
  toMa: number;
  message: string;
}

const QUALIFIER_WORDS: Record<string, Qualifier> = {
  early: "early",
  earliest: "early",
  lower: "early",
  lowermost: "early",
  middle: "middle",
  mid: "middle",
  late: "late",
  latest: "late",
  upper: "late",
  uppermost: "late",
};

const LETTER = "\\p{L}\\p{N}";

function escapeRegExp(s: string): string {
  return s.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
}

function num(v: number | string | null | undefined): number | null {
  if (v === null || v === undefined || v === "") return null;
  const n = Number(v);
  return Number.isFinite(n) ? n : null;
}

/** Shortest text for an age in Ma ("393.47", "66", "0.0117"). */
function fmt(ma: number): string {
  return String(Number(ma.toPrecision(6)));
}

export interface NameIndex {
  pattern: RegExp | null;
  byName: Map<string, Interval>;
}

/** The look-up of every name an edition carries (English and translations), once per edition. */
export function nameIndex(intervals: readonly Interval[]): NameIndex {
  const byName = new Map<string, Interval>();
  for (const iv of intervals) {
    const english = iv.name.toLowerCase();
    const all = [iv.name, ...Object.values(iv.names ?? {})];
    for (const raw of all) {
      const n = raw.trim().replace(/\s+/g, " ");
      // Very short labels (two letters, single characters) would match ordinary words, and a
      // label that is only the start of the English name is the place the interval is named
      // after ("Greenland" for the Greenlandian), not the interval.
      if (n.length < 4) continue;
      if (n !== iv.name && english.startsWith(n.toLowerCase())) continue;
      const key = n.toLowerCase();
      // The English name wins over a translation spelled the same way in another language.
      if (!byName.has(key) || n === iv.name) byName.set(key, iv);
    }
  }
  const names = [...byName.keys()].sort((a, b) => b.length - a.length || a.localeCompare(b));
  if (names.length === 0) return { pattern: null, byName };
  const alternatives = names.map((n) => escapeRegExp(n).replace(/ /g, "\\s+"));
  const pattern = new RegExp(`(?<![${LETTER}])(?:${alternatives.join("|")})(?![${LETTER}])`, "giu");
  return { pattern, byName };
}

/** Interval names a text mentions, with their qualifiers and boundary wording. */
export function mentionsIn(text: string, index: NameIndex, field: IntervalMention["field"] = "summary"): IntervalMention[] {
  if (!index.pattern || !text) return [];
  const found: { text: string; interval: Interval; start: number; end: number }[] = [];
  index.pattern.lastIndex = 0;
  for (let m = index.pattern.exec(text); m; m = index.pattern.exec(text)) {
    const iv = index.byName.get(m[0].toLowerCase().replace(/\s+/g, " "));
    if (iv) found.push({ text: m[0], interval: iv, start: m.index, end: m.index + m[0].length });
  }
  const out: IntervalMention[] = [];
  for (let i = 0; i < found.length; i++) {
    const f = found[i];
    const before = text.slice(0, f.start);
    const next = found[i + 1];
    const prev = found[i - 1];
    const gapAfter = next ? text.slice(f.end, next.start) : "";
    const gapBefore = prev ? text.slice(prev.end, f.start) : "";
    const pairAfter = next && /^\s*[–—/-]\s*$/.test(gapAfter);
    const pairBefore = prev && /^\s*[–—/-]\s*$/.test(gapBefore);
    const betweenAfter = next && /^\s+and\s+(the\s+)?$/i.test(gapAfter) && /\bbetween\s+(the\s+)?$/i.test(before);
    const betweenBefore = prev && /^\s+and\s+(the\s+)?$/i.test(gapBefore) && /\bbetween\s+(the\s+)?$/i.test(text.slice(0, prev.start));
    let boundary: IntervalMention["boundary"] = null;
    let qualifier: Qualifier | null = null;
    if (pairAfter || betweenAfter || pairBefore || betweenBefore) {
      // "X–Y" names one boundary, the base of the younger of the two: both names give the same
      // mention, written as the pair.
      const other = (pairAfter || betweenAfter ? next : prev)!;
      const [first, second] = pairAfter || betweenAfter ? [f, other] : [other, f];
      const younger = f.interval.baseMa <= other.interval.baseMa ? f.interval : other.interval;
      out.push({ text: text.slice(first.start, second.end), interval: younger, qualifier: null, boundary: "base", field });
      continue;
    } else if (/\b(base|start|beginning|onset|dawn)\s+of\s+(the\s+)?$/i.test(before)) {
      boundary = "base";
    } else if (/\bend\s*-\s*$/i.test(before) || /\bend\s+of\s+(the\s+)?$/i.test(before)) {
      boundary = "end";
    } else {
      const q = /(?:^|[^\p{L}])(\p{L}+)[\s-]+$/u.exec(before);
      if (q) qualifier = QUALIFIER_WORDS[q[1].toLowerCase()] ?? null;
    }
    out.push({ text: f.text, interval: f.interval, qualifier, boundary, field });
  }
  return out;
}

/** The span a qualifier means: halves for early/late, the central half for middle. */
export function qualifiedSpan(iv: Interval, qualifier: Qualifier | null): { fromMa: number; toMa: number } {
  const d = iv.baseMa - iv.topMa;
  if (qualifier === "early") return { fromMa: iv.baseMa, toMa: iv.baseMa - d / 2 };
  if (qualifier === "late") return { fromMa: iv.topMa + d / 2, toMa: iv.topMa };
  if (qualifier === "middle") return { fromMa: iv.baseMa - d / 4, toMa: iv.topMa + d / 4 };
  return { fromMa: iv.baseMa, toMa: iv.topMa };
}

function boundaryUncertainty(intervals: readonly Interval[], ageMa: number): number {
  const at = intervals.find((iv) => Math.abs(iv.baseMa - ageMa) < 1e-9 && iv.baseUncertaintyMa !== null);
  return at?.baseUncertaintyMa ?? 0;
}

const QUALIFIER_TEXT: Record<Qualifier, string> = { early: "the early part of", middle: "the middle part of", late: "the late part of" };

/**
 * Every event × mention that disagrees with the edition. `editionLabel` goes into the messages
 * ("on ICS 2024/12 …").
 */
export function checkIntervalNames(
  intervals: readonly Interval[],
  events: readonly NamedEvent[],
  options: { editionLabel?: string; index?: NameIndex } = {},
): IntervalWarning[] {
  const index = options.index ?? nameIndex(intervals);
  const on = options.editionLabel ? `on ${options.editionLabel}` : "on this edition";
  const warnings: IntervalWarning[] = [];
  for (const e of events) {
    const age = num(e.ageMa);
    if (age === null) continue;
    const u = num(e.uncertaintyMa) ?? 0;
    const mentions = [
      ...mentionsIn(e.name, index, "name"),
      ...mentionsIn(e.summary ?? "", index, "summary"),
      ...mentionsIn(e.datingMethod ?? "", index, "datingMethod"),
    ];
    const seen = new Set<string>();
    for (const m of mentions) {
      const iv = m.interval;
      const key = `${iv.name}|${m.qualifier}|${m.boundary}`;
      if (seen.has(key)) continue;
      seen.add(key);
      const ageText = `${fmt(age)}${u ? ` ± ${fmt(u)}` : ""} Ma`;
      const base = {
        eventId: e.id ?? null,
        eventSlug: e.slug ?? null,
        eventName: e.name,
        ageMa: age,
        uncertaintyMa: u || null,
        interval: iv.name,
        mentioned: m.text,
        qualifier: m.qualifier,
        boundary: m.boundary,
        field: m.field,
      };
      const tolerance = (at: number) => u + boundaryUncertainty(intervals, at) + 0.005 * Math.max(age, at);
      const label = m.text.toLowerCase() === iv.name.toLowerCase() ? `the ${iv.name}` : `“${m.text}” (the ${iv.name})`;
      if (m.boundary === "base") {
        if (Math.abs(age - iv.baseMa) <= tolerance(iv.baseMa)) continue;
        warnings.push({
          ...base,
          fromMa: iv.baseMa,
          toMa: iv.baseMa,
          message: `“${e.name}” (${ageText}) names ${m.text.includes(iv.name) && m.text !== iv.name ? `the ${m.text} boundary (the base of the ${iv.name})` : `the base of ${label}`}, but ${on} that boundary is at ${fmt(iv.baseMa)}${iv.baseUncertaintyMa !== null ? ` ± ${fmt(iv.baseUncertaintyMa)}` : ""} Ma.`,
        });
        continue;
      }
      const span = qualifiedSpan(iv, m.boundary === "end" ? "late" : m.qualifier);
      // The whole interval's base carries its ±; a part's limits are read as written.
      const hi = span.fromMa + (m.qualifier || m.boundary ? 0 : (iv.baseUncertaintyMa ?? 0));
      const lo = span.toMa;
      const overlaps = age - u <= hi && (u > 0 ? age + u >= lo : age > lo || (age === 0 && lo === 0));
      const nearEnd = m.boundary === "end" && Math.abs(age - iv.topMa) <= tolerance(iv.topMa);
      if (overlaps || nearEnd) continue;
      const part = m.boundary === "end" ? "the end of" : m.qualifier ? QUALIFIER_TEXT[m.qualifier] : "";
      const whole = `${fmt(iv.baseMa)}${iv.baseUncertaintyMa !== null ? ` ± ${fmt(iv.baseUncertaintyMa)}` : ""} to ${fmt(iv.topMa)} Ma`;
      const partText = part ? ` (${part} it: about ${fmt(span.fromMa)} to ${fmt(span.toMa)} Ma)` : "";
      warnings.push({
        ...base,
        fromMa: span.fromMa,
        toMa: span.toMa,
        message: `“${e.name}” (${ageText}) names ${part ? `${part} ` : ""}${label}, but ${on} the ${iv.name} runs from ${whole}${partText}.`,
      });
    }
  }
  return warnings;
}
