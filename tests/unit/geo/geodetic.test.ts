import geodesic from "geographiclib-geodesic";
import { describe, expect, it } from "vitest";
import { DEG, WGS84_A, WGS84_E2 } from "../../../app/lib/geo/ellipsoid";
import { ecefToGeodetic, ecefToGeodeticNear } from "../../../app/lib/geo/route";

// Reference: GeographicLib (geographiclib-geodesic 2.2.0) places the test points and measures the
// error on the ellipsoid; the iterative conversion below (the route code's former method, iterated
// to convergence) is the second reference.
const g = geodesic.Geodesic.WGS84;

/** Geodetic (degrees, height in metres) → Earth-centred coordinates (the textbook formula). */
function toEcef(lat: number, lon: number, h: number): [number, number, number] {
  const s = Math.sin(lat * DEG);
  const c = Math.cos(lat * DEG);
  const n = WGS84_A / Math.sqrt(1 - WGS84_E2 * s * s);
  return [(n + h) * c * Math.cos(lon * DEG), (n + h) * c * Math.sin(lon * DEG), (n * (1 - WGS84_E2) + h) * s];
}

/** The fixed-point iteration on the height (as the route code did before, with 3 steps), run to 20 steps. */
function iterative(x: number, y: number, z: number): { lat: number; lon: number } {
  const p = Math.hypot(x, y);
  let phi = Math.atan2(z, p * (1 - WGS84_E2));
  for (let i = 0; i < 20; i++) {
    const s = Math.sin(phi);
    const n = WGS84_A / Math.sqrt(1 - WGS84_E2 * s * s);
    const h = p * Math.cos(phi) + z * s - WGS84_A * Math.sqrt(1 - WGS84_E2 * s * s);
    phi = Math.atan2(z, p * (1 - (WGS84_E2 * n) / (n + h)));
  }
  return { lat: phi / DEG, lon: Math.atan2(y, x) / DEG };
}

let seed = 4242;
const rand = () => (seed = (seed * 16807) % 2147483647) / 2147483647;
const lonDiff = (a: number, b: number) => Math.abs((((a - b) % 360) + 540) % 360 - 180);

describe("ecefToGeodetic (Bowring's closed form)", () => {
  it("recovers points placed by GeographicLib, on the surface and up to 3 m below or above it", () => {
    let worstMetres = 0;
    let worstLatDeg = 0;
    for (let k = 0; k < 3000; k++) {
      // a GeographicLib point anywhere, poles and antimeridian included
      const start = { lat: -90 + 180 * rand(), lon: -180 + 360 * rand() };
      const pt = g.Direct(start.lat, start.lon, 360 * rand(), 1e6 * rand());
      const lat = pt.lat2!;
      const lon = pt.lon2!;
      for (const h of [0, -3, -0.5, 0.01, 3]) {
        const got = ecefToGeodetic(...toEcef(lat, lon, h));
        worstLatDeg = Math.max(worstLatDeg, Math.abs(got.lat - lat));
        if (Math.abs(lat) < 89.9) expect(lonDiff(got.lon, lon)).toBeLessThan(1e-11);
        worstMetres = Math.max(worstMetres, g.Inverse(lat, lon, got.lat, got.lon).s12!);
      }
    }
    expect(worstLatDeg).toBeLessThan(1e-12); // ≈ 0.1 µm
    expect(worstMetres).toBeLessThan(1e-6); // GeographicLib distance, metres
  });

  it("agrees with the converged iteration to 1e-13 degree", () => {
    for (let k = 0; k < 3000; k++) {
      const lat = -90 + 180 * rand();
      const lon = -180 + 360 * rand();
      const xyz = toEcef(lat, lon, -3 + 6 * rand());
      const got = ecefToGeodetic(...xyz);
      const ref = iterative(...xyz);
      expect(Math.abs(got.lat - ref.lat)).toBeLessThan(1e-13);
      expect(lonDiff(got.lon, ref.lon)).toBeLessThan(1e-13);
    }
  });

  it("handles the poles, the equator and the antimeridian exactly", () => {
    expect(ecefToGeodetic(...toEcef(90, 0, 0)).lat).toBeCloseTo(90, 12);
    expect(ecefToGeodetic(0, 0, -6356752.314245179).lat).toBe(-90);
    expect(ecefToGeodetic(WGS84_A, 0, 0)).toEqual({ lat: 0, lon: 0 });
    const anti = ecefToGeodetic(-WGS84_A, 0, 0);
    expect(anti.lat).toBe(0);
    expect(anti.lon).toBe(180);
    expect(ecefToGeodetic(...toEcef(-33.5, -179.9999999, 1)).lon).toBeCloseTo(-179.9999999, 11);
  });
});

describe("ecefToGeodeticNear (a point of a short segment, from its first vertex)", () => {
  it("agrees with the closed form to 1e-13 degree within 10 km of the vertex, anywhere, poles and antimeridian included", () => {
    let worst = 0;
    for (let k = 0; k < 5000; k++) {
      const lat1 = k % 10 === 0 ? (rand() < 0.5 ? -1 : 1) * (89.9 + 0.1 * rand()) : -90 + 180 * rand();
      const lon1 = k % 7 === 0 ? (rand() < 0.5 ? -1 : 1) * (179.99 + 0.01 * rand()) : -180 + 360 * rand();
      const pt = g.Direct(lat1, lon1, 360 * rand(), 10_000 * rand() ** 2); // GeographicLib
      const xyz = toEcef(pt.lat2!, pt.lon2!, -2 * rand()); // a chord point lies up to 2 m below the surface
      const near = ecefToGeodeticNear(...xyz, lon1, lat1);
      const full = ecefToGeodetic(...xyz);
      worst = Math.max(worst, Math.abs(near.lat - full.lat));
      expect(Math.abs(near.lat - full.lat), `${lat1} ${lon1}`).toBeLessThan(1e-13);
      if (Math.abs(full.lat) < 89.99) expect(lonDiff(near.lon, full.lon), `${lat1} ${lon1}`).toBeLessThan(1e-13);
      expect(near.lon).toBeGreaterThan(-180);
      expect(near.lon).toBeLessThanOrEqual(180);
    }
    expect(worst).toBeLessThan(1e-13);
  });
});
