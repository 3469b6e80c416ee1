/**
 * Walking figures at a marker on a route: time at the design walking speed and at the slow-walker
 * check, and steps as a common-practice range.
 */
import { clean, decadeOf, pow10 } from "../units";
import { formatCountTwoFigures, formatDuration } from "./format";
import { plainRecord } from "./records";

/** FHWA-RD-98-107: 1.2 m/s walking design speed. */
export const DEFAULT_WALKING_SPEED_MPS = 1.2;
/** MUTCD §4E.06: 0.9 m/s (3 ft/s) check for slower walkers. */
export const DEFAULT_ACCESSIBLE_SPEED_MPS = 0.9;
/**
 * Common practice (not a standard): a step is about 0.66 m (women) to 0.76 m (men). Step counts
 * are shown as that range; `steps` keeps the lower count (the long step), `stepsUpTo` the higher.
 */
export const STEP_LENGTH_RANGE_M = [0.66, 0.76] as const;
export const DEFAULT_STEP_LENGTH_M = STEP_LENGTH_RANGE_M[1];

export const WALKING_SOURCES = {
  walkingSpeed: "FHWA-RD-98-107: 1.2 m/s pedestrian design walking speed",
  accessibleSpeed: "MUTCD §4E.06: 0.9 m/s (3 ft/s) slow-walker check",
  stepLength: "common practice: about 0.66–0.76 m per step (not a standard)",
} as const;

export interface Walking {
  distanceFromStartMetres: number;
  seconds: number;
  accessibleSeconds: number;
  /** Steps at the long step length (the lower count). */
  steps: number;
  /** Steps at the short step length of the common-practice range (equal to `steps` when a single step length was asked for). */
  stepsUpTo: number;
  /** e.g. "12 min walk (16 min at 0.9 m/s), about 1,100–1,300 steps" */
  text: string;
}

/** The speeds and step lengths of one exhibit, and the slow speed as words ("0.9 m/s", "3 ft/s"). */
export interface WalkingSettings {
  walkingSpeed: number;
  accessibleSpeed: number;
  stepLength: number;
  shortStep: number;
  speedText: string;
}

/** A Walking, made by `new` (records.ts: a plain object the engine does not pretenure). */
const WalkingRecord = plainRecord(
  function (this: Walking, distanceFromStartMetres: number, seconds: number, accessibleSeconds: number, steps: number, stepsUpTo: number, text: string) {
    this.distanceFromStartMetres = distanceFromStartMetres;
    this.seconds = seconds;
    this.accessibleSeconds = accessibleSeconds;
    this.steps = steps;
    this.stepsUpTo = stepsUpTo;
    this.text = text;
  },
  [0.5, 0.5, 0.5, 1, 1, ""],
);

/** Walking figures for a distance from the start of the route, metres. */
export function walkingAt(d: number, w: WalkingSettings): Walking {
  return walkingFor(Float64Array.of(d), w)[0];
}

/**
 * Walking figures for each distance from the start of the route, metres (`distancesClean`: already
 * clean()ed, as the engine's are). One loop for all the markers: their distances stay in the typed
 * array, and the slow-speed wording's table of texts is looked up once.
 */
export function walkingFor(distances: Float64Array, w: WalkingSettings, distancesClean = false): Walking[] {
  const out = new Array<Walking>(distances.length);
  const times = timesTable(w.speedText);
  for (let i = 0; i < distances.length; i++) {
    const d = distances[i];
    const seconds = d / w.walkingSpeed;
    const accessibleSeconds = d / w.accessibleSpeed;
    const steps = Math.round(d / w.stepLength);
    const stepsUpTo = Math.round(d / w.shortStep);
    // "12 min walk (16 min at 0.9 m/s), " + "about 1,100–1,300 steps"
    const text = timesText(seconds, accessibleSeconds, w.speedText, times) + stepsText(steps, stepsUpTo);
    out[i] = new WalkingRecord(distancesClean ? d : clean(d), clean(seconds), clean(accessibleSeconds), steps, stepsUpTo, text);
  }
  return out;
}

// The preview writes these texts for every marker on every keystroke. Their parts take a few
// thousand values, so each is made once (by format.ts's formatDuration and formatCountTwoFigures)
// and kept in a table by value, and so are the sentence's two halves (the times, the steps), keyed
// by their parts' slots; tests/unit/geo/walking-text.test.ts checks them against format.ts.

const MINUTES_CACHED = 30_000; // 500 hours
const DURATIONS_CACHED = 61 + MINUTES_CACHED;
/** A duration's cache slot: whole seconds under a minute (0–60), then whole minutes + 61; −1 from 500 hours. */
function durationKey(seconds: number): number {
  if (seconds < 60) {
    const s = Math.round(seconds);
    return s >= 0 ? s : -1;
  }
  const minutes = Math.round(seconds / 60);
  return minutes < MINUTES_CACHED ? 61 + minutes : -1;
}
const DURATION_TEXT = new Array<string | undefined>(DURATIONS_CACHED);

