// The composer: one exhibit's settings, markers, insets and live preview. Every form carries the
// revision it was based on; the server refuses a save based on an older one (no lost update).
import { useMemo, useState } from "react";
import { data, Form, Link, redirect, useFetcher, useNavigation } from "react-router";
import { FormMessage } from "~/components/forms";
import { RoutePlan } from "~/components/exhibit/route-plan";
import { bandsFor, ScaleStrip } from "~/components/exhibit/scale-strip";
import {
  BoundaryMarkersSchema,
  computeExhibit,
  CustomMarkerSchema,
  EventMarkerSchema,
  formatAgeMa,
  formatLength,
  InsetFormSchema,
  MarkerTextSchema,
  readRouteFile,
  RevisionSchema,
  SettingsSchema,
  LengthMediumSchema,
  standardDurations,
  type ExhibitSpec,
} from "~/lib/exhibit";
import { MEDIUM_TYPES, type MediumType } from "~/lib/scale/legibility";
import type { PreparedRoute } from "~/lib/geo/route";
import { RANKS, type Rank } from "~/lib/timescale/types";
import { AGE_UNITS, LENGTH_UNITS, toYears, type AgeUnit, type LengthUnit } from "~/lib/units";
import { parseForm } from "~/lib/validation";
import { renderMarkdown } from "#server/markdown.server.ts";
import { requireMember } from "#server/auth.server.ts";
import {
  addBoundaries,
  addCustom,
  addEvent,
  addInset,
  editMarker,
  ExhibitError,
  howWeKnowFor,
  impactFor,
  removeInset,
  removeMarker,
  replaceRoute,
  repinToCurrent,
  readExhibitForm,
  requireBundle,
  updateSettings,
  type Actor,
} from "#server/exhibits.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import { z } from "zod";
import type { Route } from "./+types/exhibits.$slug";

export const meta: Route.MetaFunction = ({ loaderData }) => [{ title: `${loaderData?.exhibit.title ?? "Exhibit"} · Eonscale` }];

export async function loader({ request, params }: Route.LoaderArgs) {
  const member = await requireMember(request);
  const bundle = await requireBundle(member.organisation.id, params.slug);
  // The preview is computed in the browser; the server needs only the impact report here.
  const [impact, decay] = await Promise.all([impactFor(bundle), howWeKnowFor(bundle)]);
  const decayOf = new Map(bundle.markerRows.map((r) => [String(r.id), r.decaySystemId]));
  const e = bundle.exhibit;
  return {
    exhibit: { title: e.title, slug: e.slug, status: e.status, revision: e.revision, updatedAt: e.updatedAt.toISOString(), updatedBy: e.updatedBy?.name ?? null },
    edition: { slug: bundle.edition.slug, label: bundle.edition.label, status: bundle.edition.status },
    spec: bundle.spec,
    markers: bundle.markers.map((m) => ({ ...m, html: renderMarkdown(m.text), howWeKnow: decay.byMarker.get(m.id) ?? null, decaySystemId: decayOf.get(m.id) ?? null })),
    decaySystems: decay.systems,
    insetIds: bundle.insets.map((i) => i.id),
    intervals: bundle.intervals.map((i) => ({ name: i.name, rank: i.rank, baseMa: i.baseMa, topMa: i.topMa, color: i.color })),
    impact,
    canEdit: member.role === "designer",
  };
}

const IdSchema = z.coerce.number({ error: "Missing id." }).int().positive({ error: "Missing id." });

function insetIdNumber(id: string) {
  return Number(id.replace(/^inset-/, ""));
}

