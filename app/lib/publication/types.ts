// The publication snapshot: everything a visitor page (issue 13), a sign sheet (14) and the GPX /
// GeoJSON exports (15) need, fixed at publication. Stored as JSONB, hashed (SHA-256) over its RFC
// 8785 canonical JSON, served byte for byte by the public API. Readers check `schemaVersion`; a
// change of shape bumps it (never change what an existing version means).
//
// Conventions: ages in Ma (numbers), lengths in metres, coordinates WGS84 [longitude, latitude]
// rounded to 7 decimals (about 1 cm), times in seconds. Every text is already rendered: display
// strings ("1,234.5 m") follow the exhibit's units preference, marker texts are sanitised HTML.
import type { AgeValue, LengthValue, UnitsPreference } from "../exhibit/types";
import type { MarkerKind } from "../exhibit/types";
import type { MediumType } from "../scale/legibility";

export const SNAPSHOT_SCHEMA_VERSION = 1;

export interface PublicationSnapshot {
  schemaVersion: typeof SNAPSHOT_SCHEMA_VERSION;
  organisation: { slug: string; name: string };
  exhibit: {
    slug: string;
    title: string;
    /** The approved revision this snapshot was made from. */
    revision: number;
    unitsPreference: UnitsPreference;
    span: { older: AgeValue; younger: AgeValue; olderMa: number; youngerMa: number };
  };
  scale: {
    totalMetres: number;
    metresPerYear: number;
    metresPerMillionYears: number;
    /** "1 m per million years" and "1 mm = 1,000 years". */
    statement: { lengthPerTime: string; timePerLength: string };
  };
  medium: SnapshotMedium;
  edition: SnapshotEdition;
  /** In order from the older end (table number = position in this list + 1). */
  markers: SnapshotMarker[];
  insets: SnapshotInset[];
  durations: SnapshotDuration[];
  /** Sign numbers of earlier publications whose markers are gone: never reused. */
  retiredSigns: RetiredSign[];
  cautions: string[];
  /** Where the fixed figures come from (walking speeds, step lengths, legibility defaults). */
  sources: Record<string, string>;
}

export type SnapshotMedium =
  | { kind: "length"; mediumType: MediumType; length: LengthValue; lengthMetres: number; panelWidth: LengthValue | null }
  | {
      kind: "route";
      mediumType: MediumType;
      lengthMetres: number;
      sourceName: string | null;
      /** GeoJSON LineString, [lon, lat] or [lon, lat, elevation m] per vertex, 7 decimals. */
      geometry: { type: "LineString"; coordinates: number[][] };
      vertexCount: number;
      /** Whether the geometry carries elevations (a third coordinate on every vertex). */
      hasElevations: boolean;
      /** The scale starts at the route's first vertex (the older end). */
      start: "older" | "younger";
      walking: {
        speedMps: number;
        accessibleSpeedMps: number;
        stepLengthRangeM: [number, number];
        seconds: number;
        accessibleSeconds: number;
        steps: number;
        stepsUpTo: number;
      };
    };

export interface SnapshotEdition {
  slug: string;
  label: string;
  source: string;
  licence: string;
  /** Language tags the interval names are given in (always includes "en"). */
  languages: string[];
  /** The intervals that overlap the exhibit's span, in chart order, with the standard chart colours. */
  intervals: SnapshotInterval[];
}

export interface SnapshotInterval {
  name: string;
  rank: string;
  parent: string | null;
  baseMa: number;
  baseUncertaintyMa: number | null;
  topMa: number;
  color: string;
  approximate: boolean;
  boundaryKind: string | null;
  /** Names by language tag, as the chart data carries them ("en" included). */
  names: Record<string, string>;
}

export interface SnapshotDistance {
  fromOlderEndMetres: number;
  fromYoungerEndMetres: number;
  uncertaintyMetres: number | null;
  /** As shown: rounded so it never claims more than the age supports. */
  display: { fromOlderEnd: string; fromYoungerEnd: string; uncertainty: string | null };
}

export interface SnapshotMarker {
  /** Stable id (the marker's database id as a string): the same marker keeps it across publications. */
  id: string;
  /** Printed on the sign and in its QR code; fixed at the marker's first publication. */
  signNumber: number;
  /** Position from the older end (1 = the first a visitor reaches). */
  order: number;
  kind: MarkerKind;
  label: string;
  ageMa: number;
  uncertaintyMa: number | null;
  approximate: boolean;
  /** "66.0 Ma", "4,567 ± 1 Ma". */
  ageText: string;
  intervalName: string | null;
  intervalRank: string | null;
  eventName: string | null;
  /** Where the age comes from. */
  source: string;
  /** The marker's Markdown, and its rendered, sanitised HTML. */
  text: { markdown: string; html: string };
  /** Standard chart colour of the interval the marker falls in. */
  color: string;
  /** Names of the intervals containing the marker's age, from the eon down (English names; translations under edition.intervals). */
  within: string[];
  distance: SnapshotDistance;
  /** Route exhibits: where to place the sign. */
  position: { lon: number; lat: number; elevationMetres: number | null; bearing: number } | null;
  walking: { fromStartMetres: number; seconds: number; accessibleSeconds: number; steps: number; stepsUpTo: number; text: string } | null;
  /** "How we know": fraction of a decay system's parent left after the marker's age. */
  decay: { system: string; sentence: string; citation: string } | null;
  insets: { insetId: string; fromOlderEndMetres: number; display: string }[];
  /** The marker's image (issue 12): app-served URLs, alt text, credit; null when it has none. */
  image: SnapshotImage | null;
}

export interface SnapshotImage {
  assetId: number | string;
  alt: string;
  credit: string | null;
  sizes: { width: number; format: string; url: string }[];
}

export interface SnapshotInset {
  id: string;
  label: string;
  olderMa: number;
  youngerMa: number;
  magnification: number;
  lengthMetres: number;
  statement: { lengthPerTime: string; timePerLength: string };
  /** Where the sub-span sits on the main scale. */
  mainFromOlderEndMetres: number;
  mainToOlderEndMetres: number;
  markerIds: string[];
}

export interface SnapshotDuration {
  id: string;
  label: string;
  years: number;
  metres: number;
  text: string;
  visible: boolean;
  insets: { insetId: string; metres: number; text: string; visible: boolean }[];
}

export interface RetiredSign {
  number: number;
  label: string;
  /** The publication from which the sign no longer stands. */
  retiredAtPublication: number;
  /** "absorbed": merged into the sign `absorbedBy` (its visitor URL redirects there); "removed": gone. */
  status: "absorbed" | "removed";
  absorbedBy: number | null;
}

/** What the public JSON says about a publication (fixed at publication: names as they were then). */
export interface PublicationMeta {
  number: number;
  hash: string;
  publishedAt: string;
  approvedBy: string | null;
  edition: { slug: string; label: string };
}
