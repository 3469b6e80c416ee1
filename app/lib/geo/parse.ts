/**
 * Route input: GeoJSON (LineString, MultiLineString, Feature, FeatureCollection of lines) and GPX
 * (tracks, else routes). Produces validated interleaved coordinates [lon0, lat0, lon1, lat1, …].
 *
 * Multi-part input (MultiLineString parts, several features, several GPX tracks or track
 * segments) is joined in order: the end of one part is connected to the start of the next by a
 * straight (geodesic) segment, which counts towards the length.
 */
import { gpx as gpxToGeoJSON } from "@tmcw/togeojson";
import { DOMParser as XmlDomParser } from "@xmldom/xmldom";
import { MAX_GEOJSON_DEPTH } from "../limits";

/** Default upper bound on the number of vertices in one route. */
export const MAX_ROUTE_VERTICES = 200_000;
/** At most this many coordinate issues are reported (the first ones found). */
const MAX_ISSUES = 20;

export interface RouteIssue {
  /** Dotted path into the input, e.g. "geometry.coordinates.12.1". */
  path: string;
  message: string;
}

export type RouteParseResult =
  /** `note`: which parts were used when the file holds several (tracks and routes, lines and points). */
  | { ok: true; coords: Float64Array; vertexCount: number; note?: string }
  | { ok: false; issues: RouteIssue[] };

export interface RouteParseOptions {
  maxVertices?: number;
}

const join = (base: string, key: string | number) => (base === "" ? String(key) : `${base}.${key}`);

function isObject(x: unknown): x is Record<string, unknown> {
  return typeof x === "object" && x !== null && !Array.isArray(x);
}

interface Collector {
  lines: { path: string; coords: unknown[] }[];
  issues: RouteIssue[];
  skippedPoints: number;
  /** A geometry nested deeper than MAX_GEOJSON_DEPTH was met (and not followed). */
  tooDeep: boolean;
}

const LINE_TYPES = new Set<unknown>(["LineString", "MultiLineString"]);
const POINT_TYPES = new Set<unknown>(["Point", "MultiPoint"]);
const geometryTypeOf = (f: unknown): unknown => (isObject(f) ? (f.type === "Feature" && isObject(f.geometry) ? f.geometry.type : f.type) : undefined);

/** "1 track", "3 routes". */
const count = (n: number, one: string) => `${n} ${one}${n === 1 ? "" : "s"}`;

/** Collect the lines of a geometry at nesting level `depth` (the input is level 1); not below MAX_GEOJSON_DEPTH. */
function collectGeometry(geom: unknown, path: string, out: Collector, depth: number): void {
  if (depth > MAX_GEOJSON_DEPTH) {
    out.tooDeep = true;
    return;
  }
  if (!isObject(geom)) {
    out.issues.push({ path, message: "Expected a GeoJSON geometry object (LineString or MultiLineString)." });
    return;
  }
  const type = geom.type;
  if (type === "LineString") {
    if (!Array.isArray(geom.coordinates)) {
      out.issues.push({ path: join(path, "coordinates"), message: "LineString coordinates must be an array of positions." });
      return;
    }
    out.lines.push({ path: join(path, "coordinates"), coords: geom.coordinates });
  } else if (type === "MultiLineString") {
    if (!Array.isArray(geom.coordinates)) {
      out.issues.push({
        path: join(path, "coordinates"),
        message: "MultiLineString coordinates must be an array of LineString coordinate arrays.",
      });
      return;
    }
    geom.coordinates.forEach((part, j) => {
      const p = join(join(path, "coordinates"), j);
      if (!Array.isArray(part)) out.issues.push({ path: p, message: "Each MultiLineString part must be an array of positions." });
      else out.lines.push({ path: p, coords: part });
    });
  } else if (type === "Feature") {
    collectGeometry(geom.geometry, join(path, "geometry"), out, depth + 1);
  } else if (type === "FeatureCollection") {
    if (!Array.isArray(geom.features)) {
      out.issues.push({ path: join(path, "features"), message: "FeatureCollection features must be an array." });
      return;
    }
    if (geom.features.length === 0) {
      out.issues.push({ path: join(path, "features"), message: "The FeatureCollection has no features; a route needs a line." });
    }
    // Points beside lines (e.g. an exported points.geojson: the route and its markers) are not part
    // of the route: they are skipped and counted, and the result says so.
    const hasLine = geom.features.some((f) => LINE_TYPES.has(geometryTypeOf(f)));
    geom.features.forEach((f, j) => {
      if (hasLine && POINT_TYPES.has(geometryTypeOf(f))) out.skippedPoints++;
      else collectGeometry(f, join(join(path, "features"), j), out, depth + 2);
    });
  } else if (type === "GeometryCollection") {
    if (!Array.isArray(geom.geometries)) {
      out.issues.push({ path: join(path, "geometries"), message: "GeometryCollection geometries must be an array." });
      return;
    }
    geom.geometries.forEach((g, j) => collectGeometry(g, join(join(path, "geometries"), j), out, depth + 2));
  } else {
    out.issues.push({
      path: join(path, "type"),
      message:
        typeof type === "string"
          ? `A route must be a line: GeoJSON type "${type}" is not accepted (use LineString, MultiLineString, Feature or FeatureCollection of lines).`
          : "Missing GeoJSON \"type\" (expected LineString, MultiLineString, Feature or FeatureCollection).",
    });
  }
}

