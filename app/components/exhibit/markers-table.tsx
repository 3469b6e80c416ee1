// The exhibit's markers in visiting order: age, distances from both ends, ± on the exhibit, and
// (on routes) coordinates and walking time; designers edit or remove each one in place.
import { Form } from "react-router";
import { IntentFields } from "~/components/exhibit/form-bits";
import { ImageControl } from "~/components/exhibit/marker-image";
import { Term } from "~/components/term";
import { formatAgeMa, formatLength, type ComposerView, type UnitsPreference } from "~/lib/exhibit";
import { IMAGE_FILES_HINT } from "~/lib/images";
import type { ScaleResult } from "~/lib/scale/compute";

export interface MarkersTableProps {
  markers: ComposerView["markers"];
  decaySystems: ComposerView["decaySystems"];
  points: Map<string, ScaleResult["points"][number]>;
  flagged: Set<string>;
  units: UnitsPreference;
  isRoute: boolean;
  canEdit: boolean;
  revision: number;
}

export function MarkersTable({ markers, decaySystems, points: byId, flagged, units, isRoute, canEdit, revision }: MarkersTableProps) {
  return (
    <section className="card" aria-labelledby="markers-h">
      <h2 id="markers-h" className="text-xl">Markers ({markers.length})</h2>
      <p className="mt-1 font-sans text-sm text-ink-soft">Numbered in visiting order, from the older end. Kinds: <Term id="boundary">boundary</Term> (start of a chart interval), <Term id="event">event</Term> (from the library), <Term id="custom">custom</Term> (an age of your own). Distances are rounded to what the age's <Term id="uncertainty">±</Term> supports.{canEdit ? ` A marker's image: choose a file or drop one on its “Add an image” (${IMAGE_FILES_HINT}).` : ""}</p>
      {markers.length === 0 ? <p className="mt-2 text-ink-soft">No markers yet. Add the bases of periods, events from the library, or ages of your own below.</p> : (
        <div className="md:overflow-x-auto">
        <table className="table-cards table-cards-paired mt-3 w-full text-left font-sans text-sm">
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
                <tr key={m.id} id={`marker-${m.id}`} className={`scroll-mt-[58vh] border-b border-rule align-top last:border-0 target:outline-3 target:outline-sandstone-500 ${flagged.has(m.id) ? "bg-red-50" : ""}`}>
                  <td className="card-wide num p-2" data-label="#"><span className="mr-1 inline-block h-3 w-3 rounded-sm border border-ink/30 align-middle" style={{ background: m.color }} aria-hidden="true" />{m.number}{flagged.has(m.id) ? <span className="ml-1 whitespace-nowrap rounded bg-danger px-1 text-xs font-semibold text-white">too close</span> : null}</td>
                  <td className="card-wide p-2" data-label="Label">
                    <span className="font-semibold">{m.label}</span>
                    <div className="text-xs text-ink-soft">{m.source}</div>
                    {m.html ? <div className="prose-sm mt-1 text-xs" dangerouslySetInnerHTML={{ __html: m.html }} /> : null}
                    {m.howWeKnow ? <p className="mt-1 text-xs text-slate-river-700"><span className="font-semibold">How we know:</span> {m.howWeKnow}</p> : null}
                    <ImageControl target={m.id} revision={revision} canEdit={canEdit} name={`marker ${m.number}, ${m.label}`} />
                  </td>
                  <td className="p-2" data-label="Kind">{m.kind}</td>
                  <td className="num p-2" data-label="Age">{m.approximate ? "~" : ""}{formatAgeMa(m.ageMa)}{m.uncertaintyMa ? ` ± ${formatAgeMa(m.uncertaintyMa)}` : ""}</td>
                  <td className="num whitespace-nowrap p-2" data-label="From start">{p ? (units === "metric" ? p.display.fromOlderEnd : formatLength(p.fromOlderEndMetres, units, p.display.stepMetres)) : "—"}</td>
                  <td className="num whitespace-nowrap p-2" data-label="To end">{p ? (units === "metric" ? p.display.fromYoungerEnd : formatLength(p.fromYoungerEndMetres, units, p.display.stepMetres)) : "—"}</td>
                  <td className="num whitespace-nowrap p-2" data-label="±">{p?.display.uncertainty ?? "—"}</td>
                  {isRoute ? (
                    <>
                      <td className="card-wide num p-2" data-label="Coordinates">{p?.position ? `${p.position.lat.toFixed(6)}, ${p.position.lon.toFixed(6)}` : "—"}</td>
                      <td className="num whitespace-nowrap p-2" data-label="Walk from the start">{p?.walking ? `${Math.round(p.walking.seconds / 60)} min` : "—"}</td>
                    </>
                  ) : null}
                  {canEdit ? (
                    <td className="p-2">
                      <details>
                        <summary className="cursor-pointer whitespace-nowrap">Edit</summary>
                        <Form method="post" className="mt-2 w-64 max-w-full space-y-2">
                          <IntentFields intent="edit-marker" revision={revision} />
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
                          <IntentFields intent="remove-marker" revision={revision} />
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
        </div>
      )}
    </section>
  );
}