export async function action({ request, params }: Route.ActionArgs) {
  const member = await requireMember(request, ["designer"]);
  const read = await readExhibitForm(request);
  if (!read.ok) return data({ intent: "replace-route", error: read.message, fields: { routeFile: read.message } as Record<string, string> }, { status: 413 });
  const form = read.form;
  const intent = String(form.get("intent") ?? "");
  const rev = RevisionSchema.safeParse(form.get("revision"));
  if (!rev.success) return data({ intent, error: rev.error.issues[0].message, fields: {} as Record<string, string> }, { status: 400 });
  const actor: Actor = { organisationId: member.organisation.id, user: member.user };
  const slug = params.slug;
  const revision = rev.data;
  const invalid = (r: { fieldErrors: Record<string, string>; formError: string }) => data({ intent, error: r.formError, fields: r.fieldErrors }, { status: 400 });
  let message: string;
  try {
    switch (intent) {
      case "settings": {
        const s = parseForm(SettingsSchema, form);
        if (!s.ok) return invalid(s);
        let medium;
        if (form.get("mediumKind") === "length") {
          const m = parseForm(LengthMediumSchema, form);
          if (!m.ok) return invalid(m);
          medium = { kind: "length" as const, ...m.data };
        }
        await updateSettings(actor, slug, revision, s.data, medium);
        message = "Settings saved.";
        break;
      }
      case "add-boundaries": {
        const b = parseForm(BoundaryMarkersSchema, form);
        if (!b.ok) return invalid(b);
        const { result } = await addBoundaries(actor, slug, revision, b.data);
        message = result.length === 1 ? `Added the base of the ${result[0]}.` : `Added ${result.length} boundaries.`;
        break;
      }
      case "add-event": {
        const ev = parseForm(EventMarkerSchema, form);
        if (!ev.ok) return invalid(ev);
        const { result } = await addEvent(actor, slug, revision, ev.data.eventId);
        message = `Added “${result}”.`;
        break;
      }
      case "add-custom": {
        const c = parseForm(CustomMarkerSchema, form);
        if (!c.ok) return invalid(c);
        const ageMa = toYears({ value: c.data.ageValue, unit: c.data.ageUnit }) / 1e6;
        const uncertaintyMa = c.data.uncertaintyValue == null ? null : toYears({ value: c.data.uncertaintyValue, unit: c.data.ageUnit }) / 1e6;
        await addCustom(actor, slug, revision, { label: c.data.label, ageMa, uncertaintyMa, source: c.data.source, text: c.data.text });
        message = `Added “${c.data.label}”.`;
        break;
      }
      case "edit-marker": {
        const t = parseForm(MarkerTextSchema, form);
        if (!t.ok) return invalid(t);
        await editMarker(actor, slug, revision, t.data.markerId, t.data.label, t.data.text, t.data.decaySystemId ?? null);
        message = "Marker saved.";
        break;
      }
      case "remove-marker": {
        const id = IdSchema.safeParse(form.get("markerId"));
        if (!id.success) return data({ intent, error: "Missing marker.", fields: {} as Record<string, string> }, { status: 400 });
        const { result } = await removeMarker(actor, slug, revision, id.data);
        message = `Removed “${result}”.`;
        break;
      }
      case "add-inset": {
        const i = parseForm(InsetFormSchema, form);
        if (!i.ok) return invalid(i);
        const olderMa = toYears({ value: i.data.olderValue, unit: i.data.olderUnit }) / 1e6;
        const youngerMa = toYears({ value: i.data.youngerValue, unit: i.data.youngerUnit }) / 1e6;
        const label = i.data.label ?? `${formatAgeMa(olderMa)} to ${formatAgeMa(youngerMa)} at ${i.data.magnification.toLocaleString("en-GB")}×`;
        await addInset(actor, slug, revision, { olderMa, youngerMa, magnification: i.data.magnification, label });
        message = `Inset added: ${label}.`;
        break;
      }
      case "remove-inset": {
        const id = IdSchema.safeParse(insetIdNumber(String(form.get("insetId") ?? "")));
        if (!id.success) return data({ intent, error: "Missing inset.", fields: {} as Record<string, string> }, { status: 400 });
        await removeInset(actor, slug, revision, id.data);
        message = "Inset removed.";
        break;
      }
      case "replace-route": {
        const file = form.get("routeFile");
        if (!(file instanceof File) || file.size === 0) return data({ intent, error: "Upload the new route as a GeoJSON or GPX file.", fields: { routeFile: "Upload the new route as a GeoJSON or GPX file." } as Record<string, string> }, { status: 400 });
        const r = readRouteFile(file.name, await file.text());
        if (!r.ok) return data({ intent, error: r.message, fields: { routeFile: r.message } as Record<string, string> }, { status: 400 });
        await replaceRoute(actor, slug, revision, { kind: "route", geometry: r.geometry, lengthMetres: r.lengthMetres, vertexCount: r.vertexCount, sourceName: file.name });
        message = `Route replaced by ${file.name} (${formatLength(r.lengthMetres, "metric", 0.01)}); every marker moved with it.`;
        break;
      }
      case "repin": {
        const { result } = await repinToCurrent(actor, slug, revision);
        message = `Re-pinned from ${result.from} to ${result.to}; ${result.moved} marker${result.moved === 1 ? "" : "s"} changed. The exhibit needs review again.`;
        break;
      }
      default:
        return data({ intent, error: "Unknown action.", fields: {} as Record<string, string> }, { status: 400 });
    }
  } catch (error) {
    if (error instanceof ExhibitError) return data({ intent, error: error.message, fields: { [error.field]: error.message } as Record<string, string> }, { status: error.status });
    throw error;
  }
  return redirect(`/studio/exhibits/${slug}`, { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message }) } });
}

