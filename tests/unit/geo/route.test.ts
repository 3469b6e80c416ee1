import geodesic from "geographiclib-geodesic";
import { describe, expect, it } from "vitest";
import { CHORD_LIMIT_M, SEARCH_BLOCK, positionAt, positionsAt, prepareRoute, segmentIndexAt } from "../../../app/lib/geo/route";

// Reference for every accuracy check here: GeographicLib (geographiclib-geodesic 2.2.0).
const g = geodesic.Geodesic.WGS84;
const angleDiff = (a: number, b: number) => Math.abs((((a - b) % 360) + 540) % 360 - 180);

let seed = 777;
const rand = () => {
  seed = (seed * 16807) % 2147483647;
  return seed / 2147483647;
};

/** A wandering route generated with GeographicLib's Direct; interleaved lon/lat. */
function wander(lat0: number, lon0: number, n: number, stepM: number, heading = 90): number[] {
  const c: number[] = [];
  let lat = lat0;
  let lon = lon0;
  let h = heading;
  for (let i = 0; i < n; i++) {
    c.push(lon, lat);
    h += (rand() - 0.5) * 40;
    const r = g.Direct(lat, lon, h, stepM * (0.2 + 1.6 * rand()));
    lat = r.lat2!;
    lon = ((((r.lon2! + 180) % 360) + 360) % 360) - 180;
  }
  return c;
}

/** Compare a route with GeographicLib: length error (mm per km) and worst marker error (m), worst bearing error (deg). */
function compare(c: number[], markers = 300) {
  const route = prepareRoute(c);
  const n = c.length / 2;
  const cum = new Float64Array(n);
  const azi = new Float64Array(n);
  for (let i = 1; i < n; i++) {
    const r = g.Inverse(c[2 * i - 1], c[2 * i - 2], c[2 * i + 1], c[2 * i]); // GeographicLib
    cum[i] = cum[i - 1] + r.s12!;
    azi[i - 1] = r.azi1!;
  }
  const total = cum[n - 1];
  const ds = Array.from({ length: markers }, () => rand() * total);
  const pos = positionsAt(route, ds);
  let worst = 0;
  let worstBearing = 0;
  ds.forEach((d, k) => {
    let lo = 0;
    let hi = n - 1;
    while (hi - lo > 1) {
      const mid = (lo + hi) >> 1;
      if (cum[mid] <= d) lo = mid;
      else hi = mid;
    }
    const ref = g.Direct(c[2 * lo + 1], c[2 * lo], azi[lo], d - cum[lo]); // GeographicLib
    worst = Math.max(worst, g.Inverse(ref.lat2!, ref.lon2!, pos[k].lat, pos[k].lon).s12!);
    worstBearing = Math.max(worstBearing, angleDiff(pos[k].bearing, ref.azi2!));
  });
  return { route, total, mmPerKm: (Math.abs(route.totalMetres - total) / (total / 1000)) * 1000, worst, worstBearing };
}

describe("route length and marker positions vs GeographicLib", () => {
  const cases: [string, number[]][] = [
    ["equator, 10 m steps", wander(0, 10, 20_000, 10)],
    ["45° N, 10 m steps", wander(45, 10, 20_000, 10)],
    ["70° N, 10 m steps", wander(70, 10, 20_000, 10)],
    ["45° S, 1 km steps", wander(-45, 100, 3_000, 1000)],
    ["45° N, 8 km steps (near the chord limit)", wander(45, 10, 1_000, 8000)],
    ["45° N, 50 km steps (exact inverse/direct)", wander(45, 10, 300, 50_000)],
    ["across the antimeridian", wander(-20, 179.95, 5_000, 20, 90)],
    ["near the north pole", wander(89.99, 0, 5_000, 5, 0)],
    ["over the pole, 2 km steps", wander(89.5, 0, 2_000, 2000, 0)],
  ];
  for (const [name, c] of cases) {
    it(name, () => {
      const r = compare(c);
      // requirement: ≤ 1 mm per km and markers within 1 cm of GeographicLib (GeographicLib as reference)
      expect(r.mmPerKm).toBeLessThan(0.001);
      expect(r.worst).toBeLessThan(0.001);
      expect(r.worstBearing).toBeLessThan(1e-5);
    });
  }

  it("vertices exactly at the poles, repeated vertices and long segments across the antimeridian", () => {
    const c = [0, 89.99, 0, 90, 120, 89.99, 120, 89.99, -60, 89.0, 179.99, 0, -179.99, 0.001, 0, -90, 45, -89.9];
    const r = compare(c, 200);
    expect(r.route.longSegments).toBe(4);
    expect(r.mmPerKm).toBeLessThan(1e-6); // GeographicLib
    expect(r.worst).toBeLessThan(1e-6); // GeographicLib
  });

  it("near-antipodal long segments", () => {
    const r = compare([0, 0, 179.7, 0.3, -0.1, 0.2], 50);
    expect(r.route.longSegments).toBe(2);
    expect(r.mmPerKm).toBeLessThan(1e-6); // GeographicLib
    expect(r.worst).toBeLessThan(1e-6); // GeographicLib
  });
});

