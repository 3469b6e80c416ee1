// Small pieces shared by the edition pages: status badge, rank counts, corrections, problems.
import { RANKS, type Correction, type EditionStatus, type Problem, type Rank } from "~/lib/timescale";
import { RANK_LABELS } from "~/lib/chart/format";

const STATUS_STYLE: Record<EditionStatus, string> = {
  current: "border-ok bg-green-50 text-ok",
  draft: "border-warn bg-amber-50 text-warn",
  retired: "border-rule bg-paper-deep text-ink-soft",
};
export const STATUS_LABELS: Record<EditionStatus, string> = { current: "Current", draft: "Draft", retired: "Retired" };

export function StatusBadge({ status }: { status: EditionStatus }) {
  return (
    <span className={`inline-block rounded border px-2 py-0.5 font-sans text-xs font-semibold uppercase tracking-wide ${STATUS_STYLE[status]}`}>
      {STATUS_LABELS[status]}
    </span>
  );
}

export function RankCounts({ counts }: { counts: Record<Rank, number> }) {
  return (
    <dl className="flex flex-wrap gap-x-4 gap-y-1 font-sans text-sm">
      {RANKS.map((r) => (
        <div key={r} className="flex gap-1">
          <dt className="text-ink-soft">{RANK_LABELS[r]}s</dt>
          <dd className="figures font-semibold">{counts[r]}</dd>
        </div>
      ))}
    </dl>
  );
}

const FIELD_WORDS: Record<string, string> = {
  name: "Name",
  rank: "Level on the chart",
  parent: "Interval it belongs to",
  baseMa: "Start age (million years ago)",
  baseUncertaintyMa: "Give-or-take (±) of the start age, million years",
  topMa: "End age (million years ago)",
  color: "Chart colour",
  gssp: "Whether the start is ratified",
  boundaryKind: "How the start is defined (GSSP or GSSA)",
  approximate: "Whether the start age is approximate",
};

const shown = (field: string, v: Correction["from"]) =>
  v === null ? "not given" : v === true ? (field === "gssp" ? "ratified" : "yes") : v === false ? (field === "gssp" ? "not ratified" : "no") : String(v);

/** The source's own data-model words, said plainly (the stored correction keeps its exact wording). */
export function plainWords(text: string): string {
  return text
    .replace(/\bics-chart-(\d{4})-(\d{2})\.ttl\b/g, "the ICS chart data file $1/$2")
    .replace(/\(IRI (?:ischart:)?([\w-]+)\)/g, "(its entry for $1)")
    .replace(/skos:prefLabel(?:@en)?/g, "English name")
    .replace(/gts:ratifiedGSSA true/g, "marked as defined by an agreed age (GSSA)")
    .replace(/gts:ratifiedGSSP true/g, "marked as defined by a point in rock (GSSP)")
    .replace(/\bratifiedGSSP\b/g, "defined by a point in rock (GSSP)")
    .replace(/\bratifiedGSSA\b/g, "defined by an agreed age (GSSA)")
    .replace(/gts:\w+/g, "a field of the data file")
    .replace(/\bischart:([\w-]+)/g, "$1")
    .replace(/\bIRIs?\b/g, "entry")
    .replace(/\bedition\.corrections\b/g, "the corrections on this page")
    .replace(/\bdata file chart\.ttl\b/g, "chart data file")
    .replace(/(?:db|app|server)\/[\w./-]+/g, "the project's data");
}

function CorrectionItem({ c }: { c: Correction }) {
  return (
    <li className="rounded border border-rule bg-white p-3">
      <p className="font-sans text-sm">
        <strong>{c.interval}</strong> — {FIELD_WORDS[c.field] ?? c.field}: the source gives <span className="figures">{shown(c.field, c.from)}</span>; this edition uses{" "}
        <span className="figures font-semibold">{shown(c.field, c.to)}</span>.
      </p>
      <p className="mt-1 text-sm"><span className="font-sans font-semibold">Why: </span>{plainWords(c.reason)}</p>
      <p className="mt-1 font-sans text-xs text-ink-soft">Evidence: {plainWords(c.source)}</p>
    </li>
  );
}

export function CorrectionList({ corrections }: { corrections: readonly Correction[] }) {
  if (corrections.length === 0) {
    return <p className="text-ink-soft">No corrections: the intervals are as the source file gives them.</p>;
  }
  const fields = [...new Set(corrections.map((c) => c.field))];
  return (
    <div className="space-y-3">
      {fields.map((f) => {
        const list = corrections.filter((c) => c.field === f);
        return (
          <details key={f} open={list.length <= 12} className="rounded border border-rule bg-paper p-3">
            <summary className="cursor-pointer font-sans font-semibold">{FIELD_WORDS[f] ?? f}: {list.length} correction{list.length === 1 ? "" : "s"}</summary>
            <ol className="mt-3 space-y-3">{list.map((c, i) => <CorrectionItem key={i} c={c} />)}</ol>
          </details>
        );
      })}
    </div>
  );
}

export function ProblemTable({ problems, lineLabel }: { problems: readonly Problem[]; lineLabel: string }) {
  return (
    <div className="overflow-x-auto rounded border border-danger bg-white">
      <table className="w-full text-left text-sm" data-testid="import-problems">
        <caption className="sr-only">Problems found in the file</caption>
        <thead className="border-b border-rule bg-red-50">
          <tr>
            <th scope="col" className="px-3 py-2">{lineLabel}</th>
            <th scope="col" className="px-3 py-2">Interval</th>
            <th scope="col" className="px-3 py-2">Field</th>
            <th scope="col" className="px-3 py-2">Problem</th>
          </tr>
        </thead>
        <tbody>
          {problems.map((p, i) => (
            <tr key={i} className="border-b border-rule last:border-0 align-top">
              <td className="num px-3 py-1.5 font-semibold">{p.line ?? "—"}</td>
              <td className="px-3 py-1.5">{p.interval || "—"}</td>
              <td className="px-3 py-1.5"><code>{p.field || "—"}</code></td>
              <td className="px-3 py-1.5">{p.message}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
