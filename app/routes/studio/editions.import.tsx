// /studio/editions/import — import a chart edition in two steps. 1: upload a file (our CSV, the
// same content as JSON, or the ICS chart's Turtle); the server parses and checks it and shows a
// preview with every problem and its line — nothing is saved. 2: confirm; the server parses and
// checks the same text again from scratch and saves it as a draft only if no problem remains.
import { useId } from "react";
import { data, Form, Link, redirect, useNavigation } from "react-router";
import { ProblemTable, RankCounts } from "~/components/chart/edition-bits";
import { IntervalTable } from "~/components/chart/interval-table";
import { TimescaleChart } from "~/components/chart/timescale-chart";
import { Field, FormMessage } from "~/components/forms";
import { CSV_COLUMNS } from "~/lib/timescale";
import { parseForm } from "~/lib/validation";
import { can } from "~/lib/permissions";
import { requireAnyPermission, type Signed } from "#server/auth.server.ts";
import {
  assertMayImport,
  ConfirmSchema,
  EditionError,
  FORMAT_LABELS,
  MAX_UPLOAD_BYTES,
  UploadSchema,
  confirmImport,
  currentEditionFor,
  detectFormat,
  fileText,
  previewImport,
  readLimitedFormData,
  type ImportPreview,
} from "#server/editions.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/editions.import";

export const meta: Route.MetaFunction = () => [{ title: "Import a chart edition · Eonscale" }];

const DEFAULT_LICENCE = "CC BY 4.0 — Creative Commons Attribution 4.0 International (https://creativecommons.org/licenses/by/4.0/)";

const IMPORTERS = ["edition.import", "edition.manage-shared"] as const;

/** Whose editions this person may import: their organisation's own, and (stewards) shared ones. */
function ownersFor(s: Signed) {
  const owners: { value: "organisation" | "shared"; label: string }[] = [];
  if (s.organisation && can(s.subject, "edition.import")) owners.push({ value: "organisation", label: `${s.organisation.name}'s own edition (seen only by its members)` });
  if (can(s.subject, "edition.manage-shared")) owners.push({ value: "shared", label: "A shared edition (a published ICS chart, for everyone)" });
  return owners;
}

export async function loader({ request }: Route.LoaderArgs) {
  const s = await requireAnyPermission(request, IMPORTERS);
  const current = await currentEditionFor(s.organisation?.id ?? null);
  // Server-side values are handed to the page here: the component must not import server code.
  return { maxBytes: MAX_UPLOAD_BYTES, formatLabels: FORMAT_LABELS, current: current ? { slug: current.slug, label: current.label } : null, columns: [...CSV_COLUMNS], owners: ownersFor(s) };
}

type Values = Partial<Record<"slug" | "label" | "source" | "licence" | "format" | "owner", string>>;

function valuesOf(form: FormData): Values {
  const v = (k: string) => (typeof form.get(k) === "string" ? String(form.get(k)) : undefined);
  return { slug: v("slug"), label: v("label"), source: v("source"), licence: v("licence"), format: v("format"), owner: v("owner") };
}

/** The owner the form asks for (the first allowed when it names none); null = shared; undefined = not allowed. */
function ownerIdOf(s: Signed, value: string | undefined): number | null | undefined {
  const owners = ownersFor(s);
  const choice = owners.find((o) => o.value === (value || owners[0]?.value));
  if (!choice) return undefined;
  return choice.value === "shared" ? null : s.organisation!.id;
}

/** The preview as the page needs it (names in other languages are not shown, so not sent). */
function forPage(p: ImportPreview) {
  return { ...p, intervals: p.intervals.map((iv) => ({ ...iv, names: {} })) };
}

