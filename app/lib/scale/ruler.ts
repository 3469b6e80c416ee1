/**
 * Ruler ticks along the exhibit at round lengths of its unit system: metric ticks at 1, 2 or 5 ×
 * 10^k of mm, m or km; US ticks at 1, 2 or 5 × 10^k inches, feet or miles (and 3 or 6 inches),
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
  const out: number[] = [];
  for (let k = -3; k <= 6; k++) for (const m of [1, 2, 5]) out.push(m * pow10(k));
  if (unit === "in") out.push(3, 6); // a quarter and half of a foot
  return out.sort((a, b) => a - b);
}

/** The unit ticks are written in: the largest of the system's units that leaves at least one tick step of 1. */
function rulerUnit(totalMetres: number, system: UnitSystem): LengthUnit {
  if (system === "us") {
    if (totalMetres >= 2 * METRES_PER_LENGTH_UNIT.mi) return "mi";
    if (totalMetres >= 2 * METRES_PER_LENGTH_UNIT.ft) return "ft";
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
