// The automatic check results, per marker (pass / warning / fail with the reason in words; the word
// and an icon carry the result, not the colour alone), and the figures beside the pinned edition's.
import type { CheckReport, CheckResult, CheckStatus } from "~/lib/review/types";
import { formatAgeMa } from "~/lib/exhibit/display";

const MARK: Record<CheckStatus, { icon: string; word: string; tone: string }> = {
  pass: { icon: "✓", word: "Pass", tone: "text-ok" },
  warning: { icon: "!", word: "Warning", tone: "text-warn" },
  fail: { icon: "✕", word: "Fail", tone: "text-danger" },
};

function ResultLine({ r }: { r: CheckResult }) {
  const m = MARK[r.status];
  return (
    <li className="flex gap-2 py-1" data-status={r.status}>
      <span className={`w-20 shrink-0 font-semibold ${m.tone}`}><span aria-hidden="true">{m.icon}</span> {m.word}</span>
      <span>{r.message}</span>
    </li>
  );
}

export function CheckSummary({ report }: { report: CheckReport }) {
  const m = MARK[report.overall];
  return (
    <p className="font-sans text-sm" data-testid="check-summary">
      <strong className={m.tone}>{m.word === "Pass" ? "All checks pass" : m.word === "Warning" ? "Checks pass with warnings" : "Checks fail"}</strong>
      {" "}against {report.edition.label} (revision {report.revision}): {report.counts.pass} pass, {report.counts.warning} warning{report.counts.warning === 1 ? "" : "s"}, {report.counts.fail} fail. Recomputed on the server from the saved exhibit.
    </p>
  );
}

export function CheckList({ report, markers }: { report: CheckReport; markers: { id: string; number: number; label: string; ageText: string }[] }) {
  const general = report.results.filter((r) => r.markerId === null);
  const byMarker = new Map<string, CheckResult[]>();
  for (const r of report.results) if (r.markerId !== null) byMarker.set(r.markerId, [...(byMarker.get(r.markerId) ?? []), r]);
  const worst = (rs: CheckResult[]): CheckStatus => (rs.some((r) => r.status === "fail") ? "fail" : rs.some((r) => r.status === "warning") ? "warning" : "pass");
  return (
    <div className="space-y-4 font-sans text-sm">
      <div>
        <h3 className="font-semibold">The whole exhibit</h3>
        <ul>{general.map((r, i) => <ResultLine key={i} r={r} />)}</ul>
      </div>
      <div>
        <h3 className="font-semibold">Each marker</h3>
        <ul className="divide-y divide-rule">
          {markers.map((m) => {
            const rs = byMarker.get(m.id) ?? [];
            const w = MARK[worst(rs)];
            return (
              <li key={m.id} id={`marker-${m.id}`} className="py-2">
                <details open={worst(rs) !== "pass"}>
                  <summary className="cursor-pointer">
                    <span className={`font-semibold ${w.tone}`}><span aria-hidden="true">{w.icon}</span> {w.word}</span> · {m.number}. {m.label} <span className="text-ink-soft">({m.ageText})</span>
                  </summary>
                  <ul className="mt-1 pl-4">{rs.map((r, i) => <ResultLine key={i} r={r} />)}</ul>
                </details>
              </li>
            );
          })}
        </ul>
        {[...byMarker.keys()].filter((id) => !markers.some((m) => m.id === id)).map((id) => (
          <ul key={id}>{byMarker.get(id)!.map((r, i) => <ResultLine key={i} r={r} />)}</ul>
        ))}
      </div>
    </div>
  );
}

export function FiguresTable({ report }: { report: CheckReport }) {
  if (!report.figures.length) return <p className="font-sans text-sm text-ink-soft">This exhibit has no boundary markers.</p>;
  const pm = (v: number | null) => (v ? ` ± ${v} Ma` : "");
  return (
    <div className="overflow-x-auto">
      <table className="table-cards w-full font-sans text-sm">
        <caption className="sr-only">Boundary ages on the exhibit beside the pinned edition</caption>
        <thead>
          <tr className="text-left"><th scope="col" className="p-2">Marker</th><th scope="col" className="p-2">On the exhibit</th><th scope="col" className="p-2">{report.edition.label}</th><th scope="col" className="p-2">Same?</th></tr>
        </thead>
        <tbody>
          {report.figures.map((f) => (
            <tr key={f.markerId} className="border-t border-rule">
              <td className="p-2" data-label="Marker"><span className="num">{f.number}.</span> {f.label}</td>
              <td className="num p-2" data-label="On the exhibit">{formatAgeMa(f.exhibitAgeMa)}{pm(f.exhibitUncertaintyMa)}</td>
              <td className="num p-2" data-label={report.edition.label}>{f.editionAgeMa === null ? "not in this edition" : `${formatAgeMa(f.editionAgeMa)}${pm(f.editionUncertaintyMa)}`}</td>
              <td className={`p-2 font-semibold ${f.matches ? "text-ok" : "text-danger"}`} data-label="Same?">{f.matches ? "yes" : "NO"}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