type LoaderData = Route.ComponentProps["loaderData"];

interface Draft {
  title: string;
  spanOlderValue: string;
  spanOlderUnit: AgeUnit;
  spanYoungerValue: string;
  spanYoungerUnit: AgeUnit;
  mediumType: MediumType;
  lengthValue: string;
  lengthUnit: LengthUnit;
  unitsPreference: "metric" | "us";
  minVisibleMm: string;
  minSpacingMm: string;
}

function draftOf(d: LoaderData): Draft {
  const s = d.spec;
  return {
    title: d.exhibit.title,
    spanOlderValue: String(s.spanOlder.value),
    spanOlderUnit: s.spanOlder.unit,
    spanYoungerValue: String(s.spanYounger.value),
    spanYoungerUnit: s.spanYounger.unit,
    mediumType: s.medium.mediumType,
    lengthValue: s.medium.kind === "length" ? String(s.medium.length.value) : "",
    lengthUnit: s.medium.kind === "length" ? s.medium.length.unit : "m",
    unitsPreference: s.unitsPreference,
    minVisibleMm: s.legibility.minVisibleMetres ? String(s.legibility.minVisibleMetres * 1000) : "",
    minSpacingMm: s.legibility.minSpacingMetres ? String(s.legibility.minSpacingMetres * 1000) : "",
  };
}

function specOf(draft: Draft, saved: ExhibitSpec): ExhibitSpec {
  return {
    ...saved,
    spanOlder: { value: Number(draft.spanOlderValue), unit: draft.spanOlderUnit },
    spanYounger: { value: Number(draft.spanYoungerValue), unit: draft.spanYoungerUnit },
    medium: saved.medium.kind === "length" ? { ...saved.medium, mediumType: draft.mediumType, length: { value: Number(draft.lengthValue), unit: draft.lengthUnit } } : { ...saved.medium, mediumType: draft.mediumType },
    legibility: {
      ...(Number(draft.minVisibleMm) > 0 ? { minVisibleMetres: Number(draft.minVisibleMm) / 1000 } : {}),
      ...(Number(draft.minSpacingMm) > 0 ? { minSpacingMetres: Number(draft.minSpacingMm) / 1000 } : {}),
    },
    unitsPreference: draft.unitsPreference,
  };
}

export default function Composer({ loaderData, actionData }: Route.ComponentProps) {
  // Re-mount after every save so the drafts start from what was saved.
  return <ComposerBody key={loaderData.exhibit.revision} loaderData={loaderData} actionData={actionData} />;
}

