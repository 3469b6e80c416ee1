// /editions/compare?from=…&to=… — what changed between two editions: moved boundaries (table and
// chart), changed uncertainties, renamed, added and removed intervals, colours, GSSP flags.
import { Form, Link } from "react-router";
import { groupMoves, groupUncertainty } from "~/lib/chart/compare-model";
import { StatusBadge } from "~/components/chart/edition-bits";
import { RANK_LABELS, fmtGssp, fmtMa, fmtPercent, fmtShift } from "~/lib/chart/format";
import { ShiftChart } from "~/components/chart/shift-chart";
import { compare } from "~/lib/timescale";
import { notFound } from "#server/auth.server.ts";
import { listEditions, loadEdition, scopeOf, viewerOf } from "#server/editions.server.ts";
import { exhibitsByBoundary } from "#server/exhibits/impact.server.ts";
import type { Route } from "./+types/editions.compare";

export const meta: Route.MetaFunction = ({ loaderData }) => [
  { title: loaderData?.pair ? `${loaderData.pair.from.label} → ${loaderData.pair.to.label} · Compare · Eonscale` : "Compare chart editions · Eonscale" },
];

export async function loader({ request }: Route.LoaderArgs) {
  const viewer = await viewerOf(request);
  const scope = scopeOf(viewer);
  const editions = await listEditions(scope);
  const url = new URL(request.url);
  const current = editions.find((e) => e.currentForOrganisation) ?? editions.find((e) => e.latest);
  const toSlug = url.searchParams.get("to") || current?.slug || editions[0]?.slug;
  const fromSlug = url.searchParams.get("from") || editions.find((e) => e.slug !== toSlug && e.status === "retired")?.slug || editions.find((e) => e.slug !== toSlug)?.slug;
  const choices = editions.map((e) => ({ slug: e.slug, label: e.label, status: e.status }));
  if (!toSlug || !fromSlug) return { choices, fromSlug: fromSlug ?? null, toSlug: toSlug ?? null, pair: null, same: false };
  const [first, second] = await Promise.all([loadEdition(fromSlug, scope), loadEdition(toSlug, scope)]);
  if (!first) notFound(`There is no published chart edition "${fromSlug}".`);
  if (!second) notFound(`There is no published chart edition "${toSlug}".`);
  if (fromSlug === toSlug) return { choices, fromSlug, toSlug, pair: null, same: true };
  // The older edition always comes first, whichever order the two were chosen in.
  const swapped = editionDate(second.edition) < editionDate(first.edition);
  const [a, b] = swapped ? [second, first] : [first, second];
  const c = compare(a.intervals, b.intervals);
  const grouped = groupMoves(c.moved, b.intervals, a.intervals);
  // Signed-in members also see which of their organisation's exhibits (pinned to the older edition)
  // have a marker on each moved boundary.
  const pinned = viewer?.organisationId ? await exhibitsByBoundary(viewer.organisationId, a.edition.id) : null;
  const moved = grouped.map((m) => {
    const seen = new Map<string, { slug: string; title: string }>();
    for (const name of m.names) for (const ex of pinned?.get(name) ?? []) seen.set(ex.slug, ex);
    return { ...m, exhibits: [...seen.values()] };
  });
  const affected = new Set(moved.flatMap((m) => m.exhibits.map((e) => e.slug))).size;
  return {
    choices,
    fromSlug: a.edition.slug,
    toSlug: b.edition.slug,
    same: false,
    swapped,
    pair: {
      from: { slug: a.edition.slug, label: a.edition.label, status: a.edition.status },
      to: { slug: b.edition.slug, label: b.edition.label, status: b.edition.status },
      moved,
      movedIntervals: c.moved.length,
      showExhibits: pinned !== null,
      affected,
      uncertainty: groupUncertainty(c.uncertaintyChanged, b.intervals),
      uncertaintyIntervals: c.uncertaintyChanged.length,
      renamed: c.renamed,
      added: c.added,
      removed: c.removed,
      colourChanged: c.colourChanged,
      gsspChanged: c.gsspChanged,
      gsspStated: c.gsspStated,
      parentChanged: c.parentChanged,
      rankChanged: c.rankChanged,
      matched: c.matched.length,
    },
  };
}

