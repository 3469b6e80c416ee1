/**
 * GET /api/exhibits/:org/:slug/publications/:number/:file — a publication's export files for
 * anyone (a printer's workflow, a GIS officer): every file of server/exports/registry.server.ts.
 * Publications only, never drafts; ETag and public caching; 404 JSON for an unknown file name.
 */
import { publicExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/api.exhibits.$org.$slug.publications.$number.$file";
import { jsonOnError } from "#server/http.server.ts";

function loaderBody({ request, params }: Route.LoaderArgs) {
  return publicExport(request, params.org, params.slug, params.number, params.file);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const loader = jsonOnError(loaderBody);
