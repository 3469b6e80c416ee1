// /editions/:slug — one edition: the chart, the intervals table, the corrections and the source.
import { Form, Link, useNavigation } from "react-router";
import { CorrectionList, plainWords, RankCounts } from "~/components/chart/edition-bits";
import { EditionBadges, OwnerNote } from "~/components/chart/edition-owner";
import { can } from "~/lib/permissions";
import { IntervalTable } from "~/components/chart/interval-table";
import { TimescaleChart } from "~/components/chart/timescale-chart";
import { notFound } from "#server/auth.server.ts";
import { listEditions, loadEdition, scopeOf, viewerOf } from "#server/editions.server.ts";
import type { Route } from "./+types/editions.$slug";

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: loaderData ? `${loaderData.edition.label} · Chart editions · Eonscale` : "Chart edition · Eonscale" }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const viewer = await viewerOf(request);
  const scope = scopeOf(viewer);
  const loaded = await loadEdition(params.slug, scope);
  if (!loaded) notFound(`There is no published chart edition "${params.slug}".`);
  const others = (await listEditions(scope)).filter((e) => e.slug !== params.slug);
  const current = others.find((e) => e.currentForOrganisation) ?? others.find((e) => e.latest) ?? null;
  const e = loaded.edition;
  const subject = viewer?.subject;
  // What this reader may do to this edition (the server checks again on every post).
  const may = {
    setCurrent: Boolean(subject && viewer?.organisationId && can(subject, "edition.set-current") && !e.currentForOrganisation && (e.organisationId !== null || e.status !== "draft")),
    makeLatest: Boolean(subject && e.organisationId === null && e.status !== "current" && can(subject, "edition.manage-shared", { editionOwnerId: null })),
    retire: Boolean(subject && e.status === "draft" && can(subject, e.organisationId === null ? "edition.manage-shared" : "edition.import", { editionOwnerId: e.organisationId })),
  };
  // A current edition is compared with the one it replaced: the latest retired of those that were
  // ever current (else the latest retired).
  const retired = others.filter((e) => e.status === "retired");
  const wasCurrent = retired.filter((e) => e.madeCurrentAt).sort((a, b) => (b.retiredAt ?? "").localeCompare(a.retiredAt ?? ""));
  const previous = wasCurrent[0] ?? retired[0] ?? null;
  const languages = new Set<string>();
  for (const iv of loaded.intervals) for (const tag of Object.keys(iv.names)) languages.add(tag);
  return {
    edition: loaded.edition,
    // Names in other languages stay in the exports and the database; the page shows English.
    intervals: loaded.intervals.map((iv) => ({ ...iv, names: {} })),
    languages: [...languages].sort(),
    compareWith: loaded.edition.latest ? previous && { from: previous.slug, to: loaded.edition.slug, label: previous.label } : current && { from: current.slug, to: loaded.edition.slug, label: current.label },
    may,
    organisation: viewer?.organisationName ?? null,
  };
}

const day = (iso: string | null) => (iso ? iso.slice(0, 10) : null);

