/**
 * Walking figures at a marker on a route: time at the design walking speed and at the slow-walker
 * check, and steps as a common-practice range.
 */
import { clean } from "../units";
import { formatCountTwoFigures, formatDuration } from "./format";

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

/** Walking figures for a distance from the start of the route, metres. */
export function walkingAt(d: number, w: WalkingSettings): Walking {
  const seconds = d / w.walkingSpeed;
  const accessibleSeconds = d / w.accessibleSpeed;
  const steps = Math.round(d / w.stepLength);
  const stepsUpTo = Math.round(d / w.shortStep);
  // A range is not more precise than two figures: 6,009–6,919 steps reads "6,000–6,900".
  const low = formatCountTwoFigures(steps);
  const stepsText = steps === stepsUpTo ? `about ${low} steps` : `about ${low}–${formatCountTwoFigures(stepsUpTo)} steps`;
  return {
    distanceFromStartMetres: clean(d),
    seconds: clean(seconds),
    accessibleSeconds: clean(accessibleSeconds),
    steps,
    stepsUpTo,
    text: `${formatDuration(seconds)} walk (${formatDuration(accessibleSeconds)} at ${w.speedText}), ${stepsText}`,
  };
}
