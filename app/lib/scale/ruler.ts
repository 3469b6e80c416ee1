/**
 * Ruler ticks along the exhibit at round lengths of its unit system: metric ticks at 1, 2 or 5 ×
 * 10^k of mm, cm, m or km; US ticks at 1, 2 or 5 × 10^k feet or miles (from 10 ft, 2 mi), or at
 * ⅛, ¼, ½, 1, 2, 3, 6 or 12 inches,
 * never at converted metric figures (3.3, 6.6, 9.8 ft).
 */
import { METRES_PER_LENGTH_UNIT, pow10, type LengthUnit, type UnitSystem } from "../units";
import { formatFixed } from "./format";

export interface RulerTick {
  /** Distance from the older end, metres. */
  metres: number;
  /** e.g. "500 ft", "1.5 mi" */
  label: string;
}

export interface Ruler {
  unit: LengthUnit;
  /** Distance between ticks, metres. */
  stepMetres: number;
  ticks: RulerTick[];
}

function niceSteps(unit: LengthUnit): number[] {
  // inches the way a tape reads: fractions of an inch, then 3 and 6 inches (a quarter and a half foot)
  if (unit === "in") return [0.125, 0.25, 0.5, 1, 2, 3, 6, 12];
  const out: number[] = [];
  for (let k = -3; k <= 6; k++) for (const m of [1, 2, 5]) out.push(m * pow10(k));
  return out;
}

/** The unit ticks are written in: the largest of the system's units that leaves at least one tick step of 1. */
function rulerUnit(totalMetres: number, system: UnitSystem): LengthUnit {
  if (system === "us") {
    if (totalMetres >= 2 * METRES_PER_LENGTH_UNIT.mi) return "mi";
    if (totalMetres >= 10 * METRES_PER_LENGTH_UNIT.ft) return "ft";
    return "in";
  }
  if (totalMetres >= 2000) return "km";
  if (totalMetres >= 2) return "m";
  if (totalMetres >= 0.02) return "cm";
  return "mm";
}

/** Ticks from 0 to the exhibit's length at a round step, about `target` of them (at least 2). */
export function rulerTicks(totalMetres: number, system: UnitSystem = "metric", target = 8): Ruler {
  const unit = rulerUnit(totalMetres, system);
  const uf = METRES_PER_LENGTH_UNIT[unit];
  const total = totalMetres / uf;
  const wanted = total / Math.max(1, target);
  const steps = niceSteps(unit);
  const step = steps.find((s) => s >= wanted * (1 - 1e-9)) ?? steps[steps.length - 1];
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  const ticks: RulerTick[] = [];
  for (let i = 0; i * step <= total * (1 + 1e-9); i++) {
    const v = i * step;
    ticks.push({ metres: v * uf, label: `${formatFixed(v, decimals)} ${unit}` });
  }
  return { unit, stepMetres: step * uf, ticks };
}
