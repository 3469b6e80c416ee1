// GET /editions/:slug/intervals.csv — the edition in Eonscale interval CSV (reads back identically on import).
import { exportResponse } from "#server/editions.server.ts";
import type { Route } from "./+types/editions.$slug.csv";

export function loader({ request, params }: Route.LoaderArgs) {
  return exportResponse(request, params.slug, "csv");
}
