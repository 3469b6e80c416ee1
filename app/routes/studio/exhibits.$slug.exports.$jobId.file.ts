// GET /studio/exhibits/:slug/exports/:jobId/file — a finished background export, streamed from S3.
import { data } from "react-router";
import { requirePermission } from "#server/auth.server.ts";
import { exportJobFile } from "#server/exports/fabrication/jobs.server.ts";
import type { Route } from "./+types/exhibits.$slug.exports.$jobId.file";

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requirePermission(request, "exhibit.export");
  const file = await exportJobFile(member.organisation.id, params.slug, params.jobId);
  if (!file) throw data({ message: "This export is not ready, or there is none with this address." }, { status: 404 });
  return file;
}
