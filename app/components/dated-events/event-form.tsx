// The dated-event form (create and edit) and the small pieces the library pages share.
import { useId } from "react";
import { Form } from "react-router";
import { Field, FormMessage } from "~/components/forms";
import {
  AGE_KIND_HINTS,
  AGE_KIND_LABELS,
  AGE_KINDS,
  LIBRARY_LIMITS,
  VERIFICATIONS,
  type AgeKind,
  type Verification,
} from "~/lib/dated-events";
import { AGE_UNITS } from "~/lib/units";

/** The form's text values (what the inputs show). */
export interface EventFormValues {
  name: string;
  slug: string;
  summary: string;
  ageValue: string;
  ageUnit: string;
  uncertaintyValue: string;
  ageKind: string;
  citation: string;
  doi: string;
  url: string;
  datingMethod: string;
  verification: string;
}

export const EMPTY_EVENT_FORM: EventFormValues = {
  name: "",
  slug: "",
  summary: "",
  ageValue: "",
  ageUnit: "Ma",
  uncertaintyValue: "",
  ageKind: "point",
  citation: "",
  doi: "",
  url: "",
  datingMethod: "",
  verification: "checked against the source",
};

/** The text values of a submitted form, to show them again next to the errors. */
export function formValues(form: FormData): EventFormValues {
  const out = { ...EMPTY_EVENT_FORM };
  for (const key of Object.keys(out) as (keyof EventFormValues)[]) {
    const v = form.get(key);
    if (typeof v === "string") out[key] = v;
  }
  return out;
}

function ErrorText({ id, error }: { id: string; error?: string }) {
  return error ? (
    <p id={id} className="mt-1 font-sans text-sm text-danger">
      {error}
    </p>
  ) : null;
}

function TextArea({ label, name, error, hint, defaultValue, rows = 3, maxLength }: { label: string; name: string; error?: string; hint?: string; defaultValue: string; rows?: number; maxLength?: number }) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className="mb-4">
      <label htmlFor={id} className="mb-1 block text-sm font-semibold">{label}</label>
      {hint ? <p id={`${id}-hint`} className="mb-1 font-sans text-sm text-ink-soft">{hint}</p> : null}
      <textarea id={id} name={name} rows={rows} maxLength={maxLength} defaultValue={defaultValue} className="field" aria-invalid={error ? true : undefined} aria-describedby={describedBy} />
      <ErrorText id={`${id}-error`} error={error} />
    </div>
  );
}

function Select({ label, name, error, hint, defaultValue, options }: { label: string; name: string; error?: string; hint?: string; defaultValue: string; options: { value: string; label: string }[] }) {
  const id = useId();
  const describedBy = [error ? `${id}-error` : null, hint ? `${id}-hint` : null].filter(Boolean).join(" ") || undefined;
  return (
    <div className="mb-4">
      <label htmlFor={id} className="mb-1 block text-sm font-semibold">{label}</label>
      {hint ? <p id={`${id}-hint`} className="mb-1 font-sans text-sm text-ink-soft">{hint}</p> : null}
      <select id={id} name={name} defaultValue={defaultValue} className="field" aria-invalid={error ? true : undefined} aria-describedby={describedBy}>
        {options.map((o) => <option key={o.value} value={o.value}>{o.label}</option>)}
      </select>
      <ErrorText id={`${id}-error`} error={error} />
    </div>
  );
}

