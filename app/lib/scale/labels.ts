/**
 * Distance labels: a distance from both ends and its ±, on the grid the rounding rule (rounding.ts)
 * sets, in one unit of the metric or US customary system.
 */
import { METRES_PER_LENGTH_UNIT as UNIT_METRES, pow10, type LengthUnit, type UnitSystem } from "../units";
import { digits, formatFixed, scaledInteger } from "./digits";
import { plainRecord } from "./records";
import { ruleStep, ruleStepExponent, ruleUncertainty, stepRule, uncertaintyPlace, decadeFloor, type DisplayStep, type RoundingBasis } from "./rounding";

export interface DisplayLength {
  /** The rounded value in metres. */
  metres: number;
  /** The rounded value in the display unit. */
  value: number;
  unit: LengthUnit;
  decimals: number;
  /** e.g. "4,501.00 km" */
  text: string;
}

/** The units labels are written in, smallest first. */
export const METRIC: readonly LengthUnit[] = ["mm", "cm", "m", "km"];
export const US: readonly LengthUnit[] = ["in", "ft", "mi"];

/** A metric unit that reads well for a length (km from 10 km, m from 1 m, cm from 1 cm, else mm). */
export function autoMetricUnit(metres: number): LengthUnit {
  return METRIC[autoIndex(Math.abs(metres), false)];
}

/** A US customary unit that reads well for a length (mi from 10 mi, ft from 1 ft, else in). */
export function autoUsUnit(metres: number): LengthUnit {
  return US[autoIndex(Math.abs(metres), true)];
}

/** Index in METRIC or US of the unit that reads well for a length m ≥ 0 (autoMetricUnit, autoUsUnit). */
function autoIndex(m: number, us: boolean): number {
  if (us) return m >= 10 * UNIT_METRES.mi ? 2 : m >= UNIT_METRES.ft ? 1 : 0;
  return m >= 10_000 ? 3 : m >= 1 ? 2 : m >= 0.01 ? 1 : 0;
}

const METRIC_METRES = METRIC.map((u) => UNIT_METRES[u]);
const US_METRES = US.map((u) => UNIT_METRES[u]);

/** Index in METRIC (or US) of the unit a label of this size and step is written in (see labelUnit). */
function labelUnitIndex(size: number, stepMetres: number, us: boolean): number {
  return centimetresUp(fineEnough(autoIndex(size, us), stepMetres, us), stepMetres, us);
}

/** No more than three decimals: from unit k, a unit down while the step needs more (4,567.000000 km → 4,567,000.000 m). */
function fineEnough(k: number, stepMetres: number, us: boolean): number {
  const f = us ? US_METRES : METRIC_METRES;
  while (k > 0 && stepMetres / f[k] < 1e-3 * (1 - 1e-9)) k--;
  return k;
}

/** A step of a centimetre or more is not shown in millimetres. */
function centimetresUp(k: number, stepMetres: number, us: boolean): number {
  return !us && k === 0 && stepMetres >= 0.01 ? 1 : k;
}

/** Unit for a label: the requested one, or one of the unit system chosen from the size of the distance. */
export function labelUnit(metres: number, stepMetres: number, unit?: LengthUnit, system: UnitSystem = "metric"): LengthUnit {
  if (unit) return unit;
  const us = system === "us";
  const k = labelUnitIndex(Math.max(Math.abs(metres), stepMetres), stepMetres, us);
  return us ? US[k] : METRIC[k];
}

/** 10^(1e-9): decimalsFor's tolerance, as a factor. */
const DECIMALS_TOLERANCE = 10 ** 1e-9;

/**
 * Decimals that show a step in a unit: 0 when the step is a whole unit or more. The same as
 * max(0, floor(−log10(step) + 1e-9)) — the largest d ≥ 0 with step ≤ 10^−d·10^(1e-9) — found
 * by comparison with the table of powers, without a logarithm.
 */
function decimalsFor(stepInUnit: number): number {
  let d = 0;
  while (d < 30 && stepInUnit <= pow10(-(d + 1)) * DECIMALS_TOLERANCE) d++;
  return d;
}

/** With no decimals: the multiple a value is rounded to — the step's decade (metric), or the next decade up (inches, feet, yards, miles), never finer. */
function wholeStep(stepInUnit: number): number {
  const q = decadeFloor(Math.max(1, stepInUnit));
  return q < stepInUnit * (1 - 1e-9) ? q * 10 : q;
}

/**
 * A distance rounded on a grid of the unit (y = metres in the unit; `decimals`, or the multiple `q`
 * when there are none): its value in the unit. `up` rounds up instead of to the nearest (a ±
 * converted to feet is never shown smaller).
 */
function gridValue(y: number, decimals: number, q: number, up: boolean): number {
  let value: number;
  if (decimals > 0) {
    const p = pow10(decimals);
    const n = up ? Math.ceil(Math.abs(y) * p - 1e-9) : scaledInteger(Math.abs(y), decimals);
    value = n >= 0 ? (y < 0 ? -n : n) / p : Number(y.toFixed(decimals));
  } else {
    value = (up ? Math.ceil(y / q - 1e-9) : Math.round(y / q)) * q;
  }
  return value === 0 ? 0 : value;
}