function ComposerBody({ loaderData, actionData }: Pick<Route.ComponentProps, "loaderData" | "actionData">) {
  const { exhibit, edition, markers, intervals, impact, canEdit, decaySystems } = loaderData;
  const [draft, setDraft] = useState<Draft>(() => draftOf(loaderData));
  const [lifeYears, setLifeYears] = useState("80");
  const set = (k: keyof Draft) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setDraft((d) => ({ ...d, [k]: e.target.value }));
  const spec = useMemo(() => specOf(draft, loaderData.spec), [draft, loaderData.spec]);
  const [routeCache] = useState<{ route?: PreparedRoute; geometry?: unknown }>({});
  // The preview: the scale engine, in the browser, on every change.
  const preview = useMemo(() => {
    const c = computeExhibit(spec, markers, standardDurations(Math.max(1, Number(lifeYears) || 80)), routeCache);
    if (c.ok && c.route && spec.medium.kind === "route") {
      routeCache.route = c.route;
      routeCache.geometry = spec.medium.geometry;
    }
    return c;
  }, [spec, markers, lifeYears, routeCache]);
  const units = draft.unitsPreference;
  const result = preview.ok ? preview.result : null;
  const flagged = new Set(result?.warnings.filter((w) => w.code.startsWith("markers-")).flatMap((w) => w.pointIds) ?? []);
  const olderMa = toYears(spec.spanOlder) / 1e6;
  const youngerMa = toYears(spec.spanYounger) / 1e6;
  const bands = useMemo(() => (preview.ok ? bandsFor(intervals, olderMa, youngerMa) : []), [intervals, olderMa, youngerMa, preview.ok]);
  const byId = new Map(result?.points.map((p) => [p.id, p]) ?? []);
  const dirty = JSON.stringify(draft) !== JSON.stringify(draftOf(loaderData));
  const isRoute = spec.medium.kind === "route";
  const err = (intent: string, field: string) => (actionData?.intent === intent ? actionData.fields[field] : undefined);

  return (
    <div>
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div>
          <p className="font-sans text-sm text-ink-soft"><Link to="/studio/exhibits">Exhibits</Link> / {exhibit.slug}</p>
          <h1 className="mt-1 text-3xl">{exhibit.title}</h1>
          <p className="mt-1 font-sans text-sm text-ink-soft">
            {exhibit.status} · revision {exhibit.revision} · pinned to {edition.label}
            {exhibit.updatedBy ? ` · last saved by ${exhibit.updatedBy} ${exhibit.updatedAt.slice(0, 16).replace("T", " ")} UTC` : ""}
          </p>
          {impact ? <p className="mt-2 inline-block rounded bg-sandstone-100 px-3 py-1 font-sans text-sm font-semibold text-sandstone-700">Needs re-check: {edition.label} is {edition.status}; {impact.edition.label} is current.</p> : null}
        </div>
        <div className="flex flex-wrap gap-2 font-sans text-sm">
          <a href={`/studio/exhibits/${exhibit.slug}/schedule.csv`} className="btn-quiet no-underline" download>Marker schedule (CSV)</a>
          {isRoute ? <a href={`/studio/exhibits/${exhibit.slug}/points.geojson`} className="btn-quiet no-underline" download>Marker points (GeoJSON)</a> : null}
        </div>
      </div>

      {actionData?.error ? <div className="mt-4"><FormMessage>{actionData.error}</FormMessage></div> : null}

      {isRoute ? (
        <aside className="mt-4 rounded-lg border-l-4 border-warn bg-sandstone-50 p-4 font-sans text-sm" aria-label="Cautions for route exhibits">
          <p className="font-semibold">Before anyone walks this route</p>
          <ul className="mt-1 list-disc pl-5">
            <li>Walk the route yourself first, for hazards and for accessibility (surface, width, slopes, resting places).</li>
            <li>Get the landowner's and the relevant authorities' permission for every sign.</li>
            <li>Follow local codes and licensed practice for installing signs and posts.</li>
            <li>The coordinates here are planning figures on the WGS84 ellipsoid, not a survey; set out the markers on site.</li>
          </ul>
        </aside>
      ) : null}

      <section className="card mt-6" aria-labelledby="preview-h">
        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 id="preview-h" className="text-xl">Preview</h2>
          {dirty ? <p className="font-sans text-sm text-sandstone-700">Showing unsaved settings — save them below to keep them.</p> : null}
        </div>
        {preview.ok && result ? (
          <>
            <p className="mt-1 font-sans text-sm">
              <strong>{formatLength(result.scale.totalMetres, units, result.scale.totalMetres / 1e5)}</strong> for {formatAgeMa(olderMa)} to {youngerMa === 0 ? "the present" : formatAgeMa(youngerMa)}: {result.scale.statement.lengthPerTime} ({result.scale.statement.timePerLength}).
              {result.scale.route ? ` Walking it takes about ${Math.round(result.scale.route.walkingSeconds / 60)} min at ${result.scale.route.walkingSpeedMps} m/s (${Math.round(result.scale.route.accessibleWalkingSeconds / 60)} min at ${result.scale.route.accessibleSpeedMps} m/s).` : ""}
            </p>
            <div className="mt-4"><ScaleStrip result={result} markers={markers} bands={bands} units={units} flagged={flagged} title={`Scale strip of ${exhibit.title}`} /></div>
            <div className="mt-6 grid gap-6 lg:grid-cols-2">
              <div>
                <h3 className="text-lg">Legibility</h3>
                <p className="font-sans text-xs text-ink-soft">Smallest visible length {formatLength(result.scale.legibility.minVisibleMetres, "metric")}, smallest spacing {formatLength(result.scale.legibility.minSpacingMetres, "metric")} ({result.scale.legibility.source}).</p>
                {result.warnings.length === 0 ? <p className="mt-2 font-sans text-sm text-ok">No crowded markers or invisible durations.</p> : (
                  <ul className="mt-2 space-y-3">
                    {result.warnings.map((w, i) => (
                      <li key={i} className="rounded border border-rule bg-paper p-3 font-sans text-sm">
                        <p><span className="font-semibold text-warn">{w.code.replaceAll("-", " ")}:</span> {w.message}</p>
                        {w.suggestedInset && canEdit ? (
                          <Form method="post" className="mt-2">
                            <input type="hidden" name="intent" value="add-inset" />
                            <input type="hidden" name="revision" value={exhibit.revision} />
                            <input type="hidden" name="olderValue" value={w.suggestedInset.olderYears} />
                            <input type="hidden" name="olderUnit" value="a" />
                            <input type="hidden" name="youngerValue" value={w.suggestedInset.youngerYears} />
                            <input type="hidden" name="youngerUnit" value="a" />
                            <input type="hidden" name="magnification" value={w.suggestedInset.magnification} />
                            <input type="hidden" name="label" value={w.suggestedInset.label} />
                            <button type="submit" className="btn-quiet">Add the suggested inset: {w.suggestedInset.label}</button>
                          </Form>
                        ) : null}
                      </li>
                    ))}
                  </ul>
                )}
              </div>
              <div>
                <h3 className="text-lg">Durations on this scale</h3>
                <label className="mt-2 flex items-center gap-2 font-sans text-sm">Your own life, in years: <input className="field w-24" inputMode="numeric" value={lifeYears} onChange={(e) => setLifeYears(e.target.value)} aria-label="Your age in years" /></label>
                <ul className="mt-2 space-y-1 font-sans text-sm">
                  {result.durations.map((d) => (
                    <li key={d.id}>
                      {d.label}: <strong>{formatLength(d.metres, units, d.metres / 1000)}</strong>
                      {d.visible ? "" : " — too small to see at this scale"}
                      {d.insets.map((ins) => <span key={ins.insetId} className="text-ink-soft"> · {formatLength(ins.metres, units, ins.metres / 1000)} in the inset</span>)}
                    </li>
                  ))}
                </ul>
              </div>
            </div>
          </>
        ) : (
          <FormMessage>{preview.ok ? null : `The preview cannot be drawn: ${preview.message}`}</FormMessage>
        )}
        {isRoute && spec.medium.kind === "route" ? (
          <div className="mt-6 grid gap-4 lg:grid-cols-[3fr_2fr]">
            <RoutePlan geometry={spec.medium.geometry} result={result} markers={markers} />
            <div className="font-sans text-sm">
              <h3 className="font-serif text-lg">Route</h3>
              <p className="mt-1">{spec.medium.sourceName ?? "uploaded route"}: {formatLength(spec.medium.lengthMetres, units, 0.01)} on the WGS84 ellipsoid, {(spec.medium.geometry.coordinates as unknown[]).length.toLocaleString("en-GB")} points.</p>
              <p className="mt-1 text-ink-soft">The walk starts at the route's first point (the older end) and ends at its last point (the present).</p>
              {canEdit ? (
                <Form method="post" encType="multipart/form-data" className="mt-4 space-y-2">
                  <input type="hidden" name="intent" value="replace-route" />
                  <input type="hidden" name="revision" value={exhibit.revision} />
                  <label className="block"><span className="mb-1 block font-semibold">Replace the route (GPX or GeoJSON)</span>
                    <input type="file" name="routeFile" accept=".gpx,.geojson,.json" className="field" />
                  </label>
                  {err("replace-route", "routeFile") ? <p className="text-danger">{err("replace-route", "routeFile")}</p> : null}
                  <button type="submit" className="btn-quiet">Upload the new route</button>
                </Form>
              ) : null}
            </div>
          </div>
        ) : null}
      </section>

      {impact ? (
        <section className="card mt-6" aria-labelledby="impact-h">
          <h2 id="impact-h" className="text-xl">Edition impact: {edition.label} → {impact.edition.label}</h2>
          <p className="mt-1 font-sans text-sm text-ink-soft">Markers whose age differs between the two editions, and how far each would move on this exhibit. {impact.report.unchanged} boundary marker{impact.report.unchanged === 1 ? " is" : "s are"} unchanged.</p>
          {impact.report.rows.length ? (
            <div className="mt-3 overflow-x-auto">
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
              <input type="hidden" name="intent" value="repin" />
              <input type="hidden" name="revision" value={exhibit.revision} />
              <button type="submit" className="btn">Re-pin to {impact.edition.label}</button>
              <span className="ml-3 font-sans text-sm text-ink-soft">Makes a new revision; it goes through review again.</span>
            </Form>
          ) : null}
        </section>
      ) : null}

      <section className="card mt-6 overflow-x-auto" aria-labelledby="markers-h">
        <h2 id="markers-h" className="text-xl">Markers ({markers.length})</h2>
        {markers.length === 0 ? <p className="mt-2 text-ink-soft">No markers yet. Add the bases of periods, events from the library, or ages of your own below.</p> : (
          <table className="mt-3 w-full text-left font-sans text-sm">
            <thead className="border-b border-rule">
              <tr>
                <th className="p-2">#</th><th className="p-2">Label</th><th className="p-2">Kind</th><th className="p-2">Age</th><th className="p-2">From start</th><th className="p-2">To end</th><th className="p-2">±</th>
                {isRoute ? <><th className="p-2">Coordinates</th><th className="p-2">Walk</th></> : null}
                {canEdit ? <th className="p-2"><span className="sr-only">Actions</span></th> : null}
              </tr>
            </thead>
            <tbody>
              {markers.map((m) => {
                const p = byId.get(m.id);
                return (
                  <tr key={m.id} className={`border-b border-rule align-top last:border-0 ${flagged.has(m.id) ? "bg-red-50" : ""}`}>
                    <td className="num p-2"><span className="mr-1 inline-block h-3 w-3 rounded-sm border border-ink/30 align-middle" style={{ background: m.color }} aria-hidden="true" />{m.number}</td>
                    <td className="p-2">
                      <span className="font-semibold">{m.label}</span>
                      <div className="text-xs text-ink-soft">{m.source}</div>
                      {m.html ? <div className="prose-sm mt-1 text-xs" dangerouslySetInnerHTML={{ __html: m.html }} /> : null}
                      {m.howWeKnow ? <p className="mt-1 text-xs text-slate-river-700"><span className="font-semibold">How we know:</span> {m.howWeKnow}</p> : null}
                    </td>
                    <td className="p-2">{m.kind}</td>
                    <td className="num p-2">{m.approximate ? "~" : ""}{formatAgeMa(m.ageMa)}{m.uncertaintyMa ? ` ± ${formatAgeMa(m.uncertaintyMa)}` : ""}</td>
                    <td className="num p-2">{p ? (units === "metric" ? p.display.fromOlderEnd : formatLength(p.fromOlderEndMetres, units, p.display.stepMetres)) : "—"}</td>
                    <td className="num p-2">{p ? (units === "metric" ? p.display.fromYoungerEnd : formatLength(p.fromYoungerEndMetres, units, p.display.stepMetres)) : "—"}</td>
                    <td className="num p-2">{p?.display.uncertainty ?? "—"}</td>
                    {isRoute ? (
                      <>
                        <td className="num p-2">{p?.position ? `${p.position.lat.toFixed(6)}, ${p.position.lon.toFixed(6)}` : "—"}</td>
                        <td className="num p-2">{p?.walking ? `${Math.round(p.walking.seconds / 60)} min` : "—"}</td>
                      </>
                    ) : null}
                    {canEdit ? (
                      <td className="p-2">
                        <details>
                          <summary className="cursor-pointer">Edit</summary>
                          <Form method="post" className="mt-2 w-64 space-y-2">
                            <input type="hidden" name="intent" value="edit-marker" />
                            <input type="hidden" name="revision" value={exhibit.revision} />
                            <input type="hidden" name="markerId" value={m.id} />
                            <label className="block text-xs font-semibold">Label<input name="label" defaultValue={m.label} className="field" /></label>
                            <label className="block text-xs font-semibold">Text (Markdown)<textarea name="text" defaultValue={m.text} rows={3} className="field" /></label>
                            <label className="block text-xs font-semibold">How we know (decay system)
                              <select name="decaySystemId" defaultValue={m.decaySystemId ?? ""} className="field">
                                <option value="">none</option>
                                {decaySystems.map((d) => <option key={d.id} value={d.id}>{d.label}</option>)}
                              </select>
                            </label>
                            <button type="submit" className="btn-quiet">Save marker</button>
                          </Form>
                          <Form method="post" className="mt-2">
                            <input type="hidden" name="intent" value="remove-marker" />
                            <input type="hidden" name="revision" value={exhibit.revision} />
                            <input type="hidden" name="markerId" value={m.id} />
                            <button type="submit" className="btn-quiet text-danger">Remove</button>
                          </Form>
                        </details>
                      </td>
                    ) : null}
                  </tr>
                );
              })}
            </tbody>
          </table>
        )}
      </section>

      {canEdit ? (
        <section className="mt-6 grid gap-6 lg:grid-cols-3" aria-label="Add markers">
          <AddBoundaries revision={exhibit.revision} intervals={intervals.filter((i) => i.baseMa <= olderMa && i.baseMa >= youngerMa)} error={err("add-boundaries", "intervalName") ?? err("add-boundaries", "rank")} />
          <AddEvent revision={exhibit.revision} error={err("add-event", "eventId")} />
          <AddCustom revision={exhibit.revision} fields={actionData?.intent === "add-custom" ? actionData.fields : {}} />
        </section>
      ) : null}

      <section className="card mt-6" aria-labelledby="insets-h">
        <h2 id="insets-h" className="text-xl">Insets ({result?.insets.length ?? loaderData.insetIds.length})</h2>
        <p className="mt-1 font-sans text-sm text-ink-soft">A sub-span shown at a magnified scale, with its own scale statement on the sign.</p>
        <ul className="mt-3 space-y-2 font-sans text-sm">
          {result?.insets.map((i) => (
            <li key={i.id} className="flex flex-wrap items-center justify-between gap-2 rounded border border-rule p-2">
              <span><strong>{i.label}</strong> — {i.statement.lengthPerTime}; {formatLength(i.lengthMetres, units, i.lengthMetres / 1000)} long</span>
              {canEdit ? (
                <Form method="post">
                  <input type="hidden" name="intent" value="remove-inset" />
                  <input type="hidden" name="revision" value={exhibit.revision} />
                  <input type="hidden" name="insetId" value={i.id} />
                  <button type="submit" className="btn-quiet">Remove</button>
                </Form>
              ) : null}
            </li>
          ))}
        </ul>
        {canEdit ? <AddInset revision={exhibit.revision} fields={actionData?.intent === "add-inset" ? actionData.fields : {}} /> : null}
      </section>

      {canEdit ? (
        <section className="card mt-6" aria-labelledby="settings-h">
          <h2 id="settings-h" className="text-xl">Span and medium</h2>
          <p className="mt-1 font-sans text-sm text-ink-soft">The preview follows these fields as you type; nothing is saved until you press Save settings.</p>
          <Form method="post" className="mt-4 grid gap-4 font-sans text-sm md:grid-cols-2" noValidate>
            <input type="hidden" name="intent" value="settings" />
            <input type="hidden" name="revision" value={exhibit.revision} />
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
      ) : null}
    </div>
  );
}

