/**
 * GET /api/exhibits/:org/:slug/publications/:number — one publication by number, in the same shape
 * as /api/exhibits/:org/:slug. It never changes: cached for a year (immutable).
 */
import { publicJsonError } from "#server/editions.server.ts";
import { publicationResponse } from "#server/publications/public.server.ts";
import type { Route } from "./+types/api.exhibits.$org.$slug.publications.$number";
import { jsonOnError } from "#server/http.server.ts";

function loaderBody({ request, params }: Route.LoaderArgs) {
  const number = Number(params.number);
  if (!/^\d{1,9}$/.test(params.number) || number < 1) return publicJsonError(400, "The publication number must be a whole number from 1.");
  return publicationResponse(request, params.org, params.slug, number);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const loader = jsonOnError(loaderBody);
