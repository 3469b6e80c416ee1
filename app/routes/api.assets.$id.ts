// GET /api/assets/:id — { id, status, width, height, alt, credit, sizes: [{ width, format, url }] }
// (with error when failed); POST intent=retry starts a failed image again.
import type { Route } from "./+types/api.assets.$id";
import { assetAction, assetLoader } from "#server/assets/http.server.ts";
import { jsonOnError } from "#server/http.server.ts";

function loaderBody({ request, params }: Route.LoaderArgs) {
  return assetLoader(request, params.id);
}

function actionBody({ request, params }: Route.ActionArgs) {
  return assetAction(request, params.id);
}

// Unexpected errors (a database that cannot be reached included) are JSON too.
export const loader = jsonOnError(loaderBody);
export const action = jsonOnError(actionBody);
