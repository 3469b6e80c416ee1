/**
 * The export files: one table, file name → how to make it from a publication snapshot.
 *
 * How to add a file (e.g. "signs.pdf"):
 * 1. Write its producer `(snapshot, context) => Response | Promise<Response>` in its own module
 *    under server/exports/ (pure drawing/formatting in app/lib). The producer sets the body and
 *    `Content-Type` (and may answer 202 `{ jobUrl }` for a long job, or 400 JSON for a bad query
 *    parameter); it reads its own query parameters from `context.query` and must say
 *    `DRAFT_NOTICE` ("DRAFT — not checked") in the file whenever `context.draft` is true.
 * 2. Add a row to EXPORT_FILES below.
 * 3. Studio URL: a route module `app/routes/studio/exhibits.$slug.<name>.ts` whose loader is
 *    `studioExport(request, params.slug, "<file name>")`, a line in app/routes.ts, and its row in
 *    tests/integration/guards.test.ts. The public URL needs nothing more: the route
 *    /api/exhibits/:org/:slug/publications/:number/:file serves every row of the table.
 *
 * What the dispatchers add around a producer's 200 answer: `Content-Disposition` (attachment, file
 * name "<exhibit>-publication-<n>-<file>" or "<exhibit>-draft-rev<r>-<file>") unless the producer
 * set one; for members `Cache-Control: private, no-store`; for the public route `Cache-Control:
 * public`, an `ETag` from the publication's SHA-256, the file name, the row's `version` and the
 * query, a 304 for a matching If-None-Match before the snapshot is read, and CORS for reading.
 * Studio exports follow `?from=publication|draft` (server/exports/source.server.ts); the public
 * route serves publications only, never drafts.
 */
import { QueryTypes } from "sequelize";
import type { PublicationMeta, PublicationSnapshot } from "../../app/lib/publication/types.ts";
import type { MemberContext } from "../auth.server.ts";
import { sequelize } from "../db.server.ts";
import { etagOf, notModified, publicJsonError } from "../editions/http.server.ts";
import { env } from "../env.server.ts";
import { findPublished } from "../publications/public.server.ts";
import { pointsGeoJsonFile, pointsGpxFile } from "./points.server.ts";
import { FABRICATION_FILES } from "./fabrication/files.server.ts";
import { ExportError, exportErrorData, memberExportSource, publicationSource, type ExportSource } from "./source.server.ts";

export interface ExportContext {
  /** Made from the working copy: every file must say DRAFT_NOTICE. */
  draft: boolean;
  /** The publication the snapshot is; null for a draft. */
  publication: PublicationMeta | null;
  /** The request's query parameters (file options such as `width=`). */
  query: URLSearchParams;
  /** Absolute base URL of the site, no trailing slash (for links such as marker pages). */
  baseUrl: string;
  /** "member": a studio export; "public": the public route (no sign-in, publications only). */
  audience: "member" | "public";
  /** The signed-in member for studio exports (for jobs, audit); null on the public route. */
  member: MemberContext | null;
  request: Request;
}

export type ExportProducer = (snapshot: PublicationSnapshot, context: ExportContext) => Response | Promise<Response>;

export interface ExportFile {
  /** For menus and lists: "Marker waypoints (GPX 1.1)". */
  title: string;
  /** What it is for, in a sentence. */
  purpose: string;
  /** Made only for route exhibits (a straight length answers 404 with the reason). */
  routeOnly?: boolean;
  /** Bump when the producer's output for the same publication changes (public ETags change with it). */
  version?: number;
  produce: ExportProducer;
}

export const EXPORT_FILES: Readonly<Record<string, ExportFile>> = {
  "points.geojson": pointsGeoJsonFile,
  "points.gpx": pointsGpxFile,
  ...FABRICATION_FILES,
};

export function exportFileNamed(name: string): ExportFile | null {
  return Object.hasOwn(EXPORT_FILES, name) ? EXPORT_FILES[name] : null;
}

/** What every route-only file answers for a straight length. */
export const ROUTE_ONLY = "This file exists only for route exhibits; this one is a straight length.";

function baseUrl(): string {
  return env().APP_URL.replace(/\/+$/, "");
}

