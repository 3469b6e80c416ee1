/**
 * GET /api/timescales — the published shared chart editions (the latest and the retired ones;
 * drafts and organisations' own editions are never public):
 * { "editions": [{ "slug", "label", "status", "source", "licence", "latest" }, …], "latest": "<slug>" | null },
 * the latest first. `latest` (per edition, and the top-level slug) was added beside the original keys.
 * Cacheable: ETag, and 304 for a matching If-None-Match.
 */
import { apiEditionMeta, cachedJson, listEditions, PUBLIC_SCOPE } from "#server/editions.server.ts";
import type { Route } from "./+types/api.timescales";
import { jsonOnError } from "#server/http.server.ts";

async function loaderBody({ request }: Route.LoaderArgs) {
  const editions = await listEditions(PUBLIC_SCOPE);
  return cachedJson(request, { editions: editions.map(apiEditionMeta), latest: editions.find((e) => e.latest)?.slug ?? null });
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const loader = jsonOnError(loaderBody);
