// points.geojson: the marker points of a route exhibit for a GIS officer, valid under RFC 7946.
// - A FeatureCollection with no `properties` member (RFC 7946 §7.1 forbids it there): the exhibit's
//   metadata goes in the foreign member `eonscale`, and each marker's figures on its own feature.
// - The route itself as the first feature (a LineString), then one Point per marker in order.
// - WGS84 longitude, latitude (RFC 7946 §4) at 7 decimals (about 1 cm); with elevations, every
//   position carries a third value in metres and the `bbox` has six numbers (§5), else four.
import { COORDINATE_DECIMALS } from "../publication/build";
import type { PublicationSnapshot } from "../publication/types";
import { DRAFT_NOTICE, alongText, exhibitPageUrl, markerPageUrl, placedMarkers, statusLine, toMillimetre, waypointName, type CrewFileOptions } from "./common";

type Position = number[];

export interface PointsFeatureCollection {
  type: "FeatureCollection";
  bbox: number[];
  eonscale: Record<string, unknown>;
  features: {
    type: "Feature";
    id: string;
    geometry: { type: "Point"; coordinates: Position } | { type: "LineString"; coordinates: Position[] };
    properties: Record<string, unknown>;
  }[];
}

/** [minLon, minLat, (minEle,) maxLon, maxLat, (maxEle)] over every position. */
export function bboxOf(positions: readonly Position[], withElevation: boolean): number[] {
  const dims = withElevation ? 3 : 2;
  const min = Array<number>(dims).fill(Infinity);
  const max = Array<number>(dims).fill(-Infinity);
  for (const p of positions) {
    for (let d = 0; d < dims; d++) {
      min[d] = Math.min(min[d], p[d]);
      max[d] = Math.max(max[d], p[d]);
    }
  }
  return [...min, ...max];
}

/** The marker points of a route exhibit (throws for a straight length: it has no places on the ground). */
export function pointsGeoJson(snapshot: PublicationSnapshot, options: CrewFileOptions): PointsFeatureCollection {
  const medium = snapshot.medium;
  if (medium.kind !== "route") throw new Error("pointsGeoJson: only route exhibits have marker points");
  const markers = placedMarkers(snapshot);
  const withElevation = medium.hasElevations && markers.every((m) => m.position.elevationMetres !== null);
  const route: Position[] = medium.geometry.coordinates.map((c) => (withElevation ? [c[0], c[1], c[2]] : [c[0], c[1]]));
  const largest = Math.max(0, ...snapshot.markers.map((m) => m.signNumber));
  const points = markers.map((m) => {
    const p = m.position;
    const coordinates: Position = withElevation ? [p.lon, p.lat, p.elevationMetres!] : [p.lon, p.lat];
    return {
      type: "Feature" as const,
      id: `sign-${m.signNumber}`,
      geometry: { type: "Point" as const, coordinates },
      properties: {
        kind: "marker",
        signNumber: m.signNumber,
        order: m.order,
        name: waypointName(m, largest),
        label: m.label,
        markerKind: m.kind,
        interval: m.intervalName,
        event: m.eventName,
        ageMa: m.ageMa,
        ageUncertaintyMa: m.uncertaintyMa,
        approximate: m.approximate,
        ageText: m.ageText,
        source: m.source,
        fromStartMetres: m.walking ? toMillimetre(m.walking.fromStartMetres) : null,
        fromOlderEndMetres: toMillimetre(m.distance.fromOlderEndMetres),
        toYoungerEndMetres: toMillimetre(m.distance.fromYoungerEndMetres),
        alongText: alongText(snapshot, m),
        elevationMetres: p.elevationMetres,
        bearingDegrees: p.bearing,
        walkMinutes: m.walking ? Number((m.walking.seconds / 60).toFixed(1)) : null,
        color: m.color,
        markerPage: markerPageUrl(snapshot, m, options),
        ...(options.draft ? { status: DRAFT_NOTICE } : {}),
      },
    };
  });
  const draft = options.draft || !options.publication;
  return {
    type: "FeatureCollection",
    bbox: bboxOf([...route, ...points.map((f) => f.geometry.coordinates)], withElevation),
    eonscale: {
      status: draft ? DRAFT_NOTICE : "published",
      statusText: statusLine(snapshot, options),
      draft,
      publication: draft ? null : options.publication!.number,
      publicationHash: draft ? null : options.publication!.hash,
      exhibit: { organisation: snapshot.organisation.slug, slug: snapshot.exhibit.slug, title: snapshot.exhibit.title, revision: snapshot.exhibit.revision, page: exhibitPageUrl(snapshot, options) },
      chartEdition: snapshot.edition.label,
      scale: snapshot.scale.statement.lengthPerTime,
      routeLengthMetres: toMillimetre(medium.lengthMetres),
      coordinates: `WGS84 longitude, latitude${withElevation ? ", elevation in metres" : ""}; ${COORDINATE_DECIMALS} decimals (about 1 cm). Planning coordinates, not a survey.`,
      cautions: snapshot.cautions,
    },
    features: [
      {
        type: "Feature",
        id: "route",
        geometry: { type: "LineString", coordinates: route },
        properties: { kind: "route", name: snapshot.exhibit.title, sourceName: medium.sourceName, lengthMetres: toMillimetre(medium.lengthMetres), start: medium.start === "older" ? "older end" : "younger end" },
      },
      ...points,
    ],
  };
}
