// GET /studio/exhibits/:slug/profile.json — the route's slope profile with the ABA §1017 stretches; from the latest publication or, with ?from=draft,
// the working copy (marked "DRAFT — not checked").
import { studioExport } from "#server/exports/registry.server.ts";
import type { Route } from "./+types/exhibits.$slug.profile-json";

export function loader({ request, params }: Route.LoaderArgs) {
  return studioExport(request, params.slug, "profile.json");
}
