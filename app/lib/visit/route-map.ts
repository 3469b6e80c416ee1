// The visitor's route map, drawn as SVG from the published track (no map tiles): the track is
// projected to local metres (equirectangular about its mean latitude — under 0.1 % error over a few
// kilometres) and simplified with simplify-js (Douglas–Peucker) to half a drawing unit, which is all
// a screen can show; a 10⁵-vertex GPS track comes down to a few hundred points. The same projection,
// simplified to a metre, feeds the "nearest marker" button: public/visit.js puts the visitor's
// position on the closest point of that track and picks the marker closest along the route.
import simplify from "simplify-js";
import { DEG, WGS84_A, WGS84_E2 } from "../geo/ellipsoid";
import { prepareRoute } from "../geo/route";

export interface LocalFrame {
  lon0: number;
  lat0: number;
  /** Metres per degree of longitude and of latitude at lat0 (WGS84 radii of curvature). */
  kx: number;
  ky: number;
}

interface Pt {
  x: number;
  y: number;
  i: number;
}

export function localFrame(coordinates: readonly number[][]): LocalFrame {
  let minLon = Infinity, maxLon = -Infinity, minLat = Infinity, maxLat = -Infinity;
  for (const [lon, lat] of coordinates) {
    if (lon < minLon) minLon = lon;
    if (lon > maxLon) maxLon = lon;
    if (lat < minLat) minLat = lat;
    if (lat > maxLat) maxLat = lat;
  }
  const lat0 = (minLat + maxLat) / 2;
  const s = Math.sin(lat0 * DEG);
  const w = Math.sqrt(1 - WGS84_E2 * s * s);
  const n = WGS84_A / w; // prime vertical radius
  const m = (WGS84_A * (1 - WGS84_E2)) / (w * w * w); // meridional radius
  return { lon0: (minLon + maxLon) / 2, lat0, kx: n * Math.cos(lat0 * DEG) * DEG, ky: m * DEG };
}

export function toLocal(frame: LocalFrame, lon: number, lat: number): [number, number] {
  return [(lon - frame.lon0) * frame.kx, (lat - frame.lat0) * frame.ky];
}

/** The track in local metres, simplified so no dropped vertex lies more than `toleranceMetres` off the line. */
export function simplifyTrack(coordinates: readonly number[][], frame: LocalFrame, toleranceMetres: number): Pt[] {
  const pts: Pt[] = coordinates.map(([lon, lat], i) => {
    const [x, y] = toLocal(frame, lon, lat);
    return { x, y, i };
  });
  if (pts.length <= 2) return pts;
  // simplify-js returns the very objects it was given, so each kept point keeps its vertex index.
  return simplify(pts, toleranceMetres, true) as Pt[];
}

export interface MapMarker {
  signNumber: number;
  label: string;
  lon: number;
  lat: number;
}

export interface RouteMapModel {
  width: number;
  height: number;
  /** SVG path data of the simplified track. */
  path: string;
  start: { x: number; y: number };
  end: { x: number; y: number };
  /** `numbered`: drawn with its sign number (false where it would cover a numbered neighbour: a dot only). */
  markers: { signNumber: number; label: string; x: number; y: number; numbered: boolean }[];
  /** A round length and its drawn width, for the scale bar. */
  scaleBar: { metres: number; width: number; text: string };
  vertexCount: number;
  drawnCount: number;
}

const ROUND_LENGTHS = [1, 2, 5, 10, 20, 50, 100, 200, 250, 500, 1000, 2000, 5000, 10_000, 20_000, 50_000];

/**
 * The map in a `width`-unit-wide viewBox (height follows the track's shape, between 45 % and 100 %
 * of the width), with `pad` units kept free for the marker circles at the edges.
 */
export function routeMapModel(coordinates: readonly number[][], markers: readonly MapMarker[], width = 400, pad = 18): RouteMapModel {
  const frame = localFrame(coordinates);
  const local = coordinates.map(([lon, lat]) => toLocal(frame, lon, lat));
  const xs = local.map((p) => p[0]);
  const ys = local.map((p) => p[1]);
  const minX = Math.min(...xs), maxX = Math.max(...xs), minY = Math.min(...ys), maxY = Math.max(...ys);
  const spanX = Math.max(maxX - minX, 1);
  const spanY = Math.max(maxY - minY, 1);
  const inner = width - 2 * pad;
  const height = Math.round(Math.min(width, Math.max(width * 0.45, (spanY / spanX) * inner + 2 * pad)));
  const scale = Math.min(inner / spanX, (height - 2 * pad) / spanY);
  const offX = pad + (inner - spanX * scale) / 2;
  const offY = pad + (height - 2 * pad - spanY * scale) / 2;
  const px = (x: number, y: number) => ({ x: round1(offX + (x - minX) * scale), y: round1(offY + (maxY - y) * scale) });
  const kept = simplifyTrack(coordinates, frame, 0.5 / scale);
  const path = kept.map((p, k) => {
    const q = px(p.x, p.y);
    return `${k ? "L" : "M"}${q.x} ${q.y}`;
  }).join("");
  const bar = ROUND_LENGTHS.filter((m) => m * scale <= width / 4).pop() ?? 1;
  return {
    width,
    height,
    path,
    start: px(local[0][0], local[0][1]),
    end: px(local[local.length - 1][0], local[local.length - 1][1]),
    markers: numberWhereRoom(
      markers.map((m) => {
        const [x, y] = toLocal(frame, m.lon, m.lat);
        return { signNumber: m.signNumber, label: m.label, ...px(x, y) };
      }),
    ),
    scaleBar: { metres: bar, width: round1(bar * scale), text: bar >= 1000 ? `${bar / 1000} km` : `${bar} m` },
    vertexCount: coordinates.length,
    drawnCount: kept.length,
  };
}

/** What public/visit.js needs to find the nearest marker along the route, with no server. */
export interface NearestData {
  frame: LocalFrame;
  /** Simplified track: x, y (local metres) and distance from the first vertex along the full track, flattened, whole decimetres. */
  track: number[];
  /** [sign number, metres from the first vertex, label, marker page URL]. */
  markers: [number, number, string, string][];
}

export function nearestData(coordinates: readonly number[][], markers: readonly { signNumber: number; label: string; alongMetres: number; url: string }[], toleranceMetres = 1): NearestData {
  const frame = localFrame(coordinates);
  const route = prepareRoute(coordinates.flatMap(([lon, lat]) => [lon, lat]));
  const kept = simplifyTrack(coordinates, frame, toleranceMetres);
  const track: number[] = [];
  for (const p of kept) track.push(round1(p.x), round1(p.y), round1(route.cumulative[p.i]));
  return {
    frame: { lon0: frame.lon0, lat0: frame.lat0, kx: round1(frame.kx), ky: round1(frame.ky) },
    track,
    markers: markers.map((m) => [m.signNumber, round1(m.alongMetres), m.label, m.url]),
  };
}

/** Circles of `2 × radius` units: a marker is numbered unless it would overlap one already numbered. */
function numberWhereRoom<T extends { x: number; y: number }>(points: T[], radius = 10): (T & { numbered: boolean })[] {
  const numbered: T[] = [];
  return points.map((p) => {
    const free = numbered.every((q) => Math.hypot(p.x - q.x, p.y - q.y) >= 2 * radius);
    if (free) numbered.push(p);
    return { ...p, numbered: free };
  });
}

function round1(v: number): number {
  return Math.round(v * 10) / 10;
}