function Labelled({ label, error, children }: { label: string; error?: string; children: React.ReactNode }) {
  return (
    <label className="block">
      <span className="mb-1 block font-semibold">{label}</span>
      {children}
      {error ? <span className="mt-1 block text-danger">{error}</span> : null}
    </label>
  );
}

function SubmitButton({ label }: { label: string }) {
  const busy = useNavigation().state === "submitting";
  return <button type="submit" className="btn" disabled={busy}>{busy ? "Saving…" : label}</button>;
}

function AddBoundaries({ revision, intervals, error }: { revision: number; intervals: { name: string; rank: Rank; baseMa: number }[]; error?: string }) {
  const ranks = RANKS.filter((r) => intervals.some((i) => i.rank === r));
  return (
    <div className="card">
      <h3 className="text-lg">Interval boundaries</h3>
      <p className="mt-1 font-sans text-sm text-ink-soft">From the pinned chart edition; each marker's age is the interval's base.</p>
      {error ? <p className="mt-2 font-sans text-sm text-danger" role="alert">{error}</p> : null}
      <Form method="post" className="mt-3 space-y-2 font-sans text-sm">
        <input type="hidden" name="intent" value="add-boundaries" />
        <input type="hidden" name="revision" value={revision} />
        <label className="block"><span className="mb-1 block font-semibold">All of a rank</span>
          <select name="rank" className="field" defaultValue="period">{ranks.map((r) => <option key={r} value={r}>every {r} base</option>)}</select>
        </label>
        <button type="submit" className="btn-quiet">Add all</button>
      </Form>
      <Form method="post" className="mt-4 space-y-2 font-sans text-sm">
        <input type="hidden" name="intent" value="add-boundaries" />
        <input type="hidden" name="revision" value={revision} />
        <label className="block"><span className="mb-1 block font-semibold">One interval</span>
          <select name="intervalName" className="field">{intervals.map((i) => <option key={i.name} value={i.name}>{i.name} ({i.rank}, {i.baseMa} Ma)</option>)}</select>
        </label>
        <button type="submit" className="btn-quiet">Add its base</button>
      </Form>
    </div>
  );
}

