// GET /studio/exhibits/:slug/trailhead.pdf — the trailhead board of a route exhibit; from the latest publication or, with ?from=draft,
// the working copy (marked "DRAFT — not checked").
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.trailhead-pdf";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "trailhead.pdf");
}
