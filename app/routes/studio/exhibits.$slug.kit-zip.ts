// GET /studio/exhibits/:slug/kit.zip — every fabrication file in one ZIP; from the latest publication or, with ?from=draft,
// the working copy (marked "DRAFT — not checked").
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.kit-zip";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "kit.zip");
}