interface FoundEvent {
  id: number;
  name: string;
  ageText: string;
  citation: string;
  scope: "shared" | "organisation";
}

function AddEvent({ revision, error }: { revision: number; error?: string }) {
  const search = useFetcher<{ results?: FoundEvent[]; error?: { message: string } }>();
  const [chosen, setChosen] = useState<FoundEvent | null>(null);
  return (
    <div className="card">
      <h3 className="text-lg">Dated events</h3>
      <p className="mt-1 font-sans text-sm text-ink-soft">From the event library, each with its age, ± and citation.</p>
      {error ? <p className="mt-2 font-sans text-sm text-danger" role="alert">{error}</p> : null}
      <label className="mt-3 block font-sans text-sm"><span className="mb-1 block font-semibold">Search the library</span>
        <input type="search" className="field" placeholder="e.g. zircon, extinction, Homo" onChange={(e) => search.load(`/api/events?q=${encodeURIComponent(e.target.value)}`)} aria-controls="event-results" />
      </label>
      <ul id="event-results" className="mt-2 max-h-56 space-y-1 overflow-y-auto font-sans text-sm" aria-live="polite">
        {search.data?.results?.map((ev) => (
          <li key={ev.id}>
            <button type="button" onClick={() => setChosen(ev)} className={`w-full rounded border p-2 text-left ${chosen?.id === ev.id ? "border-sandstone-600 bg-sandstone-50" : "border-rule hover:bg-paper"}`}>
              <span className="font-semibold">{ev.name}</span> <span className="text-ink-soft">{ev.ageText}{ev.scope === "organisation" ? " · ours" : ""}</span>
            </button>
          </li>
        ))}
        {search.data?.results && search.data.results.length === 0 ? <li className="text-ink-soft">Nothing found.</li> : null}
        {search.data?.error ? <li className="text-danger">{search.data.error.message}</li> : null}
      </ul>
      <Form method="post" className="mt-3 font-sans text-sm">
        <input type="hidden" name="intent" value="add-event" />
        <input type="hidden" name="revision" value={revision} />
        <input type="hidden" name="eventId" value={chosen?.id ?? ""} />
        <p className="mb-2">{chosen ? <>Chosen: <strong>{chosen.name}</strong> <span className="text-ink-soft">({chosen.citation})</span></> : "Choose an event from the results."}</p>
        <button type="submit" className="btn-quiet" disabled={!chosen}>Add the event</button>
      </Form>
    </div>
  );
}

