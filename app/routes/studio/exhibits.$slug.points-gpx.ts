// GET /studio/exhibits/:slug/points.gpx — marker waypoints and the route for handheld GPS units
// (GPX 1.1), from the latest publication or, with ?from=draft, the working copy.
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.points-gpx";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "points.gpx");
}
