// The span and medium settings. The preview above follows these fields as they are typed; the draft
// lives in the composer so that both read the same values. The two legibility thresholds are typed
// in a unit that suits the medium (metres on a trail, centimetres on a wall) and posted in mm.
import { useState } from "react";
import { Form } from "react-router";
import { IntentFields, Labelled, SubmitButton, type FieldError } from "~/components/exhibit/form-bits";
import { Term } from "~/components/term";
import { SETTINGS_LABELS, type ExhibitSpec, type SettingsDraft } from "~/lib/exhibit";
import { LEGIBILITY_DEFAULTS, MEDIUM_TYPES, type MediumType } from "~/lib/scale/legibility";
import { AGE_UNITS, LENGTH_UNITS } from "~/lib/units";

type SetField = (k: keyof SettingsDraft, value: string) => void;

const MEDIUM_NAMES: Record<MediumType, string> = { trail: "trail or path", wall: "wall", rope: "rope or cord", banner: "banner or print", other: "something else" };
const THRESHOLD_UNITS = { mm: 1, cm: 10, m: 1000 } as const;
type ThresholdUnit = keyof typeof THRESHOLD_UNITS;
const unitFor = (medium: MediumType, kind: "visible" | "spacing"): ThresholdUnit => (medium === "trail" ? (kind === "spacing" ? "m" : "cm") : medium === "banner" ? "mm" : "cm");
const inUnit = (metres: number, unit: ThresholdUnit) => `${Number(((metres * 1000) / THRESHOLD_UNITS[unit]).toPrecision(6)).toLocaleString("en-GB")} ${unit}`;

/** A threshold typed in the medium's unit; the draft (and the posted field) keep millimetres. */
function ThresholdField({ name, label, term, mm, medium, kind, setField, error }: { name: "minVisibleMm" | "minSpacingMm"; label: string; term: string; mm: string; medium: MediumType; kind: "visible" | "spacing"; setField: SetField; error?: string }) {
  const [unit, setUnit] = useState<ThresholdUnit>(unitFor(medium, kind));
  const [text, setText] = useState(mm === "" ? "" : String(Number(mm) / THRESHOLD_UNITS[unit]));
  const toMm = (value: string, u: ThresholdUnit) => (value.trim() === "" ? "" : Number.isFinite(Number(value)) ? String(Number(value) * THRESHOLD_UNITS[u]) : value);
  const fallback = LEGIBILITY_DEFAULTS[medium][kind === "visible" ? "minVisibleMetres" : "minSpacingMetres"];
  return (
    <div>
      <span className="mb-1 block font-semibold"><Term id={term}>{label}</Term> <span className="font-normal text-ink-soft">(optional)</span></span>
      <div className="flex gap-2">
        <input aria-label={label} inputMode="decimal" className="field" value={text} placeholder={`default ${inUnit(fallback, unit)}`} aria-invalid={error ? true : undefined}
          onChange={(e) => { setText(e.target.value); setField(name, toMm(e.target.value, unit)); }} />
        <select aria-label={`Unit of the ${label.toLowerCase()}`} className="field w-20" value={unit}
          onChange={(e) => { const u = e.target.value as ThresholdUnit; setUnit(u); setField(name, toMm(text, u)); }}>
          {Object.keys(THRESHOLD_UNITS).map((u) => <option key={u}>{u}</option>)}
        </select>
      </div>
      <input type="hidden" name={name} value={mm} />
      {error ? <span className="mt-1 block text-danger">{error}</span> : null}
    </div>
  );
}

export function SettingsForm({ spec, draft, setField, revision, err }: { spec: ExhibitSpec; draft: SettingsDraft; setField: SetField; revision: number; err: FieldError }) {
  const set = (k: keyof SettingsDraft) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setField(k, e.target.value);
  return (
    <section className="card" aria-labelledby="settings-h">
      <h2 id="settings-h" className="text-xl">Span and medium</h2>
      <p className="mt-1 font-sans text-sm text-ink-soft">The preview above follows these fields as you type; nothing is saved until you press Save settings. Ages in <Term id="ma">Ma</Term> (million years ago), <Term id="ka">ka</Term>, <Term id="ga">Ga</Term> or <Term id="a">a</Term>.</p>
      <Form method="post" className="mt-4 grid gap-4 font-sans text-sm md:grid-cols-2" noValidate>
        <IntentFields intent="settings" revision={revision} />
        <input type="hidden" name="mediumKind" value={spec.medium.kind} />
        <Labelled label="Title" error={err("settings", "title")}><input name="title" className="field" value={draft.title} onChange={set("title")} /></Labelled>
        <Labelled label="What the exhibit is on"><select name="mediumType" className="field" value={draft.mediumType} onChange={set("mediumType")}>{MEDIUM_TYPES.map((m) => <option key={m} value={m}>{MEDIUM_NAMES[m]}</option>)}</select></Labelled>
        <Labelled label={SETTINGS_LABELS.spanOlder} error={err("settings", "spanOlderValue")}>
          <div className="flex gap-2"><input name="spanOlderValue" inputMode="decimal" className="field" value={draft.spanOlderValue} onChange={set("spanOlderValue")} /><select name="spanOlderUnit" aria-label="Unit of the older end" className="field w-24" value={draft.spanOlderUnit} onChange={set("spanOlderUnit")}>{AGE_UNITS.map((u) => <option key={u}>{u}</option>)}</select></div>
        </Labelled>
        <Labelled label={SETTINGS_LABELS.spanYounger} error={err("settings", "spanYoungerValue")}>
          <div className="flex gap-2"><input name="spanYoungerValue" inputMode="decimal" className="field" value={draft.spanYoungerValue} onChange={set("spanYoungerValue")} /><select name="spanYoungerUnit" aria-label="Unit of the younger end" className="field w-24" value={draft.spanYoungerUnit} onChange={set("spanYoungerUnit")}>{AGE_UNITS.map((u) => <option key={u}>{u}</option>)}</select></div>
        </Labelled>
        {spec.medium.kind === "length" ? (
          <Labelled label={SETTINGS_LABELS.length} error={err("settings", "lengthValue")}>
            <div className="flex gap-2"><input name="lengthValue" inputMode="decimal" className="field" value={draft.lengthValue} onChange={set("lengthValue")} /><select name="lengthUnit" aria-label="Unit of the length" className="field w-24" value={draft.lengthUnit} onChange={set("lengthUnit")}>{LENGTH_UNITS.map((u) => <option key={u}>{u}</option>)}</select></div>
          </Labelled>
        ) : null}
        <Labelled label="Distances in"><select name="unitsPreference" className="field" value={draft.unitsPreference} onChange={set("unitsPreference")}><option value="metric">metric (m, km)</option><option value="us">US customary (ft, mi)</option></select></Labelled>
        <ThresholdField key={`v-${draft.mediumType}`} name="minVisibleMm" label={SETTINGS_LABELS.minVisible} term="visible-length" mm={draft.minVisibleMm} medium={draft.mediumType} kind="visible" setField={setField} error={err("settings", "minVisibleMm")} />
        <ThresholdField key={`s-${draft.mediumType}`} name="minSpacingMm" label={SETTINGS_LABELS.minSpacing} term="spacing" mm={draft.minSpacingMm} medium={draft.mediumType} kind="spacing" setField={setField} error={err("settings", "minSpacingMm")} />
        <div className="md:col-span-2"><SubmitButton label="Save settings" /></div>
      </Form>
    </section>
  );
}
