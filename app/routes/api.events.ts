/**
 * GET /api/events?q=… — search the dated-event library as you type (the exhibit composer's
 * useFetcher). Signed-in members only: the shared library plus the active organisation's own
 * entries whose name or summary contains every word of q; at most 20, names starting with q first.
 *
 * 200 { query, count, limit, results: DatedEventView[] }; signed out → 401; in no organisation → 403.
 */
import type { Route } from "./+types/api.events";
import { getSigned } from "#server/auth.server.ts";
import { SEARCH_LIMIT, searchEvents } from "#server/dated-events.server.ts";
import { jsonError, jsonResponse, jsonOnError } from "#server/http.server.ts";

/** Answers depend on who asks: never kept by a shared cache. */
const PRIVATE = { "Cache-Control": "private, no-store", Vary: "Cookie" };

async function loaderBody({ request }: Route.LoaderArgs) {
  // An API answers in JSON rather than redirecting to the sign-in page.
  const signed = await getSigned(request);
  if (!signed) return jsonError(401, "Sign in to search the event library.", PRIVATE);
  const organisation = signed.organisation;
  if (!organisation) return jsonError(403, "Your account does not belong to any organisation yet, so there is no library to search.", PRIVATE);
  const url = new URL(request.url);
  const q = (url.searchParams.get("q") ?? "").trim();
  if (q.length > 100) return jsonError(400, "q: keep the search to 100 characters.", PRIVATE);
  const limitParam = url.searchParams.get("limit");
  const limit = limitParam === null ? SEARCH_LIMIT : Number(limitParam);
  if (!Number.isInteger(limit) || limit < 1 || limit > SEARCH_LIMIT) {
    return jsonError(400, `limit: a whole number from 1 to ${SEARCH_LIMIT}.`, PRIVATE);
  }
  const results = await searchEvents(organisation.id, q, limit);
  return jsonResponse(200, { query: q, count: results.length, limit, results }, PRIVATE);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const loader = jsonOnError(loaderBody);
