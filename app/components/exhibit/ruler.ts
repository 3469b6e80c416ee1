// Ruler ticks for a drawn exhibit at round lengths in the reader's units: metres and kilometres
// (or cm, mm) for metric, feet and miles (or inches) for US customary — never 3.3, 6.6, 9.8 ft.
import { scaleLinear } from "d3-scale";
import type { UnitsPreference } from "~/lib/exhibit";

const METRIC = [
  { unit: "km", metres: 1000, from: 2000 },
  { unit: "m", metres: 1, from: 2 },
  { unit: "cm", metres: 0.01, from: 0.02 },
  { unit: "mm", metres: 0.001, from: 0 },
];
const US = [
  { unit: "mi", metres: 1609.344, from: 1609.344 },
  { unit: "ft", metres: 0.3048, from: 0.9144 },
  { unit: "in", metres: 0.0254, from: 0 },
];

export function rulerUnit(totalMetres: number, units: UnitsPreference): { unit: string; metres: number } {
  const list = units === "us" ? US : METRIC;
  return list.find((u) => totalMetres >= u.from) ?? list[list.length - 1];
}

export function rulerTicks(totalMetres: number, units: UnitsPreference, maxTicks: number): { metres: number; label: string }[] {
  const u = rulerUnit(totalMetres, units);
  return scaleLinear()
    .domain([0, totalMetres / u.metres])
    .ticks(maxTicks)
    .map((t) => ({ metres: t * u.metres, label: t === 0 ? "0" : `${t.toLocaleString("en-GB")} ${u.unit}` }));
}

/** A scale bar for a map: a round length in the reader's units close to `targetMetres`. */
export function scaleBar(targetMetres: number, units: UnitsPreference): { metres: number; label: string } {
  const u = rulerUnit(targetMetres * 2, units);
  const inUnit = targetMetres / u.metres;
  const decade = 10 ** Math.floor(Math.log10(inUnit));
  const nice = [5, 2, 1].map((k) => k * decade).find((v) => v <= inUnit) ?? decade;
  return { metres: nice * u.metres, label: `${nice.toLocaleString("en-GB")} ${u.unit}` };
}
