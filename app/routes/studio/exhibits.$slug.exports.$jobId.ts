// GET /studio/exhibits/:slug/exports/:jobId — a background export's progress as JSON:
// { status, progress (0–1), url (when done), error }. Members of the exhibit's organisation only.
import { data } from "react-router";
import { requirePermission } from "#server/auth.server.ts";
import { exportJobStatus } from "#server/exports/fabrication/jobs.server.ts";
import type { Route } from "./+types/exhibits.$slug.exports.$jobId";

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requirePermission(request, "exhibit.export");
  const status = await exportJobStatus(member.organisation.id, params.slug, params.jobId);
  if (!status) throw data({ message: "There is no export with this address for this exhibit." }, { status: 404 });
  return Response.json(status, { headers: { "Cache-Control": "no-store" } });
}
