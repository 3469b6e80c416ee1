// GET /studio/exhibits/:slug/schedule.xlsx — the marker schedule as an Excel workbook; from the latest publication or, with ?from=draft,
// the working copy (marked "DRAFT — not checked").
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.schedule-xlsx";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "schedule.xlsx");
}
