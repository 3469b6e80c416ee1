/**
 * GET /visit/:org/:slug — the published exhibit for visitors (signed out, server-rendered, no
 * hydration): the scale in plain words, the strip, the markers with distances and walking times,
 * the route map with the nearest-marker button, cautions, and the review and publication lines.
 * Reads only the latest publication. Caching, ETag and 304: server/visit/http.server.ts.
 */
import visitCss from "~/components/visit/visit.css?url";
import { loadVisit } from "#server/visit/pages.server.ts";
import { exhibitView } from "~/lib/visit/exhibit-view";
import { ExhibitPage } from "~/components/visit/exhibit-page";
import { VisitNotFound } from "~/components/visit/not-found";
import type { Route } from "./+types/visit.$org.$slug";

export const handle = { visitor: true };

export const links: Route.LinksFunction = () => [{ rel: "stylesheet", href: visitCss }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const visit = await loadVisit(request, params.org, params.slug);
  return { htmlLang: visit.page.htmlLang, view: exhibitView(visit.snapshot, visit.page) };
}

export const meta: Route.MetaFunction = ({ loaderData }) =>
  loaderData ? [{ title: loaderData.view.page.title }, { name: "description", content: loaderData.view.scale.lines[0] }] : [{ title: "Not found" }];

export default function VisitExhibit({ loaderData }: Route.ComponentProps) {
  return <ExhibitPage view={loaderData.view} />;
}

export function ErrorBoundary() {
  return <VisitNotFound />;
}
