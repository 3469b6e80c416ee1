// Elevations of an uploaded route file, in the order the route reader takes its points (GPX track
// points, else route points; GeoJSON line positions). Kept only when every point has one and the
// count matches the route's vertices; otherwise the route has no elevations (and says so). Pure.

/** GPX: the <ele> of each trkpt (or, without tracks, each rtept), in document order. */
function gpxElevations(text: string): (number | null)[] {
  const tag = /<(?:\w+:)?trkpt\b/.test(text) ? "trkpt" : "rtept";
  const re = new RegExp(`<(?:\\w+:)?${tag}\\b[^>]*?(?:/>|>([\\s\\S]*?)</(?:\\w+:)?${tag}>)`, "g");
  const out: (number | null)[] = [];
  for (const m of text.matchAll(re)) {
    const ele = m[1] ? /<(?:\w+:)?ele>\s*([-+0-9.eE]+)\s*</.exec(m[1]) : null;
    const v = ele ? Number(ele[1]) : NaN;
    out.push(Number.isFinite(v) ? v : null);
  }
  return out;
}

/** GeoJSON: the third number of every LineString / MultiLineString position, in order. */
function geoJsonElevations(json: unknown): (number | null)[] {
  const out: (number | null)[] = [];
  const visit = (g: unknown) => {
    if (!g || typeof g !== "object") return;
    const o = g as { type?: string; coordinates?: unknown; geometry?: unknown; features?: unknown[]; geometries?: unknown[] };
    if (o.type === "FeatureCollection") o.features?.forEach(visit);
    else if (o.type === "Feature") visit(o.geometry);
    else if (o.type === "GeometryCollection") o.geometries?.forEach(visit);
    else if (o.type === "LineString" && Array.isArray(o.coordinates)) for (const p of o.coordinates) out.push(Array.isArray(p) && Number.isFinite(p[2]) ? Number(p[2]) : null);
    else if (o.type === "MultiLineString" && Array.isArray(o.coordinates)) for (const line of o.coordinates) if (Array.isArray(line)) for (const p of line) out.push(Array.isArray(p) && Number.isFinite(p[2]) ? Number(p[2]) : null);
  };
  visit(json);
  return out;
}

/** Elevations (metres, 0.1 m) for `vertexCount` vertices, or null when the file does not give one for each. */
export function routeElevations(text: string, isGpx: boolean, vertexCount: number): number[] | null {
  let list: (number | null)[];
  try {
    list = isGpx ? gpxElevations(text) : geoJsonElevations(JSON.parse(text));
  } catch {
    return null;
  }
  if (list.length !== vertexCount || list.some((e) => e === null || Math.abs(e) > 12_000)) return null;
  return list.map((e) => Number(e!.toFixed(1)));
}
