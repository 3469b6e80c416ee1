// The marker page as data (the QR target on each sign): name, age ± and source, text and image,
// its place on the whole strip, the previous and next markers with distances, "how we know".
// A retired sign number gives the retired-sign view instead (its own page, 410 Gone, or a redirect
// to the sign that absorbed it).
import type { PublicationSnapshot, RetiredSign, SnapshotImage } from "../publication/types";
import { formatLengthReadable } from "../scale/format";
import { fill } from "./messages";
import { stripModel, type StripModel } from "./strip";
import { gapText, walkText, withinNames, type PageBasics } from "./view";

export interface Neighbour {
  signNumber: number;
  label: string;
  href: string;
  gap: string;
  /** At the same distance (several markers can share a sign post). */
  same: boolean;
}

export interface MarkerView {
  kind: "marker";
  page: PageBasics;
  signNumber: number;
  label: string;
  kicker: string;
  ageText: string;
  within: { name: string; lang: string | null }[];
  source: string;
  html: string;
  image: SnapshotImage | null;
  strip: StripModel;
  positionText: string;
  walk: string | null;
  previous: Neighbour | null;
  next: Neighbour | null;
  decay: { system: string; sentence: string; citation: string } | null;
  insetLines: string[];
  exhibitHref: string;
  /** The exhibit page and every marker page, for the offline copy. */
  precache: string[];
}

export interface RetiredView {
  kind: "retired";
  page: PageBasics;
  sign: RetiredSign;
  heading: string;
  text: string;
  absorbedLine: string | null;
  exhibitHref: string;
}

export function markerView(snapshot: PublicationSnapshot, page: PageBasics, signNumber: number): MarkerView | RetiredView | null {
  const { t, base, suffix } = page;
  const exhibitHref = `${base}${suffix}`;
  const index = snapshot.markers.findIndex((m) => m.signNumber === signNumber);
  if (index < 0) {
    const sign = snapshot.retiredSigns.find((s) => s.number === signNumber);
    if (!sign) return null;
    return {
      kind: "retired",
      page,
      sign,
      heading: fill(t.retiredHeading, { number: sign.number }),
      text: fill(t.retiredText, { label: sign.label, publication: sign.retiredAtPublication }),
      absorbedLine: sign.absorbedBy ? fill(t.retiredAbsorbed, { number: sign.absorbedBy }) : null,
      exhibitHref,
    };
  }
  const m = snapshot.markers[index];
  const neighbour = (k: number): Neighbour | null => {
    const n = snapshot.markers[k];
    if (!n) return null;
    const same = n.distance.fromOlderEndMetres === m.distance.fromOlderEndMetres;
    return { signNumber: n.signNumber, label: n.label, href: `${base}/${n.signNumber}${suffix}`, gap: gapText(snapshot, m, n), same };
  };
  const total = snapshot.scale.totalMetres;
  const units = snapshot.exhibit.unitsPreference;
  return {
    kind: "marker",
    page,
    signNumber,
    label: m.label,
    kicker: fill(t.markerKicker, { number: signNumber, exhibit: snapshot.exhibit.title }),
    ageText: m.ageText,
    within: withinNames(snapshot, m, page.lang),
    source: m.source,
    html: m.text.html,
    image: m.image,
    strip: stripModel(snapshot, page.lang, 1),
    positionText: fill(t.markerPositionText, {
      distance: m.distance.display.fromOlderEnd + (m.distance.display.uncertainty ? ` ${m.distance.display.uncertainty}` : ""),
      total: formatLengthReadable(total, 4, units),
      percent: total > 0 ? Math.round((m.distance.fromOlderEndMetres / total) * 100) : 0,
    }),
    walk: walkText(m, t),
    previous: neighbour(index - 1),
    next: neighbour(index + 1),
    decay: m.decay,
    insetLines: m.insets.map((i) => fill(t.insetLine, { inset: snapshot.insets.find((s) => s.id === i.insetId)?.label ?? i.insetId, display: i.display })),
    exhibitHref,
    precache: [exhibitHref, ...snapshot.markers.map((n) => `${base}/${n.signNumber}${suffix}`)],
  };
}
