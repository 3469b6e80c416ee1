// The crew's files: points.geojson (RFC 7946, for GIS) and points.gpx (GPX 1.1, for handheld GPS
// units), made from a publication snapshot (or a draft one) by app/lib/exports.
import { pointsGeoJson } from "../../app/lib/exports/geojson.ts";
import { pointsGpx } from "../../app/lib/exports/gpx.ts";
import type { ExportContext, ExportFile } from "./registry.server.ts";

const options = (c: ExportContext) => ({ draft: c.draft, publication: c.publication, baseUrl: c.baseUrl });

export const pointsGeoJsonFile: ExportFile = {
  title: "Marker points (GeoJSON)",
  purpose: "For the park's GIS: every marker as a point with its sign number, label, age and source, and the route as a line (RFC 7946).",
  routeOnly: true,
  produce: (snapshot, context) =>
    new Response(JSON.stringify(pointsGeoJson(snapshot, options(context))), { headers: { "Content-Type": "application/geo+json; charset=utf-8" } }),
};

export const pointsGpxFile: ExportFile = {
  title: "Marker waypoints (GPX)",
  purpose: "For handheld GPS units and phone apps setting out the signs: a waypoint per marker and the route as a track (GPX 1.1).",
  routeOnly: true,
  produce: (snapshot, context) => new Response(pointsGpx(snapshot, options(context)), { headers: { "Content-Type": "application/gpx+xml; charset=utf-8" } }),
};
