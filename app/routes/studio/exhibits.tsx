import { Form, Link, useSearchParams } from "react-router";
import { PageHeader } from "~/components/page-header";
import { can } from "~/lib/permissions";
import { exhibitListQuery, filterAndSortExhibits, type ExhibitSort } from "~/lib/exhibit";
import { requireMember } from "#server/auth.server.ts";
import { listExhibits } from "#server/exhibits/list.server.ts";
import type { Route } from "./+types/exhibits";

export const meta: Route.MetaFunction = () => [{ title: "Exhibits · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const filters = exhibitListQuery(new URL(request.url).searchParams);
  const all = await listExhibits(member.organisation.id);
  return { rows: filterAndSortExhibits(all, filters), total: all.length, canEdit: can(member.subject, "exhibit.edit"), filters };
}

const SORT_WORDS: Record<ExhibitSort, string> = { title: "title", medium: "medium", length: "length", edition: "chart edition", status: "status", updated: "last change" };

export default function Exhibits({ loaderData }: Route.ComponentProps) {
  const { rows, total, canEdit, filters } = loaderData;
  const [params] = useSearchParams();
  const sortLink = (s: ExhibitSort) => {
    const next = new URLSearchParams(params);
    next.set("sort", s);
    next.set("dir", filters.sort === s && filters.dir === "asc" ? "desc" : "asc");
    return `?${next}`;
  };
  const header = (s: ExhibitSort, label: string) => (
    <th scope="col" className="p-3" aria-sort={filters.sort === s ? (filters.dir === "asc" ? "ascending" : "descending") : undefined}>
      <Link to={sortLink(s)} className="no-underline">{label}{filters.sort === s ? (filters.dir === "asc" ? " ▲" : " ▼") : ""}</Link>
    </th>
  );
  return (
    <div>
      <PageHeader
        title="Exhibits"
        lead="Every time-as-distance exhibit of your organisation, with the chart edition its ages were checked against."
        actions={canEdit ? <Link to="/studio/exhibits/new" className="btn no-underline">New exhibit</Link> : null}
      />
      <Form method="get" className="mt-6 flex flex-wrap items-end gap-3 font-sans text-sm">
        <div>
          <label htmlFor="q" className="mb-1 block font-semibold">Title contains</label>
          <input id="q" name="q" defaultValue={filters.q} className="field w-56" />
        </div>
        <div>
          <label htmlFor="medium" className="mb-1 block font-semibold">Medium</label>
          <select id="medium" name="medium" defaultValue={filters.medium} className="field w-40">
            <option value="">any</option>
            {["route", "trail", "wall", "rope", "banner", "other"].map((m) => <option key={m} value={m}>{m}</option>)}
          </select>
        </div>
        <label className="flex min-h-10 items-center gap-2"><input type="checkbox" name="recheck" value="1" defaultChecked={filters.recheck} /> Needs re-check only</label>
        <input type="hidden" name="sort" value={filters.sort} />
        <button type="submit" className="btn-quiet">Filter</button>
      </Form>
      {total === 0 ? (
        <div className="card mt-6">
          <h2 className="text-xl">No exhibits yet</h2>
          <p className="mt-2 text-ink-soft">
            {canEdit ? "Start with a span of the timescale and a medium — a wall, a rope, a banner, or a real route from a GPX track." : "When a designer of your organisation starts an exhibit, it appears here."}
          </p>
          {canEdit ? <Link to="/studio/exhibits/new" className="btn mt-4 no-underline">Start an exhibit</Link> : null}
        </div>
      ) : (
        <div className="card mt-6 p-0">
          <p className="px-3 pt-3 font-sans text-sm text-ink-soft md:hidden">Sort by: {(["title", "medium", "length", "edition", "status", "updated"] as const).map((s, i) => <span key={s}>{i ? " · " : ""}<Link to={sortLink(s)}>{SORT_WORDS[s]}{filters.sort === s ? (filters.dir === "asc" ? " ▲" : " ▼") : ""}</Link></span>)}</p>
          <table className="table-cards w-full text-left text-sm">
            <caption className="sr-only">Exhibits, sortable by column</caption>
            <thead className="border-b border-rule bg-paper">
              <tr>
                {header("title", "Title")}
                {header("medium", "Medium")}
                {header("length", "Length")}
                {header("edition", "Checked against chart edition")}
                {header("status", "Status")}
                {header("updated", "Updated")}
              </tr>
            </thead>
            <tbody>
              {rows.map((r) => (
                <tr key={r.slug} className="border-b border-rule last:border-0">
                  <td className="p-3" data-label="Title"><Link to={`/studio/exhibits/${r.slug}`} className="font-semibold">{r.title}</Link><div className="text-xs text-ink-soft">{r.markers} markers</div></td>
                  <td className="p-3" data-label="Medium">{r.medium}</td>
                  <td className="num p-3" data-label="Length">{r.length}</td>
                  <td className="p-3" data-label="Checked against chart edition">
                    {r.edition}
                    {r.needsRecheck ? <span className="ml-2 inline-block rounded bg-sandstone-100 px-2 py-0.5 text-xs font-semibold text-sandstone-700">needs re-check</span> : null}
                  </td>
                  <td className="p-3" data-label="Status">{r.status.replaceAll("_", " ")} · saved version {r.revision}</td>
                  <td className="p-3" data-label="Updated">{r.updated.slice(0, 10)}{r.updatedBy ? ` · ${r.updatedBy}` : ""}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {rows.length === 0 ? <p className="p-4 text-ink-soft">No exhibit matches these filters.</p> : null}
        </div>
      )}
    </div>
  );
}
