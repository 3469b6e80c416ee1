// /studio/library — the dated-event library: the shared entries every organisation sees and the
// organisation's own. Everyone reads; editors and admins add, edit and delete their own entries.
import { useEffect, useRef } from "react";
import { Form, Link, useSubmit } from "react-router";
import { ScopeBadge } from "~/components/dated-events/event-form";
import { CHECK_FILTERS, CheckingSummary, checksFigures, IntervalWarnings, isCheckFilter, type CheckFilter } from "~/components/dated-events/checking";
import { AGE_KIND_LABELS } from "~/lib/dated-events";
import { can } from "~/lib/permissions";
import { requireMember } from "#server/auth.server.ts";
import { LIBRARY_SCOPES, libraryIntervalWarnings, listEvents, type LibraryScope } from "#server/dated-events.server.ts";
import type { Route } from "./+types/library";

export const meta: Route.MetaFunction = () => [{ title: "Event library · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const url = new URL(request.url);
  const q = (url.searchParams.get("q") ?? "").trim().slice(0, 100);
  const rawScope = url.searchParams.get("scope") ?? "all";
  const scope: LibraryScope = (LIBRARY_SCOPES as readonly string[]).includes(rawScope) ? (rawScope as LibraryScope) : "all";
  const rawChecked = url.searchParams.get("checked");
  const checked: CheckFilter | null = isCheckFilter(rawChecked) ? rawChecked : null;
  const [listed, all] = await Promise.all([listEvents(member.organisation.id, { q, scope }), q || scope !== "all" ? listEvents(member.organisation.id) : null]);
  const everything = all ?? listed;
  // Editors, reviewers and admins check figures: they see how far each was checked and which
  // entries name an interval their age does not fall in (on the organisation's current edition).
  const checker = checksFigures(member.roles);
  const events = checker && checked ? listed.filter((e) => e.verification === CHECK_FILTERS[checked]) : listed;
  const count = (f: CheckFilter) => listed.filter((e) => e.verification === CHECK_FILTERS[f]).length;
  const checking = checker
    ? { counts: { checked: count("checked"), quoted: count("quoted"), memory: count("memory") }, filter: checked, ...(await libraryIntervalWarnings(member.organisation.id, everything)) }
    : null;
  return {
    checking,
    organisation: member.organisation.name,
    canManage: can(member.subject, "dated-events.manage"),
    q,
    scope,
    events,
    totals: { shared: everything.filter((e) => e.scope === "shared").length, ours: everything.filter((e) => e.scope === "organisation").length },
  };
}

export default function Library({ loaderData }: Route.ComponentProps) {
  const { organisation, canManage, q, scope, events, totals, checking } = loaderData;
  const submit = useSubmit();
  const formRef = useRef<HTMLFormElement>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  useEffect(() => () => clearTimeout(timer.current), []);
  const searchSoon = () => {
    clearTimeout(timer.current);
    timer.current = setTimeout(() => formRef.current && submit(formRef.current, { replace: true, preventScrollReset: true }), 250);
  };
  const filtered = Boolean(q) || scope !== "all";
  return (
    <div>
      <div className="flex flex-wrap items-end justify-between gap-4">
        <div className="max-w-3xl">
          <h1 className="text-3xl">Event library</h1>
          <p className="mt-2 text-ink-soft">
            Dated events that are not chart boundaries — the oldest mineral grains, the first land plants — each with its age, uncertainty and published source.
            Shared entries are kept by Eonscale with their citations and are read-only; {canManage ? `add ${organisation}'s own entries for anything else.` : `${organisation}'s editors can add the organisation's own entries.`}
          </p>
        </div>
        <div className="flex gap-2">
          {canManage ? <Link to="/studio/library/new" className="btn no-underline">Add an event</Link> : null}
          <Link to="/studio/library/decay" className="btn-quiet no-underline">Decay systems</Link>
        </div>
      </div>

      <Form method="get" ref={formRef} role="search" aria-label="Search the library" className="mt-6 flex flex-wrap items-end gap-3">
        <div className="min-w-64 flex-1">
          <label htmlFor="library-q" className="mb-1 block text-sm font-semibold">Search</label>
          <input id="library-q" type="search" name="q" defaultValue={q} placeholder="zircon, extinction, Homo…" className="field" onChange={searchSoon} />
        </div>
        <div>
          <label htmlFor="library-scope" className="mb-1 block text-sm font-semibold">Show</label>
          <select id="library-scope" name="scope" defaultValue={scope} className="field w-auto" onChange={(e) => submit(e.currentTarget.form, { replace: true, preventScrollReset: true })}>
            <option value="all">All entries ({totals.shared + totals.ours})</option>
            <option value="shared">Shared library ({totals.shared})</option>
            <option value="ours">{organisation} ({totals.ours})</option>
          </select>
        </div>
        <button type="submit" className="btn-quiet">Search</button>
        {filtered ? <Link to="/studio/library" className="btn-quiet no-underline">Clear</Link> : null}
      </Form>

      {checking ? (
        <>
          <CheckingSummary counts={checking.counts} filter={checking.filter} query={q} />
          <IntervalWarnings editionLabel={checking.editionLabel} warnings={checking.warnings} />
        </>
      ) : null}

      <p className="mt-4 font-sans text-sm text-ink-soft" role="status">
        {events.length === 0 ? "No entries match." : `${events.length} ${events.length === 1 ? "entry" : "entries"}${filtered ? " match" : ""}, oldest first.`}
      </p>

      {events.length === 0 ? (
        <div className="card mt-3">
          <p>
            {scope === "ours" && !q
              ? `${organisation} has no entries of its own yet.${canManage ? " Add one for an event the shared library lacks — a local fossil find, a dated lava flow on your trail." : ""}`
              : "Nothing matches that search. Try a shorter word, or show all entries."}
          </p>
          {canManage && scope === "ours" && !q ? <Link to="/studio/library/new" className="btn mt-4 no-underline">Add an event</Link> : null}
        </div>
      ) : (
        <>
        {/* Small screens: one card per entry. */}
        <ul className="mt-3 grid gap-3 md:hidden">
          {events.map((e) => (
            <li key={e.id} className="card p-4">
              <div className="flex flex-wrap items-center gap-2">
                <Link to={`/studio/library/${e.id}`} className="font-sans font-semibold">{e.name}</Link>
                <ScopeBadge scope={e.scope} />
              </div>
              <p className="mt-1 figures font-semibold">{e.ageText}{e.ageKind !== "point" ? <span className="ml-2 text-xs font-normal text-ink-soft">{AGE_KIND_LABELS[e.ageKind]}</span> : null}</p>
              <p className="mt-1 line-clamp-3 text-sm text-ink-soft">{e.summary}</p>
              {e.datingMethod ? <p className="mt-1 font-sans text-xs">{e.datingMethod}</p> : null}
            </li>
          ))}
        </ul>
        <div className="card mt-3 hidden overflow-x-auto p-0 md:block">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Dated events, oldest first</caption>
            <thead className="border-b border-rule bg-paper">
              <tr>
                <th scope="col" className="p-3">Event</th>
                <th scope="col" className="p-3 text-right">Age</th>
                <th scope="col" className="p-3">Dating method</th>
                <th scope="col" className="p-3">Source</th>
              </tr>
            </thead>
            <tbody>
              {events.map((e) => (
                <tr key={e.id} className="border-b border-rule align-top last:border-0">
                  <td className="max-w-md p-3">
                    <div className="flex flex-wrap items-center gap-2">
                      <Link to={`/studio/library/${e.id}`} className="font-semibold">{e.name}</Link>
                      <ScopeBadge scope={e.scope} />
                    </div>
                    <p className="mt-1 line-clamp-2 font-serif text-ink-soft">{e.summary}</p>
                  </td>
                  <td className="whitespace-nowrap p-3 text-right figures">
                    <span className="font-semibold">{e.ageText}</span>
                    {e.ageKind !== "point" ? <div className="text-xs text-ink-soft">{AGE_KIND_LABELS[e.ageKind]}</div> : null}
                  </td>
                  <td className="max-w-48 p-3">{e.datingMethod ?? <span className="text-ink-soft">—</span>}</td>
                  <td className="max-w-72 p-3">
                    <p className="line-clamp-2" title={e.citation}>{e.citation}</p>
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
        </>
      )}
    </div>
  );
}
