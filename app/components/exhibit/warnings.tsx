// The legibility warnings of the preview, each linked to the marker rows it is about (by table
// number and label), with what can be done about it: add the suggested inset, combine same-age
// markers into one, or acknowledge the warning with a written reason (the reviewer reads it).
import { useState } from "react";
import { Form } from "react-router";
import { IntentFields } from "~/components/exhibit/form-bits";
import type { WarningAcknowledgement } from "~/lib/exhibit";
import type { ScaleResult } from "~/lib/scale/compute";

type Warning = ScaleResult["warnings"][number];

const TITLES: Record<string, string> = {
  "markers-same-age": "Same age, same spot",
  "markers-too-close": "Markers too close together",
  "markers-too-close-in-inset": "Still too close in the inset",
  "duration-too-small": "Too small to see",
  "inset-longer-than-medium": "Inset longer than the exhibit",
};

export function WarningsSection({
  warnings,
  acknowledged,
  canEdit,
  revision,
  refusal,
}: {
  warnings: Warning[];
  acknowledged: ReadonlyMap<string, WarningAcknowledgement>;
  canEdit: boolean;
  revision: number;
  refusal?: { intent: string; error: string; fields: Record<string, string> };
}) {
  // Which acknowledge form was sent last, so that a refusal shows beside that one only.
  const [sentKey, setSentKey] = useState<string | null>(null);
  const open = warnings.filter((w) => !acknowledged.has(w.key));
  const done = warnings.filter((w) => acknowledged.has(w.key));
  return (
    <section className="card" id="warnings" aria-labelledby="warnings-h">
      <h2 id="warnings-h" className="text-xl">Legibility warnings ({open.length}{done.length ? `, ${done.length} acknowledged` : ""})</h2>
      {warnings.length === 0 ? <p className="mt-2 font-sans text-sm text-ok">No crowded markers or invisible durations.</p> : null}
      <ul className="mt-3 space-y-3">
        {[...open, ...done].map((w) => {
          const key = w.key;
          const ack = acknowledged.get(key);
          const rows = w.markers;
          const ackError = refusal?.intent === "acknowledge-warning" && sentKey === key ? (refusal.fields.reason ?? refusal.error) : undefined;
          const combineError = refusal?.intent === "combine-markers" && sentKey === key ? refusal.error : undefined;
          return (
            <li key={key} className={`rounded border p-3 font-sans text-sm ${ack ? "border-rule bg-paper" : "border-warn bg-white"}`} data-warning-key={key}>
              <p>
                <span className={`font-semibold ${ack ? "text-ink-soft" : "text-warn"}`}>{ack ? "Acknowledged — " : "⚠ "}{TITLES[w.code] ?? w.code}:</span> {w.message}
              </p>
              {rows.length ? (
                <p className="mt-1">
                  <span className="text-ink-soft">In the table: </span>
                  {rows.map((m, i) => (
                    <span key={m.id}>{i ? ", " : ""}<a href={`#marker-${m.id}`}>{m.number}. {m.label}</a></span>
                  ))}
                </p>
              ) : null}
              {ack ? <p className="mt-1 text-ink-soft">Reason given{ack.by ? ` by ${ack.by}` : ""} (saved version {ack.revision}): {ack.reason}</p> : null}
              {canEdit && !ack ? (
                <div className="mt-2 flex flex-wrap items-start gap-2">
                  {w.suggestedInset ? (
                    <Form method="post">
                      <IntentFields intent="add-inset" revision={revision} />
                      <input type="hidden" name="olderValue" value={w.suggestedInset.olderYears} />
                      <input type="hidden" name="olderUnit" value="a" />
                      <input type="hidden" name="youngerValue" value={w.suggestedInset.youngerYears} />
                      <input type="hidden" name="youngerUnit" value="a" />
                      <input type="hidden" name="magnification" value={w.suggestedInset.magnification} />
                      <input type="hidden" name="label" value={w.suggestedInset.label} />
                      <button type="submit" className="btn-quiet">Add the suggested inset: {w.suggestedInset.label}</button>
                    </Form>
                  ) : null}
                  {w.code === "markers-same-age" && rows.length > 1 ? (
                    <Form method="post" onSubmit={() => setSentKey(key)}>
                      <IntentFields intent="combine-markers" revision={revision} />
                      <input type="hidden" name="markerIds" value={w.pointIds.join(",")} />
                      <button type="submit" className="btn-quiet">Combine markers {rows.map((m) => m.number).join(" and ")} into one</button>
                      {combineError ? <p className="mt-1 text-danger" role="alert">{combineError}</p> : null}
                    </Form>
                  ) : null}
                  <details className="min-w-0 grow basis-64" open={Boolean(ackError)}>
                    <summary className="btn-quiet cursor-pointer list-none">Acknowledge with a reason…</summary>
                    <Form method="post" className="mt-2 space-y-2" onSubmit={() => setSentKey(key)} noValidate>
                      <IntentFields intent="acknowledge-warning" revision={revision} />
                      <input type="hidden" name="warningKey" value={key} />
                      <label className="block">
                        <span className="mb-1 block font-semibold">Why this is acceptable (the reviewer reads it)</span>
                        <textarea name="reason" rows={2} className="field" aria-invalid={ackError ? true : undefined} placeholder="e.g. The two signs share one post; both names are on it." />
                      </label>
                      {ackError ? <p className="text-danger" role="alert">{ackError}</p> : null}
                      <button type="submit" className="btn-quiet">Acknowledge</button>
                    </Form>
                  </details>
                </div>
              ) : null}
            </li>
          );
        })}
      </ul>
    </section>
  );
}