export const DEPTH_MESSAGE = `The GeoJSON is nested more than ${MAX_GEOJSON_DEPTH} levels deep; a route is a LineString, MultiLineString, Feature or FeatureCollection (a few levels).`;

/** True when an array holds no array or object (a position: numbers only). */
function isLeafArray(a: unknown[]): boolean {
  for (let i = 0; i < a.length; i++) {
    const x = a[i];
    if (x !== null && typeof x === "object") return false;
  }
  return true;
}

/**
 * True when arrays/objects nest deeper than `max` levels (counted without recursion, so any depth
 * is safe). A leaf array (a position) within the limit is checked in place, not stacked: a route of
 * 10⁵ positions allocates nothing per position. The arrays given as keys of `deferred` (a route's
 * lists of positions) are not looked into: the level each is found at is written into the map, and
 * the caller checks their positions as it reads them (positionExceeds), so that 10⁵ positions are
 * read once, not twice.
 */
export function nestingExceeds(value: unknown, max: number, deferred?: Map<unknown, number>): boolean {
  const values: unknown[] = [value];
  const depths: number[] = [1];
  while (values.length) {
    const v = values.pop();
    const depth = depths.pop()!;
    if (v === null || typeof v !== "object") continue;
    if (depth > max) return true;
    if (deferred !== undefined) {
      const seen = deferred.get(v);
      if (seen !== undefined) {
        if (depth > seen) deferred.set(v, depth);
        continue;
      }
    }
    const children = Array.isArray(v) ? (v as unknown[]) : Object.values(v);
    for (let i = 0; i < children.length; i++) {
      const child = children[i];
      if (child === null || typeof child !== "object") continue;
      if (depth < max && Array.isArray(child) && isLeafArray(child)) continue;
      values.push(child);
      depths.push(depth + 1);
    }
  }
  return false;
}

/** Does one position of a deferred list found at level `listDepth` nest deeper than `max` (as nestingExceeds would find it)? */
function positionExceeds(pos: unknown, listDepth: number, max: number): boolean {
  if (pos === null || typeof pos !== "object") return false;
  if (listDepth < max && Array.isArray(pos) && isLeafArray(pos)) return false;
  return nestingExceeds(pos, max - listDepth);
}

/** What is wrong with one position (none: a valid one the usual-case test did not take, e.g. with extra members). */
function positionIssues(pos: unknown, path: string, issues: RouteIssue[]): void {
  if (!Array.isArray(pos) || pos.length < 2) {
    issues.push({ path, message: "A position must be an array [longitude, latitude] (optionally with elevation)." });
    return;
  }
  const [lon, lat] = pos;
  if (typeof lon !== "number" || !Number.isFinite(lon)) issues.push({ path: join(path, 0), message: "Longitude must be a finite number." });
  else if (lon < -180 || lon > 180) issues.push({ path: join(path, 0), message: `Longitude ${lon} is outside −180…180 degrees.` });
  if (typeof lat !== "number" || !Number.isFinite(lat)) issues.push({ path: join(path, 1), message: "Latitude must be a finite number." });
  else if (lat < -90 || lat > 90) issues.push({ path: join(path, 1), message: `Latitude ${lat} is outside −90…90 degrees.` });
}

