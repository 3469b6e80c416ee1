/**
 * What computeScale answers: the result's shape (ScaleResult and its parts), and the constructors of
 * the per-marker objects (records.ts: plain objects the engine does not pretenure).
 */
import type { UnitSystem } from "../units";
import type { DistanceLabel, ScaleStatement } from "./format";
import type { Legibility, MediumType, SuggestedInset } from "./legibility";
import { plainRecord } from "./records";
import type { Walking, WALKING_SOURCES } from "./walking";
import type { ScaleWarning } from "./warnings";

export interface InsetPlacement {
  insetId: string;
  fromOlderEndMetres: number;
  fromYoungerEndMetres: number;
  uncertaintyMetres: number | null;
  display: DistanceLabel;
}

export interface PointResult {
  id: string;
  /** Table number, 1–N by age, oldest first (numbering.ts). */
  number: number;
  label?: string;
  ageYears: number;
  uncertaintyYears: number | null;
  fromOlderEndMetres: number;
  fromYoungerEndMetres: number;
  uncertaintyMetres: number | null;
  display: DistanceLabel;
  position?: { lon: number; lat: number };
  /** Direction of travel along the route at the marker, degrees clockwise from true north. */
  bearing?: number;
  walking?: Walking;
  /** The marker on each inset that shows it (one shared empty list when none does). */
  insets: readonly InsetPlacement[];
}

/** A duration on one inset's scale. */
export interface DurationInset {
  insetId: string;
  insetLabel: string;
  metres: number;
  /** Does the inset show it: a located span only when the inset's sub-span contains it; a comparison always. */
  covers: boolean;
  /** "1.17 m in inset “last 20,000 years at 100×”", "… at the scale of inset “…”", or why it is not shown there. */
  text: string;
  /** Covered and at least the smallest visible length. */
  visible: boolean;
}

export interface DurationResult {
  id: string;
  label?: string;
  years: number;
  /** A located span shown at its place (the last N years, or ending `endsAgoYears` ago, inside the span); false: a comparison. */
  located: boolean;
  /** Younger end of a located span, years ago (0: "the last N years"); null for a comparison. */
  endsAgoYears: number | null;
  metres: number;
  text: string;
  visible: boolean;
  insets: DurationInset[];
}

export interface InsetResult {
  id: string;
  label: string;
  olderYears: number;
  youngerYears: number;
  magnification: number;
  /** Sub-span length × magnification, metres. */
  lengthMetres: number;
  metresPerYear: number;
  statement: ScaleStatement;
  /** Where the sub-span sits on the main scale (distance from the older end), metres. */
  mainFromOlderEndMetres: number;
  mainToOlderEndMetres: number;
  pointIds: string[];
}

export interface ScaleResult {
  scale: {
    olderYears: number;
    youngerYears: number;
    spanYears: number;
    totalMetres: number;
    metresPerYear: number;
    yearsPerMetre: number;
    metresPerMillionYears: number;
    yearsPerMillimetre: number;
    statement: ScaleStatement;
    mediumKind: "length" | "route";
    mediumType: MediumType;
    /** The units labels, statements and durations are written in. */
    unitSystem: UnitSystem;
    legibility: Legibility & { source: string };
    route?: {
      vertexCount: number;
      lengthMetres: number;
      start: "older" | "younger";
      walkingSpeedMps: number;
      accessibleSpeedMps: number;
      stepLengthM: number;
      /** The common-practice range of step lengths the counts span (both equal when one was asked for). */
      stepLengthRangeM: [number, number];
      walkingSeconds: number;
      accessibleWalkingSeconds: number;
      steps: number;
      stepsUpTo: number;
      sources: typeof WALKING_SOURCES;
      caution: string;
    };
  };
  points: PointResult[];
  durations: DurationResult[];
  insets: InsetResult[];
  suggestedInsets: SuggestedInset[];
  warnings: ScaleWarning[];
}

// The per-marker results, made by `new` (records.ts: plain objects the engine does not pretenure).

export const LonLat = plainRecord(
  function (this: { lon: number; lat: number }, lon: number, lat: number) {
    this.lon = lon;
    this.lat = lat;
  },
  [0.5, 0.5],
);

export const Placement = plainRecord(
  function (this: InsetPlacement, insetId: string, fromOlderEndMetres: number, fromYoungerEndMetres: number, uncertaintyMetres: number | null, display: DistanceLabel) {
    this.insetId = insetId;
    this.fromOlderEndMetres = fromOlderEndMetres;
    this.fromYoungerEndMetres = fromYoungerEndMetres;
    this.uncertaintyMetres = uncertaintyMetres;
    this.display = display;
  },
  ["", 0.5, 0.5, null, {} as DistanceLabel],
);

/** A point on no inset: one list for all of them (most markers lie outside every inset). */
export const NO_INSETS: readonly InsetPlacement[] = Object.freeze([]);

/**
 * A point: on a route with its place, bearing and walking figures (`position` given), else without
 * them; the label last, and only when the request has one. Every point of a result has the same
 * fields in the same order.
 */
export const Point = plainRecord(
  function (
    this: PointResult,
    id: string,
    number: number,
    ageYears: number,
    uncertaintyYears: number | null,
    fromOlderEndMetres: number,
    fromYoungerEndMetres: number,
    uncertaintyMetres: number | null,
    display: DistanceLabel,
    insets: readonly InsetPlacement[],
    position: { lon: number; lat: number } | undefined,
    bearing: number,
    walking: Walking | undefined,
    label: string | undefined,
  ) {
    this.id = id;
    this.number = number;
    this.ageYears = ageYears;
    this.uncertaintyYears = uncertaintyYears;
    this.fromOlderEndMetres = fromOlderEndMetres;
    this.fromYoungerEndMetres = fromYoungerEndMetres;
    this.uncertaintyMetres = uncertaintyMetres;
    this.display = display;
    this.insets = insets;
    if (position !== undefined) {
      this.position = position;
      this.bearing = bearing;
      this.walking = walking;
    }
    if (label !== undefined) this.label = label;
  },
  // on a route and on a length, with a label and without
  ["", 1, 0.5, null, 0.5, 0.5, null, {} as DistanceLabel, NO_INSETS, new LonLat(0.5, 0.5), 0.5, {} as Walking, ""],
  ["", 1, 0.5, null, 0.5, 0.5, null, {} as DistanceLabel, NO_INSETS, new LonLat(0.5, 0.5), 0.5, {} as Walking, undefined],
  ["", 1, 0.5, null, 0.5, 0.5, null, {} as DistanceLabel, NO_INSETS, undefined, 0, undefined, ""],
  ["", 1, 0.5, null, 0.5, 0.5, null, {} as DistanceLabel, NO_INSETS, undefined, 0, undefined, undefined],
);