/** When an edition was issued: the year and month in its label ("ICS 2024/12"), else when it was imported. */
function editionDate(e: { label: string; createdAt: string | Date }): string {
  const m = /(\d{4})\s*\/\s*(\d{1,2})/.exec(e.label);
  return m ? `${m[1]}-${m[2].padStart(2, "0")}` : new Date(e.createdAt).toISOString().slice(0, 7);
}

const unc = (u: number | null, approx: boolean) => `${approx ? "~ " : ""}${u === null ? "no ±" : `± ${fmtMa(u)}`}`;

export default function CompareEditions({ loaderData }: Route.ComponentProps) {
  const { choices, fromSlug, toSlug, pair, same } = loaderData;
  const swapped = "swapped" in loaderData && loaderData.swapped;
  return (
    <div>
      <h1 className="text-3xl">Compare two editions</h1>
      <p className="mt-2 max-w-3xl text-ink-soft">
        Which boundaries moved, and by how much. Exhibits pinned to the older edition place their markers by its figures; each moved boundary here is a marker that may need to move.
      </p>
      <Form method="get" className="card mt-5 flex flex-wrap items-end gap-4 font-sans text-sm">
        <div>
          <label htmlFor="cmp-from" className="mb-1 block font-semibold">Older edition (before)</label>
          <select id="cmp-from" name="from" defaultValue={fromSlug ?? ""} className="field w-auto">
            {choices.map((e) => <option key={e.slug} value={e.slug}>{e.label} ({e.status})</option>)}
          </select>
        </div>
        <span aria-hidden="true" className="pb-2 text-xl">→</span>
        <div>
          <label htmlFor="cmp-to" className="mb-1 block font-semibold">Newer edition (after)</label>
          <select id="cmp-to" name="to" defaultValue={toSlug ?? ""} className="field w-auto">
            {choices.map((e) => <option key={e.slug} value={e.slug}>{e.label} ({e.status})</option>)}
          </select>
        </div>
        <button type="submit" className="btn">Compare</button>
      </Form>
      {same ? <p className="card mt-6">Choose two different editions.</p> : null}
      {swapped && pair ? <p className="mt-4 font-sans text-sm" role="status">{pair.to.label} was chosen first but is the newer edition, so it is shown second: older before, newer after.</p> : null}
      {!pair && !same ? <p className="card mt-6">At least two editions are needed for a comparison.</p> : null}
      {pair ? (
        <>
          <h2 className="mt-8 text-2xl">
            <span className="font-sans text-base font-normal text-ink-soft">Older: </span><Link to={`/editions/${pair.from.slug}`}>{pair.from.label}</Link> <StatusBadge status={pair.from.status} /> →{" "}
            <span className="font-sans text-base font-normal text-ink-soft">newer: </span><Link to={`/editions/${pair.to.slug}`}>{pair.to.label}</Link> <StatusBadge status={pair.to.status} />
          </h2>
          <ul className="mt-4 grid gap-3 font-sans text-sm sm:grid-cols-3 lg:grid-cols-6" aria-label="Summary">
            {[
              ["Boundaries moved", pair.moved.length, `${pair.movedIntervals} interval bases`],
              ["Uncertainties changed", pair.uncertainty.length, `${pair.uncertaintyIntervals} interval bases`],
              ["Renamed", pair.renamed.length, null],
              ["Added", pair.added.length, null],
              ["Removed", pair.removed.length, null],
              ["Colours changed", pair.colourChanged.length, null],
            ].map(([label, n, note]) => (
              <li key={String(label)} className="card p-3">
                <p className="text-ink-soft">{label}</p>
                <p className="figures text-2xl font-semibold">{n}</p>
                {note ? <p className="text-xs text-ink-soft">{note}</p> : null}
              </li>
            ))}
          </ul>

          <section className="mt-8" aria-labelledby="moved-heading">
            <h3 id="moved-heading" className="text-xl">Moved boundaries</h3>
            {pair.moved.length === 0 ? (
              <p className="mt-2 text-ink-soft">No boundary moved: every base age is the same in both editions.</p>
            ) : (
              <>
                <p className="mb-3 mt-1 text-ink-soft">One row per boundary, youngest first; a boundary shared by several ranks is named by the shallowest (the others are in the table).</p>
                {pair.showExhibits ? (
                  <p className="mb-3 font-sans text-sm" data-testid="affected-summary">
                    {pair.affected === 0
                      ? `None of your organisation's exhibits pinned to ${pair.from.label} has a marker on a moved boundary.`
                      : `${pair.affected} of your organisation's exhibits pinned to ${pair.from.label} ${pair.affected === 1 ? "has" : "have"} markers on moved boundaries; each is listed in the table and shows its impact report.`}
                  </p>
                ) : null}
                <ShiftChart rows={pair.moved} title={`Boundaries moved from ${pair.from.label} to ${pair.to.label}, shift in Ma`} />
                <div className="card scroll-x mt-4 p-0" tabIndex={0} role="region" aria-label="Moved boundaries (scrolls sideways on narrow screens)">
                  <table className="w-full text-left text-sm" data-testid="moved-table">
                    <caption className="sr-only">Moved boundaries</caption>
                    <thead className="border-b border-rule bg-paper">
                      <tr>
                        <th scope="col" className="px-3 py-2">Base of</th>
                        <th scope="col" className="px-3 py-2">Rank</th>
                        <th scope="col" className="px-3 py-2 text-right">{pair.from.label} (Ma)</th>
                        <th scope="col" className="px-3 py-2 text-right">{pair.to.label} (Ma)</th>
                        <th scope="col" className="px-3 py-2 text-right">Shift (Ma)</th>
                        <th scope="col" className="px-3 py-2 text-right">Shift (% of old)</th>
                        {pair.showExhibits ? <th scope="col" className="px-3 py-2">Your exhibits affected</th> : null}
                      </tr>
                    </thead>
                    <tbody>
                      {pair.moved.map((m) => (
                        <tr key={m.key} className="border-b border-rule last:border-0">
                          <td className="px-3 py-1.5">
                            <span aria-hidden="true" className="mr-2 inline-block h-3 w-5 rounded-sm border border-ink/40 align-middle" style={{ background: m.color }} />
                            <strong>{m.names[0]}</strong>
                            {m.names.length > 1 ? <span className="text-ink-soft">, {m.names.slice(1).join(", ")}</span> : null}
                          </td>
                          <td className="px-3 py-1.5">{RANK_LABELS[m.rank]}</td>
                          <td className="num px-3 py-1.5 text-right">{fmtMa(m.oldBaseMa)}{m.oldUncertaintyMa !== null ? ` ± ${fmtMa(m.oldUncertaintyMa)}` : ""}</td>
                          <td className="num px-3 py-1.5 text-right">{fmtMa(m.newBaseMa)}{m.newUncertaintyMa !== null ? ` ± ${fmtMa(m.newUncertaintyMa)}` : ""}</td>
                          <td className="num px-3 py-1.5 text-right font-semibold">{fmtShift(m.shiftMa)}</td>
                          <td className="num px-3 py-1.5 text-right">{fmtPercent(m.shiftPercent)}</td>
                          {pair.showExhibits ? (
                            <td className="px-3 py-1.5">
                              {m.exhibits.length === 0 ? <span className="text-ink-soft">none</span> : m.exhibits.map((e, i) => <span key={e.slug}>{i ? ", " : ""}<Link to={`/studio/exhibits/${e.slug}`}>{e.title}</Link></span>)}
                            </td>
                          ) : null}
                        </tr>
                      ))}
                    </tbody>
                  </table>
                </div>
              </>
            )}
          </section>

          {pair.uncertainty.length ? (
            <section className="mt-8" aria-labelledby="unc-heading">
              <h3 id="unc-heading" className="text-xl">Changed uncertainties</h3>
              <div className="card scroll-x mt-3 p-0" tabIndex={0} role="region" aria-label="Changed uncertainties (scrolls sideways on narrow screens)">
                <table className="w-full text-left text-sm">
                  <thead className="border-b border-rule bg-paper">
                    <tr>
                      <th scope="col" className="px-3 py-2">Base of</th>
                      <th scope="col" className="px-3 py-2 text-right">Base in {pair.to.label} (Ma)</th>
                      <th scope="col" className="px-3 py-2 text-right">{pair.from.label}</th>
                      <th scope="col" className="px-3 py-2 text-right">{pair.to.label}</th>
                    </tr>
                  </thead>
                  <tbody>
                    {pair.uncertainty.map((u) => (
                      <tr key={u.key} className="border-b border-rule last:border-0">
                        <td className="px-3 py-1.5"><strong>{u.names[0]}</strong>{u.names.length > 1 ? <span className="text-ink-soft">, {u.names.slice(1).join(", ")}</span> : null}</td>
                        <td className="num px-3 py-1.5 text-right">{fmtMa(u.baseMa)}</td>
                        <td className="num px-3 py-1.5 text-right">{unc(u.change.oldUncertaintyMa, u.change.oldApproximate)}</td>
                        <td className="num px-3 py-1.5 text-right">{unc(u.change.newUncertaintyMa, u.change.newApproximate)}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            </section>
          ) : null}

          <section className="mt-8 grid gap-4 md:grid-cols-2" aria-label="Other changes">
            <ChangeList title="Renamed" empty="No interval was renamed." items={pair.renamed.map((r) => `${r.oldName} → ${r.newName} (${RANK_LABELS[r.rank].toLowerCase()})`)} />
            <ChangeList title="Added" empty="No interval was added." items={pair.added.map((r) => `${r.name} (${RANK_LABELS[r.rank].toLowerCase()}, ${fmtMa(r.baseMa)}–${fmtMa(r.topMa)} Ma)`)} />
            <ChangeList title="Removed" empty="No interval was removed." items={pair.removed.map((r) => `${r.name} (${RANK_LABELS[r.rank].toLowerCase()}, ${fmtMa(r.baseMa)}–${fmtMa(r.topMa)} Ma)`)} />
            <ChangeList title="Colour changed" empty="Every colour is the same." items={pair.colourChanged.map((c) => `${c.name}: ${c.oldColor} → ${c.newColor}`)} />
            <ChangeList title="Parent or rank changed" empty="No interval changed its parent or rank." items={[...pair.parentChanged.map((p) => `${p.name}: under ${p.oldParent ?? "—"} → under ${p.newParent ?? "—"}`), ...pair.rankChanged.map((r) => `${r.name}: ${r.oldRank} → ${r.newRank}`)]} />
            <ChangeList title="GSSP ratification changed" empty="No GSSP flag changed between two stated values." items={pair.gsspChanged.map((g) => `${g.name}: ${fmtGssp(g.oldGssp)} → ${fmtGssp(g.newGssp)}`)} />
          </section>
          {pair.gsspStated.length ? (
            <details className="card mt-4">
              <summary className="cursor-pointer font-sans font-semibold">
                GSSP flag stated in only one edition: {pair.gsspStated.length} interval{pair.gsspStated.length === 1 ? "" : "s"}
              </summary>
              <p className="mt-2 text-sm text-ink-soft">One edition's source says nothing about ratification for these; that is a gap in the data, not a change on the chart.</p>
              <ul className="mt-2 columns-2 font-sans text-sm md:columns-3">
                {pair.gsspStated.map((g) => <li key={g.name}>{g.name}: {fmtGssp(g.oldGssp)} → {fmtGssp(g.newGssp)}</li>)}
              </ul>
            </details>
          ) : null}
          <p className="mt-6 font-sans text-sm text-ink-soft">{pair.matched} intervals matched by name or position.</p>
        </>
      ) : null}
    </div>
  );
}

function ChangeList({ title, items, empty }: { title: string; items: string[]; empty: string }) {
  return (
    <div className="card">
      <h3 className="text-lg">{title}</h3>
      {items.length === 0 ? <p className="mt-1 text-sm text-ink-soft">{empty}</p> : (
        <ul className="mt-2 list-disc pl-5 text-sm">{items.map((t) => <li key={t}>{t}</li>)}</ul>
      )}
    </div>
  );
}
