// /editions — the shared chart editions (the latest marked), and for a signed-in member also the
// organisation's own editions, each labelled as such; drafts only for those who manage them.
import { Link } from "react-router";
import { plainWords, RankCounts } from "~/components/chart/edition-bits";
import { EditionBadges } from "~/components/chart/edition-owner";
import { listEditions, managesEditions, scopeOf, viewerOf } from "#server/editions.server.ts";
import type { Route } from "./+types/editions.index";

export const meta: Route.MetaFunction = () => [{ title: "Chart editions · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const viewer = await viewerOf(request);
  // The page sends what it shows, field by field: how many corrections an edition has, not the
  // corrections themselves (their evidence is on the edition's page), and no internal file path
  // (sourceFile) or database id.
  const editions = (await listEditions(scopeOf(viewer))).map((e) => ({
    slug: e.slug,
    label: e.label,
    status: e.status,
    source: e.source,
    counts: e.counts,
    total: e.total,
    createdAt: e.createdAt,
    createdBy: e.createdBy,
    madeCurrentAt: e.madeCurrentAt,
    madeCurrentBy: e.madeCurrentBy,
    retiredAt: e.retiredAt,
    organisationId: e.organisationId,
    ownerName: e.ownerName,
    latest: e.latest,
    currentForOrganisation: e.currentForOrganisation,
    correctionCount: e.corrections.length,
  }));
  return { editions, canManage: managesEditions(viewer), organisation: viewer?.organisationName ?? null };
}

const day = (iso: string | null) => (iso ? iso.slice(0, 10) : null);

export default function EditionsIndex({ loaderData }: Route.ComponentProps) {
  const { editions, canManage, organisation } = loaderData;
  const latest = editions.find((e) => e.latest);
  const current = editions.find((e) => e.currentForOrganisation) ?? latest;
  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div className="max-w-3xl">
          <h1 className="text-3xl">Chart editions</h1>
          <p className="mt-2 text-ink-soft">
            The International Chronostratigraphic Chart is the agreed geologic timescale, revised every year or two. Every exhibit is checked against one named edition of it.
            {latest ? <> The latest shared edition is <strong className="text-ink">{latest.label}</strong>.</> : " No shared edition has been published yet."}
            {organisation && current ? <> {organisation} works against <strong className="text-ink">{current.label}</strong>; its new exhibits are pinned to it.</> : null}
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
                <Link to={`/editions/${e.slug}`}>{e.label}</Link> <EditionBadges edition={e} organisationName={organisation} />
              </h2>
              <p className="font-sans text-sm text-ink-soft">
                {e.total} intervals
                {e.status === "current" && e.madeCurrentAt ? ` · ${e.latest ? "latest" : "in use"} since ${day(e.madeCurrentAt)}${e.madeCurrentBy ? ` (${e.madeCurrentBy})` : ""}` : ""}
                {e.status === "retired" && e.retiredAt ? ` · retired ${day(e.retiredAt)}` : ""}
                {e.status === "draft" ? ` · imported ${day(e.createdAt)}${e.createdBy ? ` by ${e.createdBy}` : ""}` : ""}
              </p>
            </div>
            <div className="mt-3"><RankCounts counts={e.counts} /></div>
            <p className="mt-3 line-clamp-2 text-sm text-ink-soft">{plainWords(e.source)}</p>
            <p className="mt-3 flex flex-wrap gap-x-4 gap-y-1 font-sans text-sm">
              <Link to={`/editions/${e.slug}`}>Chart and intervals</Link>
              {e.correctionCount ? <Link to={`/editions/${e.slug}#corrections`}>{e.correctionCount} correction{e.correctionCount === 1 ? "" : "s"}</Link> : null}
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
