// TEST ORACLE (test-only): the composer's computeExhibit as it was before the single formatter
// module (issue 10), kept to compare labels with. Do not change.
// Turning an exhibit into a scale-engine request, and the comparisons every exhibit shows.
import { parseScaleRequest, type ScaleRequest } from "./schema";
import { computeScale, type ScaleResult } from "./compute";
import { prepareRoute, type PreparedRoute } from "./route";
import { parseGeoJsonRoute } from "./geo-parse";
import { toMetres, toYears } from "./units";
import type { DurationSpec, ExhibitSpec, LineStringGeometry, ResolvedMarker } from "../../../../app/lib/exhibit/types";

/** Comparisons shown on every exhibit. The life span is the visitor's to change in the preview. */
export function standardDurations(lifeYears = 80): DurationSpec[] {
  return [
    { id: "life", label: `a ${lifeYears}-year life`, years: lifeYears },
    // Oldest writing, about 5,200 years ago (Sumerian cuneiform; common practice figure).
    { id: "writing", label: "recorded history (about 5,200 years)", years: 5200 },
    // Holocene base 11,700 years b2k (ICS chart).
    { id: "holocene", label: "the Holocene (11,700 years)", years: 11_700 },
    // Earliest Homo sapiens fossils, about 300,000 years (common practice round figure).
    { id: "sapiens", label: "our species (about 300,000 years)", years: 300_000 },
  ];
}

/** The scale-engine request for an exhibit (not yet validated: run it through parseScaleRequest). */
export function scaleRequestFor(spec: ExhibitSpec, markers: ResolvedMarker[], durations: DurationSpec[] = []): unknown {
  return {
    span: { older: spec.spanOlder, younger: spec.spanYounger },
    medium: spec.medium.kind === "length" ? { kind: "length", length: spec.medium.length } : { kind: "route", geometry: spec.medium.geometry },
    mediumType: spec.medium.mediumType,
    legibility: spec.legibility,
    points: markers.map((m) => ({
      id: m.id,
      label: m.label,
      age: { value: m.ageMa, unit: "Ma" },
      ...(m.uncertaintyMa != null && m.uncertaintyMa > 0 ? { uncertainty: { value: m.uncertaintyMa, unit: "Ma" } } : {}),
    })),
    durations: durations.map((d) => ({ id: d.id, label: d.label, years: d.years })),
    insets: spec.insets.map((i) => ({
      id: i.id,
      label: i.label,
      older: { value: i.olderMa, unit: "Ma" },
      younger: { value: i.youngerMa, unit: "Ma" },
      magnification: i.magnification,
    })),
  };
}

export type ExhibitComputation =
  | { ok: true; request: ScaleRequest; route?: PreparedRoute; result: ScaleResult }
  | { ok: false; message: string; issues: { path: string; message: string }[] };

/**
 * Validate and compute an exhibit. Pass `route` (from an earlier call) to skip re-measuring the
 * route on every keystroke in the preview.
 */
export function computeExhibit(spec: ExhibitSpec, markers: ResolvedMarker[], durations: DurationSpec[] = [], cache?: { route?: PreparedRoute; geometry?: unknown }): ExhibitComputation {
  const body = scaleRequestFor(spec, markers, durations) as { medium: { kind: string; geometry?: unknown } };
  const reuse = cache?.route && spec.medium.kind === "route" && cache.geometry === spec.medium.geometry;
  const parsed = parseScaleRequest(reuse ? { ...body, medium: { kind: "length", length: { value: cache!.route!.totalMetres, unit: "m" } } } : body);
  if (!parsed.ok) return { ok: false, message: parsed.error.message, issues: parsed.error.issues };
  if (reuse) {
    const request = { ...parsed.request, medium: body.medium } as ScaleRequest;
    return { ok: true, request, route: cache!.route, result: computeScale(request, { route: cache!.route }) };
  }
  return { ok: true, request: parsed.request, route: parsed.route, result: computeScale(parsed.request, { route: parsed.route }) };
}

