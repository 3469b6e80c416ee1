// GET /studio/exhibits/:slug/schedule.csv — the marker schedule for fabrication and installation.
import { scheduleCsv, scheduleRows } from "~/lib/exhibit";
import { requireMember } from "#server/auth.server.ts";
import { requireBundle, resultOf } from "#server/exhibits/load.server.ts";
import type { Route } from "./+types/exhibits.$slug.schedule-csv";

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const bundle = await requireBundle(member.organisation.id, params.slug);
  const csv = scheduleCsv(scheduleRows(bundle.markers, resultOf(bundle)));
  return new Response(csv, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="${bundle.exhibit.slug}-schedule-rev${bundle.exhibit.revision}.csv"`,
      "Cache-Control": "private, no-store",
    },
  });
}
