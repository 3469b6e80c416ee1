// The image endpoints' answers (the routes only pass the request on):
//   POST /api/assets            upload (designers of the organisation)
//   GET  /api/assets/:id        status and sizes (the organisation; anyone once a publication uses it)
//   POST /api/assets/:id        intent=retry: process a failed image again
//   GET  /media/:assetId/:file  the files, streamed from S3 with ETag and Cache-Control
// Another organisation's draft image and a signed-out request for one get 404, never 403, so ids
// reveal nothing.
import { parseMediaFile, sizeFileName } from "../../app/lib/images.ts";
import { can } from "../../app/lib/permissions.ts";
import { Asset } from "../../db/models/index.ts";
import type { AssetFile } from "../../db/models/asset.ts";
import { getMember, getSigned } from "../auth.server.ts";
import { jsonError, jsonResponse } from "../http.server.ts";
import { getObjectStream, StorageUnavailableError } from "../storage/s3.server.ts";
import { retryAsset } from "./jobs.server.ts";
import { receiveUpload } from "./upload.server.ts";
import { assetJson, canViewAsset, publishedUse } from "./usage.server.ts";

const PRIVATE = { "Cache-Control": "private, no-store", Vary: "Cookie" };
const NOT_FOUND = "There is no image with this id that you may see.";

async function uploader(request: Request): Promise<Response | { organisationId: number; userId: number }> {
  const signed = await getSigned(request);
  if (!signed) return jsonError(401, "Sign in to upload images.", PRIVATE);
  if (!signed.organisation) return jsonError(403, "Your account does not belong to any organisation yet.", PRIVATE);
  if (!can(signed.subject, "image.upload")) return jsonError(403, "Uploading images needs the designer role in your organisation.", PRIVATE);
  return { organisationId: signed.organisation.id, userId: signed.user.id };
}

export async function uploadAction(request: Request): Promise<Response> {
  if (request.method !== "POST") return jsonError(405, "Upload with POST.", { Allow: "POST" });
  const who = await uploader(request);
  if (who instanceof Response) return who;
  return receiveUpload(request, who);
}

function idOf(raw: string | undefined): number | null {
  const id = Number(raw);
  return Number.isInteger(id) && id > 0 && id < 2 ** 31 ? id : null;
}

async function visibleAsset(request: Request, rawId: string | undefined): Promise<Asset | null> {
  const id = idOf(rawId);
  const asset = id ? await Asset.findByPk(id) : null;
  if (!asset) return null;
  const member = await getMember(request);
  return (await canViewAsset(asset, member?.organisation.id ?? null)) ? asset : null;
}

export async function assetLoader(request: Request, rawId: string | undefined): Promise<Response> {
  const asset = await visibleAsset(request, rawId);
  return asset ? jsonResponse(200, assetJson(asset), PRIVATE) : jsonError(404, NOT_FOUND, PRIVATE);
}

export async function assetAction(request: Request, rawId: string | undefined): Promise<Response> {
  const who = await uploader(request);
  if (who instanceof Response) return who;
  const id = idOf(rawId);
  const asset = id ? await Asset.findOne({ where: { id, organisationId: who.organisationId } }) : null;
  if (!asset) return jsonError(404, NOT_FOUND, PRIVATE);
  const form = await request.formData().catch(() => null);
  if (form?.get("intent") !== "retry") return jsonError(400, "intent: the only action on an image is “retry”.", PRIVATE);
  if (asset.status !== "failed") return jsonError(409, `This image is ${asset.status}; only a failed image can be tried again.`, PRIVATE);
  await retryAsset(asset);
  return jsonResponse(202, assetJson(asset), PRIVATE);
}

function fileOf(asset: Asset, name: string): AssetFile | null {
  const parsed = parseMediaFile(name);
  if (!parsed) return null;
  const files = asset.files as AssetFile[];
  if (parsed.kind === "print") return files.find((f) => f.role === "print") ?? null;
  return files.find((f) => f.role === "web" && sizeFileName(f.width, f.format) === name) ?? null;
}

/** One file of an image: 304 when the browser has it, else streamed from S3. */
export async function mediaLoader(request: Request, rawId: string | undefined, name: string | undefined): Promise<Response> {
  const notFound = () => new Response("Not found", { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8", ...PRIVATE } });
  const id = idOf(rawId);
  const asset = id ? await Asset.findByPk(id) : null;
  const file = asset && name ? fileOf(asset, name) : null;
  if (!asset || !file) return notFound();
  const member = await getMember(request);
  const own = member?.organisation.id === asset.organisationId;
  const published = own ? false : await publishedUse(asset.id);
  if (!own && !published) return notFound();
  const etag = `"${file.hash}"`;
  // The bytes behind a URL never change (a new image is a new asset): cache for a year; drafts
  // only in the member's own browser.
  const headers: Record<string, string> = {
    ETag: etag,
    "Cache-Control": published ? "public, max-age=31536000, immutable" : "private, max-age=31536000, immutable",
    "Content-Type": file.format === "jpeg" ? "image/jpeg" : `image/${file.format}`,
    "X-Content-Type-Options": "nosniff",
    ...(published ? {} : { Vary: "Cookie" }),
  };
  if ((request.headers.get("if-none-match") ?? "").split(",").some((t) => t.trim().replace(/^W\//, "") === etag)) return new Response(null, { status: 304, headers });
  try {
    const object = await getObjectStream(file.key);
    if (!object?.Body) return notFound();
    if (object.ContentLength != null) headers["Content-Length"] = String(object.ContentLength);
    if (file.role === "print") headers["Content-Disposition"] = `inline; filename="image-${asset.id}-print.jpg"`;
    return new Response(object.Body.transformToWebStream(), { status: 200, headers });
  } catch (error) {
    if (error instanceof StorageUnavailableError) return new Response("The image store is not reachable right now.", { status: 503, headers: { "Retry-After": "30", "Content-Type": "text/plain; charset=utf-8", "Cache-Control": "no-store" } });
    throw error;
  }
}

