// GET /studio/exhibits/:slug/points.geojson — marker points of a route exhibit for GIS (RFC 7946),
// from the latest publication or, with ?from=draft, the working copy (server/exports/registry.server.ts).
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.points-geojson";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "points.geojson");
}
