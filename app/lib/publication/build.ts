// Builds the publication snapshot from an exhibit as the scale engine computed it. Pure: the server
// gathers the inputs (rendered texts, decay panels, images, sign numbers) and hashes the result.
import type { ExhibitSpec, ResolvedMarker } from "../exhibit/types";
import { formatAgeMa } from "../exhibit/display";
import type { ScaleResult } from "../scale/compute";
import { WALKING_SOURCES } from "../scale/compute";
import { chainAt } from "../timescale/lookup";
import type { Interval } from "../timescale/types";
import { toYears } from "../units";
import { prepareRoute } from "../geo/route";
import {
  SNAPSHOT_SCHEMA_VERSION,
  type PublicationSnapshot,
  type RetiredSign,
  type SnapshotImage,
  type SnapshotInterval,
  type SnapshotMarker,
  type SnapshotMedium,
} from "./types";

export interface SnapshotInput {
  organisation: { slug: string; name: string };
  exhibit: { slug: string; title: string; revision: number };
  spec: ExhibitSpec;
  markers: ResolvedMarker[];
  result: ScaleResult;
  edition: { slug: string; label: string; source: string; licence: string };
  intervals: readonly Interval[];
  /** Marker id → sanitised HTML of its text. */
  html: ReadonlyMap<string, string>;
  decay: ReadonlyMap<string, { system: string; sentence: string; citation: string }>;
  images: ReadonlyMap<string, SnapshotImage>;
  /** Marker id → sign number (every marker must have one). */
  signs: ReadonlyMap<string, number>;
  retiredSigns: RetiredSign[];
}

/** 7 decimals of a degree: about 1 cm on the ground. */
export const COORDINATE_DECIMALS = 7;
const deg = (x: number) => Number(x.toFixed(COORDINATE_DECIMALS));
/** Lengths to 0.1 mm and times to 0.1 s: enough for any sign, stable to print. */
const mm = (x: number) => Number(x.toFixed(4));
const tenth = (x: number) => Number(x.toFixed(1));
const opt = <T, R>(x: T | null | undefined, f: (v: T) => R): R | null => (x == null ? null : f(x));

export const PUBLICATION_CAUTIONS = {
  route:
    "Planning figures, not a survey: walk the route first for hazards and accessibility, get the landowner's and authority's permission, and follow local codes for sign installation.",
  ages: "Ages carry the uncertainty of their source; each marker names its source.",
  edition: (label: string) => `Boundary ages are those of ${label}; a later edition of the chart may move them.`,
} as const;

function ageText(m: ResolvedMarker): string {
  const base = formatAgeMa(m.ageMa);
  if (m.uncertaintyMa == null || m.uncertaintyMa <= 0) return `${m.approximate ? "about " : ""}${base}`;
  const [value, unit] = base.split(" ");
  const factor = unit === "Ga" ? 1e-3 : unit === "ka" ? 1e3 : unit === "a" ? 1e6 : 1;
  return `${value} ± ${Number((m.uncertaintyMa * factor).toPrecision(3))} ${unit}`;
}

/** Elevation at a distance along a route whose vertices carry a third coordinate, by linear interpolation. */
function elevationAt(coords: number[][], cumulative: number[] | null, distance: number): number | null {
  if (!cumulative || coords.some((c) => c.length < 3 || !Number.isFinite(c[2]))) return null;
  const i = cumulative.findIndex((d) => d >= distance);
  if (i <= 0) return coords[i === 0 ? 0 : coords.length - 1][2];
  const t = (distance - cumulative[i - 1]) / (cumulative[i] - cumulative[i - 1] || 1);
  return Number((coords[i - 1][2] + t * (coords[i][2] - coords[i - 1][2])).toFixed(1));
}

function mediumOf(spec: ExhibitSpec, result: ScaleResult): SnapshotMedium {
  const m = spec.medium;
  if (m.kind === "length") {
    return { kind: "length", mediumType: m.mediumType, length: m.length, lengthMetres: mm(result.scale.totalMetres), panelWidth: m.panelWidth };
  }
  const r = result.scale.route!;
  const coordinates = (m.geometry.coordinates as number[][]).map((c) => (c.length >= 3 ? [deg(c[0]), deg(c[1]), Number(c[2].toFixed(2))] : [deg(c[0]), deg(c[1])]));
  return {
    kind: "route",
    mediumType: m.mediumType,
    lengthMetres: mm(result.scale.totalMetres),
    sourceName: m.sourceName,
    geometry: { type: "LineString", coordinates },
    vertexCount: coordinates.length,
    hasElevations: coordinates.every((c) => c.length === 3),
    start: r.start,
    walking: {
      speedMps: r.walkingSpeedMps,
      accessibleSpeedMps: r.accessibleSpeedMps,
      stepLengthRangeM: r.stepLengthRangeM,
      seconds: tenth(r.walkingSeconds),
      accessibleSeconds: tenth(r.accessibleWalkingSeconds),
      steps: r.steps,
      stepsUpTo: r.stepsUpTo,
    },
  };
}

/** Intervals overlapping [younger, older] Ma, with every name the chart data carries. */
export function snapshotIntervals(intervals: readonly Interval[], olderMa: number, youngerMa: number): SnapshotInterval[] {
  return intervals
    .filter((iv) => iv.baseMa > youngerMa && iv.topMa < olderMa)
    .map((iv) => ({
      name: iv.name,
      rank: iv.rank,
      parent: iv.parent,
      baseMa: iv.baseMa,
      baseUncertaintyMa: iv.baseUncertaintyMa,
      topMa: iv.topMa,
      color: iv.color,
      approximate: iv.approximate,
      boundaryKind: iv.boundaryKind ?? null,
      names: { en: iv.name, ...iv.names },
    }));
}

