/**
 * GET /api/exhibits/:org/:slug — the latest publication of an exhibit, for anyone (no sign-in):
 * { "publication": { "number", "hash", "publishedAt", "approvedBy", "edition" }, "snapshot": { … } }
 * (the snapshot's shape: app/lib/publication/types.ts, schemaVersion 1). Canonical JSON (RFC 8785),
 * byte for byte the same until the next publication; ETag "<hash>" (SHA-256 of the snapshot), 304 on
 * If-None-Match before anything is rendered; 404 JSON for an unknown or never-published exhibit; 301
 * from a renamed exhibit's or organisation's old slug.
 */
import { publicationResponse } from "#server/publications/public.server.ts";
import type { Route } from "./+types/api.exhibits.$org.$slug";
import { jsonOnError } from "#server/http.server.ts";

function loaderBody({ request, params }: Route.LoaderArgs) {
  return publicationResponse(request, params.org, params.slug, null);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const loader = jsonOnError(loaderBody);
