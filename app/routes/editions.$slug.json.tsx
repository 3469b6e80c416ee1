// GET /editions/:slug/intervals.json — the edition as a JSON array of intervals (reads back identically on import).
import { exportResponse } from "#server/editions.server.ts";
import type { Route } from "./+types/editions.$slug.json";

export function loader({ request, params }: Route.LoaderArgs) {
  return exportResponse(request, params.slug, "json");
}
