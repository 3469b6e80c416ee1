// Walking times for visitors, from the published distances. Speeds come from the snapshot
// (FHWA-RD-98-107: 1.2 m/s pedestrian design speed; MUTCD §4E.06: 0.9 m/s slow-walker check — the
// snapshot's `sources` names them on the page).
import { fill, type Messages } from "./messages";

/** Seconds to walk `metres` at `speedMps`. */
export function walkSeconds(metres: number, speedMps: number): number {
  if (!(speedMps > 0)) throw new RangeError("walking speed must be positive");
  return Math.max(0, metres) / speedMps;
}

/** "0 min", "under 1 min", "7 min", "1 h 3 min" (whole minutes, rounded to the nearest). */
export function durationText(seconds: number, t: Messages): string {
  if (seconds <= 0) return fill(t.minutes, { n: 0 });
  if (seconds < 30) return t.underAMinute;
  const minutes = Math.round(seconds / 60);
  if (minutes < 60) return fill(t.minutes, { n: minutes });
  return fill(t.hoursMinutes, { h: Math.floor(minutes / 60), m: minutes % 60 });
}
