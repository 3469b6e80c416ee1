// /studio/exhibits/:slug/revisions/compare?from=N&to=M (or to=published) — the markers added,
// removed, moved (in the exhibit's units) and rewritten between two revisions, and the settings
// that changed.
import { data, Link } from "react-router";
import { PageHeader } from "~/components/page-header";
import { requireMember } from "#server/auth.server.ts";
import { ExhibitError } from "#server/exhibits/load.server.ts";
import { compareView } from "#server/review/view.server.ts";
import type { Route } from "./+types/exhibits.$slug.revisions.compare";

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `Compare: ${loaderData?.exhibit.title ?? "exhibit"} · Eonscale` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  try {
    return await compareView(member.organisation.id, params.slug, new URL(request.url).searchParams);
  } catch (error) {
    if (error instanceof ExhibitError) throw data({ message: error.message }, { status: error.status });
    throw error;
  }
}

export default function Compare({ loaderData }: Route.ComponentProps) {
  const { exhibit, from, to, diff } = loaderData;
  const base = `/studio/exhibits/${exhibit.slug}`;
  const nothing = !diff.added.length && !diff.removed.length && !diff.changed.length && !diff.settings.length;
  return (
    <div>
      <PageHeader title={`Changes from ${from.label} to ${to.label}`} crumbs={[{ to: "/studio/exhibits", label: "Exhibits" }, { to: base, label: exhibit.title }, { to: `${base}/revisions`, label: "History" }]} current="Compare" lead={`${diff.unchanged} marker${diff.unchanged === 1 ? "" : "s"} unchanged.`} />
      <div className="mt-6 space-y-6 font-sans text-sm">
        {nothing ? <p>No differences.</p> : null}
        {diff.settings.length ? <section className="card"><h2 className="text-lg">Settings</h2><ul className="mt-2 list-disc pl-5">{diff.settings.map((s) => <li key={s}>{s}</li>)}</ul></section> : null}
        {diff.added.length ? <section className="card" data-testid="diff-added"><h2 className="text-lg">Added ({diff.added.length})</h2><ul className="mt-2 list-disc pl-5">{diff.added.map((m) => <li key={m.id}><strong>{m.label}</strong>, {m.ageText}{m.position ? `, ${m.position}` : ""}</li>)}</ul></section> : null}
        {diff.removed.length ? <section className="card" data-testid="diff-removed"><h2 className="text-lg">Removed ({diff.removed.length})</h2><ul className="mt-2 list-disc pl-5">{diff.removed.map((m) => <li key={m.id}><strong>{m.label}</strong>, {m.ageText}</li>)}</ul></section> : null}
        {diff.changed.length ? <section className="card" data-testid="diff-changed"><h2 className="text-lg">Changed ({diff.changed.length})</h2><ul className="mt-2 list-disc pl-5">{diff.changed.map((m) => <li key={m.id}><strong>{m.label}</strong>: {m.changes.join("; ")}</li>)}</ul></section> : null}
        <p><Link to={`${base}/revisions`}>Back to the history</Link></p>
      </div>
    </div>
  );
}
