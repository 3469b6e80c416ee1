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

const shown = (v: Correction["from"]) => (v === null ? "none" : String(v));

export function CorrectionList({ corrections }: { corrections: readonly Correction[] }) {
  if (corrections.length === 0) {
    return <p className="text-ink-soft">No corrections: the intervals are as the source file gives them.</p>;
  }
  return (
    <ol className="space-y-3">
      {corrections.map((c, i) => (
        <li key={i} className="rounded border border-rule bg-white p-3">
          <p className="font-sans text-sm">
            <strong>{c.interval}</strong> · <code>{c.field}</code>: <span className="figures">{shown(c.from)}</span> →{" "}
            <span className="figures font-semibold">{shown(c.to)}</span>
          </p>
          <p className="mt-1 text-sm">{c.reason}</p>
          <p className="mt-1 font-sans text-xs text-ink-soft">Authority: {c.source}</p>
        </li>
      ))}
    </ol>
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
