// The span and medium settings. The preview follows these fields as they are typed; the draft lives
// in the composer so that both read the same values.
import { Form } from "react-router";
import { IntentFields, Labelled, SubmitButton, type FieldError } from "~/components/exhibit/form-bits";
import type { ExhibitSpec, SettingsDraft } from "~/lib/exhibit";
import { MEDIUM_TYPES } from "~/lib/scale/legibility";
import { AGE_UNITS, LENGTH_UNITS } from "~/lib/units";

type Change = (k: keyof SettingsDraft) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => void;

export function SettingsForm({ spec, draft, set, revision, err }: { spec: ExhibitSpec; draft: SettingsDraft; set: Change; revision: number; err: FieldError }) {
  return (
    <section className="card mt-6" aria-labelledby="settings-h">
      <h2 id="settings-h" className="text-xl">Span and medium</h2>
      <p className="mt-1 font-sans text-sm text-ink-soft">The preview follows these fields as you type; nothing is saved until you press Save settings.</p>
      <Form method="post" className="mt-4 grid gap-4 font-sans text-sm md:grid-cols-2" noValidate>
        <IntentFields intent="settings" revision={revision} />
        <input type="hidden" name="mediumKind" value={spec.medium.kind} />
        <Labelled label="Title" error={err("settings", "title")}><input name="title" className="field" value={draft.title} onChange={set("title")} /></Labelled>
        <Labelled label="Medium type"><select name="mediumType" className="field" value={draft.mediumType} onChange={set("mediumType")}>{MEDIUM_TYPES.map((m) => <option key={m}>{m}</option>)}</select></Labelled>
        <Labelled label="Older end" error={err("settings", "spanOlderValue")}>
          <div className="flex gap-2"><input name="spanOlderValue" inputMode="decimal" className="field" value={draft.spanOlderValue} onChange={set("spanOlderValue")} /><select name="spanOlderUnit" aria-label="Unit of the older end" className="field w-24" value={draft.spanOlderUnit} onChange={set("spanOlderUnit")}>{AGE_UNITS.map((u) => <option key={u}>{u}</option>)}</select></div>
        </Labelled>
        <Labelled label="Younger end" error={err("settings", "spanYoungerValue")}>
          <div className="flex gap-2"><input name="spanYoungerValue" inputMode="decimal" className="field" value={draft.spanYoungerValue} onChange={set("spanYoungerValue")} /><select name="spanYoungerUnit" aria-label="Unit of the younger end" className="field w-24" value={draft.spanYoungerUnit} onChange={set("spanYoungerUnit")}>{AGE_UNITS.map((u) => <option key={u}>{u}</option>)}</select></div>
        </Labelled>
        {spec.medium.kind === "length" ? (
          <Labelled label="Length" error={err("settings", "lengthValue")}>
            <div className="flex gap-2"><input name="lengthValue" inputMode="decimal" className="field" value={draft.lengthValue} onChange={set("lengthValue")} /><select name="lengthUnit" aria-label="Unit of the length" className="field w-24" value={draft.lengthUnit} onChange={set("lengthUnit")}>{LENGTH_UNITS.map((u) => <option key={u}>{u}</option>)}</select></div>
          </Labelled>
        ) : null}
        <Labelled label="Distances in"><select name="unitsPreference" className="field" value={draft.unitsPreference} onChange={set("unitsPreference")}><option value="metric">metric</option><option value="us">US customary</option></select></Labelled>
        <Labelled label="Smallest visible length (mm, optional)" error={err("settings", "minVisibleMm")}><input name="minVisibleMm" inputMode="decimal" className="field" value={draft.minVisibleMm} onChange={set("minVisibleMm")} placeholder="default for the medium" /></Labelled>
        <Labelled label="Smallest marker spacing (mm, optional)" error={err("settings", "minSpacingMm")}><input name="minSpacingMm" inputMode="decimal" className="field" value={draft.minSpacingMm} onChange={set("minSpacingMm")} placeholder="default for the medium" /></Labelled>
        <div className="md:col-span-2"><SubmitButton label="Save settings" /></div>
      </Form>
    </section>
  );
}
