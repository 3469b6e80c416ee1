import { useState } from "react";
import { data, Form, redirect, useNavigation } from "react-router";
import { Field, FormMessage, UnitSelect } from "~/components/forms";
import { PageHeader } from "~/components/page-header";
import { readNewExhibitForm } from "~/lib/exhibit";
import { MEDIUM_TYPES } from "~/lib/scale/legibility";
import { AGE_UNITS, LENGTH_UNITS } from "~/lib/units";
import { requirePermission } from "#server/auth.server.ts";
import { currentEditionFor, editionIntervals } from "#server/editions.server.ts";
import { createExhibit } from "#server/exhibits/commands.server.ts";
import { pinnableEditions } from "#server/exhibits/list.server.ts";
import { ExhibitError } from "#server/exhibits/load.server.ts";
import { readExhibitForm } from "#server/exhibits/revise.server.ts";
import { noticeHeader } from "#server/session.server.ts";
import type { Route } from "./+types/exhibits.new";

export const meta: Route.MetaFunction = () => [{ title: "New exhibit · Eonscale" }];

export async function loader({ request }: Route.LoaderArgs) {
  const member = await requirePermission(request, "exhibit.edit");
  const [{ editions, current }, edition] = await Promise.all([pinnableEditions(member.organisation.id), currentEditionFor(member.organisation.id)]);
  const intervals = edition ? await editionIntervals(edition.id) : [];
  return {
    editions,
    current,
    // For "span from the base of …": eons, eras and periods of the current edition.
    starts: intervals.filter((i) => ["eon", "era", "period"].includes(i.rank)).map((i) => ({ name: i.name, rank: i.rank, baseMa: i.baseMa })),
  };
}

export async function action({ request }: Route.ActionArgs) {
  const member = await requirePermission(request, "exhibit.edit");
  const read = await readExhibitForm(request);
  if (!read.ok) return data({ error: read.message, fields: { routeFile: read.message } as Record<string, string> }, { status: 413 });
  const parsed = await readNewExhibitForm(read.form);
  if (!parsed.ok) return data({ error: "Check the highlighted fields.", fields: parsed.fields }, { status: 400 });
  const { input } = parsed;
  try {
    await createExhibit({ organisationId: member.organisation.id, user: member.user }, input);
  } catch (error) {
    if (error instanceof ExhibitError) return data({ error: error.message, fields: { [error.field]: error.message } }, { status: 400 });
    throw error;
  }
  return redirect(`/studio/exhibits/${input.slug}`, { headers: { "Set-Cookie": await noticeHeader({ kind: "success", message: `Exhibit created. Now add its markers.${input.medium.kind === "route" && input.medium.note ? ` ${input.medium.note}` : ""}` }) } });
}

