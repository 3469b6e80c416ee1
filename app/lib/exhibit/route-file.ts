// An uploaded route file (GeoJSON or GPX) → the LineString an exhibit stores, with its WGS84 length.
import { parseGeoJsonRoute, parseGpxRoute, type RouteIssue } from "../geo/parse";
import { prepareRoute } from "../geo/route";
import { routeElevations } from "../profile/elevations";
import type { LineStringGeometry } from "./types";

export type RouteFileResult =
  | { ok: true; geometry: LineStringGeometry; lengthMetres: number; vertexCount: number; format: "gpx" | "geojson"; note?: string }
  | { ok: false; message: string; issues: RouteIssue[] };

export function readRouteFile(fileName: string, text: string): RouteFileResult {
  const trimmed = text.trimStart();
  const isGpx = /\.gpx$/i.test(fileName) || trimmed.startsWith("<");
  let parsed;
  if (isGpx) {
    parsed = parseGpxRoute(text, "file");
  } else {
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch (error) {
      return { ok: false, message: `${fileName} is neither GPX nor valid GeoJSON: ${(error as Error).message}`, issues: [] };
    }
    parsed = parseGeoJsonRoute(json, "file");
  }
  if (!parsed.ok) {
    return { ok: false, message: `${fileName}: ${parsed.issues.slice(0, 3).map((i) => `${i.path}: ${i.message}`).join("; ")}`, issues: parsed.issues };
  }
  const c = parsed.coords;
  const coordinates: [number, number][] = [];
  for (let i = 0; i < c.length; i += 2) coordinates.push([Number(c[i].toFixed(8)), Number(c[i + 1].toFixed(8))]);
  const route = prepareRoute(coordinates.flat());
  // Elevations, when the file gives one for every point, ride along as a third coordinate (the slope profile reads them).
  const elevations = routeElevations(text, isGpx, coordinates.length);
  const stored = elevations ? coordinates.map((c, i) => [c[0], c[1], elevations[i]]) : coordinates;
  return { ok: true, geometry: { type: "LineString", coordinates: stored }, lengthMetres: route.totalMetres, vertexCount: coordinates.length, format: isGpx ? "gpx" : "geojson", ...(parsed.note ? { note: parsed.note } : {}) };
}
