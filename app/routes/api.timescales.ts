/**
 * GET /api/timescales — the published chart editions (current and retired; drafts are not public):
 * { "editions": [{ "slug", "label", "status", "source", "licence" }, …] }, current first.
 * Cacheable: ETag, and 304 for a matching If-None-Match.
 */
import { apiEditionMeta, cachedJson, listEditions } from "#server/editions.server.ts";
import type { Route } from "./+types/api.timescales";

export async function loader({ request }: Route.LoaderArgs) {
  const editions = await listEditions({ includeDrafts: false });
  return cachedJson(request, { editions: editions.map(apiEditionMeta) });
}
