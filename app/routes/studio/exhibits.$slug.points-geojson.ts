// GET /studio/exhibits/:slug/points.geojson — marker points of a route exhibit for GIS and setting out.
import { data } from "react-router";
import { markerPointsGeoJson } from "~/lib/exhibit";
import { requireMember } from "#server/auth.server.ts";
import { requireBundle, resultOf } from "#server/exhibits/load.server.ts";
import { jsonResponse } from "#server/http.server.ts";
import type { Route } from "./+types/exhibits.$slug.points-geojson";

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const bundle = await requireBundle(member.organisation.id, params.slug);
  if (bundle.spec.medium.kind !== "route") throw data({ message: "Marker points exist only for route exhibits; this one is a straight length." }, { status: 404 });
  const body = markerPointsGeoJson(bundle.markers, resultOf(bundle), { exhibit: bundle.exhibit.title, edition: bundle.edition.label });
  return jsonResponse(200, body, {
    "Content-Type": "application/geo+json; charset=utf-8",
    "Content-Disposition": `attachment; filename="${bundle.exhibit.slug}-points-rev${bundle.exhibit.revision}.geojson"`,
    "Cache-Control": "private, no-store",
  });
}
