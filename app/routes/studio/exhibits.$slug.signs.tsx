// /studio/exhibits/:slug/signs — the exhibit's sign settings (the text's mounting height and the
// viewing distance that size the sign sheets' text; designers change them) and the fabrication
// files with their options: sign sheets (size, mounting height, viewing distance), print panels
// (roll width, height, overlap, bleed; many panels are made in the background with progress).
import { data, Form, Link, redirect } from "react-router";
import { PageHeader } from "~/components/page-header";
import { ExportJobs, startBackgroundExportUrl } from "~/components/exhibit/export-progress";
import { can } from "~/lib/permissions";
import { PANEL_DEFAULTS, ROLL_PRESETS } from "~/lib/fabrication/panels";
import { SIGN_SIZES } from "~/lib/fabrication/signs";
import { FABRICATION_SOURCES } from "~/lib/fabrication/sources";
import { requireMember, requirePermission } from "#server/auth.server.ts";
import { saveSignSettings, signsPageView } from "#server/exports/fabrication/sign-settings.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/exhibits.$slug.signs";

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `Signs and print files: ${loaderData?.title ?? "exhibit"} · Eonscale` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const view = await signsPageView(member.organisation.id, params.slug);
  if (!view) throw data({ message: "There is no exhibit at this address in your organisation." }, { status: 404 });
  return { ...view, canEdit: can(member.subject, "exhibit.edit") };
}

export async function action({ request, params }: Route.ActionArgs) {
  const member = await requirePermission(request, "exhibit.edit");
  const result = await saveSignSettings(member, params.slug, await request.formData());
  if (!result.ok) return data({ error: result.formError, fields: result.fieldErrors }, { status: 400 });
  return redirect(`/studio/exhibits/${encodeURIComponent(params.slug)}/signs`, { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message: `Sign settings saved: text ${result.settings.mountingHeightMm} mm above the floor, read from ${result.settings.viewingDistanceMm} mm.` }) } });
}

/** Sources as sentences: "Common roll widths …". */
const sentences = (...texts: string[]) => texts.map((t) => `${t.charAt(0).toUpperCase()}${t.slice(1)}.`).join(" ");

