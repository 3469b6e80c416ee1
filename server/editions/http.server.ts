// HTTP caching for the chart-edition exports and the public timescale API: strong ETags, 304 on a
// matching If-None-Match, public caching for shared editions, private for drafts and an
// organisation's own editions.
import { createHash } from "node:crypto";
import { exportCsv, exportJson } from "../../app/lib/timescale/index.ts";
import { JSON_CONTENT_TYPE, jsonError } from "../http.server.ts";
import { loadEdition } from "./reads.server.ts";
import { scopeOf, viewerOf } from "./viewer.server.ts";

/** A strong ETag of a response body. */
export function etagOf(body: string): string {
  return `"${createHash("sha256").update(body).digest("base64url").slice(0, 32)}"`;
}

/** Does If-None-Match name this ETag (weak comparison, as RFC 9110 asks for GET)? */
export function notModified(request: Request, etag: string): boolean {
  const header = request.headers.get("If-None-Match");
  if (!header) return false;
  const bare = etag.replace(/^W\//, "");
  return header.split(",").some((t) => {
    const tag = t.trim();
    return tag === "*" || tag.replace(/^W\//, "") === bare;
  });
}

/** Editions change rarely: caches may keep a copy for five minutes, then revalidate with the ETag. */
export const PUBLIC_CACHE_CONTROL = "public, max-age=300, stale-while-revalidate=3600";

/** A cacheable JSON response with an ETag; 304 when the client already has it. */
export function cachedJson(request: Request, body: unknown, extra: Record<string, string> = {}): Response {
  const text = JSON.stringify(body);
  const etag = etagOf(text);
  const headers = {
    ETag: etag,
    "Cache-Control": PUBLIC_CACHE_CONTROL,
    "Access-Control-Allow-Origin": "*",
    "Access-Control-Expose-Headers": "ETag",
    Vary: "Accept-Encoding",
    ...extra,
  };
  if (notModified(request, etag)) return new Response(null, { status: 304, headers });
  return new Response(text, { status: 200, headers: { ...headers, "Content-Type": JSON_CONTENT_TYPE } });
}

/** A JSON error of the public timescale API (readable from any origin). */
export function publicJsonError(status: number, message: string): Response {
  return jsonError(status, message, { "Access-Control-Allow-Origin": "*" });
}

/** The CSV or JSON download of an edition (exactly what the importer reads back). */
export async function exportResponse(request: Request, slug: string, format: "csv" | "json"): Promise<Response> {
  const loaded = await loadEdition(slug, scopeOf(await viewerOf(request)));
  if (!loaded) {
    return new Response(`No chart edition "${slug}" is published here.\n`, { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  }
  const text = format === "csv" ? exportCsv(loaded.intervals) : exportJson(loaded.intervals);
  const etag = etagOf(text);
  // Drafts and an organisation's own editions are for some readers only: never in a shared cache.
  const restricted = loaded.edition.status === "draft" || loaded.edition.organisationId !== null;
  const headers: Record<string, string> = {
    ETag: etag,
    "Cache-Control": restricted ? "private, no-cache" : PUBLIC_CACHE_CONTROL,
    "Content-Disposition": `attachment; filename="${slug}-intervals.${format}"`,
  };
  if (notModified(request, etag)) return new Response(null, { status: 304, headers });
  return new Response(text, {
    headers: { ...headers, "Content-Type": format === "csv" ? "text/csv; charset=utf-8" : JSON_CONTENT_TYPE },
  });
}
