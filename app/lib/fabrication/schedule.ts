// The marker schedule from a publication snapshot, as typed cells for a spreadsheet (numbers stay
// numbers). Text that a spreadsheet could read as a formula (starting with = + - @, a tab or a
// carriage return) is prefixed with an apostrophe, as OWASP's CSV-injection advice says, so a
// label such as "=HYPERLINK(…)" shows as text and never runs. Pure.
import { neutraliseCell } from "../csv-safe";
import type { PublicationSnapshot } from "../publication/types";

export type Cell = string | number | null;

export const SCHEDULE_COLUMNS = [
  { key: "sign", header: "Sign", width: 6 },
  { key: "label", header: "Label", width: 40 },
  { key: "kind", header: "Kind", width: 10 },
  { key: "interval", header: "Interval", width: 18 },
  { key: "ageMa", header: "Age (Ma)", width: 10 },
  { key: "uncertaintyMa", header: "± (Ma)", width: 8 },
  { key: "ageText", header: "Age as printed", width: 16 },
  { key: "source", header: "Source", width: 40 },
  { key: "fromStartM", header: "From the older end (m)", width: 14 },
  { key: "toEndM", header: "To the younger end (m)", width: 14 },
  { key: "latitude", header: "Latitude", width: 12 },
  { key: "longitude", header: "Longitude", width: 12 },
  { key: "elevationM", header: "Elevation (m)", width: 10 },
  { key: "walkMinutes", header: "Walk (min)", width: 9 },
] as const;

/** Text safe from formula evaluation in spreadsheets: the one rule of app/lib/csv-safe.ts. */
export function safeText(text: string): string {
  return neutraliseCell(text);
}

export function scheduleCells(snapshot: PublicationSnapshot): Cell[][] {
  return snapshot.markers.map((m) => [
    m.signNumber,
    safeText(m.label),
    m.kind,
    safeText(m.intervalName ?? ""),
    m.ageMa,
    m.uncertaintyMa,
    safeText(m.ageText),
    safeText(m.source),
    Number(m.distance.fromOlderEndMetres.toFixed(3)),
    Number(m.distance.fromYoungerEndMetres.toFixed(3)),
    m.position ? m.position.lat : null,
    m.position ? m.position.lon : null,
    m.position?.elevationMetres ?? null,
    m.walking ? Number((m.walking.seconds / 60).toFixed(1)) : null,
  ]);
}
