// GET /studio/exhibits/:slug/signs.pdf — sign sheets (?size=label|a4|letter|wayside or width=&height=; height= mounting, distance= viewing); from the latest publication or, with ?from=draft,
// the working copy (marked "DRAFT — not checked").
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.signs-pdf";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "signs.pdf");
}
