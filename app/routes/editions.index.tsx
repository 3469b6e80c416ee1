// /editions — every published chart edition (and, for editors and admins, the drafts).
import { Link } from "react-router";
import { RankCounts, StatusBadge } from "~/components/chart/edition-bits";
import { listEditions, viewerOf } from "#server/editions.server.ts";
import type { Route } from "./+types/editions.index";

export const meta: Route.MetaFunction = () => [{ title: "Chart editions · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const viewer = await viewerOf(request);
  const editions = await listEditions({ includeDrafts: Boolean(viewer?.canManage) });
  return { editions, canManage: Boolean(viewer?.canManage) };
}

const day = (iso: string | null) => (iso ? iso.slice(0, 10) : null);

export default function EditionsIndex({ loaderData }: Route.ComponentProps) {
  const { editions, canManage } = loaderData;
  const current = editions.find((e) => e.status === "current");
  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div className="max-w-3xl">
          <h1 className="text-3xl">Chart editions</h1>
          <p className="mt-2 text-ink-soft">
            Every exhibit is checked against one named edition of the International Chronostratigraphic Chart.
            {current ? <> The current edition is <strong className="text-ink">{current.label}</strong>; new exhibits are pinned to it.</> : " No edition is current yet."}
          </p>
        </div>
        {canManage ? (
          <div className="flex gap-2">
            <Link to="/studio/editions/import" className="btn no-underline">Import an edition</Link>
            <Link to="/studio/editions" className="btn-quiet no-underline">Manage editions</Link>
          </div>
        ) : null}
      </div>
      {editions.length === 0 ? <p className="card mt-6">No chart edition has been published yet.</p> : null}
      <ul className="mt-6 grid gap-4">
        {editions.map((e) => (
          <li key={e.slug} className="card">
            <div className="flex flex-wrap items-baseline justify-between gap-3">
              <h2 className="text-xl">
                <Link to={`/editions/${e.slug}`}>{e.label}</Link> <StatusBadge status={e.status} />
              </h2>
              <p className="font-sans text-sm text-ink-soft">
                <code>{e.slug}</code> · {e.total} intervals
                {e.status === "current" && e.madeCurrentAt ? ` · current since ${day(e.madeCurrentAt)}${e.madeCurrentBy ? ` (${e.madeCurrentBy})` : ""}` : ""}
                {e.status === "retired" && e.retiredAt ? ` · retired ${day(e.retiredAt)}` : ""}
                {e.status === "draft" ? ` · imported ${day(e.createdAt)}${e.createdBy ? ` by ${e.createdBy}` : ""}` : ""}
              </p>
            </div>
            <div className="mt-3"><RankCounts counts={e.counts} /></div>
            <p className="mt-3 line-clamp-2 text-sm text-ink-soft">{e.source}</p>
            <p className="mt-3 flex flex-wrap gap-x-4 gap-y-1 font-sans text-sm">
              <Link to={`/editions/${e.slug}`}>Chart and intervals</Link>
              {e.corrections.length ? <Link to={`/editions/${e.slug}#corrections`}>{e.corrections.length} correction{e.corrections.length === 1 ? "" : "s"}</Link> : null}
              {current && current.slug !== e.slug ? <Link to={`/editions/compare?from=${e.status === "draft" ? current.slug : e.slug}&to=${e.status === "draft" ? e.slug : current.slug}`}>Compare with {current.label}</Link> : null}
              <a href={`/editions/${e.slug}/intervals.csv`}>CSV</a>
              <a href={`/editions/${e.slug}/intervals.json`}>JSON</a>
            </p>
          </li>
        ))}
      </ul>
    </div>
  );
}
