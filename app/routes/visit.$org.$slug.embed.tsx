/**
 * GET /visit/:org/:slug/embed — the strip for a museum's own web site, in an iframe: the only page
 * any site may frame (server/visit/http.server.ts lifts frame-ancestors for it alone).
 */
import visitCss from "~/components/visit/visit.css?url";
import { loadVisit } from "#server/visit/pages.server.ts";
import { embedView } from "~/lib/visit/embed-view";
import { EmbedPage } from "~/components/visit/embed-page";
import { VisitNotFound } from "~/components/visit/not-found";
import type { Route } from "./+types/visit.$org.$slug.embed";

export const handle = { visitor: true };

export const links: Route.LinksFunction = () => [{ rel: "stylesheet", href: visitCss }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const visit = await loadVisit(request, params.org, params.slug, (base) => `${base}/embed`);
  return { htmlLang: visit.page.htmlLang, view: embedView(visit.snapshot, visit.page) };
}

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: loaderData ? loaderData.view.title : "Not found" }];

export default function VisitEmbed({ loaderData }: Route.ComponentProps) {
  return <EmbedPage view={loaderData.view} />;
}

export function ErrorBoundary() {
  return <VisitNotFound />;
}