async function produce(name: string, file: ExportFile, source: ExportSource, context: Omit<ExportContext, "draft" | "publication" | "baseUrl">): Promise<Response> {
  if (file.routeOnly && source.snapshot.medium.kind !== "route") throw new ExportError(ROUTE_ONLY, 404);
  const response = await file.produce(source.snapshot, { ...context, draft: source.draft, publication: source.publication, baseUrl: baseUrl() });
  if (response.status === 200 && !response.headers.has("Content-Disposition")) {
    response.headers.set("Content-Disposition", `attachment; filename="${source.fileStem}-${name}"`);
  }
  return response;
}

/** GET /studio/exhibits/:slug/<name>: a member's export, `?from=publication|draft`. */
export async function studioExport(request: Request, slug: string, name: string): Promise<Response> {
  const file = exportFileNamed(name);
  if (!file) throw new Error(`studioExport: no export file "${name}" in EXPORT_FILES`);
  try {
    const { member, source } = await memberExportSource(request, slug);
    const response = await produce(name, file, source, { query: new URL(request.url).searchParams, audience: "member", member, request });
    if (!response.headers.has("Cache-Control")) response.headers.set("Cache-Control", "private, no-store");
    return response;
  } catch (error) {
    return exportErrorData(error);
  }
}

/** Publication files may be fetched by anyone; a day in a cache, then revalidated by ETag. */
export const PUBLIC_FILE_CACHE_CONTROL = "public, max-age=86400, stale-while-revalidate=604800";
const CORS = { "Access-Control-Allow-Origin": "*", "Access-Control-Expose-Headers": "ETag, Content-Disposition" };

/** GET /api/exhibits/:org/:slug/publications/:number/:file (no sign-in; publications only). */
export async function publicExport(request: Request, org: string, slug: string, numberText: string, name: string): Promise<Response> {
  const file = exportFileNamed(name);
  if (!file) return publicJsonError(404, `No file "${name}" here. A publication's files: ${Object.keys(EXPORT_FILES).join(", ")}.`);
  if (new URL(request.url).searchParams.get("from") === "draft") return publicJsonError(404, "Drafts are never public: only a publication's files are served here.");
  const number = Number(numberText);
  if (!/^\d{1,9}$/.test(numberText) || number < 1) return publicJsonError(400, "The publication number must be a whole number from 1.");
  const found = await findPublished(org, slug);
  if (!found) return publicJsonError(404, "No published exhibit at this address. Drafts are never public; the exhibit may not be published yet.");
  const url = new URL(request.url);
  if (found.moved) {
    const location = `/api/exhibits/${found.org}/${found.slug}/publications/${number}/${name}${url.search}`;
    return new Response(null, { status: 301, headers: { Location: location, ...CORS } });
  }
  const [head] = await publicationHead(found.exhibitId, number);
  if (!head) return publicJsonError(404, `This exhibit has no publication ${number}.`);
  const query = [...url.searchParams].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  const etag = etagOf(`${head.sha256}\n${name}\n${file.version ?? 1}\n${new URLSearchParams(query)}`);
  const headers = { ETag: etag, "Cache-Control": PUBLIC_FILE_CACHE_CONTROL, Vary: "Accept-Encoding", ...CORS };
  if (notModified(request, etag)) return new Response(null, { status: 304, headers });
  const source = await publicationSource(found.exhibitId, number);
  if (!source) return publicJsonError(404, `This exhibit has no publication ${number}.`);
  try {
    const response = await produce(name, file, source, { query: url.searchParams, audience: "public", member: null, request });
    for (const [k, v] of Object.entries(response.status === 200 ? headers : CORS)) response.headers.set(k, v);
    return response;
  } catch (error) {
    if (error instanceof ExportError) return publicJsonError(error.status, error.message);
    throw error;
  }
}

function publicationHead(exhibitId: number, number: number) {
  return sequelize.query<{ sha256: string }>(`SELECT sha256 FROM publications WHERE exhibit_id = $1 AND number = $2`, { bind: [exhibitId, number], type: QueryTypes.SELECT });
}

/** For pages: the files of an exhibit, in menu order (route-only files left out for straight lengths). */
export function exportMenuFiles(kind: "length" | "route"): { name: string; title: string; purpose: string }[] {
  return Object.entries(EXPORT_FILES)
    .filter(([, f]) => kind === "route" || !f.routeOnly)
    .map(([name, f]) => ({ name, title: f.title, purpose: f.purpose }));
}
