// The three ways to add markers: interval boundaries from the pinned edition, events from the
// library (searched as you type through /api/events), and ages of the designer's own with a source.
import { useState } from "react";
import { Form, useFetcher } from "react-router";
import { IntentFields, Labelled } from "~/components/exhibit/form-bits";
import { RANKS, type Rank } from "~/lib/timescale/types";
import { AGE_UNITS } from "~/lib/units";

export function AddBoundaries({ revision, intervals, error }: { revision: number; intervals: { name: string; rank: Rank; baseMa: number }[]; error?: string }) {
  const ranks = RANKS.filter((r) => intervals.some((i) => i.rank === r));
  return (
    <div className="card">
      <h3 className="text-lg">Interval boundaries</h3>
      <p className="mt-1 font-sans text-sm text-ink-soft">From the pinned chart edition; each marker's age is the interval's base.</p>
      {error ? <p className="mt-2 font-sans text-sm text-danger" role="alert">{error}</p> : null}
      <Form method="post" className="mt-3 space-y-2 font-sans text-sm">
        <IntentFields intent="add-boundaries" revision={revision} />
        <label className="block"><span className="mb-1 block font-semibold">All of a rank</span>
          <select name="rank" className="field" defaultValue="period">{ranks.map((r) => <option key={r} value={r}>every {r} base</option>)}</select>
        </label>
        <button type="submit" className="btn-quiet">Add all</button>
      </Form>
      <Form method="post" className="mt-4 space-y-2 font-sans text-sm">
        <IntentFields intent="add-boundaries" revision={revision} />
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

export function AddEvent({ revision, error }: { revision: number; error?: string }) {
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
        <IntentFields intent="add-event" revision={revision} />
        <input type="hidden" name="eventId" value={chosen?.id ?? ""} />
        <p className="mb-2">{chosen ? <>Chosen: <strong>{chosen.name}</strong> <span className="text-ink-soft">({chosen.citation})</span></> : "Choose an event from the results."}</p>
        <button type="submit" className="btn-quiet" disabled={!chosen}>Add the event</button>
      </Form>
    </div>
  );
}

export function AddCustom({ revision, fields }: { revision: number; fields: Record<string, string> }) {
  return (
    <div className="card">
      <h3 className="text-lg">An age of your own</h3>
      <p className="mt-1 font-sans text-sm text-ink-soft">Every custom age needs its source; the reviewer checks it.</p>
      <Form method="post" className="mt-3 space-y-2 font-sans text-sm" noValidate>
        <IntentFields intent="add-custom" revision={revision} />
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