/** The snapshot of an exhibit. Elevations (when every route vertex has one) are interpolated along the route. */
export function buildSnapshot(input: SnapshotInput): PublicationSnapshot {
  const { spec, result } = input;
  const points = new Map(result.points.map((p) => [p.id, p]));
  const olderMa = toYears(spec.spanOlder) / 1e6;
  const youngerMa = toYears(spec.spanYounger) / 1e6;
  const medium = mediumOf(spec, result);
  const routeCoords = medium.kind === "route" && medium.hasElevations ? medium.geometry.coordinates : null;
  const routeCumulative = routeCoords ? Array.from(prepareRoute(routeCoords.flatMap((c) => [c[0], c[1]])).cumulative) : null;
  const markers = input.markers.map((m, i): SnapshotMarker => {
    const p = points.get(m.id);
    if (!p) throw new Error(`buildSnapshot: marker ${m.id} was not computed`);
    const sign = input.signs.get(m.id);
    if (sign === undefined) throw new Error(`buildSnapshot: marker ${m.id} has no sign number`);
    return {
      id: m.id,
      signNumber: sign,
      order: i + 1,
      kind: m.kind,
      label: m.label,
      ageMa: m.ageMa,
      uncertaintyMa: m.uncertaintyMa,
      approximate: m.approximate,
      ageText: ageText(m),
      intervalName: m.intervalName,
      intervalRank: m.intervalRank,
      eventName: m.eventName,
      source: m.source,
      text: { markdown: m.text, html: input.html.get(m.id) ?? "" },
      color: m.color,
      within: chainAt(input.intervals, m.ageMa).map((iv) => iv.name),
      distance: {
        fromOlderEndMetres: mm(p.fromOlderEndMetres),
        fromYoungerEndMetres: mm(p.fromYoungerEndMetres),
        uncertaintyMetres: opt(p.uncertaintyMetres, mm),
        display: { fromOlderEnd: p.display.fromOlderEnd, fromYoungerEnd: p.display.fromYoungerEnd, uncertainty: p.display.uncertainty },
      },
      position: p.position
        ? { lon: deg(p.position.lon), lat: deg(p.position.lat), elevationMetres: routeCoords ? elevationAt(routeCoords, routeCumulative, p.walking?.distanceFromStartMetres ?? 0) : null, bearing: Number((p.bearing ?? 0).toFixed(1)) }
        : null,
      walking: p.walking
        ? { fromStartMetres: mm(p.walking.distanceFromStartMetres), seconds: tenth(p.walking.seconds), accessibleSeconds: tenth(p.walking.accessibleSeconds), steps: p.walking.steps, stepsUpTo: p.walking.stepsUpTo, text: p.walking.text }
        : null,
      decay: input.decay.get(m.id) ?? null,
      insets: p.insets.map((ip) => ({ insetId: ip.insetId, fromOlderEndMetres: mm(ip.fromOlderEndMetres), display: ip.display.fromOlderEnd })),
      image: input.images.get(m.id) ?? null,
    };
  });
  const intervals = snapshotIntervals(input.intervals, olderMa, youngerMa);
  const languages = [...new Set(intervals.flatMap((iv) => Object.keys(iv.names)))].sort();
  return {
    schemaVersion: SNAPSHOT_SCHEMA_VERSION,
    organisation: input.organisation,
    exhibit: { ...input.exhibit, unitsPreference: spec.unitsPreference, span: { older: spec.spanOlder, younger: spec.spanYounger, olderMa, youngerMa } },
    scale: {
      totalMetres: mm(result.scale.totalMetres),
      metresPerYear: result.scale.metresPerYear,
      metresPerMillionYears: result.scale.metresPerMillionYears,
      statement: { lengthPerTime: result.scale.statement.lengthPerTime, timePerLength: result.scale.statement.timePerLength },
    },
    medium,
    edition: { ...input.edition, languages, intervals },
    markers,
    insets: result.insets.map((i) => ({
      id: i.id,
      label: i.label,
      olderMa: i.olderYears / 1e6,
      youngerMa: i.youngerYears / 1e6,
      magnification: i.magnification,
      lengthMetres: mm(i.lengthMetres),
      statement: { lengthPerTime: i.statement.lengthPerTime, timePerLength: i.statement.timePerLength },
      mainFromOlderEndMetres: mm(i.mainFromOlderEndMetres),
      mainToOlderEndMetres: mm(i.mainToOlderEndMetres),
      markerIds: i.pointIds,
    })),
    durations: result.durations.map((d) => ({
      id: d.id,
      label: d.label ?? d.id,
      years: d.years,
      metres: d.metres,
      text: d.text,
      visible: d.visible,
      insets: d.insets.map((x) => ({ insetId: x.insetId, metres: x.metres, text: x.text, visible: x.visible })),
    })),
    retiredSigns: input.retiredSigns,
    cautions: [...(medium.kind === "route" ? [PUBLICATION_CAUTIONS.route] : []), PUBLICATION_CAUTIONS.ages, PUBLICATION_CAUTIONS.edition(input.edition.label)],
    sources: {
      ...(medium.kind === "route" ? WALKING_SOURCES : {}),
      legibility: result.scale.legibility.source,
    },
  };
}