/**
 * Validate a GeoJSON route and flatten it to interleaved lon/lat coordinates.
 * `basePath` prefixes every issue path (e.g. "medium.geometry").
 */
export function parseGeoJsonRoute(input: unknown, basePath = "", options: RouteParseOptions = {}): RouteParseResult {
  const maxVertices = options.maxVertices ?? MAX_ROUTE_VERTICES;
  const out: Collector = { lines: [], issues: [], skippedPoints: 0, tooDeep: false };
  collectGeometry(input, basePath, out, 1);
  // the nesting of everything but the positions, which the loop below checks as it reads them
  const listDepth = new Map<unknown, number>(out.lines.map((l) => [l.coords, 0]));
  const tooDeep = (): RouteParseResult => ({ ok: false, issues: [{ path: basePath, message: DEPTH_MESSAGE }] });
  if (out.tooDeep || nestingExceeds(input, MAX_GEOJSON_DEPTH, listDepth)) return tooDeep();
  let total = 0;
  for (const l of out.lines) total += l.coords.length;
  if (out.issues.length > 0 || total > maxVertices) {
    // a position nested too deep is the first thing to say
    for (const l of out.lines) for (const pos of l.coords) if (positionExceeds(pos, listDepth.get(l.coords)!, MAX_GEOJSON_DEPTH)) return tooDeep();
  }
  if (out.issues.length > 0) return { ok: false, issues: out.issues.slice(0, MAX_ISSUES) };
  if (total > maxVertices) {
    return {
      ok: false,
      issues: [
        {
          path: basePath,
          message: `The route has ${total.toLocaleString("en-US")} vertices; at most ${maxVertices.toLocaleString("en-US")} are accepted. Simplify the track first.`,
        },
      ],
    };
  }
  const coords = new Float64Array(total * 2);
  let k = 0;
  const issues: RouteIssue[] = [];
  for (const line of out.lines) {
    const depth = listDepth.get(line.coords)!;
    for (let j = 0; j < line.coords.length; j++) {
      const pos = line.coords[j];
      // the path is spelled out only for an issue (10⁵ vertices: no string, no closure per valid vertex)
      if (Array.isArray(pos) && pos.length >= 2) {
        const lon = pos[0];
        const lat = pos[1];
        // the usual case in one test (NaN and ±Infinity fail the ranges; a third number is an
        // elevation); anything else is looked at below
        if (
          typeof lon === "number" && typeof lat === "number" && lon >= -180 && lon <= 180 && lat >= -90 && lat <= 90 &&
          (pos.length === 2 || (pos.length === 3 && typeof pos[2] !== "object")) && depth < MAX_GEOJSON_DEPTH
        ) {
          coords[k] = lon;
          coords[k + 1] = lat;
          k += 2;
          continue;
        }
      }
      if (positionExceeds(pos, depth, MAX_GEOJSON_DEPTH)) return tooDeep();
      // enough issues to report: only the nesting is still looked at
      if (issues.length < MAX_ISSUES) positionIssues(pos, join(line.path, j), issues);
      if (Array.isArray(pos)) {
        coords[k] = pos[0] as number;
        coords[k + 1] = pos[1] as number;
      }
      k += 2;
    }
  }
  if (issues.length > MAX_ISSUES) issues.length = MAX_ISSUES;
  if (issues.length > 0) return { ok: false, issues };
  // at least two distinct points
  let distinct = false;
  for (let i = 2; i < coords.length; i += 2) {
    if (coords[i] !== coords[0] || coords[i + 1] !== coords[1]) {
      distinct = true;
      break;
    }
  }
  if (!distinct) {
    return {
      ok: false,
      issues: [{ path: basePath, message: "A route needs at least two distinct points." }],
    };
  }
  const note = out.skippedPoints > 0 ? `The file holds ${count(out.lines.length, "line")} and ${count(out.skippedPoints, "point")}: the ${out.lines.length === 1 ? "line is" : "lines, joined in order, are"} the route; the points are not part of it.` : undefined;
  return note ? { ok: true, coords, vertexCount: total, note } : { ok: true, coords, vertexCount: total };
}

