// The scale strip of a visitor page as data: rows of interval bands (eons, eras, periods… in the
// standard chart colours, each with its name in the page language and a text colour that keeps
// 4.5:1 on it) and the markers' positions, as fractions of the whole length. The scale is linear,
// so a fraction of the span is the same fraction of the length.
import { textOn } from "../chart/colour";
import type { PublicationSnapshot, SnapshotInterval } from "../publication/types";

export interface StripBand {
  name: string;
  /** The name's language tag when it is not the page's language (no translation in the chart). */
  lang: string | null;
  color: string;
  textColor: string;
  /** From the older end, 0–1. */
  start: number;
  width: number;
  /** Wide enough for a few letters of its name. */
  labelled: boolean;
}

export interface StripModel {
  rows: { rank: string; bands: StripBand[] }[];
  ticks: { signNumber: number; at: number }[];
}

const RANKS = ["eon", "era", "period", "sub-period", "epoch", "age"];
/** A row with more bands than this is too busy for a phone-wide strip. */
const MAX_BANDS = 24;

export function intervalName(interval: SnapshotInterval, lang: string): { name: string; lang: string | null } {
  const own = interval.names[lang];
  if (own && own.trim()) return { name: own.trim(), lang: null };
  return { name: interval.names.en ?? interval.name, lang: lang === "en" ? null : "en" };
}

export function stripModel(snapshot: PublicationSnapshot, lang: string, maxRows = 3): StripModel {
  const older = snapshot.exhibit.span.olderMa;
  const younger = snapshot.exhibit.span.youngerMa;
  const span = older - younger;
  const rows: StripModel["rows"] = [];
  for (const rank of RANKS) {
    if (rows.length >= maxRows) break;
    const inRank = snapshot.edition.intervals.filter((i) => i.rank === rank && i.baseMa > younger && i.topMa < older);
    if (!inRank.length || inRank.length > MAX_BANDS) continue;
    const bands = inRank.map((i) => {
      const from = Math.min(i.baseMa, older);
      const to = Math.max(i.topMa, younger);
      const width = (from - to) / span;
      const { name, lang: nameLang } = intervalName(i, lang);
      return { name, lang: nameLang, color: i.color, textColor: textOn(i.color), start: (older - from) / span, width, labelled: width >= 0.06 };
    });
    rows.push({ rank, bands: bands.sort((a, b) => a.start - b.start) });
  }
  const total = snapshot.scale.totalMetres;
  const ticks = snapshot.markers.map((m) => ({ signNumber: m.signNumber, at: total > 0 ? m.distance.fromOlderEndMetres / total : 0 }));
  return { rows, ticks };
}
