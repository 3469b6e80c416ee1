/**
 * GET /visit/:org/:slug/:number — a marker page, the QR target on its sign (:number is the sign
 * number, fixed at the marker's first publication). Readable with no script. A retired sign
 * number answers 301 to the sign that absorbed it, or 410 with a page saying the sign was removed.
 */
import { data, redirect } from "react-router";
import visitCss from "~/components/visit/visit.css?url";
import { loadVisit } from "#server/visit/pages.server.ts";
import { markerView } from "~/lib/visit/marker-view";
import { MarkerPage, RetiredSignPage } from "~/components/visit/marker-page";
import { VisitNotFound } from "~/components/visit/not-found";
import type { Route } from "./+types/visit.$org.$slug.$number";

export const handle = { visitor: true };

export const links: Route.LinksFunction = () => [{ rel: "stylesheet", href: visitCss }];

export async function loader({ request, params }: Route.LoaderArgs) {
  if (!/^\d{1,9}$/.test(params.number)) throw data({ message: "A sign number is a whole number." }, { status: 404 });
  const visit = await loadVisit(request, params.org, params.slug, (base) => `${base}/${params.number}`);
  const view = markerView(visit.snapshot, visit.page, Number(params.number));
  if (!view) throw data({ message: "No sign with this number." }, { status: 404 });
  if (view.kind === "retired" && view.sign.absorbedBy) throw redirect(`${visit.page.base}/${view.sign.absorbedBy}${visit.page.suffix}`, 301);
  return data({ htmlLang: visit.page.htmlLang, view }, { status: view.kind === "retired" ? 410 : 200 });
}

export const meta: Route.MetaFunction = ({ loaderData }) => {
  if (!loaderData) return [{ title: "Not found" }];
  const v = loaderData.view;
  return [{ title: v.kind === "marker" ? `${v.label} — ${v.page.title}` : v.heading }];
};

export default function VisitMarker({ loaderData }: Route.ComponentProps) {
  const v = loaderData.view;
  return v.kind === "marker" ? <MarkerPage view={v} /> : <RetiredSignPage view={v} />;
}

export function ErrorBoundary() {
  return <VisitNotFound />;
}
