// A revision's content (what exhibit_revisions.content keeps) from the loaded exhibit. Pure.
import type { ExhibitSpec, ResolvedMarker } from "../exhibit/types";
import type { RevisionContent } from "./types";

export interface ContentSource {
  title: string;
  slug: string;
  edition: { id: number; slug: string; label: string };
  spec: ExhibitSpec;
  markers: ResolvedMarker[];
  /** Marker id → its decay system (for "how we know" panels). */
  decaySystems: ReadonlyMap<string, number | null>;
  medium: { vertexCount: number | null; geometrySha256: string | null };
}

export function revisionContent(s: ContentSource): RevisionContent {
  const m = s.spec.medium;
  return {
    title: s.title,
    slug: s.slug,
    edition: s.edition,
    spanOlder: s.spec.spanOlder,
    spanYounger: s.spec.spanYounger,
    unitsPreference: s.spec.unitsPreference,
    legibility: s.spec.legibility,
    medium: {
      kind: m.kind,
      mediumType: m.mediumType,
      lengthValue: m.kind === "length" ? m.length.value : null,
      lengthUnit: m.kind === "length" ? m.length.unit : null,
      panelWidthValue: m.kind === "length" ? (m.panelWidth?.value ?? null) : null,
      panelWidthUnit: m.kind === "length" ? (m.panelWidth?.unit ?? null) : null,
      routeLengthM: m.kind === "route" ? m.lengthMetres : null,
      routeVertexCount: m.kind === "route" ? s.medium.vertexCount : null,
      sourceName: m.kind === "route" ? m.sourceName : null,
      geometrySha256: m.kind === "route" ? s.medium.geometrySha256 : null,
    },
    markers: s.markers.map((x) => ({
      id: x.id,
      kind: x.kind,
      label: x.label,
      text: x.text,
      ageMa: x.ageMa,
      uncertaintyMa: x.uncertaintyMa,
      intervalName: x.intervalName,
      eventName: x.eventName,
      source: x.source,
      decaySystemId: s.decaySystems.get(x.id) ?? null,
    })),
    insets: s.spec.insets.map((i) => ({ id: i.id, label: i.label, olderMa: i.olderMa, youngerMa: i.youngerMa, magnification: i.magnification })),
  };
}