/** formatDuration(seconds) of format.ts, from a cache: "45 s", "12 min", "1 h 05 min". */
export function formatDurationCached(seconds: number): string {
  const k = durationKey(seconds);
  if (k < 0) return formatDuration(seconds);
  return DURATION_TEXT[k] ?? (DURATION_TEXT[k] = formatDuration(seconds));
}

/**
 * Sentence halves kept by value, the value being their two parts' slots (a, b), in a table with
 * one entry per first slot (a direct-mapped cache: an entry holds one pair, checked on reading). A
 * half's second slot nearly always follows from its first (the slow time is the walking time at a
 * fixed ratio, the upper step count the lower at a fixed ratio), so a pair seldom meets another in
 * its entry; read from two arrays, not hashed. A pair not in its entry is written afresh and takes
 * the entry: the text never depends on what was asked before. A table's size is its number of first slots.
 */
class PairTable {
  private readonly second: Int32Array;
  private readonly text: (string | undefined)[];
  constructor(slots: number) {
    this.second = new Int32Array(slots).fill(-1);
    this.text = new Array<string | undefined>(slots);
  }
  /** The text kept for (a, b), a in range and b ≥ 0. */
  get(a: number, b: number): string | undefined {
    return this.second[a] === b ? this.text[a] : undefined;
  }
  /** Keep `text` for (a, b) in a's entry; returns the text. */
  keep(a: number, b: number, text: string): string {
    this.second[a] = b;
    this.text[a] = text;
    return text;
  }
}

/**
 * The times half of the sentence for each slow-speed wording ("0.9 m/s"). At most SPEEDS_KEPT
 * wordings keep a table (the speed comes with an /api/scale request, so a server would otherwise
 * keep one for every speed it was ever sent): at most 8 × 30,061 short texts, a few megabytes.
 */
const TIMES_TEXT = new Map<string, PairTable>();
const SPEEDS_KEPT = 8;

/** The table of times halves for one slow-speed wording (at most SPEEDS_KEPT kept). */
function timesTable(speedText: string): PairTable {
  let table = TIMES_TEXT.get(speedText);
  if (table === undefined) {
    if (TIMES_TEXT.size >= SPEEDS_KEPT) TIMES_TEXT.clear();
    TIMES_TEXT.set(speedText, (table = new PairTable(DURATIONS_CACHED)));
  }
  return table;
}

/** "12 min walk (16 min at 0.9 m/s), " (`table`: timesTable(speedText)) */
function timesText(seconds: number, slowSeconds: number, speedText: string, table: PairTable): string {
  const a = durationKey(seconds);
  const b = durationKey(slowSeconds);
  const cached = a >= 0 && b >= 0;
  const known = cached ? table.get(a, b) : undefined;
  if (known !== undefined) return known;
  const text = formatDurationCached(seconds) + " walk (" + formatDurationCached(slowSeconds) + " at " + speedText + "), ";
  return cached ? table.keep(a, b, text) : text;
}

/** A count's cache slot: the value below 100; from 100, 100 + the power of ten k × 101 + the two figures m (10–100); −1 otherwise. */
function countKey(n: number): number {
  if (n >= 0 && n < 100) return Number.isInteger(n) ? n : -1;
  if (!(n >= 100 && Number.isSafeInteger(n))) return -1;
  const k = decadeOf(n) - 1; // n has two more digits than 10^k has zeros (exact: n is an integer)
  return 100 + k * 101 + Math.round(n / pow10(k));
}
const COUNTS_CACHED = 100 + 16 * 101; // k ≤ 15 below 2^53
/** Above every count slot: the second slot of a single count ("about 1,100 steps"), apart from any range's. */
const SINGLE_COUNT = COUNTS_CACHED;
const COUNT_TEXT = new Array<string | undefined>(COUNTS_CACHED);

/** formatCountTwoFigures(n) of format.ts for a count n ≥ 0, from a cache: 6,009 → "6,000". */
export function formatCountTwoFiguresCached(n: number): string {
  const k = countKey(n);
  if (k < 0) return formatCountTwoFigures(n);
  return COUNT_TEXT[k] ?? (COUNT_TEXT[k] = formatCountTwoFigures(n));
}

/** The steps half of the sentence, by the two counts' slots (a single count and a range are kept apart). */
const STEPS_TEXT = new PairTable(COUNTS_CACHED);

/** "about 1,100–1,300 steps", or "about 1,100 steps" for one count. A range is not more precise than two figures: 6,009–6,919 steps reads "6,000–6,900". */
function stepsText(steps: number, stepsUpTo: number): string {
  const a = countKey(steps);
  const b = steps === stepsUpTo ? SINGLE_COUNT : countKey(stepsUpTo);
  const cached = a >= 0 && b >= 0;
  const known = cached ? STEPS_TEXT.get(a, b) : undefined;
  if (known !== undefined) return known;
  const low = formatCountTwoFiguresCached(steps);
  const text = steps === stepsUpTo ? "about " + low + " steps" : "about " + low + "–" + formatCountTwoFiguresCached(stepsUpTo) + " steps";
  return cached ? STEPS_TEXT.keep(a, b, text) : text;
}
