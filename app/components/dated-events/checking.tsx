// How far the library's figures were checked, in plain words, for the people who check them
// (editors, reviewers, admins): a count with a filter on the library page, a sentence on an entry.
// Never a badge on every line, and never shown to visitors.
import { Link } from "react-router";
import type { IntervalWarning } from "~/lib/interval-consistency";
import type { Verification } from "~/lib/dated-events";

/** The roles that check figures and so see how far each was checked: editors, reviewers, admins. */
export function checksFigures(roles: readonly string[]): boolean {
  return roles.some((r) => r === "editor" || r === "reviewer" || r === "admin");
}

export const CHECK_FILTERS = { checked: "checked against the source", quoted: "seen quoted by a secondary source", memory: "from memory" } as const satisfies Record<string, Verification>;
export type CheckFilter = keyof typeof CHECK_FILTERS;

export function isCheckFilter(v: string | null): v is CheckFilter {
  return v !== null && Object.hasOwn(CHECK_FILTERS, v);
}

/** "These figures were checked against … ." — the entry page's sentence. */
export function checkedSentence(verification: Verification, checkedAgainst: string | null, shared: boolean): string {
  if (verification === "checked against the source") {
    return checkedAgainst ? `The figures were checked against the published source: ${checkedAgainst}` : "The figures were checked against the published source.";
  }
  if (verification === "seen quoted by a secondary source") {
    return `The figures were seen quoted by a secondary source, not read in the paper itself${checkedAgainst ? `: ${checkedAgainst}` : "."}`;
  }
  return shared
    ? `The figures are from memory: the source could not be reached to check them${checkedAgainst ? ` (what could be checked: ${checkedAgainst})` : ""}. Check them against the paper before anything is printed.`
    : "The figures are marked “from memory”: check them against the paper before anything is printed.";
}

export function CheckingSummary({ counts, filter, query }: { counts: Record<CheckFilter, number>; filter: CheckFilter | null; query: string }) {
  const total = counts.checked + counts.quoted + counts.memory;
  const link = (f: CheckFilter | null) => {
    const p = new URLSearchParams();
    if (query) p.set("q", query);
    if (f) p.set("checked", f);
    const s = p.toString();
    return s ? `/studio/library?${s}` : "/studio/library";
  };
  const part = (f: CheckFilter, words: string) =>
    filter === f ? <strong>{counts[f]} {words}</strong> : <Link to={link(f)}>{counts[f]} {words}</Link>;
  return (
    <p className="mt-4 font-sans text-sm">
      How far the figures were checked ({total} entries): {part("checked", "checked against the published source")}, {part("quoted", "seen quoted by a secondary source")},{" "}
      {part("memory", "from memory")}.{filter ? <> <Link to={link(null)}>Show all</Link></> : null}
    </p>
  );
}

export function IntervalWarnings({ editionLabel, warnings }: { editionLabel: string | null; warnings: readonly IntervalWarning[] }) {
  if (!editionLabel) return null;
  if (warnings.length === 0) {
    return <p className="mt-2 font-sans text-sm text-ink-soft">Interval names in the entries agree with their ages on {editionLabel}, your organisation's current edition.</p>;
  }
  return (
    <section className="card mt-4 border-warn" aria-labelledby="interval-warnings">
      <h2 id="interval-warnings" className="text-lg">
        {warnings.length} {warnings.length === 1 ? "entry names an interval" : "entries name intervals"} its age does not fall in ({editionLabel})
      </h2>
      <ul className="mt-2 list-disc pl-5 text-sm">
        {warnings.map((w) => (
          <li key={`${w.eventId}-${w.interval}-${w.qualifier}-${w.boundary}`}>
            {w.eventId !== null ? <Link to={`/studio/library/${w.eventId}`}>{w.message}</Link> : w.message}
          </li>
        ))}
      </ul>
    </section>
  );
}
