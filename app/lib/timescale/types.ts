// Core types of a chart edition: a versioned geologic timescale and its intervals.
// Pure data; shared by the browser and the server.

/** Ranks from the shallowest (eon) to the deepest (age). "subperiod" is optional between period and epoch. */
export const RANKS = ["eon", "era", "period", "subperiod", "epoch", "age"] as const;
export type Rank = (typeof RANKS)[number];

/** 0 for eon … 5 for age. */
export function rankDepth(rank: Rank): number {
  return RANKS.indexOf(rank);
}

export function isRank(value: unknown): value is Rank {
  return typeof value === "string" && (RANKS as readonly string[]).includes(value);
}

/**
 * How a ratified boundary is defined: a GSSP (Global Boundary Stratotype Section and Point, a
 * point in a rock section) or a GSSA (Global Standard Stratigraphic Age, a boundary defined by a
 * numerical age — the Precambrian ones).
 */
export const BOUNDARY_KINDS = ["GSSP", "GSSA"] as const;
export type BoundaryKind = (typeof BOUNDARY_KINDS)[number];

/** One interval (eon, era, period, subperiod, epoch/series, age/stage) of a chart edition. */
export interface Interval {
  /** English name; unique within an edition. */
  name: string;
  rank: Rank;
  /** Name of the enclosing interval, or null for a root (roots are eons). */
  parent: string | null;
  /** Age of the base (older boundary) in Ma (millions of years before present). */
  baseMa: number;
  /** ± of the base age in Ma, or null when the chart gives none. */
  baseUncertaintyMa: number | null;
  /** Age of the top (younger boundary) in Ma; equals the base of the next younger interval. */
  topMa: number;
  /** Standard chart colour, "#RRGGBB". */
  color: string;
  /** Base defined by a ratified GSSP or GSSA: true / false; null when the source says nothing. */
  gssp: boolean | null;
  /**
   * Which of the two defines the base, where it is ratified (gssp true) and the source says so;
   * null or absent otherwise (not ratified, or the kind not stated — older files).
   */
  boundaryKind?: BoundaryKind | null;
  /** The chart marks the base age as approximate ("~"). */
  approximate: boolean;
  /** Names in other languages, keyed by language tag ("de", "pt-br", …), as the source carries them. */
  names: Record<string, string>;
  /** Position in chart order (see README: depth-first, oldest first), 1-based. */
  order: number;
}

export type EditionStatus = "draft" | "current" | "retired";

/** Fields a correction may change. */
export const CORRECTABLE_FIELDS = [
  "name",
  "rank",
  "parent",
  "baseMa",
  "baseUncertaintyMa",
  "topMa",
  "color",
  "gssp",
  "boundaryKind",
  "approximate",
] as const;
export type CorrectableField = (typeof CORRECTABLE_FIELDS)[number];

/** One recorded change to the source data: what, from → to, why, on what authority. */
export interface Correction {
  /** Name of the interval at the time the correction is applied (corrections apply in list order). */
  interval: string;
  field: CorrectableField;
  from: string | number | boolean | null;
  to: string | number | boolean | null;
  reason: string;
  source: string;
}

export interface EditionMeta {
  /** e.g. "ics-2024-12" */
  slug: string;
  /** e.g. "ICS 2024/12" */
  label: string;
  status: EditionStatus;
  /** Full citation of the chart edition and of the data file it was read from. */
  source: string;
  licence: string;
  /** Repository path of the file the intervals were read from. */
  sourceFile: string;
  corrections: Correction[];
}

export interface Edition {
  edition: EditionMeta;
  intervals: Interval[];
}

/** Names of the invariants check() enforces (and of the parsers' own row rules). */
export type ProblemRule =
  | "name" // name present
  | "name-unique"
  | "number" // a number is finite
  | "base-older-than-top"
  | "age-negative"
  | "uncertainty"
  | "color"
  | "parent-exists"
  | "parent-cycle"
  | "rank-nesting"
  | "root-eon"
  | "tiling-base"
  | "tiling-top"
  | "sibling-gap"
  | "sibling-overlap"
  | "boundary-consistency"
  | "boundary-kind" // a boundary kind on a base that is not ratified
  | "rank-gap"
  | "rank-overlap"
  | "youngest-top"
  // raised by the parsers, before check():
  | "row" // a row/record fails validation
  | "syntax" // the file cannot be read (CSV quoting, JSON, Turtle syntax)
  | "source"; // the Turtle file's own structure (missing label, broader/narrower disagreement, …)

export interface Problem {
  /** Name of the interval concerned ("" when none can be named). */
  interval: string;
  /** Field concerned, as named in the Interval type (parsers: as named in the file format). */
  field: string;
  message: string;
  /** CSV: 1-based file line; JSON: 0-based array index; Turtle: 1-based line of the subject. */
  line?: number;
  rule: ProblemRule;
}

export interface ParseResult {
  intervals: Interval[];
  problems: Problem[];
}
