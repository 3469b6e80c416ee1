// GET /studio/exhibits/:slug/panels.zip — one SVG per print panel; from the latest publication or, with ?from=draft,
// the working copy (marked "DRAFT — not checked").
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.panels-zip";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "panels.zip");
}
