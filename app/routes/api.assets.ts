// POST /api/assets — upload one image (multipart, field "file"): 201 { id, status: "processing" };
// 413/415/422 { error: { message } } for too large, wrong type, too many pixels; 503 when S3 is down.
import type { Route } from "./+types/api.assets";
import { uploadAction } from "#server/assets/http.server.ts";
import { jsonOnError } from "#server/http.server.ts";

function actionBody({ request }: Route.ActionArgs) {
  return uploadAction(request);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const action = jsonOnError(actionBody);