export function EventForm({
  values,
  errors = {},
  formError,
  submitLabel,
  busy,
  intent,
  cancelTo,
}: {
  values: EventFormValues;
  errors?: Record<string, string>;
  formError?: string;
  submitLabel: string;
  busy: boolean;
  intent?: string;
  cancelTo: string;
}) {
  const ageId = useId();
  const ageErrors = [errors.ageValue, errors.ageUnit, errors.uncertaintyValue].filter(Boolean);
  return (
    <Form method="post" noValidate className="card">
      {formError ? <FormMessage>{formError}</FormMessage> : null}
      {intent ? <input type="hidden" name="intent" value={intent} /> : null}
      <Field label="Name" name="name" defaultValue={values.name} error={errors.name} maxLength={LIBRARY_LIMITS.name} required hint="As a label on a sign: “Oldest dated rock (Acasta Gneiss)”." />
      <TextArea label="Summary" name="summary" defaultValue={values.summary} error={errors.summary} maxLength={LIBRARY_LIMITS.summary} hint={`What happened, in a sentence or two a visitor can read (up to ${LIBRARY_LIMITS.summary} characters).`} />

      <fieldset className="mb-4" aria-describedby={ageErrors.length ? `${ageId}-errors` : `${ageId}-hint`}>
        <legend className="mb-1 block text-sm font-semibold">Age and uncertainty</legend>
        <p id={`${ageId}-hint`} className="mb-2 font-sans text-sm text-ink-soft">
          Exactly as the source gives it, e.g. 4404 ± 8 Ma or 315 ± 34 ka. The ± is in the same unit; leave it empty if the source gives none.
        </p>
        <div className="flex flex-wrap items-end gap-3">
          <div>
            <label htmlFor={`${ageId}-value`} className="mb-1 block font-sans text-sm">Age</label>
            <input id={`${ageId}-value`} name="ageValue" inputMode="decimal" defaultValue={values.ageValue} className="field w-40 figures" aria-invalid={errors.ageValue ? true : undefined} />
          </div>
          <div>
            <label htmlFor={`${ageId}-unc`} className="mb-1 block font-sans text-sm">±</label>
            <input id={`${ageId}-unc`} name="uncertaintyValue" inputMode="decimal" defaultValue={values.uncertaintyValue} className="field w-32 figures" aria-invalid={errors.uncertaintyValue ? true : undefined} />
          </div>
          <div>
            <label htmlFor={`${ageId}-unit`} className="mb-1 block font-sans text-sm">Unit</label>
            <select id={`${ageId}-unit`} name="ageUnit" defaultValue={values.ageUnit} className="field w-auto min-w-20" aria-invalid={errors.ageUnit ? true : undefined}>
              {AGE_UNITS.map((u) => <option key={u} value={u}>{u}</option>)}
            </select>
          </div>
        </div>
        {ageErrors.length ? (
          <div id={`${ageId}-errors`}>
            {ageErrors.map((e) => <p key={e} className="mt-1 font-sans text-sm text-danger">{e}</p>)}
          </div>
        ) : null}
      </fieldset>

      <Select
        label="Kind of age"
        name="ageKind"
        defaultValue={values.ageKind}
        error={errors.ageKind}
        hint="How the age should be read on a sign."
        options={AGE_KINDS.map((k: AgeKind) => ({ value: k, label: `${AGE_KIND_LABELS[k]} — ${AGE_KIND_HINTS[k]}` }))}
      />
      <Field label="Dating method" name="datingMethod" defaultValue={values.datingMethod} error={errors.datingMethod} maxLength={LIBRARY_LIMITS.datingMethod} hint="Optional, e.g. “U–Pb zircon (SHRIMP)” or “40Ar/39Ar sanidine”." />
      <TextArea label="Citation" name="citation" rows={4} defaultValue={values.citation} error={errors.citation} maxLength={LIBRARY_LIMITS.citation} hint="The full reference: authors, year, title, journal or publisher, volume and pages." />
      <div className="grid gap-x-4 sm:grid-cols-2">
        <Field label="DOI" name="doi" defaultValue={values.doi} error={errors.doi} hint="Optional, e.g. 10.1038/35051550." />
        <Field label="Link" name="url" type="url" defaultValue={values.url} error={errors.url} hint="Optional web address of the source." />
      </div>
      <Select
        label="Checked"
        name="verification"
        defaultValue={values.verification}
        error={errors.verification}
        hint="Say honestly how far the figure has been checked; a reviewer sees this."
        options={VERIFICATIONS.map((v: Verification) => ({ value: v, label: v[0].toUpperCase() + v.slice(1) }))}
      />
      <Field label="Slug" name="slug" defaultValue={values.slug} error={errors.slug} maxLength={LIBRARY_LIMITS.slug} hint="Optional: a short identifier for exports. Left empty, it is made from the name." />
      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn" disabled={busy}>{submitLabel}</button>
        <a href={cancelTo} className="btn-quiet no-underline">Cancel</a>
      </div>
    </Form>
  );
}

export function ScopeBadge({ scope }: { scope: "shared" | "organisation" }) {
  return scope === "shared" ? (
    <span className="inline-block rounded border border-slate-river-500 bg-slate-river-100 px-2 py-0.5 font-sans text-xs font-semibold text-slate-river-700">Shared</span>
  ) : (
    <span className="inline-block rounded border border-sandstone-500 bg-sandstone-50 px-2 py-0.5 font-sans text-xs font-semibold text-sandstone-700">Ours</span>
  );
}
