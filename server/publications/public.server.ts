// The public JSON of publications (no sign-in): the latest publication of an exhibit, the list of
// its publications, and any one by number. A draft is never visible here; the body of a publication
// is its stored canonical JSON (byte for byte the same until the next publication), its ETag the
// snapshot's SHA-256, and a matching If-None-Match is answered 304 before the snapshot is read.
// Renamed organisations and exhibits (slugs are frozen once published) answer 301 to the new address.
import { QueryTypes } from "sequelize";
import { canonicalJson, publicationBody } from "../../app/lib/publication/canonical.ts";
import type { PublicationMeta } from "../../app/lib/publication/types.ts";
import { sequelize } from "../db.server.ts";
import { notModified, publicJsonError } from "../editions/http.server.ts";
import { JSON_CONTENT_TYPE } from "../http.server.ts";

/** Publications never change; the latest may be replaced by the next one, so caches revalidate after five minutes. */
export const PUBLICATION_CACHE_CONTROL = "public, max-age=300, stale-while-revalidate=86400";
/** A numbered publication never changes at all. */
export const NUMBERED_CACHE_CONTROL = "public, max-age=31536000, immutable";

const NOT_PUBLISHED = "No published exhibit at this address. Drafts are never public; the exhibit may not be published yet.";

export interface Found {
  exhibitId: number;
  org: string;
  slug: string;
  /** The address used an old slug: answer with a redirect to this one. */
  moved: boolean;
}

/** The exhibit behind /:org/:slug, following frozen-slug redirects; only exhibits with a publication. */
export async function findPublished(org: string, slug: string): Promise<Found | null> {
  const rows = await sequelize.query<{ exhibitId: number; org: string; slug: string }>(
    `WITH o AS (
       SELECT id, slug FROM organisations WHERE slug = $1
       UNION ALL SELECT g.id, g.slug FROM organisation_slug_redirects r JOIN organisations g ON g.id = r.organisation_id WHERE r.old_slug = $1
       LIMIT 1)
     SELECT e.id AS "exhibitId", o.slug AS org, e.slug FROM o JOIN exhibits e ON e.organisation_id = o.id
      WHERE (e.slug = $2 OR e.id = (SELECT exhibit_id FROM exhibit_slug_redirects WHERE organisation_id = o.id AND old_slug = $2))
        AND EXISTS (SELECT 1 FROM publications p WHERE p.exhibit_id = e.id)
      ORDER BY (e.slug = $2) DESC LIMIT 1`,
    { bind: [org, slug], type: QueryTypes.SELECT },
  );
  const r = rows[0];
  return r ? { ...r, moved: r.org !== org || r.slug !== slug } : null;
}

const CORS = { "Access-Control-Allow-Origin": "*", "Access-Control-Expose-Headers": "ETag" };

function moved(request: Request, found: Found, rest = ""): Response {
  const url = new URL(request.url);
  return new Response(null, { status: 301, headers: { Location: `/api/exhibits/${found.org}/${found.slug}${rest}${url.search}`, ...CORS } });
}

/** One publication (the latest, or by number): 304 on a matching ETag before anything else is read. */
export async function publicationResponse(request: Request, org: string, slug: string, number: number | null): Promise<Response> {
  const found = await findPublished(org, slug);
  if (!found) return publicJsonError(404, NOT_PUBLISHED);
  if (found.moved) return moved(request, found, number === null ? "" : `/publications/${number}`);
  const heads = await sequelize.query<{ number: number; sha256: string }>(
    number === null
      ? `SELECT number, sha256 FROM publications WHERE exhibit_id = $1 ORDER BY number DESC LIMIT 1`
      : `SELECT number, sha256 FROM publications WHERE exhibit_id = $1 AND number = $2`,
    { bind: number === null ? [found.exhibitId] : [found.exhibitId, number], type: QueryTypes.SELECT },
  );
  if (!heads[0]) return publicJsonError(404, `This exhibit has no publication ${number}.`);
  const etag = `"${heads[0].sha256}"`;
  const headers = { ETag: etag, "Cache-Control": number === null ? PUBLICATION_CACHE_CONTROL : NUMBERED_CACHE_CONTROL, Vary: "Accept-Encoding", ...CORS };
  if (notModified(request, etag)) return new Response(null, { status: 304, headers });
  const [row] = await sequelize.query<{ meta: PublicationMeta; snapshot_canonical: string }>(
    `SELECT meta, snapshot_canonical FROM publications WHERE exhibit_id = $1 AND number = $2`,
    { bind: [found.exhibitId, heads[0].number], type: QueryTypes.SELECT },
  );
  return new Response(publicationBody(row.meta, row.snapshot_canonical), { status: 200, headers: { ...headers, "Content-Type": JSON_CONTENT_TYPE } });
}

/** The list of an exhibit's publications, newest first. */
export async function publicationsListResponse(request: Request, org: string, slug: string): Promise<Response> {
  const found = await findPublished(org, slug);
  if (!found) return publicJsonError(404, NOT_PUBLISHED);
  if (found.moved) return moved(request, found, "/publications");
  const rows = await sequelize.query<{ meta: PublicationMeta }>(`SELECT meta FROM publications WHERE exhibit_id = $1 ORDER BY number DESC`, { bind: [found.exhibitId], type: QueryTypes.SELECT });
  const body = canonicalJson({
    exhibit: { organisation: found.org, slug: found.slug, latest: `/api/exhibits/${found.org}/${found.slug}` },
    publications: rows.map((r) => ({ ...r.meta, url: `/api/exhibits/${found.org}/${found.slug}/publications/${r.meta.number}` })),
  });
  const etag = `"${rows[0].meta.hash}-${rows.length}"`;
  const headers = { ETag: etag, "Cache-Control": PUBLICATION_CACHE_CONTROL, Vary: "Accept-Encoding", ...CORS };
  if (notModified(request, etag)) return new Response(null, { status: 304, headers });
  return new Response(body, { status: 200, headers: { ...headers, "Content-Type": JSON_CONTENT_TYPE } });
}
