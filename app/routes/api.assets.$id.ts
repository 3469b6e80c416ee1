// GET /api/assets/:id — { id, status, width, height, alt, credit, sizes: [{ width, format, url }] }
// (with error when failed); POST intent=retry starts a failed image again.
import type { Route } from "./+types/api.assets.$id";
import { assetAction, assetLoader } from "#server/assets/http.server.ts";

export function loader({ request, params }: Route.LoaderArgs) {
  return assetLoader(request, params.id);
}

export function action({ request, params }: Route.ActionArgs) {
  return assetAction(request, params.id);
}