export async function action({ request }: Route.ActionArgs) {
  const s = await requireAnyPermission(request, IMPORTERS);
  let form: FormData;
  try {
    form = await readLimitedFormData(request);
  } catch (error) {
    if (error instanceof EditionError) {
      return data({ step: "upload" as const, error: error.message, fields: { [error.field]: error.message } as Record<string, string>, values: {} as Values, preview: null }, { status: error.status });
    }
    throw error;
  }
  const values = valuesOf(form);
  const ownerId = ownerIdOf(s, values.owner);
  if (ownerId === undefined) {
    const message = "Owner: choose whose edition this is — your organisation's own, or (chart stewards only) a shared edition.";
    return data({ step: "upload" as const, error: message, fields: { owner: message } as Record<string, string>, values, preview: null }, { status: 400 });
  }
  try {
    assertMayImport(s.subject, ownerId);
  } catch (error) {
    if (error instanceof EditionError) return data({ step: "upload" as const, error: error.message, fields: { owner: error.message } as Record<string, string>, values, preview: null }, { status: error.status });
    throw error;
  }

  if (form.get("intent") === "confirm") {
    const parsed = parseForm(ConfirmSchema, form);
    if (!parsed.ok) return data({ step: "upload" as const, error: parsed.formError, fields: parsed.fieldErrors, values, preview: null }, { status: 400 });
    const { slug, label, source, licence, format, fileName, content, token } = parsed.data;
    const result = await confirmImport({
      meta: { slug, label, source, licence },
      format,
      fileName,
      content,
      token,
      actor: { id: s.user.id, subject: s.subject },
      ownerId,
    });
    if (result.saved) {
      const message = `${result.edition.label} has been imported as a draft${ownerId === null ? " shared edition" : ` of ${s.organisation!.name}'s own`}. Compare it with the current edition, then make it current when it has been checked.`;
      return redirect(`/editions/${result.edition.slug}`, { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message }) } });
    }
    return data({ step: "preview" as const, error: result.message, fields: result.preview.metaErrors, values, preview: forPage(result.preview) }, { status: 422 });
  }

  const parsed = parseForm(UploadSchema, form);
  if (!parsed.ok) return data({ step: "upload" as const, error: parsed.formError, fields: parsed.fieldErrors, values, preview: null }, { status: 400 });
  const { file, format: chosen, slug, label, source, licence } = parsed.data;
  let text: string;
  try {
    text = await fileText(file);
  } catch (error) {
    if (error instanceof EditionError) return data({ step: "upload" as const, error: error.message, fields: { file: error.message } as Record<string, string>, values, preview: null }, { status: 400 });
    throw error;
  }
  const format = chosen === "auto" ? detectFormat(file.name, text) : chosen;
  const preview = await previewImport({ meta: { slug, label, source, licence }, format, fileName: file.name, content: text, userId: s.user.id, ownerId });
  const n = preview.problems.length + Object.keys(preview.metaErrors).length;
  return data(
    { step: "preview" as const, error: n ? `${n} problem${n === 1 ? "" : "s"} found. Nothing has been saved.` : null, fields: preview.metaErrors, values, preview: forPage(preview) },
    { status: preview.confirm ? 200 : 422 },
  );
}

