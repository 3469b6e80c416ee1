// GET /studio/exhibits/:slug/panels.pdf — print panels at 1:1 (?width=&height=&overlap=&bleed= in mm); many pages → 202 { jobUrl }; from the latest publication or, with ?from=draft,
// the working copy (marked "DRAFT — not checked").
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.panels-pdf";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "panels.pdf");
}
