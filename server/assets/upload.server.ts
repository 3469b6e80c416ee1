// POST /api/assets: the multipart body is parsed as it streams in (@remix-run/form-data-parser,
// one file of at most 60 MB, no whole-body buffer); the file's type is judged by its content; the
// original goes to S3 under a private key named by the asset id taken from the sequence; only then
// is the row written, with its processing job, in one transaction. Refusals store nothing.
import { FormDataParseError, MaxFileSizeExceededError, MaxFilesExceededError, MaxTotalSizeExceededError, MultipartParseError, parseFormData, type FileUpload } from "@remix-run/form-data-parser";
import { QueryTypes } from "sequelize";
import { MAX_IMAGE_BYTES } from "../../app/lib/images.ts";
import { Asset } from "../../db/models/index.ts";
import { audit } from "../audit.server.ts";
import { sequelize } from "../db.server.ts";
import { jsonError, jsonResponse, megabytes } from "../http.server.ts";
import { logger } from "../logger.server.ts";
import { deleteObjects, putObject, StorageUnavailableError } from "../storage/s3.server.ts";
import { queueProcessing } from "./jobs.server.ts";
import { ImageRefusedError, recognise } from "./process.server.ts";
import { assetPrefix } from "./keys.server.ts";

export const TOO_LARGE = `The file is larger than ${megabytes(MAX_IMAGE_BYTES)}. Export a smaller version (a 36 × 24 in panel at 300 dpi fits well under this) and upload it again.`;
export const ONE_FILE = "Send one image per upload, in the field “file”.";
const NO_FILE = "Choose an image file to upload (the form field “file”).";

export interface Uploader {
  organisationId: number;
  userId: number;
}

/** Handles the upload request and answers with the JSON the API promises (201, 400, 413, 415, 422, 503). */
export async function receiveUpload(request: Request, who: Uploader): Promise<Response> {
  const declared = Number(request.headers.get("content-length") ?? 0);
  if (declared > MAX_IMAGE_BYTES + 1024 * 1024) return jsonError(413, TOO_LARGE);
  if (!(request.headers.get("content-type") ?? "").startsWith("multipart/form-data")) return jsonError(400, NO_FILE);

  let files = 0;
  let form: FormData;
  try {
    form = await parseFormData(
      request,
      { maxFiles: 1, maxFileSize: MAX_IMAGE_BYTES, maxTotalSize: MAX_IMAGE_BYTES + 64 * 1024, maxParts: 8 },
      (file: FileUpload) => {
        files++;
        return file.fieldName === "file" ? file : null;
      },
    );
  } catch (error) {
    if (error instanceof MaxFileSizeExceededError || error instanceof MaxTotalSizeExceededError) return jsonError(413, TOO_LARGE);
    if (error instanceof MaxFilesExceededError) return jsonError(400, ONE_FILE);
    if (error instanceof FormDataParseError || error instanceof MultipartParseError) return jsonError(400, "The upload could not be read (the connection may have been cut). Try again.");
    throw error;
  }
  const file = form.get("file");
  if (files > 1) return jsonError(400, ONE_FILE);
  if (!(file instanceof File) || file.size === 0) return jsonError(400, NO_FILE);

  const bytes = new Uint8Array(await file.arrayBuffer());
  let kind;
  try {
    kind = await recognise(bytes);
  } catch (error) {
    if (error instanceof ImageRefusedError) return jsonError(error.status, error.message);
    throw error;
  }

  // The id first (the sequence), so the object key names the row that will own it.
  const [{ id }] = await sequelize.query<{ id: number }>(`SELECT nextval(pg_get_serial_sequence('assets', 'id'))::int AS id`, { type: QueryTypes.SELECT });
  const originalKey = `${assetPrefix(id)}original`;
  try {
    await putObject(originalKey, bytes, `image/${kind.format}`);
  } catch (error) {
    if (error instanceof StorageUnavailableError) {
      logger.warn({ err: error.cause, assetId: id }, "S3 refused an upload");
      return jsonError(503, error.message, { "Retry-After": "30" });
    }
    throw error;
  }
  try {
    await sequelize.transaction(async (transaction) => {
      await Asset.create(
        { id, organisationId: who.organisationId, uploadedById: who.userId, originalKey, originalName: file.name.slice(0, 255), format: kind.format, bytes: bytes.byteLength, width: kind.width, height: kind.height },
        { transaction },
      );
      await queueProcessing(id, transaction);
      await audit({ organisationId: who.organisationId, actorId: who.userId, action: "asset.upload", objectType: "asset", objectId: id, details: { bytes: bytes.byteLength, format: kind.format, width: kind.width, height: kind.height } }, transaction);
    });
  } catch (error) {
    // No row: take the object back (the orphan sweep removes it if S3 refuses now).
    await deleteObjects([originalKey]).catch(() => {});
    throw error;
  }
  return jsonResponse(201, { id, status: "processing" }, { Location: `/api/assets/${id}` });
}
