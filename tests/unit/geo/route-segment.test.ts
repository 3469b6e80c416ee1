import geodesic from "geographiclib-geodesic";
import { describe, expect, it } from "vitest";
import { EX, EY, EZ, FRAME, chordBearing, vertexFrame } from "../../../app/lib/geo/ecef";
import { positionAt, positionsAt, prepareRoute, VERTEX_RECORD } from "../../../app/lib/geo/route";
import { VERTEX_TERMS } from "../../../app/lib/geo/route-prepare";
import { BEARING_END, BEARING_START, C_BEARING, C_LAT, C_LON, SHORT_LAT_LIMIT, SHORT_SEGMENT_M, shortWay } from "../../../app/lib/geo/route-segment";

// Reference: GeographicLib (geographiclib-geodesic 2.2.0) for the point a fraction of the way along
// a geodesic; the bearing is the chord's direction in the local frame at that point, as the
// Earth-centred method defines it (route.ts), worked out here from GeographicLib's point.
const g = geodesic.Geodesic.WGS84;
let seed = 4242;
const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
const F = new Float64Array(3 * FRAME);
const FRACTIONS = [0.001, 0.1, 0.25, 0.5, 0.77, 0.93, 0.999];

/** Worst differences (degrees) between the route's places and bearings and the reference, over random segments. */
function worst(latMax: number, sMin: number, sMax: number, lon0?: number) {
  let position = 0;
  let bearing = 0;
  let short = 0;
  for (let n = 0; n < 1500; n++) {
    const lat1 = (rand() * 2 - 1) * latMax;
    const lon1 = lon0 ?? rand() * 360 - 180;
    const r = g.Direct(lat1, lon1, rand() * 360, sMin + (sMax - sMin) * rand());
    const lat2 = r.lat2!;
    const lon2 = ((r.lon2! + 540) % 360) - 180;
    if (Math.abs(lat2) > latMax) continue;
    const route = prepareRoute([lon1, lat1, lon2, lat2], { repeatedQueries: true });
    if (!Number.isNaN(route.vertices![VERTEX_TERMS + C_LAT])) short++;
    const line = g.InverseLine(lat1, lon1, lat2, lon2);
    vertexFrame(lon1, lat1, F, 0);
    vertexFrame(lon2, lat2, F, FRAME);
    for (const u of FRACTIONS) {
      const p = positionAt(route, u * route.totalMetres);
      const q = line.Position(u * line.s13!);
      position = Math.max(position, Math.abs(p.lat - q.lat2!), Math.abs(shortWay(p.lon - q.lon2!)));
      vertexFrame(q.lon2!, q.lat2!, F, 2 * FRAME);
      const b = chordBearing(F, 2 * FRAME, F[FRAME + EX] - F[EX], F[FRAME + EY] - F[EY], F[FRAME + EZ] - F[EZ]);
      bearing = Math.max(bearing, Math.abs(shortWay(p.bearing - b)));
    }
  }
  return { position, bearing, short };
}

describe("a short segment placed by its terms", () => {
  it(`is limited to chords under ${SHORT_SEGMENT_M} m between ±${SHORT_LAT_LIMIT}°`, () => {
    expect(SHORT_SEGMENT_M).toBe(100);
    expect(SHORT_LAT_LIMIT).toBe(80);
  });

  for (const [name, latMax, sMin, sMax, lon0] of [
    ["1–10 m steps, up to 30°", 30, 1, 10],
    ["1–10 m steps, up to 80°", 80, 1, 10],
    ["10–99 m steps, up to 60°", 60, 10, 99],
    ["10–99 m steps, up to 80° (the worst case)", 80, 10, 99],
    ["across the antimeridian", 70, 5, 99, 179.9995],
  ] as [string, number, number, number, number?][]) {
    it(`agrees with GeographicLib to 1e-12 degree in place and bearing: ${name}`, () => {
      const r = worst(latMax, sMin, sMax, lon0);
      expect(r.short).toBeGreaterThan(1000); // the terms were used
      expect(r.position).toBeLessThan(1e-12); // GeographicLib
      expect(r.bearing).toBeLessThan(1e-12); // chord direction at GeographicLib's point
    });
  }

  it("longer segments and segments near the poles get no terms, and are placed the Earth-centred way, as accurately", () => {
    for (const [lat, s] of [[45, 150], [45, 5000], [85, 10], [-88, 50]]) {
      const r = g.Direct(lat, 10, 37, s);
      const route = prepareRoute([10, lat, r.lon2!, r.lat2!], { repeatedQueries: true });
      for (const t of [C_LAT, C_LON, C_BEARING]) expect(route.vertices![VERTEX_TERMS + t], `${lat}°, ${s} m`).toBeNaN();
      const line = g.InverseLine(lat, 10, r.lat2!, r.lon2!);
      const p = positionAt(route, 0.4 * route.totalMetres);
      const q = line.Position(0.4 * line.s13!);
      expect(Math.abs(p.lat - q.lat2!)).toBeLessThan(1e-11); // GeographicLib
      expect(Math.abs(shortWay(p.lon - q.lon2!))).toBeLessThan(1e-11); // GeographicLib
    }
  });

  it("puts the ends exactly on the vertices, with the chord's bearings there", () => {
    const c = [-2.9, 54.2, -2.8996, 54.2003, -2.8991, 54.2003];
    const route = prepareRoute(c, { repeatedQueries: true });
    const v = route.vertices!;
    expect(v.length).toBe(3 * VERTEX_RECORD);
    const [a, b, e] = positionsAt(route, [0, route.cumulative[1], route.totalMetres]);
    expect([a.lon, a.lat, b.lon, b.lat, e.lon, e.lat]).toEqual(c);
    expect(a.bearing).toBe(v[VERTEX_TERMS + BEARING_START]);
    expect(b.bearing).toBe(v[VERTEX_RECORD + VERTEX_TERMS + BEARING_START]); // a vertex starts the next segment
    expect(e.bearing).toBe(v[VERTEX_RECORD + VERTEX_TERMS + BEARING_END]); // the route's end closes the last one
    // just before the middle vertex: the first segment's end bearing, nearly
    const before = positionAt(route, route.cumulative[1] - 1e-9);
    expect(Math.abs(before.bearing - v[VERTEX_TERMS + BEARING_END])).toBeLessThan(1e-8);
    expect(Math.abs(before.bearing - v[VERTEX_TERMS + BEARING_START])).toBeGreaterThan(1e-6); // the chord's bearing turns along it
  });

  it("gives a one-off route the same terms as a kept one, so both place every marker identically", () => {
    const c: number[] = [];
    let lon = 12.3;
    let lat = 47.1;
    for (let i = 0; i < 3000; i++) {
      c.push(lon, lat);
      lon += (rand() - 0.5) * (i % 50 === 0 ? 0.01 : 1e-4); // some segments longer than 100 m
      lat += (rand() - 0.5) * 1e-4;
    }
    const once = prepareRoute(c);
    const kept = prepareRoute(c, { repeatedQueries: true });
    const ds = Array.from({ length: 2000 }, () => rand() * once.totalMetres);
    expect(positionsAt(kept, ds)).toEqual(positionsAt(once, ds));
  });
});