export default function EditionPage({ loaderData }: Route.ComponentProps) {
  const { edition: e, intervals, languages, compareWith, may, organisation } = loaderData;
  const busy = useNavigation().state === "submitting";
  const here = `/editions/${e.slug}`;
  return (
    <div>
      <div className="flex flex-wrap items-baseline justify-between gap-3">
        <h1 className="text-3xl">
          {e.label} <EditionBadges edition={e} organisationName={organisation} />
        </h1>
        <p className="flex flex-wrap gap-2 font-sans text-sm">
          {compareWith ? <Link className="btn-quiet no-underline" to={`/editions/compare?from=${compareWith.from}&to=${compareWith.to}`}>Compare with {compareWith.label}</Link> : null}
          <a className="btn-quiet no-underline" href={`${here}/intervals.csv`} download>Download CSV</a>
          <a className="btn-quiet no-underline" href={`${here}/intervals.json`} download>Download JSON</a>
        </p>
      </div>
      <OwnerNote edition={e} />
      {e.status === "draft" ? (
        <p role="status" className="mt-4 rounded border-l-4 border-warn bg-amber-50 p-3 font-sans text-sm text-warn">
          Draft: only those who manage {e.organisationId === null ? "the shared editions (chart stewards)" : "this organisation's editions"} can see it. It passed every check on import; release it when a geologist has compared it with the printed chart.
        </p>
      ) : null}
      <section className="card mt-4 grid gap-4 md:grid-cols-[2fr_1fr]">
        <div>
          <h2 className="sr-only">About this edition</h2>
          <p className="text-sm"><span className="font-sans font-semibold">Source. </span>{plainWords(e.source)}</p>
          <p className="mt-2 text-sm"><span className="font-sans font-semibold">Licence. </span>{plainWords(e.licence)}</p>
          {languages.length ? <p className="mt-2 font-sans text-xs text-ink-soft">The interval names in {languages.length} other languages are kept in the downloads.</p> : null}
        </div>
        <div className="font-sans text-sm">
          <RankCounts counts={e.counts} />
          <p className="mt-3 text-ink-soft">
            {e.total} intervals
            <br />
            {e.createdBy ? <>Imported {day(e.createdAt)} by {e.createdBy}<br /></> : null}
            {e.madeCurrentAt ? <>{e.organisationId === null ? "Made the latest" : "Made current"} {day(e.madeCurrentAt)}{e.madeCurrentBy ? ` by ${e.madeCurrentBy}` : ""}<br /></> : null}
            {e.retiredAt ? <>Retired {day(e.retiredAt)}</> : null}
          </p>
          {may.setCurrent || may.makeLatest || may.retire ? (
            <div className="mt-3 flex flex-wrap gap-2">
              {may.setCurrent ? (
                <Form method="post" action="/studio/editions" onSubmit={(ev) => { if (!confirm(`Make ${e.label} the current edition of ${organisation}? Exhibits pinned to another edition will need a re-check.`)) ev.preventDefault(); }}>
                  <input type="hidden" name="intent" value="set-current" />
                  <input type="hidden" name="slug" value={e.slug} />
                  <input type="hidden" name="redirectTo" value={here} />
                  <button type="submit" className="btn" disabled={busy}>Make current for {organisation}</button>
                </Form>
              ) : null}
              {may.makeLatest ? (
                <Form method="post" action="/studio/editions" onSubmit={(ev) => { if (!confirm(`Make ${e.label} the latest shared edition? The present latest one will be retired.`)) ev.preventDefault(); }}>
                  <input type="hidden" name="intent" value="make-latest" />
                  <input type="hidden" name="slug" value={e.slug} />
                  <input type="hidden" name="redirectTo" value={here} />
                  <button type="submit" className="btn" disabled={busy}>Make latest shared edition</button>
                </Form>
              ) : null}
              {may.retire ? (
                <Form method="post" action="/studio/editions">
                  <input type="hidden" name="intent" value="retire" />
                  <input type="hidden" name="slug" value={e.slug} />
                  <input type="hidden" name="redirectTo" value={here} />
                  <button type="submit" className="btn-quiet" disabled={busy}>Retire</button>
                </Form>
              ) : null}
            </div>
          ) : null}
        </div>
      </section>

      <section className="mt-8" aria-labelledby="chart-heading">
        <h2 id="chart-heading" className="text-2xl">The chart</h2>
        <p className="mb-3 mt-1 text-ink-soft">Youngest at the top; ages in million years ago (Ma). Hide levels to simplify it, draw any stretch of time, and make box heights follow duration to see how little room the recent past takes.</p>
        <TimescaleChart intervals={intervals} title={e.label} />
      </section>

      <section className="mt-10" id="corrections" aria-labelledby="corrections-heading">
        <h2 id="corrections-heading" className="text-2xl">Corrections to the source data</h2>
        <p className="mb-3 mt-1 text-ink-soft">Where this edition differs from the data file the Commission published: what was changed, from what to what, why, and the evidence.</p>
        <CorrectionList corrections={e.corrections} />
      </section>

      <section className="mt-10" aria-labelledby="intervals-heading">
        <h2 id="intervals-heading" className="mb-3 text-2xl">Intervals</h2>
        <IntervalTable intervals={intervals} caption={`Intervals of ${e.label}`} />
      </section>
    </div>
  );
}