describe("prepared route queries", () => {
  const c = [0, 0, 0.001, 0, 0.001, 0, 0.002, 0.001, 0.003, 0.001];
  const route = prepareRoute(c);

  it("computes cumulative distance once, with zero-length segments kept", () => {
    expect(route.cumulative.length).toBe(5);
    expect(route.cumulative[0]).toBe(0);
    expect(route.cumulative[2]).toBe(route.cumulative[1]);
    expect(route.totalMetres).toBe(route.cumulative[4]);
    expect(route.longSegments).toBe(0);
  });

  it("finds segments by binary search and clamps distances to the route", () => {
    expect(segmentIndexAt(route, -5)).toBe(0);
    expect(segmentIndexAt(route, route.cumulative[1] + 0.1)).toBe(2); // skips the zero-length segment
    expect(segmentIndexAt(route, route.totalMetres + 10)).toBe(3);
    const start = positionAt(route, -1);
    expect(start.lon).toBeCloseTo(0, 12);
    expect(start.lat).toBeCloseTo(0, 12);
    const end = positionAt(route, 1e9);
    expect(end.lon).toBeCloseTo(0.003, 12);
    expect(end.lat).toBeCloseTo(0.001, 12);
    expect(end.distanceMetres).toBe(route.totalMetres);
  });

  it("returns batch positions in input order, identical to single look-ups", () => {
    const ds = [300, 5, 250.5, 0, route.totalMetres, 120, 120];
    const many = positionsAt(route, ds);
    ds.forEach((d, k) => {
      const one = positionAt(route, d);
      expect(many[k].lon).toBe(one.lon);
      expect(many[k].lat).toBe(one.lat);
      expect(many[k].distanceMetres).toBe(Math.min(d, route.totalMetres));
    });
  });

  it("finds the same segment for every marker in one forward pass as by binary search, repeated vertices and vertex distances included", () => {
    const c: number[] = [];
    for (let i = 0; i < 5000; i++) {
      const lon = 0.00001 * i + (i % 13 === 0 ? 0 : 0.000001 * i);
      c.push(lon, 10 + 0.00001 * Math.sin(i));
      if (i % 11 === 0) c.push(lon, 10 + 0.00001 * Math.sin(i)); // a repeated vertex: a zero-length segment
    }
    // a one-off route gallops from marker to marker; one kept for repeated queries searches its blocks first
    for (const r of [prepareRoute(c), prepareRoute(c, { repeatedQueries: true })]) {
      const ds = [0, r.totalMetres, ...Array.from(r.cumulative.slice(0, 3000)), ...Array.from({ length: 2000 }, () => rand() * r.totalMetres)];
      const many = positionsAt(r, ds);
      ds.forEach((d, k) => {
        // (at distance 0 a batch may name a zero-length first segment; the place is the same)
        if (d > 0) expect(many[k].segment, `distance ${d}`).toBe(segmentIndexAt(r, Math.min(d, r.totalMetres)));
        const one = positionAt(r, d);
        expect(many[k].lon).toBe(one.lon);
        expect(many[k].lat).toBe(one.lat);
      });
    }
    const kept = prepareRoute(c, { repeatedQueries: true });
    expect(kept.blockStarts!.length).toBe(Math.ceil(kept.vertexCount / SEARCH_BLOCK));
    kept.blockStarts!.forEach((v, b) => expect(v).toBe(kept.cumulative[b * SEARCH_BLOCK]));
  });

  it("an eastward equatorial segment has bearing 90°", () => {
    expect(positionAt(route, 50).bearing).toBeCloseTo(90, 9);
  });

  it("uses the chord formula below 10 km", () => {
    expect(CHORD_LIMIT_M).toBe(10_000);
    expect(prepareRoute([0, 45, 0.2, 45]).longSegments).toBe(1); // about 15.7 km
    expect(prepareRoute([0, 45, 0.1, 45]).longSegments).toBe(0); // about 7.9 km
  });
});

describe("a route prepared for repeated queries", () => {
  it("places every marker exactly where a one-off route does (kept segment terms = terms worked out again), with the same lengths", async () => {
    const { prepareRoute, positionsAt } = await import("../../../app/lib/geo/route");
    let s = 11;
    const rand = () => (s = (s * 16807) % 2147483647) / 2147483647;
    for (const [lon0, lat0] of [[-2.9, 54.2], [179.9995, -33.1], [12.5, 89.9], [-70, 0]]) {
      const coords: number[] = [];
      let lon = lon0;
      let lat = lat0;
      for (let i = 0; i < 2000; i++) {
        coords.push(lon, lat);
        lon += (rand() - 0.5) * (i % 97 === 0 ? 0.3 : 1e-4); // a few segments longer than 10 km
        lat = Math.max(-90, Math.min(90, lat + (rand() - 0.5) * 1e-4));
        if (lon > 180) lon -= 360;
      }
      const once = prepareRoute(coords);
      const kept = prepareRoute(coords, { repeatedQueries: true });
      expect(kept.vertices).toBeInstanceOf(Float64Array);
      expect(once.vertices).toBeUndefined();
      expect(Array.from(kept.cumulative)).toEqual(Array.from(once.cumulative));
      const ds = Array.from({ length: 500 }, () => rand() * once.totalMetres).concat([0, once.totalMetres, once.cumulative[7]]);
      expect(positionsAt(kept, ds)).toEqual(positionsAt(once, ds));
    }
  });
});
