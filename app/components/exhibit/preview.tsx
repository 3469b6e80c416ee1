// The live preview: the scale engine's result for the settings as typed — scale statement, strip,
// legibility warnings (with the suggested inset one click away), durations, and the route.
import { Form } from "react-router";
import { FormMessage } from "~/components/forms";
import { RoutePlan } from "~/components/exhibit/route-plan";
import { ScaleStrip } from "~/components/exhibit/scale-strip";
import { IntentFields, type FieldError } from "~/components/exhibit/form-bits";
import { formatAgeMa, formatLength, type Band, type computeExhibit, type ExhibitSpec, type ResolvedMarker, type UnitsPreference } from "~/lib/exhibit";

export interface PreviewProps {
  title: string;
  revision: number;
  spec: ExhibitSpec;
  preview: ReturnType<typeof computeExhibit>;
  markers: ResolvedMarker[];
  bands: Band[];
  units: UnitsPreference;
  flagged: Set<string>;
  olderMa: number;
  youngerMa: number;
  dirty: boolean;
  canEdit: boolean;
  lifeYears: string;
  onLifeYears: (value: string) => void;
  err: FieldError;
}

export function Preview({ title, revision, spec, preview, markers, bands, units, flagged, olderMa, youngerMa, dirty, canEdit, lifeYears, onLifeYears, err }: PreviewProps) {
  const result = preview.ok ? preview.result : null;
  const isRoute = spec.medium.kind === "route";
  return (
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
          <div className="mt-4"><ScaleStrip result={result} markers={markers} bands={bands} units={units} flagged={flagged} title={`Scale strip of ${title}`} /></div>
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
                          <IntentFields intent="add-inset" revision={revision} />
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
              <label className="mt-2 flex items-center gap-2 font-sans text-sm">Your own life, in years: <input className="field w-24" inputMode="numeric" value={lifeYears} onChange={(e) => onLifeYears(e.target.value)} aria-label="Your age in years" /></label>
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
                <IntentFields intent="replace-route" revision={revision} />
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
  );
}
