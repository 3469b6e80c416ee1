// Trailhead facts of a route exhibit: length, total ascent and descent, typical and maximum running
// slope, the stretches that break an ABA §1017 limit with their distances, and walking times at
// 1.2 m/s (FHWA-RD-98-107) and 0.9 m/s (MUTCD §4E.06), each with its source. Without elevations it
// says so and asks for a track with them. Pure.
import { formatLength } from "../exhibit/display";
import type { PublicationSnapshot } from "../publication/types";
import { WALKING_SOURCES } from "../scale/compute";
import { FABRICATION_SOURCES } from "../fabrication/sources";
import { routeProfile, type ProfileOptions, type SlopeProfile, PROFILE_DEFAULTS } from "./profile";

export const NO_ELEVATIONS =
  "This route has no elevations, so there is no slope profile. Upload the route again as a GPX track or GeoJSON whose points carry elevations (most GPS units and phone apps record them).";
export const PLANNING_CAUTION =
  "A planning aid computed from GPS data. It does not replace a trail assessment under local codes: measure running and cross slopes, tread width and surface on site.";

export interface TrailheadFacts {
  title: string;
  lengthText: string;
  hasElevations: boolean;
  facts: { label: string; value: string }[];
  flagged: { from: string; to: string; slope: string; rule: string }[];
  walking: { speed: string; time: string; source: string }[];
  method: string | null;
  notes: string[];
  caution: string;
  sources: string[];
}

function minutes(seconds: number): string {
  const m = Math.round(seconds / 60);
  return m < 60 ? `${m} min` : `${Math.floor(m / 60)} h ${String(m % 60).padStart(2, "0")} min`;
}

const pct = (x: number) => `${x.toFixed(1)} %`;

/** The profile of a snapshot's route, or null without elevations (or for a straight length). */
export function snapshotProfile(snapshot: PublicationSnapshot, options: ProfileOptions = PROFILE_DEFAULTS): SlopeProfile | null {
  const m = snapshot.medium;
  if (m.kind !== "route" || !m.hasElevations) return null;
  return routeProfile(m.geometry.coordinates, options);
}

export function trailheadFacts(snapshot: PublicationSnapshot, profile: SlopeProfile | null): TrailheadFacts {
  const m = snapshot.medium;
  const units = snapshot.exhibit.unitsPreference;
  const length = m.lengthMetres;
  const lengthText = formatLength(length, units, 1);
  const walking =
    m.kind === "route"
      ? [
          { speed: "1.2 m/s", time: minutes(length / 1.2), source: WALKING_SOURCES.walkingSpeed },
          { speed: "0.9 m/s", time: minutes(length / 0.9), source: WALKING_SOURCES.accessibleSpeed },
        ]
      : [];
  const facts = [{ label: "Length", value: lengthText }];
  const flagged: TrailheadFacts["flagged"] = [];
  const notes: string[] = [];
  if (profile) {
    const t = profile.totals;
    facts.push(
      { label: "Total ascent", value: formatLength(t.ascentMetres, units, 1) },
      { label: "Total descent", value: formatLength(t.descentMetres, units, 1) },
      { label: "Typical running slope", value: pct(t.typicalSlopePercent) },
      { label: "Steepest running slope", value: pct(t.maxSlopePercent) },
      { label: "Steeper than 8.33 %", value: `${formatLength(t.over833Metres, units, 1)} (${pct(t.over833Percent)} of the length)` },
    );
    for (const s of profile.stretches) {
      if (!s.rule) continue;
      flagged.push({ from: formatLength(s.fromMetres, units, 1), to: formatLength(s.toMetres, units, 1), slope: `${s.direction === "up" ? "up" : "down"} ${pct(Math.abs(s.runningSlopePercent))}, steepest ${pct(s.maxSlopePercent)}`, rule: s.rule });
    }
    if (t.rule) notes.push(`${t.rule}: ${pct(t.over833Percent)} of this route is steeper.`);
    notes.push(...profile.notes);
  } else notes.push(m.kind === "route" ? NO_ELEVATIONS : "A straight exhibit has no trail profile.");
  return {
    title: snapshot.exhibit.title,
    lengthText,
    hasElevations: profile !== null,
    facts,
    flagged,
    walking,
    method: profile?.method.text ?? null,
    notes,
    caution: PLANNING_CAUTION,
    sources: [FABRICATION_SOURCES.aba, FABRICATION_SOURCES.gpsHeights, FABRICATION_SOURCES.walking],
  };
}
