// Fabrication and installation exports: the marker schedule (CSV). Marker points (GeoJSON, GPX) are
// made from publication snapshots in app/lib/exports.
import type { ScaleResult } from "../scale/compute";
import { writeCsv } from "../timescale/csv";
import type { ResolvedMarker } from "./types";

export const SCHEDULE_HEADER = [
  "number",
  "label",
  "kind",
  "interval",
  "event",
  "age_ma",
  "age_uncertainty_ma",
  "source",
  "from_start_m",
  "to_end_m",
  "latitude",
  "longitude",
  "walk_minutes",
] as const;

/** Shortest decimal text of a number (no exponent for the magnitudes used here). */
function num(x: number): string {
  return String(Number(x.toPrecision(15)));
}

export interface ScheduleRow {
  number: number;
  label: string;
  kind: string;
  interval: string;
  event: string;
  ageMa: string;
  ageUncertaintyMa: string;
  source: string;
  fromStartM: string;
  toEndM: string;
  latitude: string;
  longitude: string;
  walkMinutes: string;
}

/**
 * One row per marker, in marker order. The start is the older end (the scale runs from the oldest
 * age to the youngest); distances in metres to the millimetre, coordinates to 7 decimals (about
 * 1 cm), walking minutes to 0.1 min at the exhibit's walking speed.
 */
export function scheduleRows(markers: ResolvedMarker[], result: ScaleResult): ScheduleRow[] {
  const byId = new Map(result.points.map((p) => [p.id, p]));
  return markers.map((m) => {
    const p = byId.get(m.id);
    if (!p) throw new Error(`marker ${m.id} has no computed position`);
    return {
      number: m.number,
      label: m.label,
      kind: m.kind,
      interval: m.kind === "boundary" ? (m.intervalName ?? "") : "",
      event: m.kind === "event" ? (m.eventName ?? "") : "",
      ageMa: num(m.ageMa),
      ageUncertaintyMa: m.uncertaintyMa == null ? "" : num(m.uncertaintyMa),
      source: m.source,
      fromStartM: p.fromOlderEndMetres.toFixed(3),
      toEndM: p.fromYoungerEndMetres.toFixed(3),
      latitude: p.position ? p.position.lat.toFixed(7) : "",
      longitude: p.position ? p.position.lon.toFixed(7) : "",
      walkMinutes: p.walking ? (p.walking.seconds / 60).toFixed(1) : "",
    };
  });
}

export function scheduleCsv(rows: ScheduleRow[]): string {
  return writeCsv([
    [...SCHEDULE_HEADER],
    ...rows.map((r) => [String(r.number), r.label, r.kind, r.interval, r.event, r.ageMa, r.ageUncertaintyMa, r.source, r.fromStartM, r.toEndM, r.latitude, r.longitude, r.walkMinutes]),
  ]);
}