/** The same distance's text, with thousands separators ("4,501.00"), then `suffix` (" km"); `plusMinus`: "± " first. */
function gridText(y: number, decimals: number, q: number, up: boolean, suffix = "", plusMinus = false): string {
  if (decimals > 0) {
    const n = up ? Math.ceil(Math.abs(y) * pow10(decimals) - 1e-9) : scaledInteger(Math.abs(y), decimals);
    if (n >= 0) return gridDigits(n, decimals, y < 0, suffix, plusMinus);
  }
  return (plusMinus ? "± " : "") + formatFixed(gridValue(y, decimals, q, up), decimals) + suffix;
}

/**
 * digits(n, …) for a scaled integer n ≥ 0, passed as a small integer when it is one: the engine
 * then hands it over untouched, where a fractional-typed number is boxed at every call.
 */
function gridDigits(n: number, d: number, negative: boolean, suffix: string, plusMinus: boolean): string {
  return n < 2_147_483_648 ? digits(n | 0, d, negative, suffix, plusMinus) : digits(n, d, negative, suffix, plusMinus);
}

/**
 * The grid of a step that is a power of ten, 10^e for −30 ≤ e ≤ 30 (as the rounding rule's steps
 * are), worked out once per unit: the same numbers labelUnitIndex, decimalsFor and wholeStep give
 * for it, read from a table by e (the preview labels every marker on every keystroke).
 */
interface PowerGrid {
  /** The largest unit index fineEnough allows for the step. */
  top: Int8Array;
  /** decimals[k][e + 30]: decimalsFor(10^e / unit k). */
  decimals: Int8Array[];
  /** multiple[k][e + 30]: the multiple with no decimals (wholeStep), 1 with decimals. */
  multiple: Float64Array[];
}
const POWERS = 61;
function powerGrid(us: boolean): PowerGrid {
  const f = us ? US_METRES : METRIC_METRES;
  const grid: PowerGrid = { top: new Int8Array(POWERS), decimals: [], multiple: [] };
  for (let k = 0; k < f.length; k++) {
    grid.decimals.push(new Int8Array(POWERS));
    grid.multiple.push(new Float64Array(POWERS));
  }
  for (let e = -30; e <= 30; e++) {
    const step = pow10(e);
    grid.top[e + 30] = fineEnough(f.length - 1, step, us);
    for (let k = 0; k < f.length; k++) {
      const d = decimalsFor(step / f[k]);
      grid.decimals[k][e + 30] = d;
      grid.multiple[k][e + 30] = d > 0 ? 1 : wholeStep(step / f[k]);
    }
  }
  return grid;
}
const METRIC_GRID = powerGrid(false);
const US_GRID = powerGrid(true);

/** Round a distance at a step and express it in a unit without implying more precision than the step. */
export function roundAtStep(metres: number, stepMetres: number, unit: LengthUnit): DisplayLength {
  const uf = UNIT_METRES[unit];
  const decimals = decimalsFor(stepMetres / uf);
  const q = decimals > 0 ? 1 : wholeStep(stepMetres / uf);
  const value = gridValue(metres / uf, decimals, q, false);
  return { metres: value * uf, value, unit, decimals, text: gridText(metres / uf, decimals, q, false, UNIT_SUFFIX[unit]) };
}

export interface DistanceLabel {
  fromOlderEnd: string;
  fromYoungerEnd: string;
  /** "± 0.05 km", or null without an uncertainty. */
  uncertainty: string | null;
  stepMetres: number;
  basis: RoundingBasis;
}

/** A DistanceLabel, made by `new` (records.ts: a plain object the engine does not pretenure). */
const DistanceLabelRecord = plainRecord(
  function (this: DistanceLabel, fromOlderEnd: string, fromYoungerEnd: string, uncertainty: string | null, stepMetres: number, basis: RoundingBasis) {
    this.fromOlderEnd = fromOlderEnd;
    this.fromYoungerEnd = fromYoungerEnd;
    this.uncertainty = uncertainty;
    this.stepMetres = stepMetres;
    this.basis = basis;
  },
  ["", "", null, 0.5, "uncertainty"],
);

const UNITS = Object.keys(UNIT_METRES) as LengthUnit[];
const IS_METRIC = Object.fromEntries(UNITS.map((u) => [u, METRIC.includes(u)])) as Readonly<Record<LengthUnit, boolean>>;
/** " km": a unit as it follows a figure (one string per unit, not one per label). */
const UNIT_SUFFIX = Object.fromEntries(UNITS.map((u) => [u, ` ${u}`])) as Readonly<Record<LengthUnit, string>>;
/** The same strings by index in METRIC and US (an array read, where a look-up by the unit's name is a hash look-up). */
const METRIC_SUFFIX = METRIC.map((u) => UNIT_SUFFIX[u]);
const US_SUFFIX = US.map((u) => UNIT_SUFFIX[u]);

