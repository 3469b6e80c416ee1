// Shapes of review data: a revision's stored content, and the automatic check results.
import type { AgeValue, LegibilitySettings, MarkerKind, UnitsPreference } from "../exhibit/types";
import type { LengthUnit } from "../units";
import type { MediumType } from "../scale/legibility";

/** A copy of the whole exhibit at one revision (JSONB in exhibit_revisions.content): enough for history and diffs. */
export interface RevisionContent {
  title: string;
  slug: string;
  edition: { id: number; slug: string; label: string };
  spanOlder: AgeValue;
  spanYounger: AgeValue;
  unitsPreference: UnitsPreference;
  legibility: LegibilitySettings;
  medium: {
    kind: "length" | "route";
    mediumType: MediumType;
    lengthValue: number | null;
    lengthUnit: LengthUnit | null;
    panelWidthValue: number | null;
    panelWidthUnit: LengthUnit | null;
    /** The route's WGS84 length (route media). */
    routeLengthM: number | null;
    routeVertexCount: number | null;
    sourceName: string | null;
    /** SHA-256 of the route geometry, kept once in exhibit_route_geometries. */
    geometrySha256: string | null;
  };
  markers: RevisionMarker[];
  insets: { id: string; label: string; olderMa: number; youngerMa: number; magnification: number }[];
}

export interface RevisionMarker {
  id: string;
  kind: MarkerKind;
  label: string;
  text: string;
  /** The age as resolved at that revision (a boundary's base on the pinned edition, an event's library age). */
  ageMa: number;
  uncertaintyMa: number | null;
  intervalName: string | null;
  eventName: string | null;
  source: string;
  decaySystemId: number | null;
}

export type CheckStatus = "pass" | "warning" | "fail";

export const CHECK_KINDS = [
  "boundary-age",
  "source",
  "inside-span",
  "legibility",
  "inset-magnification",
  "interval-names",
  "image-alt",
  "edition-current",
  "computes",
] as const;
export type CheckKind = (typeof CHECK_KINDS)[number];

/** One check result, in words. A result about one marker names it (markerId, its table number and label). */
export interface CheckResult {
  kind: CheckKind;
  status: CheckStatus;
  message: string;
  markerId: string | null;
  markerNumber: number | null;
  /** For legibility warnings: the warning key an acknowledgement names. */
  warningKey?: string;
  /** For acknowledged warnings: the written reason. */
  acknowledgement?: { reason: string; by: string | null; at: string } | null;
}

/** The figures side by side: what the exhibit uses and what the pinned edition says (boundary markers). */
export interface FigureRow {
  markerId: string;
  number: number;
  label: string;
  intervalName: string;
  exhibitAgeMa: number;
  exhibitUncertaintyMa: number | null;
  editionAgeMa: number | null;
  editionUncertaintyMa: number | null;
  matches: boolean;
}

export interface CheckReport {
  revision: number;
  edition: { slug: string; label: string };
  /** "fail" when any check fails, else "warning" when any warns, else "pass". */
  overall: CheckStatus;
  counts: Record<CheckStatus, number>;
  results: CheckResult[];
  figures: FigureRow[];
  /** Set when the organisation's current edition is another one ("needs re-check"). */
  recheck: { edition: { slug: string; label: string }; moved: number; missing: number } | null;
}

/** A review comment as the pages show it: on the exhibit or one marker, with its replies. */
export interface ReviewComment {
  id: number;
  markerId: number | null;
  markerLabel: string | null;
  author: string;
  body: string;
  revision: number;
  at: string;
  resolved: { by: string; at: string } | null;
  replies: ReviewComment[];
}