export default function ImportEdition({ loaderData, actionData }: Route.ComponentProps) {
  const { maxBytes, current, columns, formatLabels, owners } = loaderData;
  const busy = useNavigation().state === "submitting";
  const preview = actionData?.preview ?? null;
  const fields = actionData?.fields ?? {};
  const values = actionData?.values ?? {};
  const hasProblems = Boolean(preview && !preview.confirm);
  const step = preview ? (preview.confirm ? 3 : 2) : 1;
  const id = useId();
  return (
    <div>
      <p className="font-sans text-sm"><Link to="/studio/editions">Chart editions</Link> ›</p>
      <h1 className="mt-1 text-3xl">Import a chart edition</h1>
      <ol className="mt-4 flex flex-wrap gap-2 font-sans text-sm" aria-label="Steps">
        {["Upload the file", "Check the preview", "Confirm: saved as a draft"].map((s, i) => (
          <li key={s} aria-current={step === i + 1 ? "step" : undefined} className={`rounded-full border px-3 py-1 ${step === i + 1 ? "border-slate-river-700 bg-slate-river-700 text-white" : step > i + 1 ? "border-ok text-ok" : "border-rule text-ink-soft"}`}>
            {i + 1}. {s}
          </li>
        ))}
      </ol>

      {actionData?.step === "upload" && actionData.error ? <div className="mt-4"><FormMessage>{actionData.error}</FormMessage></div> : null}

      {preview ? (
        <section className="card mt-6" aria-labelledby="preview-heading">
          <h2 id="preview-heading" className="text-2xl">Preview of {preview.fileName || "the file"}</h2>
          <p className="mt-1 font-sans text-sm text-ink-soft">
            {formatLabels[preview.format]} · {(preview.bytes / 1024).toFixed(1)} kB · {preview.intervals.length} intervals read
          </p>
          <div className="mt-3"><RankCounts counts={preview.counts} /></div>
          {hasProblems ? (
            <div className="mt-4">
              <FormMessage>
                {actionData?.error ?? "Problems were found."} Fix {preview.problems.length + Object.keys(preview.metaErrors).length === 1 ? "it" : "them"} and upload the corrected file below.
              </FormMessage>
              {Object.values(preview.metaErrors).length ? (
                <ul className="mb-3 list-disc pl-5 font-sans text-sm text-danger">{Object.values(preview.metaErrors).map((m) => <li key={m}>{m}</li>)}</ul>
              ) : null}
              {preview.problems.length ? (
                <ProblemTable problems={preview.problems} lineLabel={preview.format === "json" ? "Item (from 0)" : "Line"} />
              ) : null}
            </div>
          ) : (
            <div className="mt-4">
              <FormMessage kind="success">
                No problems: all {preview.intervals.length} intervals pass every check (tiling, no gaps or overlaps, ages, colours, parents).
                {preview.comparedWith ? ` Against the current edition ${preview.comparedWith.label}: ${preview.comparedWith.moved} interval bases moved, ${preview.comparedWith.added} added, ${preview.comparedWith.removed} removed, ${preview.comparedWith.renamed} renamed.` : ""}
              </FormMessage>
              <dl className="grid gap-x-4 gap-y-1 font-sans text-sm sm:grid-cols-[8rem_1fr]">
                <dt className="font-semibold">Label</dt><dd>{preview.meta.label}</dd>
                <dt className="font-semibold">Slug</dt><dd><code>{preview.meta.slug}</code> (page /editions/{preview.meta.slug})</dd>
                <dt className="font-semibold">Source</dt><dd>{preview.meta.source}</dd>
                <dt className="font-semibold">Licence</dt><dd>{preview.meta.licence}</dd>
                <dt className="font-semibold">Corrections</dt><dd>{preview.corrections.length ? `${preview.corrections.length} carried by the file` : "none"}</dd>
              </dl>
              <Form method="post" encType="multipart/form-data" className="mt-4 flex flex-wrap items-center gap-3">
                <input type="hidden" name="intent" value="confirm" />
                <input type="hidden" name="owner" value={values.owner ?? owners[0]?.value ?? ""} />
                <input type="hidden" name="slug" value={preview.meta.slug} />
                <input type="hidden" name="label" value={preview.meta.label} />
                <input type="hidden" name="source" value={preview.meta.source} />
                <input type="hidden" name="licence" value={preview.meta.licence} />
                <input type="hidden" name="format" value={preview.format} />
                <input type="hidden" name="fileName" value={preview.fileName} />
                <input type="hidden" name="content" value={preview.confirm!.content} />
                <input type="hidden" name="token" value={preview.confirm!.token} />
                <button type="submit" className="btn" disabled={busy}>{busy ? "Importing…" : "Import as draft"}</button>
                <span className="font-sans text-sm text-ink-soft">The server checks the file once more before saving. Drafts are not public.</span>
              </Form>
            </div>
          )}
          {preview.intervals.length ? (
            <>
              <details className="mt-5">
                <summary className="cursor-pointer font-sans font-semibold">Chart of the file</summary>
                <div className="mt-3"><TimescaleChart intervals={preview.intervals} title={`Preview of ${preview.fileName}`} /></div>
              </details>
              <details className="mt-3">
                <summary className="cursor-pointer font-sans font-semibold">Intervals read from the file ({preview.intervals.length})</summary>
                <div className="mt-3"><IntervalTable intervals={preview.intervals} caption={`Intervals read from ${preview.fileName}`} /></div>
              </details>
            </>
          ) : null}
        </section>
      ) : null}

      <div className="mt-6 grid gap-6 lg:grid-cols-[3fr_2fr]">
        <section className="card min-w-0" aria-labelledby="upload-heading">
          <h2 id="upload-heading" className="text-xl">{hasProblems ? "Upload the corrected file" : preview ? "Upload a different file" : "Upload the file"}</h2>
          <p className="mb-4 mt-1 font-sans text-sm text-ink-soft">Nothing is saved at this step: you see a preview and every problem first. At most {Math.round(maxBytes / (1024 * 1024))} MB.</p>
          <Form method="post" encType="multipart/form-data" noValidate>
            <input type="hidden" name="intent" value="preview" />
            {owners.length > 1 ? (
              <fieldset className="mb-4">
                <legend className="mb-1 block text-sm font-semibold">Whose edition</legend>
                {owners.map((o, i) => (
                  <label key={o.value} className="flex items-center gap-2 font-sans text-sm">
                    <input type="radio" name="owner" value={o.value} defaultChecked={values.owner ? values.owner === o.value : i === 0} /> {o.label}
                  </label>
                ))}
                {fields.owner ? <p className="mt-1 font-sans text-sm text-danger">{fields.owner}</p> : null}
              </fieldset>
            ) : (
              <>
                <input type="hidden" name="owner" value={owners[0]?.value ?? ""} />
                <p className="mb-4 font-sans text-sm">This will be {owners[0]?.label.replace(/ \(.*\)$/, "") ?? "an edition"}{owners[0]?.value === "organisation" ? ": always shown as your organisation's own, never as an ICS edition." : "."}</p>
                {fields.owner ? <p className="mb-4 font-sans text-sm text-danger">{fields.owner}</p> : null}
              </>
            )}
            <div className="mb-4">
              <label htmlFor={`${id}-file`} className="mb-1 block text-sm font-semibold">File</label>
              <input id={`${id}-file`} name="file" type="file" accept=".csv,.json,.ttl,text/csv,application/json,text/turtle" className="field" aria-invalid={fields.file ? true : undefined} aria-describedby={fields.file ? `${id}-file-error` : undefined} />
              {fields.file ? <p id={`${id}-file-error`} className="mt-1 font-sans text-sm text-danger">{fields.file}</p> : null}
            </div>
            <div className="mb-4">
              <label htmlFor={`${id}-format`} className="mb-1 block text-sm font-semibold">Format</label>
              <select id={`${id}-format`} name="format" defaultValue={values.format ?? "auto"} className="field w-auto">
                <option value="auto">Detect from the file name (.csv, .json, .ttl)</option>
                <option value="csv">{formatLabels.csv}</option>
                <option value="json">{formatLabels.json}</option>
                <option value="turtle">{formatLabels.turtle}</option>
              </select>
              {fields.format ? <p className="mt-1 font-sans text-sm text-danger">{fields.format}</p> : null}
            </div>
            <div className="grid gap-x-4 sm:grid-cols-2">
              <Field label="Label" name="label" required placeholder={owners[0]?.value === "shared" ? "ICS 2025/06" : "Our working chart 2025"} defaultValue={values.label} error={fields.label} />
              <Field label="Slug" name="slug" required placeholder="ics-2025-06" hint="Its web address: /editions/<slug>" defaultValue={values.slug} error={fields.slug} />
            </div>
            <div className="mb-4">
              <label htmlFor={`${id}-source`} className="mb-1 block text-sm font-semibold">Source citation</label>
              <p id={`${id}-source-hint`} className="mb-1 font-sans text-sm text-ink-soft">The chart edition and the data file it came from, as a geologist would cite them.</p>
              <textarea id={`${id}-source`} name="source" rows={3} required className="field" defaultValue={values.source} aria-invalid={fields.source ? true : undefined} aria-describedby={`${id}-source-hint${fields.source ? ` ${id}-source-error` : ""}`} />
              {fields.source ? <p id={`${id}-source-error`} className="mt-1 font-sans text-sm text-danger">{fields.source}</p> : null}
            </div>
            <Field label="Licence" name="licence" required defaultValue={values.licence ?? DEFAULT_LICENCE} error={fields.licence} />
            <button type="submit" className="btn" disabled={busy}>{busy ? "Checking…" : "Upload and check"}</button>
          </Form>
        </section>

        <aside className="card min-w-0 font-sans text-sm" aria-labelledby="formats-heading">
          <h2 id="formats-heading" className="text-xl">Formats</h2>
          <p className="mt-2"><strong>CSV</strong> (UTF-8, one header line, one interval per line, quoted as RFC 4180). Every column is required, in any order:</p>
          <table className="mt-2 w-full text-left text-xs">
            <tbody>
              {columns.map((c) => (
                <tr key={c} className="border-b border-rule last:border-0">
                  <th scope="row" className="py-1 pr-2 align-top"><code>{c}</code></th>
                  <td className="py-1">{COLUMN_HELP[c] ?? ""}</td>
                </tr>
              ))}
            </tbody>
          </table>
          <p className="mt-3"><strong>JSON</strong>: an array of intervals with the fields <code>name, rank, parent, baseMa, baseUncertaintyMa, topMa, color, gssp, boundaryKind, approximate, names, order</code> (<code>boundaryKind</code> may be left out), or an edition file <code>{"{ edition, intervals }"}</code>. Problems name the array index, from 0.</p>
          <p className="mt-3"><strong>Turtle</strong>: the ICS chart's own linked-data file (<code>.ttl</code>). The super-eon is left out; problems name the line where the interval's description starts.</p>
          <p className="mt-3">Any edition's page has a CSV and a JSON download in exactly this form{current ? <> — start from <a href={`/editions/${current.slug}/intervals.csv`}>{current.label} as CSV</a></> : null}.</p>
        </aside>
      </div>
    </div>
  );
}

const COLUMN_HELP: Record<string, string> = {
  name: "English name, unique in the edition",
  rank: "eon, era, period, subperiod, epoch or age",
  parent: "name of the enclosing interval; empty for an eon",
  base_ma: "base age in Ma (538.8, 0.0117)",
  base_uncertainty_ma: "± of the base in Ma; empty if the chart gives none",
  top_ma: "top age in Ma",
  color: "standard chart colour, #RRGGBB",
  gssp: "true / false — the base is ratified (by a GSSP or a GSSA); empty = not stated",
  approximate: "true / false — the chart's “~”",
  order: "chart order, whole number from 1",
  names_json: 'names in other languages, e.g. {"de":"Kreide"}; may be empty',
  boundary_kind: "GSSP (a point in a rock section) or GSSA (a numerical age); empty = not ratified or not stated. Optional: older files without this column still read",
};
