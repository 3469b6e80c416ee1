// The embeddable strip: title, scale statement, the strip and the marker list (its text alternative).
import type { PublicationSnapshot } from "../publication/types";
import { fill } from "./messages";
import { stripModel, type StripModel } from "./strip";
import { markerRows, spanEnds, type MarkerRow, type PageBasics } from "./view";

export interface EmbedView {
  page: PageBasics;
  title: string;
  statement: string;
  strip: StripModel;
  caption: string;
  rows: MarkerRow[];
  exhibitHref: string;
}

export function embedView(snapshot: PublicationSnapshot, page: PageBasics): EmbedView {
  const { t } = page;
  return {
    page,
    title: fill(t.embedTitle, { exhibit: snapshot.exhibit.title }),
    statement: snapshot.scale.statement.lengthPerTime,
    strip: stripModel(snapshot, page.lang),
    caption: fill(t.stripCaption, spanEnds(snapshot, t)),
    rows: markerRows(snapshot, page.base, t, page.suffix),
    exhibitHref: `${page.base}${page.suffix}`,
  };
}
