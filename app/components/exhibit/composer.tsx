// The composer: one exhibit's settings, markers, insets and live preview. The preview pane stays in
// view at the top of the window (sticky) while everything below it is edited; the scale engine runs
// in the browser on every change of the settings draft, reusing the prepared route, and React
// draws the preview at a lower priority than the typing (useDeferredValue), so keystrokes stay
// quick. Every form carries the revision it was based on; the server refuses a save based on an
// older one.
import { memo, useCallback, useDeferredValue, useMemo, useState } from "react";
import { FormMessage } from "~/components/forms";
import { PageHeader } from "~/components/page-header";
import { Term } from "~/components/term";
import { AddBoundaries, AddCustom, AddEvent } from "~/components/exhibit/add-markers";
import type { FieldError } from "~/components/exhibit/form-bits";
import { ExportMenu } from "~/components/exhibit/export-menu";
import { ImpactSection } from "~/components/exhibit/impact-section";
import { InsetsSection } from "~/components/exhibit/insets";
import { MarkersTable } from "~/components/exhibit/markers-table";
import { CoverImageSection } from "~/components/exhibit/marker-image";
import { DurationsSection, PreviewPane, RouteSection } from "~/components/exhibit/preview";
import { SettingsForm } from "~/components/exhibit/settings-form";
import { WarningsSection } from "~/components/exhibit/warnings";
import { bandsFor, computeExhibit, draftOf, routeCacheFor, specOfDraft, standardDurations, type ComposerRefusal, type ComposerView, type SettingsDraft } from "~/lib/exhibit";
import { toYears } from "~/lib/units";

// Sections re-draw only when their own inputs change: a keystroke in a settings field re-draws the
// field at once and the preview (at lower priority), not the whole page.
const Pane = memo(PreviewPane);
const Warnings = memo(WarningsSection);
const Durations = memo(DurationsSection);
const Impact = memo(ImpactSection);
const Markers = memo(MarkersTable);
const Boundaries = memo(AddBoundaries);
const Event = memo(AddEvent);
const Custom = memo(AddCustom);
const Insets = memo(InsetsSection);
const Route = memo(RouteSection);
const Cover = memo(CoverImageSection);
const NO_FIELDS: Record<string, string> = {};

export function Composer({ view, refusal, children }: { view: ComposerView; refusal?: ComposerRefusal; children?: React.ReactNode }) {
  // Re-mount after every save so the drafts start from what was saved.
  return <ComposerBody key={view.exhibit.revision} view={view} refusal={refusal}>{children}</ComposerBody>;
}

const STATUS_WORDS: Record<string, string> = { draft: "Draft", in_review: "In review", "in-review": "In review", changes_requested: "Changes requested", approved: "Approved", published: "Published" };


