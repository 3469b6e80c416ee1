// The exhibit's insets (sub-spans at a magnified scale, each with its own scale statement).
import { Form } from "react-router";
import { IntentFields, Labelled } from "~/components/exhibit/form-bits";
import { insetLetter } from "~/components/exhibit/scale-strip";
import { Term } from "~/components/term";
import { formatLength, type UnitsPreference } from "~/lib/exhibit";
import type { ScaleResult } from "~/lib/scale/compute";
import { AGE_UNITS } from "~/lib/units";

export function InsetsSection({ insets, savedCount, units, canEdit, revision, fields }: { insets: ScaleResult["insets"] | undefined; savedCount: number; units: UnitsPreference; canEdit: boolean; revision: number; fields: Record<string, string> }) {
  return (
    <section className="card" aria-labelledby="insets-h">
      <h2 id="insets-h" className="text-xl">Insets ({insets?.length ?? savedCount})</h2>
      <p className="mt-1 font-sans text-sm text-ink-soft">An <Term id="inset">inset</Term> shows a short stretch of time at a <Term id="magnification">magnified</Term> scale, with its own scale statement on the sign; lettered as on the strip.</p>
      <ul className="mt-3 space-y-2 font-sans text-sm">
        {insets?.map((i, k) => (
          <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 rounded border border-rule p-2">
            <span><strong>{insetLetter(k)} — {i.label}</strong> — {i.statement.lengthPerTime}; {formatLength(i.lengthMetres, units, i.lengthMetres / 1000)} long</span>
            {canEdit ? (
              <Form method="post">
                <IntentFields intent="remove-inset" revision={revision} />
                <input type="hidden" name="insetId" value={i.id} />
                <button type="submit" className="btn-quiet">Remove</button>
              </Form>
            ) : null}
          </li>
        ))}
      </ul>
      {canEdit ? <AddInset revision={revision} fields={fields} /> : null}
    </section>
  );
}

function AddInset({ revision, fields }: { revision: number; fields: Record<string, string> }) {
  return (
    <Form method="post" className="mt-4 grid gap-2 font-sans text-sm md:grid-cols-[1fr_auto_1fr_auto_1fr_2fr_auto] md:items-end" noValidate>
      <IntentFields intent="add-inset" revision={revision} />
      <Labelled label="From (older)" error={fields.olderValue}><input name="olderValue" inputMode="decimal" className="field" /></Labelled>
      <Labelled label="Unit"><select name="olderUnit" className="field" defaultValue="ka">{AGE_UNITS.map((u) => <option key={u}>{u}</option>)}</select></Labelled>
      <Labelled label="To (younger)" error={fields.youngerValue}><input name="youngerValue" inputMode="decimal" className="field" defaultValue="0" /></Labelled>
      <Labelled label="Unit"><select name="youngerUnit" className="field" defaultValue="ka">{AGE_UNITS.map((u) => <option key={u}>{u}</option>)}</select></Labelled>
      <Labelled label="Magnification ×" error={fields.magnification}><input name="magnification" inputMode="decimal" className="field" /></Labelled>
      <Labelled label="Label (optional)" error={fields.label}><input name="label" className="field" /></Labelled>
      <button type="submit" className="btn-quiet">Add inset</button>
    </Form>
  );
}
