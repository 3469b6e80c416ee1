// The composer: one exhibit's settings, markers, insets and live preview. The scale engine runs in
// the browser on every change of the settings draft, reusing the prepared route. Every form carries
// the revision it was based on; the server refuses a save based on an older one.
import { useMemo, useState } from "react";
import { FormMessage } from "~/components/forms";
import { PageHeader } from "~/components/page-header";
import { AddBoundaries, AddCustom, AddEvent } from "~/components/exhibit/add-markers";
import type { FieldError } from "~/components/exhibit/form-bits";
import { ImpactSection } from "~/components/exhibit/impact-section";
import { InsetsSection } from "~/components/exhibit/insets";
import { MarkersTable } from "~/components/exhibit/markers-table";
import { Preview } from "~/components/exhibit/preview";
import { SettingsForm } from "~/components/exhibit/settings-form";
import { bandsFor, computeExhibit, draftOf, routeCacheFor, specOfDraft, standardDurations, type ComposerRefusal, type ComposerView, type SettingsDraft } from "~/lib/exhibit";
import { toYears } from "~/lib/units";

export function Composer({ view, refusal }: { view: ComposerView; refusal?: ComposerRefusal }) {
  // Re-mount after every save so the drafts start from what was saved.
  return <ComposerBody key={view.exhibit.revision} view={view} refusal={refusal} />;
}

function ComposerBody({ view, refusal }: { view: ComposerView; refusal?: ComposerRefusal }) {
  const { exhibit, edition, markers, intervals, impact, canEdit, decaySystems } = view;
  const saved = useMemo(() => draftOf(exhibit.title, view.spec), [exhibit.title, view.spec]);
  const [draft, setDraft] = useState<SettingsDraft>(saved);
  const [lifeYears, setLifeYears] = useState("80");
  const set = (k: keyof SettingsDraft) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setDraft((d) => ({ ...d, [k]: e.target.value }));
  const spec = useMemo(() => specOfDraft(draft, view.spec), [draft, view.spec]);
  // The saved route is measured once; the preview reuses it on every keystroke.
  const routeGeometry = view.spec.medium.kind === "route" ? view.spec.medium.geometry : null;
  const routeCache = useMemo(() => routeCacheFor(routeGeometry), [routeGeometry]);
  // The preview: the scale engine, in the browser, on every change.
  const preview = useMemo(() => computeExhibit(spec, markers, standardDurations(Math.max(1, Number(lifeYears) || 80)), routeCache), [spec, markers, lifeYears, routeCache]);
  const units = draft.unitsPreference;
  const result = preview.ok ? preview.result : null;
  const flagged = new Set(result?.warnings.filter((w) => w.code.startsWith("markers-")).flatMap((w) => w.pointIds) ?? []);
  const olderMa = toYears(spec.spanOlder) / 1e6;
  const youngerMa = toYears(spec.spanYounger) / 1e6;
  const bands = useMemo(() => (preview.ok ? bandsFor(intervals, olderMa, youngerMa) : []), [intervals, olderMa, youngerMa, preview.ok]);
  const points = new Map(result?.points.map((p) => [p.id, p]) ?? []);
  const dirty = JSON.stringify(draft) !== JSON.stringify(saved);
  const isRoute = spec.medium.kind === "route";
  const fieldsOf = (intent: string) => (refusal?.intent === intent ? refusal.fields : {});
  const err: FieldError = (intent, field) => fieldsOf(intent)[field];
  const revision = exhibit.revision;

  return (
    <div>
      <PageHeader
        align="start"
        crumbs={[{ to: "/studio/exhibits", label: "Exhibits" }]}
        current={exhibit.slug}
        title={exhibit.title}
        actions={
          <>
            <a href={`/studio/exhibits/${exhibit.slug}/schedule.csv`} className="btn-quiet no-underline" download>Marker schedule (CSV)</a>
            {isRoute ? <a href={`/studio/exhibits/${exhibit.slug}/points.geojson`} className="btn-quiet no-underline" download>Marker points (GeoJSON)</a> : null}
          </>
        }
      >
        <p className="mt-1 font-sans text-sm text-ink-soft">
          {exhibit.status} · revision {revision} · pinned to {edition.label}
          {exhibit.updatedBy ? ` · last saved by ${exhibit.updatedBy} ${exhibit.updatedAt.slice(0, 16).replace("T", " ")} UTC` : ""}
        </p>
        {impact ? <p className="mt-2 inline-block rounded bg-sandstone-100 px-3 py-1 font-sans text-sm font-semibold text-sandstone-700">Needs re-check: pinned to {edition.label}; {impact.edition.label} is current for your organisation.</p> : null}
      </PageHeader>

      {refusal?.error ? <div className="mt-4"><FormMessage>{refusal.error}</FormMessage></div> : null}

      {isRoute ? <RouteCautions /> : null}

      <Preview
        title={exhibit.title}
        revision={revision}
        spec={spec}
        preview={preview}
        markers={markers}
        bands={bands}
        units={units}
        flagged={flagged}
        olderMa={olderMa}
        youngerMa={youngerMa}
        dirty={dirty}
        canEdit={canEdit}
        lifeYears={lifeYears}
        onLifeYears={setLifeYears}
        err={err}
      />

      {impact ? <ImpactSection impact={impact} editionLabel={edition.label} units={units} revision={revision} canEdit={canEdit} /> : null}

      <MarkersTable markers={markers} decaySystems={decaySystems} points={points} flagged={flagged} units={units} isRoute={isRoute} canEdit={canEdit} revision={revision} />

      {canEdit ? (
        <section className="mt-6 grid gap-6 lg:grid-cols-3" aria-label="Add markers">
          <AddBoundaries revision={revision} intervals={intervals.filter((i) => i.baseMa <= olderMa && i.baseMa >= youngerMa)} error={err("add-boundaries", "intervalName") ?? err("add-boundaries", "rank")} />
          <AddEvent revision={revision} error={err("add-event", "eventId")} />
          <AddCustom revision={revision} fields={fieldsOf("add-custom")} />
        </section>
      ) : null}

      <InsetsSection insets={result?.insets} savedCount={view.insetIds.length} units={units} canEdit={canEdit} revision={revision} fields={fieldsOf("add-inset")} />

      {canEdit ? <SettingsForm spec={spec} draft={draft} set={set} revision={revision} err={err} /> : null}
    </div>
  );
}

function RouteCautions() {
  return (
    <aside className="mt-4 rounded-lg border-l-4 border-warn bg-sandstone-50 p-4 font-sans text-sm" aria-label="Cautions for route exhibits">
      <p className="font-semibold">Before anyone walks this route</p>
      <ul className="mt-1 list-disc pl-5">
        <li>Walk the route yourself first, for hazards and for accessibility (surface, width, slopes, resting places).</li>
        <li>Get the landowner's and the relevant authorities' permission for every sign.</li>
        <li>Follow local codes and licensed practice for installing signs and posts.</li>
        <li>The coordinates here are planning figures on the WGS84 ellipsoid, not a survey; set out the markers on site.</li>
      </ul>
    </aside>
  );
}