/** The labels of a distance from both ends, with its ± — all in one unit, on one grid. */
export function distanceLabel(fromOlder: number, fromYounger: number, step: DisplayStep, unit?: LengthUnit, system: UnitSystem = "metric"): DistanceLabel {
  return labelOnGrid(fromOlder, fromYounger, step.stepMetres, NaN, step.basis, step.uncertaintyMetres, unit, system);
}

/**
 * distanceLabel(fromOlder, fromYounger, displayStep(age, ±, scale, resolution), unit, system) in one
 * call, without the intermediate step object (the preview labels every marker on every keystroke).
 */
export function markerLabel(
  fromOlder: number,
  fromYounger: number,
  ageYears: number,
  uncertaintyYears: number | null,
  metresPerYear: number,
  resolutionMetres: number,
  unit?: LengthUnit,
  system: UnitSystem = "metric",
): DistanceLabel {
  const basis = stepRule(ageYears, uncertaintyYears, metresPerYear, resolutionMetres);
  return labelOnGrid(fromOlder, fromYounger, ruleStep(), ruleStepExponent(), basis, ruleUncertainty(), unit, system);
}

/**
 * The labels on the step's grid. A step 10^e (−30 ≤ e ≤ 30; `e` NaN when not known to be one) in a
 * unit of the system's choosing reads its grid from the tables (powerGrid); any other is worked out.
 */
function labelOnGrid(
  fromOlder: number,
  fromYounger: number,
  stepMetres: number,
  e: number,
  basis: RoundingBasis,
  uncertaintyMetres: number | null,
  unit: LengthUnit | undefined,
  system: UnitSystem,
): DistanceLabel {
  const us = system === "us";
  const grid = unit === undefined && e >= -30 && e <= 30 ? (us ? US_GRID : METRIC_GRID) : null;
  let k = 0;
  let uf: number;
  let suffix: string;
  let roundUp: boolean;
  if (unit) {
    uf = UNIT_METRES[unit];
    suffix = UNIT_SUFFIX[unit];
    roundUp = !IS_METRIC[unit];
  } else {
    const larger = Math.abs(fromOlder > fromYounger ? fromOlder : fromYounger);
    const size = larger > stepMetres ? larger : stepMetres;
    if (grid !== null) {
      const top = grid.top[e + 30];
      const auto = autoIndex(size, us);
      k = centimetresUp(auto < top ? auto : top, stepMetres, us);
    } else {
      k = labelUnitIndex(size, stepMetres, us);
    }
    uf = us ? US_METRES[k] : METRIC_METRES[k];
    suffix = us ? US_SUFFIX[k] : METRIC_SUFFIX[k];
    roundUp = us;
  }
  const stepInUnit = stepMetres / uf;
  const decimals = grid !== null ? grid.decimals[k][e + 30] : decimalsFor(stepInUnit);
  const q = grid !== null ? grid.multiple[k][e + 30] : decimals > 0 ? 1 : wholeStep(stepInUnit);
  let unc: string | null = null;
  if (uncertaintyMetres !== null) {
    // the ± keeps its own figures (rounded up) even when the medium's resolution is coarser;
    // converted to inches, feet or miles it is rounded up again, never down. Its grid is the finer
    // of its own last place and the step (both powers of ten)
    const p = uncertaintyPlace(uncertaintyMetres);
    const ue = (p < e ? p : e) + 30;
    let ud: number;
    let uq: number;
    if (grid !== null && ue >= 0) {
      ud = grid.decimals[k][ue];
      uq = grid.multiple[k][ue];
    } else {
      const place = pow10(p);
      const uStep = (place < stepMetres ? place : stepMetres) / uf;
      ud = decimalsFor(uStep);
      uq = ud > 0 ? 1 : wholeStep(uStep);
    }
    const y = uncertaintyMetres / uf;
    const n = ud > 0 ? (roundUp ? Math.ceil(y * pow10(ud) - 1e-9) : scaledInteger(y, ud)) : -1;
    unc = n >= 0 ? gridDigits(n, ud, false, suffix, true) : gridText(y, ud, uq, roundUp, suffix, true);
  }
  // gridText's way, its scaled integers worked out here rather than in a call per text: only
  // integers and strings go on to digits() (a fractional number passed to a call the engine does
  // not inline is boxed, once per call: measured, 100 bytes more per marker)
  const older = fromOlder / uf;
  const younger = fromYounger / uf;
  const nOlder = decimals > 0 ? scaledInteger(older < 0 ? -older : older, decimals) : -1;
  const nYounger = decimals > 0 ? scaledInteger(younger < 0 ? -younger : younger, decimals) : -1;
  // a step is a power of ten from pow10: already the double nearest it (what clean() would give)
  return new DistanceLabelRecord(
    nOlder >= 0 ? gridDigits(nOlder, decimals, older < 0, suffix, false) : gridText(older, decimals, q, false, suffix),
    nYounger >= 0 ? gridDigits(nYounger, decimals, younger < 0, suffix, false) : gridText(younger, decimals, q, false, suffix),
    unc,
    stepMetres,
    basis,
  );
}
