// The exhibit as the scale engine and the composer see it: pure data, no database.
import type { AgeUnit, LengthUnit } from "../units";
import type { MediumType } from "../scale/legibility";

export const MARKER_KINDS = ["boundary", "event", "custom"] as const;
export type MarkerKind = (typeof MARKER_KINDS)[number];

export const UNITS_PREFERENCES = ["metric", "us"] as const;
export type UnitsPreference = (typeof UNITS_PREFERENCES)[number];

export interface AgeValue {
  value: number;
  unit: AgeUnit;
}

export interface LengthValue {
  value: number;
  unit: LengthUnit;
}

export interface LineStringGeometry {
  type: "LineString";
  coordinates: [number, number][] | number[][];
}

export type MediumSpec =
  | { kind: "length"; mediumType: MediumType; length: LengthValue; panelWidth: LengthValue | null }
  | { kind: "route"; mediumType: MediumType; geometry: LineStringGeometry; lengthMetres: number; sourceName: string | null };

export interface LegibilitySettings {
  minVisibleMetres?: number;
  minSpacingMetres?: number;
}

export interface InsetSpec {
  id: string;
  label: string;
  olderMa: number;
  youngerMa: number;
  magnification: number;
}

/** A marker with its age resolved (a boundary's age is its interval's base in the pinned edition). */
export interface ResolvedMarker {
  id: string;
  number: number;
  kind: MarkerKind;
  label: string;
  text: string;
  ageMa: number;
  uncertaintyMa: number | null;
  /** English name of the interval whose base this is (boundary markers). */
  intervalName: string | null;
  intervalRank: string | null;
  /** Name of the library event (event markers). */
  eventName: string | null;
  /** Where the age comes from: the chart edition, the event's citation, or the designer's source. */
  source: string;
  /** Standard chart colour of the interval the marker falls in (finest rank available). */
  color: string;
  approximate: boolean;
}

export interface ExhibitSpec {
  spanOlder: AgeValue;
  spanYounger: AgeValue;
  medium: MediumSpec;
  legibility: LegibilitySettings;
  unitsPreference: UnitsPreference;
  insets: InsetSpec[];
}

export interface DurationSpec {
  id: string;
  label: string;
  years: number;
  /**
   * A located span ends this many years ago (0: "the last N years"): it shows only on an inset that
   * contains it. Without it the duration is a pure comparison ("as long as …"), shown on any inset's scale.
   */
  endsAgoYears?: number;
}
