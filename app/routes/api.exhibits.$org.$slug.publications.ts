/**
 * GET /api/exhibits/:org/:slug/publications — every publication of the exhibit, newest first:
 * { "exhibit": { organisation, slug, latest }, "publications": [{ number, hash, publishedAt, approvedBy, edition, url }] }.
 */
import { publicationsListResponse } from "#server/publications/public.server.ts";
import type { Route } from "./+types/api.exhibits.$org.$slug.publications";
import { jsonOnError } from "#server/http.server.ts";

function loaderBody({ request, params }: Route.LoaderArgs) {
  return publicationsListResponse(request, params.org, params.slug);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const loader = jsonOnError(loaderBody);
