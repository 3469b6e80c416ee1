// /studio/exhibits/:slug/revisions — every kept revision: who changed what, when; which were
// reviewed and published; links to compare any two (or a revision with the live publication).
import { Form, Link } from "react-router";
import { PageHeader } from "~/components/page-header";
import { revisionActionWords, STATUS_WORDS } from "~/lib/review/lifecycle";
import { requireMember } from "#server/auth.server.ts";
import { revisionsView } from "#server/review/view.server.ts";
import type { Route } from "./+types/exhibits.$slug.revisions";

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `History: ${loaderData?.exhibit.title ?? "exhibit"} · Eonscale` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  return revisionsView(member.organisation.id, params.slug);
}

export default function Revisions({ loaderData }: Route.ComponentProps) {
  const { exhibit, revisions } = loaderData;
  const base = `/studio/exhibits/${exhibit.slug}`;
  const published = revisions.some((r) => r.published !== null);
  return (
    <div>
      <PageHeader title={`History: ${exhibit.title}`} crumbs={[{ to: "/studio/exhibits", label: "Exhibits" }, { to: base, label: exhibit.title }]} current="History" lead={`${STATUS_WORDS[exhibit.status]} · revision ${exhibit.revision} · ${revisions.length} revision${revisions.length === 1 ? "" : "s"} kept`} />
      <Form method="get" action={`${base}/revisions/compare`} className="mt-6 flex flex-wrap items-end gap-3 font-sans text-sm">
        <div><label htmlFor="from" className="mb-1 block font-semibold">Compare revision</label><input id="from" name="from" type="number" min={1} defaultValue={Math.max(1, exhibit.revision - 1)} className="field w-28" /></div>
        <div><label htmlFor="to" className="mb-1 block font-semibold">with</label>
          <select id="to" name="to" defaultValue={String(exhibit.revision)} className="field w-48">
            {revisions.map((r) => <option key={r.revision} value={r.revision}>revision {r.revision}</option>)}
            {published ? <option value="published">the live publication</option> : null}
          </select>
        </div>
        <button type="submit" className="btn-quiet">Compare</button>
      </Form>
      <div className="mt-4">
        <table className="table-cards w-full font-sans text-sm">
          <caption className="sr-only">Revisions, newest first</caption>
          <thead><tr className="text-left"><th scope="col" className="p-2">Revision</th><th scope="col" className="p-2">Who</th><th scope="col" className="p-2">What</th><th scope="col" className="p-2">When (UTC)</th><th scope="col" className="p-2">Markers</th><th scope="col" className="p-2">Review / publication</th><th scope="col" className="p-2"><span className="sr-only">Compare</span></th></tr></thead>
          <tbody>
            {revisions.map((r) => (
              <tr key={r.revision} className="border-t border-rule align-top">
                <td className="num p-2 font-semibold" data-label="Revision">{r.revision}</td>
                <td className="p-2" data-label="Who">{r.author}</td>
                <td className="p-2" data-label="What">{revisionActionWords(r.action)}</td>
                <td className="num whitespace-nowrap p-2" data-label="When (UTC)">{r.at.slice(0, 16).replace("T", " ")}</td>
                <td className="num p-2" data-label="Markers">{r.markers}</td>
                <td className="p-2 max-md:empty:hidden" data-label="Review / publication">{[r.reviewed, r.published ? `publication ${r.published}` : null].filter(Boolean).join("; ")}</td>
                <td className="p-2 max-md:empty:hidden">{r.revision > 1 ? <Link to={`${base}/revisions/compare?from=${r.revision - 1}&to=${r.revision}`}>What changed from {r.revision - 1}</Link> : null}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
