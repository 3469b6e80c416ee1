// Why an exhibit does not compute, in the composer's words: settings by the labels of their fields,
// markers by table number and label with their ages, insets by name — not the scale engine's
// request paths ("points.0.age"), database ids or ages in years. /api/scale keeps the engine's own
// message; the composer's preview, its refused saves and the review checks show this one.
import { markerNames } from "../scale/warnings";
import { formatAgeMa, formatSpanEndMa } from "./display";
import type { ExhibitSpec, ResolvedMarker } from "./types";

/** One problem the scale engine's request schema found (path: "span.older.value", "points.3.age" …). */
export interface EngineIssue {
  path: string;
  message: string;
}

/** The labels of the composer's settings fields (settings-form.tsx shows them; the messages below name fields by them). */
export const SETTINGS_LABELS = {
  spanOlder: "Older end (start)",
  spanYounger: "Younger end (finish)",
  length: "Length",
  minVisible: "Smallest visible length",
  minSpacing: "Smallest marker spacing",
} as const;

/** The composer's fields, by the request path they fill. */
const FIELDS: readonly [path: string, label: string][] = [
  ["span.older", SETTINGS_LABELS.spanOlder],
  ["span.younger", SETTINGS_LABELS.spanYounger],
  ["medium.length", SETTINGS_LABELS.length],
  ["medium.geometry", "Route"],
  ["legibility.minVisibleMetres", SETTINGS_LABELS.minVisible],
  ["legibility.minSpacingMetres", SETTINGS_LABELS.minSpacing],
];

/** An end of the span as the designer typed it: "541 Ma", "11.7 ka"; an age of 0 is the present. */
function spanEnd(age: ExhibitSpec["spanOlder"]): string {
  return age.value === 0 ? "the present" : `${age.value.toLocaleString("en-GB", { maximumFractionDigits: 6 })} ${age.unit}`;
}

/** A path into one of the request's lists: "points.3.age" → list "points", index 3, rest "age". */
const INDEXED = /^(points|insets)\.(\d+)(?:\.(.*))?$/;

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
    // the span's ends in the wrong order: the schema puts it on span.older itself
    if (issue.path === "span.older") {
      order = `The older end (start), ${spanEnd(spec.spanOlder)}, must be older than the younger end (finish), ${spanEnd(spec.spanYounger)}.`;
      continue;
    }
    const field = FIELDS.find(([path]) => issue.path === path || issue.path.startsWith(`${path}.`));
    if (field) {
      fields.push(fieldProblem(field[1], issue.message));
      continue;
    }
    const [, list, at, within] = INDEXED.exec(issue.path) ?? [];
    const marker = list === "points" ? markers[Number(at)] : undefined;
    const insetSpec = list === "insets" ? spec.insets[Number(at)] : undefined;
    if (marker && within === "age" && /outside the span/.test(issue.message)) {
      outside.push(marker);
    } else if (marker) {
      rest.push(`Marker ${marker.number} “${marker.label}”: ${issue.message}`);
    } else if (insetSpec) {
      const { label, olderMa, youngerMa } = insetSpec;
      if (!insets.has(Number(at))) insets.set(Number(at), `Inset “${label}” (${formatAgeMa(olderMa)} to ${formatSpanEndMa(youngerMa)}): ${issue.message}`);
    } else {
      rest.push(issue.message);
    }
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
