// What re-pinning the exhibit to the current chart edition would move, and the re-pin button.
import { Form } from "react-router";
import { IntentFields } from "~/components/exhibit/form-bits";
import { formatLength, type ComposerView, type UnitsPreference } from "~/lib/exhibit";

export function ImpactSection({ impact, editionLabel, units, revision, canEdit }: { impact: NonNullable<ComposerView["impact"]>; editionLabel: string; units: UnitsPreference; revision: number; canEdit: boolean }) {
  return (
    <section className="card" aria-labelledby="impact-h">
      <h2 id="impact-h" className="text-xl">Impact of the newer chart edition: {editionLabel} → {impact.edition.label}</h2>
      <p className="mt-1 font-sans text-sm text-ink-soft">Markers whose age differs between the two editions, and how far each would move on this exhibit. {impact.report.unchanged} boundary marker{impact.report.unchanged === 1 ? " is" : "s are"} unchanged.</p>
      {impact.report.rows.length ? (
        <div className="scroll-x mt-3" tabIndex={0} role="region" aria-label="Markers that would move (scrolls sideways on narrow screens)">
          <table className="w-full text-left font-sans text-sm">
            <thead className="border-b border-rule"><tr><th className="p-2">#</th><th className="p-2">Marker</th><th className="p-2">Old age</th><th className="p-2">New age</th><th className="p-2">Change</th><th className="p-2">Moves</th></tr></thead>
            <tbody>
              {impact.report.rows.map((r) => (
                <tr key={r.markerId} className="border-b border-rule last:border-0">
                  <td className="num p-2">{r.number}</td>
                  <td className="p-2">{r.label}{r.newIntervalName ? ` (now ${r.newIntervalName})` : ""}</td>
                  <td className="num p-2">{r.oldAgeMa} Ma{r.oldUncertaintyMa != null ? ` ± ${r.oldUncertaintyMa}` : ""}</td>
                  <td className="num p-2">{r.newAgeMa == null ? "not in the new edition" : `${r.newAgeMa} Ma${r.newUncertaintyMa != null ? ` ± ${r.newUncertaintyMa}` : ""}`}</td>
                  <td className="num p-2">{r.shiftMa == null ? "—" : `${r.shiftMa > 0 ? "+" : ""}${Number(r.shiftMa.toFixed(6))} Ma`}</td>
                  <td className="num p-2">{r.shiftMetres == null ? "—" : r.shiftMetres === 0 ? "no move (± changed)" : `${formatLength(Math.abs(r.shiftMetres), units, Math.min(0.001, Math.abs(r.shiftMetres) / 10))} towards the ${r.shiftMetres > 0 ? "younger" : "older"} end`}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : <p className="mt-2 font-sans text-sm">No marker moves.</p>}
      {canEdit ? (
        <Form method="post" className="mt-4">
          <IntentFields intent="repin" revision={revision} />
          <button type="submit" className="btn">Move to {impact.edition.label} (re-pin)</button>
          <span className="ml-3 font-sans text-sm text-ink-soft">Makes a new revision; it goes through review again.</span>
        </Form>
      ) : null}
    </section>
  );
}