function ComposerBody({ view, refusal, children }: { view: ComposerView; refusal?: ComposerRefusal; children?: React.ReactNode }) {
  const { exhibit, edition, markers, intervals, impact, canEdit, decaySystems } = view;
  const saved = useMemo(() => draftOf(exhibit.title, view.spec), [exhibit.title, view.spec]);
  const [draft, setDraft] = useState<SettingsDraft>(saved);
  const [lifeYears, setLifeYears] = useState("80");
  const setField = useCallback((k: keyof SettingsDraft, value: string) => setDraft((d) => ({ ...d, [k]: value })), []);
  // The fields update at once; the preview follows at a lower priority.
  const shownDraft = useDeferredValue(draft);
  const shownLife = useDeferredValue(lifeYears);
  const spec = useMemo(() => specOfDraft(shownDraft, view.spec), [shownDraft, view.spec]);
  // The saved route is measured once; the preview reuses it on every keystroke.
  const routeGeometry = view.spec.medium.kind === "route" ? view.spec.medium.geometry : null;
  const routeCache = useMemo(() => routeCacheFor(routeGeometry), [routeGeometry]);
  const preview = useMemo(() => computeExhibit(spec, markers, standardDurations(Math.max(1, Number(shownLife) || 80)), routeCache), [spec, markers, shownLife, routeCache]);
  const units = shownDraft.unitsPreference;
  const result = preview.ok ? preview.result : null;
  const acknowledged = useMemo(() => new Map(view.acknowledgements.map((a) => [a.warningKey, a])), [view.acknowledgements]);
  const warnings = useMemo(() => result?.warnings ?? [], [result]);
  const openWarnings = useMemo(() => warnings.filter((w) => !acknowledged.has(w.key)), [warnings, acknowledged]);
  const flagged = useMemo(() => new Set(openWarnings.filter((w) => w.code.startsWith("markers-")).flatMap((w) => w.pointIds)), [openWarnings]);
  const olderMa = toYears(spec.spanOlder) / 1e6;
  const youngerMa = toYears(spec.spanYounger) / 1e6;
  const bands = useMemo(() => (preview.ok ? bandsFor(intervals, olderMa, youngerMa) : []), [intervals, olderMa, youngerMa, preview.ok]);
  const points = useMemo(() => new Map(result?.points.map((p) => [p.id, p]) ?? []), [result]);
  const dirty = JSON.stringify(draft) !== JSON.stringify(saved);
  const isRoute = spec.medium.kind === "route";
  const fieldsOf = useCallback((intent: string) => (refusal?.intent === intent ? refusal.fields : NO_FIELDS), [refusal]);
  const err = useCallback<FieldError>((intent, field) => fieldsOf(intent)[field], [fieldsOf]);
  const boundaryChoices = useMemo(() => intervals.filter((i) => i.baseMa <= olderMa && i.baseMa >= youngerMa), [intervals, olderMa, youngerMa]);
  const revision = exhibit.revision;
  // Errors of forms that show their own message beside the form are not repeated at the top.
  const ownMessage = refusal && ["acknowledge-warning", "combine-markers"].includes(refusal.intent);

  return (
    <div>
      <PageHeader
        align="start"
        crumbs={[{ to: "/studio/exhibits", label: "Exhibits" }]}
        current={exhibit.title}
        title={exhibit.title}
        actions={
          <>
            <a href={`/studio/exhibits/${exhibit.slug}/schedule.csv`} className="btn-quiet no-underline" download>Marker schedule (CSV)</a>
            <a href={`/studio/exhibits/${exhibit.slug}/signs`} className="btn-quiet no-underline">Signs and print files</a>
            {view.exportMenu ? <ExportMenu slug={exhibit.slug} view={view.exportMenu} /> : null}
          </>
        }
      >
        <p className="mt-1 font-sans text-sm text-ink-soft">
          {STATUS_WORDS[exhibit.status] ?? exhibit.status} · saved version (<Term id="revision" />) {revision} · checked against chart edition <strong className="text-ink">{edition.label}</strong> (<Term id="pinned">pinned</Term>)
          {exhibit.updatedBy ? ` · last saved by ${exhibit.updatedBy} ${exhibit.updatedAt.slice(0, 16).replace("T", " ")} UTC` : ""}
        </p>
        {impact ? <p className="mt-2 inline-block rounded bg-sandstone-100 px-3 py-1 font-sans text-sm font-semibold text-sandstone-700"><Term id="needs-recheck">Needs re-check</Term>: checked against {edition.label}; {impact.edition.label} is current for your organisation.</p> : null}
      </PageHeader>

      {refusal?.error && !ownMessage ? <div className="mt-4"><FormMessage>{refusal.error}</FormMessage></div> : null}
      {children}

      {/* A direct child of the page's column, so that it stays in view over the whole composer. */}
      <Pane title={exhibit.title} preview={preview} markers={markers} bands={bands} units={units} flagged={flagged} olderMa={olderMa} youngerMa={youngerMa} dirty={dirty} openWarnings={openWarnings.length} />

      <div className="mt-6 space-y-6">
        {canEdit ? <SettingsForm spec={spec} draft={draft} setField={setField} revision={revision} err={err} /> : null}

        {result ? (
          <div className="grid gap-6 lg:grid-cols-[3fr_2fr]">
            <Warnings warnings={warnings} acknowledged={acknowledged} canEdit={canEdit} revision={revision} refusal={refusal} />
            <Durations result={result} units={units} lifeYears={lifeYears} onLifeYears={setLifeYears} />
          </div>
        ) : null}

        {impact ? <Impact impact={impact} editionLabel={edition.label} units={units} revision={revision} canEdit={canEdit} /> : null}

        <Markers markers={markers} decaySystems={decaySystems} points={points} flagged={flagged} units={units} isRoute={isRoute} canEdit={canEdit} revision={revision} />

        <Cover revision={revision} canEdit={canEdit} />

        {canEdit ? (
          <section className="grid gap-6 lg:grid-cols-3" aria-label="Add markers">
            <Boundaries revision={revision} intervals={boundaryChoices} error={err("add-boundaries", "intervalName") ?? err("add-boundaries", "rank")} />
            <Event revision={revision} error={err("add-event", "eventId")} />
            <Custom revision={revision} fields={fieldsOf("add-custom")} />
          </section>
        ) : null}

        <Insets insets={result?.insets} savedCount={view.insetIds.length} units={units} canEdit={canEdit} revision={revision} fields={fieldsOf("add-inset")} />

        {isRoute ? <Route spec={spec} result={result} markers={markers} units={units} canEdit={canEdit} revision={revision} err={err} /> : null}
        {isRoute ? <RouteCautions /> : null}
      </div>
    </div>
  );
}

function RouteCautions() {
  return (
    <aside className="rounded-lg border-l-4 border-warn bg-sandstone-50 p-4 font-sans text-sm" aria-label="Cautions for route exhibits">
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