type DomParserCtor = new () => { parseFromString(text: string, type: string): unknown };

/**
 * Parse a GPX document (tracks; if it has none, routes) into a validated route.
 * Uses @xmldom/xmldom's DOMParser, which runs in the browser and in Node; a different parser
 * (e.g. the browser's own DOMParser) may be passed in.
 */
export function parseGpxRoute(
  text: string,
  basePath = "gpx",
  options: RouteParseOptions & { DOMParser?: DomParserCtor } = {},
): RouteParseResult {
  if (typeof text !== "string" || text.trim() === "") {
    return { ok: false, issues: [{ path: basePath, message: "The GPX document is empty." }] };
  }
  let doc: unknown;
  try {
    const parser = options.DOMParser
      ? new options.DOMParser()
      : new XmlDomParser({
          // errors become the message below instead of console output; warnings are ignored
          onError: (level, msg) => {
            if (level !== "warning") throw new Error(msg.trim());
          },
        });
    doc = parser.parseFromString(text, "text/xml");
  } catch (err) {
    return {
      ok: false,
      issues: [{ path: basePath, message: `The GPX document is not well-formed XML: ${(err as Error).message}` }],
    };
  }
  const root = (doc as { documentElement?: { nodeName?: string } } | null)?.documentElement;
  if (!root || String(root.nodeName).toLowerCase() !== "gpx") {
    return { ok: false, issues: [{ path: basePath, message: "The document is not GPX (its root element is not <gpx>)." }] };
  }
  let fc: { features: { geometry: unknown; properties?: Record<string, unknown> | null }[] };
  try {
    fc = gpxToGeoJSON(doc as Document) as unknown as typeof fc;
  } catch (err) {
    return { ok: false, issues: [{ path: basePath, message: `The GPX document could not be read: ${(err as Error).message}` }] };
  }
  const isLine = (f: { geometry: unknown }) => {
    const t = (f.geometry as { type?: string } | null)?.type;
    return t === "LineString" || t === "MultiLineString";
  };
  const lines = fc.features.filter(isLine);
  const tracks = lines.filter((f) => f.properties?._gpxType === "trk");
  const routes = lines.filter((f) => f.properties?._gpxType !== "trk");
  const chosen = tracks.length > 0 ? tracks : lines;
  if (chosen.length === 0) {
    return { ok: false, issues: [{ path: basePath, message: "The GPX document has no track (<trk>) or route (<rte>) with points." }] };
  }
  const parsed = parseGeoJsonRoute({ type: "FeatureCollection", features: chosen }, basePath, options);
  if (!parsed.ok || lines.length === 1) return parsed;
  return { ...parsed, note: gpxChoiceNote(tracks.length, routes.length, chosen) };
}

/** Which of several tracks and routes made the route, in words: "The file holds 2 tracks and 1 route: …". */
function gpxChoiceNote(tracks: number, routes: number, chosen: { properties?: Record<string, unknown> | null }[]): string {
  const held = [tracks ? count(tracks, "track") : "", routes ? count(routes, "route") : ""].filter(Boolean).join(" and ");
  const names = chosen.map((f, i) => (typeof f.properties?.name === "string" && f.properties.name.trim() ? `“${f.properties.name.trim()}”` : `no. ${i + 1} (unnamed)`));
  const kind = tracks ? "track" : "route";
  const used = chosen.length === 1 ? `the ${kind} ${names[0]} is the route` : `the ${count(chosen.length, kind)} ${names.join(", ")} are joined in order (end of one to start of the next)`;
  return `The file holds ${held}: ${used}${tracks && routes ? `; the ${routes === 1 ? "route is" : "routes are"} not used` : ""}.`;
}
