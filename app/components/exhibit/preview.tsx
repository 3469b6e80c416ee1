// The live preview: the scale engine's result for the settings as typed. The pane with the scale
// statement and the strip stays in view (sticky) while the settings, markers and insets below are
// edited; durations and the route plan are sections of their own further down.
import { useEffect, useState } from "react";
import { Form } from "react-router";
import { FormMessage } from "~/components/forms";
import { RoutePlan } from "~/components/exhibit/route-plan";
import { ProfileChart } from "~/components/exhibit/profile-chart";
import { ScaleStrip } from "~/components/exhibit/scale-strip";
import { IntentFields, type FieldError } from "~/components/exhibit/form-bits";
import { Term } from "~/components/term";
import { formatAgeMa, formatLength, formatLengthAsGiven, formatSpanEndMa, type Band, type computeExhibit, type ExhibitSpec, type ResolvedMarker, type UnitsPreference } from "~/lib/exhibit";
import type { ScaleResult } from "~/lib/scale/compute";
import { formatLengthSig } from "~/lib/scale/format";

type Preview = ReturnType<typeof computeExhibit>;

export interface PreviewPaneProps {
  title: string;
  preview: Preview;
  markers: ResolvedMarker[];
  bands: Band[];
  units: UnitsPreference;
  flagged: Set<string>;
  olderMa: number;
  youngerMa: number;
  dirty: boolean;
  openWarnings: number;
}

export function PreviewPane({ title, preview, markers, bands, units, flagged, olderMa, youngerMa, dirty, openWarnings }: PreviewPaneProps) {
  const [shown, setShown] = useState(true);
  const result = preview.ok ? preview.result : null;
  useEffect(() => {
    document.documentElement.classList.add("under-preview-pane");
    return () => document.documentElement.classList.remove("under-preview-pane");
  }, []);
  return (
    <section className="sticky top-0 z-20 -mx-4 mt-4 max-h-[55vh] overflow-y-auto border-b border-rule bg-white px-4 py-3 shadow-sm sm:mx-0 sm:rounded-b-lg sm:border sm:border-t-0" aria-labelledby="preview-h" data-testid="preview-pane">
      <div className="flex flex-wrap items-center justify-between gap-x-3 gap-y-1">
        <h2 id="preview-h" className="text-lg">Preview</h2>
        <div className="flex flex-wrap items-center gap-x-3 gap-y-1 font-sans text-sm">
          {dirty ? <span className="font-semibold text-sandstone-700" role="status">Unsaved settings shown — Save settings keeps them</span> : null}
          {openWarnings ? <a href="#warnings" className="font-semibold text-warn">⚠ {openWarnings} warning{openWarnings === 1 ? "" : "s"}</a> : null}
          <button type="button" className="btn-quiet min-h-8 px-2 py-0.5" aria-expanded={shown} aria-controls="preview-body" onClick={() => setShown((s) => !s)}>
            {shown ? "Hide the strip" : "Show the strip"}
          </button>
        </div>
      </div>
      {preview.ok && result ? (
        <div id="preview-body">
          <p className="mt-1 font-sans text-sm">
            <strong>{formatLengthAsGiven(result.scale.totalMetres, units, result.scale.totalMetres / 1e5)}</strong> for {formatAgeMa(olderMa)} to {formatSpanEndMa(youngerMa)}: {result.scale.statement.lengthPerTime} ({result.scale.statement.timePerLength}).
          </p>
          {shown ? <div className="mt-2"><ScaleStrip result={result} markers={markers} bands={bands} units={units} flagged={flagged} title={`Scale strip of ${title}`} /></div> : null}
        </div>
      ) : (
        <div id="preview-body" className="mt-2"><FormMessage>{preview.ok ? null : `The preview cannot be drawn: ${preview.message}`}</FormMessage></div>
      )}
    </section>
  );
}

export function DurationsSection({ result, units, lifeYears, onLifeYears }: { result: ScaleResult; units: UnitsPreference; lifeYears: string; onLifeYears: (value: string) => void }) {
  return (
    <section className="card" aria-labelledby="durations-h">
      <h2 id="durations-h" className="text-xl">Durations on this scale</h2>
      <p className="mt-1 font-sans text-xs text-ink-soft">
        Smallest visible length {formatLength(result.scale.legibility.minVisibleMetres, units, result.scale.legibility.minVisibleMetres / 10)}, smallest spacing between markers {formatLength(result.scale.legibility.minSpacingMetres, units, result.scale.legibility.minSpacingMetres / 10)} ({result.scale.legibility.source}).
      </p>
      <label className="mt-2 flex flex-wrap items-center gap-2 font-sans text-sm">
        <span>Your own life, in years:</span>
        <input className="field w-24" inputMode="numeric" value={lifeYears} onChange={(e) => onLifeYears(e.target.value)} />
      </label>
      <ul className="mt-2 space-y-1 font-sans text-sm">
        {result.durations.map((d) => (
          <li key={d.id}>
            {d.label}: <strong>{formatLengthSig(d.metres, 3, undefined, units)}</strong>
            {d.visible ? "" : " — too small to see at this scale"}
            {/* the engine's own words per inset: "8 cm in inset “…”", "… at the scale of inset “…”", or why it is not shown there */}
            {d.insets.map((ins) => (
              <span key={ins.insetId} className="text-ink-soft">{` · ${ins.text}`}</span>
            ))}
          </li>
        ))}
      </ul>
    </section>
  );
}

export function RouteSection({ spec, result, markers, units, canEdit, revision, err }: { spec: ExhibitSpec; result: ScaleResult | null; markers: ResolvedMarker[]; units: UnitsPreference; canEdit: boolean; revision: number; err: FieldError }) {
  if (spec.medium.kind !== "route") return null;
  const medium = spec.medium;
  return (
    <section className="card" aria-labelledby="route-h">
      <h2 id="route-h" className="text-xl">The route</h2>
      <div className="mt-3 grid gap-4 lg:grid-cols-[3fr_2fr]">
        <RoutePlan geometry={medium.geometry} result={result} markers={markers} units={units} />
        <div className="font-sans text-sm">
          <p>
            {medium.sourceName ?? "uploaded route"}: {formatLength(medium.lengthMetres, units, 0.01)} measured on the <Term id="wgs84" />, {(medium.geometry.coordinates as unknown[]).length.toLocaleString("en-GB")} points.
          </p>
          {result?.scale.route ? (
            <p className="mt-1">Walking it takes about {Math.round(result.scale.route.walkingSeconds / 60)} min at {result.scale.route.walkingSpeedMps} m/s ({Math.round(result.scale.route.accessibleWalkingSeconds / 60)} min at {result.scale.route.accessibleSpeedMps} m/s).</p>
          ) : null}
          <p className="mt-1 text-ink-soft">The walk starts at the route's first point (the older end) and ends at its last point (the present).</p>
          {canEdit ? (
            <Form method="post" encType="multipart/form-data" className="mt-4 space-y-2">
              <IntentFields intent="replace-route" revision={revision} />
              <label className="block"><span className="mb-1 block font-semibold">Replace the route (a GPX or GeoJSON file)</span>
                <input type="file" name="routeFile" accept=".gpx,.geojson,.json" className="field" />
              </label>
              {err("replace-route", "routeFile") ? <p className="text-danger">{err("replace-route", "routeFile")}</p> : null}
              <button type="submit" className="btn-quiet">Upload the new route</button>
            </Form>
          ) : null}
        </div>
      </div>
      <ProfileChart geometry={medium.geometry} units={units} />
    </section>
  );
}
