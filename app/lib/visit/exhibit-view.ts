// The exhibit page as data (app/routes/visit.$org.$slug.tsx renders it): all words and figures,
// the strip, the route map and what public/visit.js needs (nearest marker, offline copy).
import type { PublicationSnapshot } from "../publication/types";
import { fill } from "./messages";
import { nearestData, routeMapModel, type NearestData, type RouteMapModel } from "./route-map";
import { stripModel, type StripModel } from "./strip";
import { markerRows, spanEnds, scaleWords, walkingWords, type MarkerRow, type PageBasics } from "./view";

export interface ExhibitView {
  page: PageBasics;
  scale: { lines: string[]; durations: string[] };
  walking: { note: string; total: string } | null;
  strip: StripModel;
  stripCaption: string;
  rows: MarkerRow[];
  map: RouteMapModel | null;
  nearest: NearestData | null;
  cautions: string[];
  editionSource: string;
  jsonHref: string;
  /** Every page the offline copy keeps (this one first). */
  precache: string[];
}

export function exhibitView(snapshot: PublicationSnapshot, page: PageBasics): ExhibitView {
  const { t, base, suffix } = page;
  const rows = markerRows(snapshot, base, t, suffix);
  const route = snapshot.medium.kind === "route" ? snapshot.medium : null;
  const coordinates = route?.geometry.coordinates ?? [];
  const placed = snapshot.markers.filter((m) => m.position);
  return {
    page,
    scale: scaleWords(snapshot, t),
    walking: walkingWords(snapshot, t),
    strip: stripModel(snapshot, page.lang),
    stripCaption: fill(t.stripCaption, spanEnds(snapshot, t)),
    rows,
    map: route && coordinates.length > 1 ? routeMapModel(coordinates, placed.map((m) => ({ signNumber: m.signNumber, label: m.label, lon: m.position!.lon, lat: m.position!.lat }))) : null,
    nearest:
      route && coordinates.length > 1
        ? nearestData(
            coordinates,
            snapshot.markers.map((m) => ({ signNumber: m.signNumber, label: m.label, alongMetres: m.walking?.fromStartMetres ?? 0, url: `${base}/${m.signNumber}${suffix}` })),
          )
        : null,
    cautions: snapshot.cautions,
    editionSource: fill(t.editionSource, { source: snapshot.edition.source }),
    jsonHref: `/api/exhibits/${page.org}/${page.slug}`,
    precache: [`${base}${suffix}`, ...rows.map((r) => r.href)],
  };
}