export default function Signs({ loaderData, actionData }: Route.ComponentProps) {
  const v = loaderData;
  const base = `/studio/exhibits/${encodeURIComponent(v.slug)}`;
  const from = v.published ? "publication" : "draft";
  const fields = (actionData as { fields?: Record<string, string> } | undefined)?.fields ?? {};
  return (
    <div>
      <PageHeader title={`Signs and print files: ${v.title}`} crumbs={[{ to: "/studio/exhibits", label: "Exhibits" }, { to: base, label: v.title }]} current="Signs and print files" lead={v.published ? "Files come from the latest publication unless you choose the working copy." : "Not published yet: files come from the working copy and say “DRAFT — not checked”."} />
      <section className="card mt-6 font-sans text-sm" aria-labelledby="settings-h">
        <h2 id="settings-h" className="text-xl">Sign settings</h2>
        <p className="mt-1 text-ink-soft">The sign sheets size their text from these: names meet the ADA §703.5.5 capital height, running text the x-height table for the viewing distance. {v.settings.saved ? "" : "These are the defaults (a wall label's centre, read from 1 m)."}</p>
        <Form method="post" className="mt-3 flex flex-wrap items-end gap-4">
          <div>
            <label htmlFor="mountingHeightMm" className="mb-1 block font-semibold">Text height above the floor or ground (mm)</label>
            <input id="mountingHeightMm" name="mountingHeightMm" type="number" min={300} max={6000} step="any" defaultValue={v.settings.mountingHeightMm} className="field w-40" disabled={!v.canEdit} aria-describedby={fields.mountingHeightMm ? "mh-err" : undefined} />
            {fields.mountingHeightMm ? <p id="mh-err" className="text-danger">{fields.mountingHeightMm}</p> : null}
          </div>
          <div>
            <label htmlFor="viewingDistanceMm" className="mb-1 block font-semibold">Viewing distance (mm)</label>
            <input id="viewingDistanceMm" name="viewingDistanceMm" type="number" min={200} max={30000} step="any" defaultValue={v.settings.viewingDistanceMm} className="field w-40" disabled={!v.canEdit} aria-describedby={fields.viewingDistanceMm ? "vd-err" : undefined} />
            {fields.viewingDistanceMm ? <p id="vd-err" className="text-danger">{fields.viewingDistanceMm}</p> : null}
          </div>
          {v.canEdit ? <button type="submit" className="btn-quiet">Save the sign settings</button> : <p className="text-ink-soft">Designers change these.</p>}
        </Form>
        <p className="mt-2 text-ink-soft">{sentences(FABRICATION_SOURCES.wallLabelHeight, FABRICATION_SOURCES.wayside)}</p>
      </section>

      <section className="card mt-6 font-sans text-sm" aria-labelledby="signs-h">
        <h2 id="signs-h" className="text-xl">Sign sheets</h2>
        <Form method="get" action={`${base}/signs.pdf`} reloadDocument className="mt-3 flex flex-wrap items-end gap-4">
          <input type="hidden" name="from" value={from} />
          <div>
            <label htmlFor="size" className="mb-1 block font-semibold">Size</label>
            <select id="size" name="size" defaultValue={v.kind === "route" ? "wayside" : "a4"} className="field">
              {Object.entries(SIGN_SIZES).map(([id, s]) => <option key={id} value={id}>{s.label}</option>)}
            </select>
          </div>
          <div><label htmlFor="sign-height" className="mb-1 block font-semibold">Text height (mm, optional)</label><input id="sign-height" name="height" type="number" min={300} max={6000} step="any" placeholder={String(v.settings.mountingHeightMm)} className="field w-32" /></div>
          <div><label htmlFor="sign-distance" className="mb-1 block font-semibold">Viewing distance (mm, optional)</label><input id="sign-distance" name="distance" type="number" min={200} max={30000} step="any" placeholder={String(v.settings.viewingDistanceMm)} className="field w-32" /></div>
          <button type="submit" className="btn-quiet">Download signs.pdf</button>
        </Form>
        <p className="mt-2 text-ink-soft">The first page lists the rules applied and every warning (text that does not fit is cut and listed, never shrunk below the rule).</p>
      </section>

      {v.kind === "length" ? (
        <section className="card mt-6 font-sans text-sm" aria-labelledby="panels-h">
          <h2 id="panels-h" className="text-xl">Print panels at 1:1</h2>
          <form
            method="get"
            action={`${base}/panels.pdf`}
            className="mt-3 flex flex-wrap items-end gap-4"
            onSubmit={(e) => {
              e.preventDefault();
              const q = new URLSearchParams(new FormData(e.currentTarget) as unknown as Record<string, string>);
              for (const [k, val] of [...q]) if (val === "") q.delete(k);
              startBackgroundExportUrl(`${base}/panels.pdf?${q}`, "Print panels (PDF)");
            }}
          >
            <input type="hidden" name="from" value={from} />
            <div>
              <label htmlFor="width" className="mb-1 block font-semibold">Panel width (mm)</label>
              <input id="width" name="width" type="number" min={100} max={5000} step="any" list="rolls" placeholder={PANEL_DEFAULTS.widthMm.toFixed(1)} className="field w-32" />
              <datalist id="rolls">{ROLL_PRESETS.map((r) => <option key={r.id} value={r.widthMm}>{r.label}</option>)}</datalist>
            </div>
            <div><label htmlFor="height" className="mb-1 block font-semibold">Height (mm)</label><input id="height" name="height" type="number" min={50} max={5000} step="any" placeholder={String(PANEL_DEFAULTS.heightMm)} className="field w-28" /></div>
            <div><label htmlFor="overlap" className="mb-1 block font-semibold">Overlap (mm)</label><input id="overlap" name="overlap" type="number" min={0} max={500} step="any" placeholder={String(PANEL_DEFAULTS.overlapMm)} className="field w-24" /></div>
            <div><label htmlFor="bleed" className="mb-1 block font-semibold">Bleed (mm)</label><input id="bleed" name="bleed" type="number" min={0} max={50} step="any" placeholder={String(PANEL_DEFAULTS.bleedMm)} className="field w-24" /></div>
            <button type="submit" className="btn-quiet">Make panels.pdf</button>
          </form>
          <ExportJobs />
          <p className="mt-2 text-ink-soft">{sentences(FABRICATION_SOURCES.rolls, FABRICATION_SOURCES.overlap, FABRICATION_SOURCES.bleed)}</p>
        </section>
      ) : (
        <p className="mt-6 font-sans text-sm"><a href={`${base}/trailhead.pdf?from=${from}`}>Trailhead board (PDF)</a> · <a href={`${base}/profile.json?from=${from}`}>Slope profile (JSON)</a> · <Link to={base}>the profile chart is under the route plan</Link></p>
      )}
      <p className="mt-4 font-sans text-sm"><a href={`${base}/kit.zip?from=${from}`}>Everything in one ZIP (kit.zip)</a></p>
    </div>
  );
}
