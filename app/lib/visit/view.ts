// Visitor pages as words and figures: everything a page shows, made from a publication snapshot
// in the page language (interval names) and interface language (app/locales). Pure; the route
// modules render it.
import { formatLengthReadable } from "../scale/format";
import type { PublicationSnapshot, SnapshotMarker } from "../publication/types";
import { autonym } from "./language";
import { fill, interfaceLanguage, messagesFor, type Messages } from "./messages";
import { intervalName } from "./strip";
import { durationText } from "./walking";

export interface PublicationFacts {
  number: number;
  sha256: string;
  approvedAt: string;
  publishedAt: string;
  editionLabel: string;
}

export interface PageBasics {
  org: string;
  slug: string;
  /** Page language (interval names) and interface language (the page's own words, <html lang>). */
  lang: string;
  htmlLang: string;
  t: Messages;
  base: string;
  /** "?lang=xx" when the visitor chose the language by link (kept on every link of the page), else "". */
  suffix: string;
  title: string;
  units: "metric" | "us";
  organisationName: string;
  languages: { tag: string; name: string; href: string; current: boolean }[];
  checkedLine: string;
  publicationLine: string;
  publication: PublicationFacts;
}

const MEDIUM_KEYS = { trail: "mediumTrail", wall: "mediumWall", rope: "mediumRope", banner: "mediumBanner", other: "mediumOther" } as const;

export function mediumWord(snapshot: PublicationSnapshot, t: Messages): string {
  return t[MEDIUM_KEYS[snapshot.medium.mediumType] ?? "mediumOther"];
}

/** "3 December 2026" / "3. Dezember 2026" (UTC: the same words on every server). */
export function dateText(iso: string, htmlLang: string): string {
  return new Intl.DateTimeFormat(htmlLang === "de" ? "de-DE" : "en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" }).format(new Date(iso));
}

export function pageBasics(snapshot: PublicationSnapshot, publication: PublicationFacts, lang: string, path: string, suffix = ""): PageBasics {
  const htmlLang = interfaceLanguage(lang);
  const t = messagesFor(lang);
  const org = snapshot.organisation.slug;
  const slug = snapshot.exhibit.slug;
  return {
    org,
    slug,
    lang,
    htmlLang,
    t,
    base: `/visit/${org}/${slug}`,
    suffix,
    title: snapshot.exhibit.title,
    units: snapshot.exhibit.unitsPreference,
    organisationName: snapshot.organisation.name,
    languages: snapshot.edition.languages.map((tag) => ({ tag, name: autonym(tag), href: `${path}?lang=${tag}`, current: tag === lang })),
    checkedLine: fill(t.checkedLine, { edition: publication.editionLabel, date: dateText(publication.approvedAt, htmlLang) }),
    publicationLine: fill(t.publicationLine, { number: publication.number, date: dateText(publication.publishedAt, htmlLang) }),
    publication,
  };
}

/** Interval names of a marker's "within" list, in the page language where the chart has them. */
export function withinNames(snapshot: PublicationSnapshot, marker: SnapshotMarker, lang: string): { name: string; lang: string | null }[] {
  return marker.within.map((english) => {
    const interval = snapshot.edition.intervals.find((i) => i.name === english);
    return interval ? intervalName(interval, lang) : { name: english, lang: lang === "en" ? null : "en" };
  });
}

export interface MarkerRow {
  signNumber: number;
  href: string;
  label: string;
  ageText: string;
  distance: string;
  uncertainty: string | null;
  walk: string | null;
  color: string;
}

export function walkText(marker: SnapshotMarker, t: Messages): string | null {
  if (!marker.walking) return null;
  if (marker.walking.fromStartMetres === 0) return t.walkStart;
  return fill(t.walkBoth, { fast: durationText(marker.walking.seconds, t), slow: durationText(marker.walking.accessibleSeconds, t) });
}

export function markerRows(snapshot: PublicationSnapshot, base: string, t: Messages, suffix = ""): MarkerRow[] {
  return snapshot.markers.map((m) => ({
    signNumber: m.signNumber,
    href: `${base}/${m.signNumber}${suffix}`,
    label: m.label,
    ageText: m.ageText,
    distance: m.distance.display.fromOlderEnd,
    uncertainty: m.distance.display.uncertainty,
    walk: walkText(m, t),
    color: m.color,
  }));
}

/** "4,567 Ma" and "the present" (an end at age 0), or "66 Ma": the span's ends as the designer gave them. */
export function spanEnds(snapshot: PublicationSnapshot, t: Messages): { older: string; younger: string } {
  const end = ({ value, unit }: { value: number; unit: string }) => (value === 0 ? t.presentDay : `${value.toLocaleString("en-GB")} ${unit}`);
  return { older: end(snapshot.exhibit.span.older), younger: end(snapshot.exhibit.span.younger) };
}

/** The scale in plain words: "On this path: 1 m per million years." and the durations ("an 80-year life: 80 years = 0.08 mm"). */
export function scaleWords(snapshot: PublicationSnapshot, t: Messages): { lines: string[]; durations: string[] } {
  const medium = mediumWord(snapshot, t);
  const units = snapshot.exhibit.unitsPreference;
  const ends = spanEnds(snapshot, t);
  const span = fill(t.spanFromTo, ends);
  return {
    lines: [
      fill(t.scaleOn, { medium, statement: snapshot.scale.statement.lengthPerTime }),
      fill(t.scaleInverse, { statement: snapshot.scale.statement.timePerLength }),
      fill(t.scaleLength, { medium, length: formatLengthReadable(snapshot.scale.totalMetres, 4, units), span }),
    ],
    durations: snapshot.durations.map((d) => {
      const inset = d.insets.find((i) => i.visible);
      const text = d.visible ? d.text : `${d.text} (${fill(t.durationInvisible, { medium })}${inset ? `; ${inset.text}` : ""})`;
      return fill(t.durationLine, { label: d.label, text });
    }),
  };
}

/** Walking: the sources line and the whole route's time (route exhibits only). */
export function walkingWords(snapshot: PublicationSnapshot, t: Messages): { note: string; total: string } | null {
  if (snapshot.medium.kind !== "route") return null;
  const w = snapshot.medium.walking;
  const src = snapshot.sources;
  return {
    note: fill(t.walkNote, {
      fast: w.speedMps,
      slow: w.accessibleSpeedMps,
      fastSource: src.walkingSpeed ?? "FHWA-RD-98-107",
      slowSource: src.accessibleSpeed ?? "MUTCD §4E.06",
      steps: src.stepLength ?? "common practice",
    }),
    total: fill(t.walkTotal, {
      length: formatLengthReadable(snapshot.medium.lengthMetres, 3, snapshot.exhibit.unitsPreference),
      fast: durationText(w.seconds, t),
      slow: durationText(w.accessibleSeconds, t),
      fastSpeed: w.speedMps,
      slowSpeed: w.accessibleSpeedMps,
    }),
  };
}

/** The length between two markers, in the exhibit's units. */
export function gapText(snapshot: PublicationSnapshot, a: SnapshotMarker, b: SnapshotMarker): string {
  return formatLengthReadable(Math.abs(b.distance.fromOlderEndMetres - a.distance.fromOlderEndMetres), 3, snapshot.exhibit.unitsPreference);
}
