/**
 * GET /api/events?q=… — search the dated-event library as you type (the exhibit composer's
 * useFetcher). Signed-in members only: the shared library plus the active organisation's own
 * entries whose name or summary contains every word of q; at most 20, names starting with q first.
 *
 * 200 { query, count, limit, results: DatedEventView[] }; signed out → 401; no organisation → 403.
 */
import type { Route } from "./+types/api.events";
import { requireMember } from "#server/auth.server.ts";
import { SEARCH_LIMIT, searchEvents } from "#server/dated-events.server.ts";

const HEADERS = { "Content-Type": "application/json; charset=utf-8", "Cache-Control": "private, no-store", Vary: "Cookie" };

function json(status: number, body: unknown): Response {
  return new Response(JSON.stringify(body), { status, headers: HEADERS });
}

export async function loader({ request }: Route.LoaderArgs) {
  let member;
  try {
    member = await requireMember(request);
  } catch (thrown) {
    // An API answers in JSON rather than redirecting to the sign-in page.
    if (thrown instanceof Response && thrown.status >= 300 && thrown.status < 400) {
      return json(401, { error: { message: "Sign in to search the event library." } });
    }
    if (thrown && typeof thrown === "object" && "type" in thrown && (thrown as { type: string }).type === "DataWithResponseInit") {
      const d = thrown as unknown as { data: { message?: string }; init: ResponseInit | null };
      return json(d.init?.status ?? 403, { error: { message: d.data?.message ?? "Not allowed." } });
    }
    throw thrown;
  }
  const url = new URL(request.url);
  const q = (url.searchParams.get("q") ?? "").trim();
  if (q.length > 100) return json(400, { error: { message: "q: keep the search to 100 characters." } });
  const limitParam = url.searchParams.get("limit");
  const limit = limitParam === null ? SEARCH_LIMIT : Number(limitParam);
  if (!Number.isInteger(limit) || limit < 1 || limit > SEARCH_LIMIT) {
    return json(400, { error: { message: `limit: a whole number from 1 to ${SEARCH_LIMIT}.` } });
  }
  const results = await searchEvents(member.organisation.id, q, limit);
  return json(200, { query: q, count: results.length, limit, results });
}