export default function NewExhibit({ loaderData, actionData }: Route.ComponentProps) {
  const f: Record<string, string> = actionData?.fields ?? {};
  const [kind, setKind] = useState<"length" | "route">("length");
  const [older, setOlder] = useState("4567");
  const [olderUnit, setOlderUnit] = useState("Ma");
  const busy = useNavigation().state === "submitting";
  return (
    <div className="max-w-3xl">
      <PageHeader title="New exhibit" lead="Choose the span of time and what it is laid out on. Markers come next." />
      <FormMessage>{actionData?.error}</FormMessage>
      <Form method="post" encType="multipart/form-data" noValidate className="card mt-6">
        <Field label="Title" name="title" required error={f.title} placeholder="e.g. Riverside walk through deep time" />
        <Field label="Web address (slug)" name="slug" hint="Optional: made from the title when left empty." error={f.slug} />
        <div className="mb-4">
          <label htmlFor="editionSlug" className="mb-1 block text-sm font-semibold">Chart edition to pin</label>
          <select id="editionSlug" name="editionSlug" defaultValue={loaderData.current ?? undefined} className="field">
            {loaderData.editions.map((e) => <option key={e.slug} value={e.slug}>{e.label}{e.own ? " · your organisation's own" : ""}{e.current ? " (current)" : ` (${e.status})`}</option>)}
          </select>
          {f.editionSlug ? <p className="mt-1 font-sans text-sm text-danger">{f.editionSlug}</p> : null}
        </div>
        <fieldset className="mb-4 rounded border border-rule p-4">
          <legend className="px-1 font-sans text-sm font-semibold">Span (years before present)</legend>
          <div className="mb-3">
            <label htmlFor="start-pick" className="mb-1 block font-sans text-sm">Start at the base of…</label>
            <select id="start-pick" className="field" defaultValue="" onChange={(e) => { const s = loaderData.starts.find((x) => x.name === e.target.value); if (s) { setOlder(String(s.baseMa)); setOlderUnit("Ma"); } }}>
              <option value="">(type the ages below)</option>
              {loaderData.starts.map((s) => <option key={s.name} value={s.name}>{s.name} ({s.rank}, {s.baseMa} Ma) to the present</option>)}
            </select>
          </div>
          <div className="grid grid-cols-[1fr_auto] gap-2">
            <Field label="Older end" name="spanOlderValue" inputMode="decimal" value={older} onChange={(e) => setOlder(e.target.value)} error={f.spanOlderValue} />
            <UnitSelect name="spanOlderUnit" label="unit" units={AGE_UNITS} value={olderUnit} onChange={setOlderUnit} />
            <Field label="Younger end" name="spanYoungerValue" inputMode="decimal" defaultValue="0" error={f.spanYoungerValue} />
            <UnitSelect name="spanYoungerUnit" label="unit" units={AGE_UNITS} defaultValue="Ma" />
          </div>
        </fieldset>
        <fieldset className="mb-4 rounded border border-rule p-4">
          <legend className="px-1 font-sans text-sm font-semibold">Medium</legend>
          <div className="mb-3 flex gap-6 font-sans">
            <label className="flex items-center gap-2"><input type="radio" name="mediumKind" value="length" checked={kind === "length"} onChange={() => setKind("length")} /> A straight length (wall, rope, banner)</label>
            <label className="flex items-center gap-2"><input type="radio" name="mediumKind" value="route" checked={kind === "route"} onChange={() => setKind("route")} /> A route (GeoJSON or GPX)</label>
          </div>
          <div className="mb-4">
            <label htmlFor="mediumType" className="mb-1 block text-sm font-semibold">What it is</label>
            <select id="mediumType" name="mediumType" defaultValue={kind === "route" ? "trail" : "wall"} key={kind} className="field">
              {MEDIUM_TYPES.map((m) => <option key={m} value={m}>{m}</option>)}
            </select>
          </div>
          {kind === "length" ? (
            <div className="grid grid-cols-[1fr_auto] gap-2">
              <Field label="Length" name="lengthValue" inputMode="decimal" required error={f.lengthValue} />
              <UnitSelect name="lengthUnit" label="unit" units={LENGTH_UNITS} defaultValue="m" />
              <Field label="Print panel width (optional)" name="panelWidthValue" inputMode="decimal" error={f.panelWidthValue} hint="For banners and wall panels printed in tiles." />
              <UnitSelect name="panelWidthUnit" label="unit" units={LENGTH_UNITS} defaultValue="mm" />
            </div>
          ) : (
            <div className="mb-2">
              <label htmlFor="routeFile" className="mb-1 block text-sm font-semibold">Route file</label>
              <p className="mb-1 font-sans text-sm text-ink-soft">A GPX track or a GeoJSON LineString. Its length is measured on the WGS84 ellipsoid; the walk starts at the file's first point (the older end).</p>
              <input id="routeFile" name="routeFile" type="file" accept=".gpx,.geojson,.json,application/gpx+xml,application/geo+json" className="field" aria-invalid={f.routeFile ? true : undefined} />
              {f.routeFile ? <p className="mt-1 font-sans text-sm text-danger">{f.routeFile}</p> : null}
            </div>
          )}
        </fieldset>
        <div className="mb-6">
          <label htmlFor="unitsPreference" className="mb-1 block text-sm font-semibold">Show distances in</label>
          <select id="unitsPreference" name="unitsPreference" defaultValue="metric" className="field">
            <option value="metric">metric (m, km)</option>
            <option value="us">US customary (ft, mi)</option>
          </select>
        </div>
        <button type="submit" className="btn" disabled={busy}>{busy ? "Creating…" : "Create the exhibit"}</button>
      </Form>
    </div>
  );
}
