import { describe, expect, it } from "vitest";
import { parseGeoJsonRoute, parseGpxRoute } from "../../../app/lib/geo/parse";

const ok = (r: ReturnType<typeof parseGeoJsonRoute>) => {
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return Array.from(r.coords);
};
const issues = (r: ReturnType<typeof parseGeoJsonRoute>) => {
  if (r.ok) throw new Error("expected a failure");
  return r.issues;
};

describe("GeoJSON routes", () => {
  const ls = { type: "LineString", coordinates: [[-1.5, 53.0], [-1.49, 53.001, 12.5], [-1.48, 53.002]] };

  it("accepts LineString, Feature, MultiLineString (parts joined in order) and FeatureCollection", () => {
    expect(ok(parseGeoJsonRoute(ls))).toEqual([-1.5, 53.0, -1.49, 53.001, -1.48, 53.002]);
    expect(ok(parseGeoJsonRoute({ type: "Feature", properties: {}, geometry: ls }))).toHaveLength(6);
    const mls = { type: "MultiLineString", coordinates: [[[0, 0], [0, 1]], [[0, 2], [0, 3]]] };
    expect(ok(parseGeoJsonRoute(mls))).toEqual([0, 0, 0, 1, 0, 2, 0, 3]);
    const fc = {
      type: "FeatureCollection",
      features: [
        { type: "Feature", geometry: { type: "LineString", coordinates: [[1, 1], [1, 2]] } },
        { type: "Feature", geometry: mls },
      ],
    };
    expect(ok(parseGeoJsonRoute(fc))).toEqual([1, 1, 1, 2, 0, 0, 0, 1, 0, 2, 0, 3]);
  });

  it("reports bad coordinates with their path", () => {
    const bad = {
      type: "Feature",
      geometry: { type: "LineString", coordinates: [[0, 0], [181, 0], [0, -91], [0, "x"], [NaN, 0], [1]] },
    };
    const paths = issues(parseGeoJsonRoute(bad)).map((i) => i.path);
    expect(paths).toEqual([
      "geometry.coordinates.1.0",
      "geometry.coordinates.2.1",
      "geometry.coordinates.3.1",
      "geometry.coordinates.4.0",
      "geometry.coordinates.5",
    ]);
    const prefixed = issues(parseGeoJsonRoute({ type: "LineString", coordinates: [[0, 0], [0, 95]] }, "medium.geometry"));
    expect(prefixed[0].path).toBe("medium.geometry.coordinates.1.1");
    expect(prefixed[0].message).toMatch(/−90…90/);
  });

  it("rejects non-lines, fewer than two distinct points and too many vertices", () => {
    expect(issues(parseGeoJsonRoute({ type: "Point", coordinates: [0, 0] }))[0]).toMatchObject({ path: "type" });
    expect(issues(parseGeoJsonRoute({ type: "FeatureCollection", features: [{ type: "Feature", geometry: { type: "Polygon", coordinates: [] } }] }))[0].path).toBe(
      "features.0.geometry.type",
    );
    expect(issues(parseGeoJsonRoute({ type: "LineString", coordinates: [[1, 1], [1, 1]] }))[0].message).toMatch(/two distinct points/);
    expect(issues(parseGeoJsonRoute({ type: "LineString", coordinates: [[1, 1]] }))[0].message).toMatch(/two distinct points/);
    expect(issues(parseGeoJsonRoute("nope"))[0].message).toMatch(/geometry object/);
    const many = { type: "LineString", coordinates: Array.from({ length: 11 }, (_, i) => [i * 0.001, 0]) };
    expect(issues(parseGeoJsonRoute(many, "", { maxVertices: 10 }))[0].message).toMatch(/11 vertices; at most 10/);
  });
});

describe("GPX routes", () => {
  // a small hand-written GPX document: a track with two segments, a waypoint, and a separate route
  const gpx = `<?xml version="1.0" encoding="UTF-8"?>
<gpx version="1.1" creator="Eonscale test" xmlns="http://www.topografix.com/GPX/1/1">
  <wpt lat="54.2000" lon="-2.9000"><name>Trailhead</name></wpt>
  <trk><name>Marrowby riverside walk</name>
    <trkseg>
      <trkpt lat="54.2000" lon="-2.9000"><ele>12</ele></trkpt>
      <trkpt lat="54.2010" lon="-2.8990"><ele>13</ele></trkpt>
    </trkseg>
    <trkseg>
      <trkpt lat="54.2020" lon="-2.8980"></trkpt>
      <trkpt lat="54.2030" lon="-2.8970"></trkpt>
    </trkseg>
  </trk>
  <rte><rtept lat="10" lon="10"/><rtept lat="11" lon="11"/></rte>
</gpx>`;

  it("reads tracks (segments joined in order) and ignores waypoints and routes when a track exists", () => {
    const r = parseGpxRoute(gpx);
    expect(ok(r)).toEqual([-2.9, 54.2, -2.899, 54.201, -2.898, 54.202, -2.897, 54.203]);
  });

  it("falls back to routes when there is no track", () => {
    const onlyRoute = `<gpx version="1.1" xmlns="http://www.topografix.com/GPX/1/1"><rte><rtept lat="10" lon="10"/><rtept lat="11" lon="11.5"/></rte></gpx>`;
    expect(ok(parseGpxRoute(onlyRoute))).toEqual([10, 10, 11.5, 11]);
  });

  it("rejects empty, non-GPX, malformed and pointless documents", () => {
    expect(issues(parseGpxRoute(""))[0].message).toMatch(/empty/);
    expect(issues(parseGpxRoute("<kml></kml>"))[0].message).toMatch(/not GPX/);
    expect(issues(parseGpxRoute("<gpx><trk><trkseg><trkpt lat='1' lon='2'>"))[0].path).toBe("gpx");
    expect(issues(parseGpxRoute(`<gpx version="1.1"><wpt lat="1" lon="1"/></gpx>`))[0].message).toMatch(/no track/);
    const outOfRange = `<gpx version="1.1"><trk><trkseg><trkpt lat="95" lon="0"/><trkpt lat="1" lon="1"/></trkseg></trk></gpx>`;
    expect(issues(parseGpxRoute(outOfRange, "medium.gpx"))[0].message).toMatch(/Latitude 95/);
  });
});
