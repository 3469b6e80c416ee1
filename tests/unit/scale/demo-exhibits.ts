// The three demo exhibits (db/seeders/demo) rebuilt without a database, from the same reference
// data files the seeders read: for the oracle comparison and the composer benchmark.
import { readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { ExhibitSpec, ResolvedMarker } from "../../../app/lib/exhibit/types.ts";
import type { Interval } from "../../../app/lib/timescale/types.ts";
import { SEED_DATED_EVENTS } from "../../../db/data/dated-events/dated-events.ts";
import { riversideRoute } from "../../../db/seeders/demo/2026.12.01T03.00.00.marrowby-exhibits.ts";

const here = path.dirname(fileURLToPath(import.meta.url));
const intervalsOf = (slug: string) => (JSON.parse(readFileSync(path.join(here, "../../../db/data/ics", `${slug}.json`), "utf8")) as { intervals: Interval[] }).intervals;

let nextId = 1;
function marker(fields: Partial<ResolvedMarker> & Pick<ResolvedMarker, "kind" | "label" | "ageMa">): ResolvedMarker {
  const id = String(nextId++);
  return { id, number: 0, text: "", uncertaintyMa: null, intervalName: null, intervalRank: null, eventName: null, source: "demo", color: "#888888", approximate: false, ...fields };
}

/** Boundary markers as the demo seeder makes them: one per age, labelled with every name. */
function boundaryMarkers(intervals: Interval[], ranks: string[], olderMa: number): ResolvedMarker[] {
  const byAge = new Map<number, Interval[]>();
  for (const iv of intervals.filter((i) => ranks.includes(i.rank) && i.baseMa <= olderMa).sort((a, b) => a.order - b.order)) byAge.set(iv.baseMa, [...(byAge.get(iv.baseMa) ?? []), iv]);
  return [...byAge.values()].map((ivs) =>
    marker({ kind: "boundary", label: `Base of the ${ivs.map((i) => i.name).join(", ")}`, ageMa: ivs[0].baseMa, uncertaintyMa: ivs[0].baseUncertaintyMa, intervalName: ivs[0].name, intervalRank: ivs[0].rank }),
  );
}

function eventMarkers(limit: number): ResolvedMarker[] {
  return SEED_DATED_EVENTS.filter((e) => Number(e.ageMa) <= 4567)
    .sort((a, b) => Number(b.ageMa) - Number(a.ageMa))
    .slice(0, limit)
    .map((e) => marker({ kind: "event", label: e.name, ageMa: Number(e.ageMa), uncertaintyMa: e.uncertaintyMa === null ? null : Number(e.uncertaintyMa), eventName: e.name }));
}

export interface DemoExhibit {
  slug: string;
  spec: ExhibitSpec;
  markers: ResolvedMarker[];
}

export function demoExhibits(): DemoExhibit[] {
  const e2024 = intervalsOf("ics-2024-12");
  const e2023 = intervalsOf("ics-2023-09");
  const coords = riversideRoute();
  const walk: DemoExhibit = {
    slug: "riverside-walk",
    spec: {
      spanOlder: { value: 4567, unit: "Ma" },
      spanYounger: { value: 0, unit: "Ma" },
      medium: { kind: "route", mediumType: "trail", geometry: { type: "LineString", coordinates: coords }, lengthMetres: 4567, sourceName: "marrowby-riverside-path.gpx" },
      legibility: {},
      unitsPreference: "metric",
      insets: [{ id: "inset-1", label: "last 10,000 years at 1,000×", olderMa: 0.01, youngerMa: 0, magnification: 1000 }],
    },
    markers: [
      ...boundaryMarkers(e2024, ["eon", "era", "period"], 4567),
      ...eventMarkers(14),
      marker({ kind: "custom", label: "Marrowby mill built", ageMa: 0.0002 }),
    ],
  };
  const wall: DemoExhibit = {
    slug: "corridor-wall",
    spec: {
      spanOlder: { value: 538.8, unit: "Ma" },
      spanYounger: { value: 0, unit: "Ma" },
      medium: { kind: "length", mediumType: "wall", length: { value: 18, unit: "m" }, panelWidth: { value: 1000, unit: "mm" } },
      legibility: {},
      unitsPreference: "metric",
      insets: [],
    },
    markers: boundaryMarkers(e2023, ["era", "period", "epoch"], 538.8),
  };
  const rope: DemoExhibit = {
    slug: "school-rope",
    spec: {
      spanOlder: { value: 4567, unit: "Ma" },
      spanYounger: { value: 0, unit: "Ma" },
      medium: { kind: "length", mediumType: "rope", length: { value: 46, unit: "m" }, panelWidth: null },
      legibility: {},
      unitsPreference: "metric",
      insets: [],
    },
    markers: [...boundaryMarkers(e2024, ["eon", "era"], 4567), ...eventMarkers(10)],
  };
  for (const e of [walk, wall, rope]) {
    e.markers.sort((a, b) => b.ageMa - a.ageMa || Number(a.id) - Number(b.id));
    e.markers.forEach((m, i) => (m.number = i + 1));
  }
  return [walk, wall, rope];
}
