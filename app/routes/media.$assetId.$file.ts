// GET /media/:assetId/:file — an image's files ("960.webp", "480.jpg", "1600.avif", "print.jpg"),
// streamed from S3 with ETag and Cache-Control. Stable URLs: snapshots and offline copies keep them.
import type { Route } from "./+types/media.$assetId.$file";
import { mediaLoader } from "#server/assets/http.server.ts";

export function loader({ request, params }: Route.LoaderArgs) {
  return mediaLoader(request, params.assetId, params.file);
}