function AddCustom({ revision, fields }: { revision: number; fields: Record<string, string> }) {
  return (
    <div className="card">
      <h3 className="text-lg">An age of your own</h3>
      <p className="mt-1 font-sans text-sm text-ink-soft">Every custom age needs its source; the reviewer checks it.</p>
      <Form method="post" className="mt-3 space-y-2 font-sans text-sm" noValidate>
        <input type="hidden" name="intent" value="add-custom" />
        <input type="hidden" name="revision" value={revision} />
        <Labelled label="Label" error={fields.label}><input name="label" className="field" /></Labelled>
        <div className="grid grid-cols-[1fr_1fr_auto] gap-2">
          <Labelled label="Age" error={fields.ageValue}><input name="ageValue" inputMode="decimal" className="field" /></Labelled>
          <Labelled label="±" error={fields.uncertaintyValue}><input name="uncertaintyValue" inputMode="decimal" className="field" /></Labelled>
          <Labelled label="Unit"><select name="ageUnit" className="field" defaultValue="Ma">{AGE_UNITS.map((u) => <option key={u}>{u}</option>)}</select></Labelled>
        </div>
        <Labelled label="Source" error={fields.source}><input name="source" className="field" placeholder="Author (year), journal, or a named dataset" /></Labelled>
        <Labelled label="Text (Markdown, optional)" error={fields.text}><textarea name="text" rows={2} className="field" /></Labelled>
        <button type="submit" className="btn-quiet">Add the age</button>
      </Form>
    </div>
  );
}

function AddInset({ revision, fields }: { revision: number; fields: Record<string, string> }) {
  return (
    <Form method="post" className="mt-4 grid gap-2 font-sans text-sm md:grid-cols-[1fr_auto_1fr_auto_1fr_2fr_auto] md:items-end" noValidate>
      <input type="hidden" name="intent" value="add-inset" />
      <input type="hidden" name="revision" value={revision} />
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
