/**
 * GET /api/timescales/:slug — one published edition and its intervals in chart order:
 * { "edition": { slug, label, status, source, licence, latest, madeCurrentAt, corrections },
 *   "intervals": [{ name, rank, parent, baseMa, baseUncertaintyMa, topMa, color, gssp, approximate }, …] }
 * English names; ages in Ma; baseUncertaintyMa null where the chart gives none; gssp null where the
 * source does not say. Shared editions only: unknown slug, a draft or an organisation's own edition → 404 { "error": { "message" } }. ETag / 304.
 */
import { apiEditionBody, cachedJson, publicJsonError } from "#server/editions.server.ts";
import type { Route } from "./+types/api.timescales.$slug";
import { jsonOnError } from "#server/http.server.ts";

async function loaderBody({ request, params }: Route.LoaderArgs) {
  const body = await apiEditionBody(params.slug);
  if (!body) return publicJsonError(404, `No published chart edition has the slug "${params.slug}". GET /api/timescales lists them.`);
  return cachedJson(request, body);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const loader = jsonOnError(loaderBody);
