// Why an exhibit does not compute, in the composer's words: settings by the labels of their fields,
// markers by table number and label with their ages, insets by name — not the scale engine's
// request paths ("points.0.age"), database ids or ages in years. /api/scale keeps the engine's own
// message; the composer's preview, its refused saves and the review checks show this one.
import { markerNames } from "../scale/warnings";
import { formatAgeMa } from "./display";
import type { ExhibitSpec, ResolvedMarker } from "./types";

/** One problem the scale engine's request schema found (path: "span.older.value", "points.3.age" …). */
export interface EngineIssue {
  path: string;
  message: string;
}

/** The composer's fields, by the request path they fill (settings-form.tsx uses the same labels). */
const FIELDS: readonly [path: string, label: string][] = [
  ["span.older", "Older end (start)"],
  ["span.younger", "Younger end (finish)"],
  ["medium.length", "Length"],
  ["medium.geometry", "Route"],
  ["legibility.minVisibleMetres", "Smallest visible length"],
  ["legibility.minSpacingMetres", "Smallest marker spacing"],
];

/** An end of the span as the designer typed it: "541 Ma", "11.7 ka"; an age of 0 is the present. */
function spanEnd(age: ExhibitSpec["spanOlder"]): string {
  return age.value === 0 ? "the present" : `${age.value.toLocaleString("en-GB", { maximumFractionDigits: 6 })} ${age.unit}`;
}

/** Index and rest of a path under `head` ("points.3.age" under "points" → [3, "age"]), or null. */
function indexed(path: string, head: string): [number, string] | null {
  const m = new RegExp(`^${head}\\.(\\d+)(?:\\.(.*))?$`).exec(path);
  return m ? [Number(m[1]), m[2] ?? ""] : null;
}

/** A field's problem: a number that is not one asks for one; otherwise the engine's reason after the field's label. */
function fieldProblem(label: string, message: string): string {
  return /must be a finite number|is required/.test(message) ? `${label}: type a number.` : `${label}: ${message}`;
}

/**
 * The problems, one sentence per kind, most basic first (a field, the order of the span's ends,
 * markers outside the span, insets, anything else), and how many more kinds there are.
 */
export function exhibitProblems(spec: ExhibitSpec, markers: readonly ResolvedMarker[], issues: readonly EngineIssue[]): string[] {
  const fields: string[] = [];
  const outside: ResolvedMarker[] = [];
  const insets = new Map<number, string>();
  const rest: string[] = [];
  let order: string | null = null;
  for (const issue of issues) {
    const field = FIELDS.find(([path]) => issue.path === `${path}.value` || issue.path === `${path}.unit`);
    if (field) {
      fields.push(fieldProblem(field[1], issue.message));
      continue;
    }
    if (issue.path === "span.older") {
      order = `The older end (start), ${spanEnd(spec.spanOlder)}, must be older than the younger end (finish), ${spanEnd(spec.spanYounger)}.`;
      continue;
    }
    const point = indexed(issue.path, "points");
    const marker = point ? markers[point[0]] : undefined;
    if (point && marker && point[1] === "age" && /outside the span/.test(issue.message)) {
      outside.push(marker);
      continue;
    }
    if (point && marker) {
      rest.push(`Marker ${marker.number} “${marker.label}”: ${issue.message}`);
      continue;
    }
    const inset = indexed(issue.path, "insets");
    const insetSpec = inset ? spec.insets[inset[0]] : undefined;
    if (inset && insetSpec) {
      const { label, olderMa, youngerMa } = insetSpec;
      if (!insets.has(inset[0])) insets.set(inset[0], `Inset “${label}” (${formatAgeMa(olderMa)} to ${youngerMa === 0 ? "the present" : formatAgeMa(youngerMa)}): ${issue.message}`);
      continue;
    }
    const known = FIELDS.find(([path]) => issue.path === path || issue.path.startsWith(`${path}.`));
    rest.push(known ? fieldProblem(known[1], issue.message) : issue.message);
  }
  const span = `(${spanEnd(spec.spanOlder)} to ${spanEnd(spec.spanYounger)})`;
  const named = markerNames(outside, 6, (m) => `${m.number} “${m.label}” (${formatAgeMa(m.ageMa)})`);
  const markersOutside =
    outside.length === 0 ? [] : outside.length === 1 ? [`Marker ${named} lies outside the span ${span}.`] : [`${outside.length} markers lie outside the span ${span}: ${named}.`];
  return [...new Set(fields), ...(order ? [order] : []), ...markersOutside, ...insets.values(), ...new Set(rest)];
}

/** exhibitProblems as one message: the first problem, and how many more there are. */
export function exhibitProblem(spec: ExhibitSpec, markers: readonly ResolvedMarker[], issues: readonly EngineIssue[]): string {
  const all = exhibitProblems(spec, markers, issues);
  if (all.length === 0) return "The exhibit's settings cannot be worked out.";
  const more = all.length - 1;
  return more > 0 ? `${all[0]} (And ${more} more problem${more > 1 ? "s" : ""}.)` : all[0];
}
