// Route upload: GPX tracks and routes in GPX 1.0 and 1.1, and what the reader says when a file
// holds several (hand-written documents; namespaces as the two GPX versions declare them).
import { describe, expect, it } from "vitest";
import { parseGeoJsonRoute, parseGpxRoute } from "../../../app/lib/geo/parse";
import { readRouteFile } from "../../../app/lib/exhibit/route-file";

const NS = { "1.0": "http://www.topografix.com/GPX/1/0", "1.1": "http://www.topografix.com/GPX/1/1" } as const;
const doc = (version: "1.0" | "1.1", body: string) => `<?xml version="1.0" encoding="UTF-8"?>\n<gpx version="${version}" creator="hand-written" xmlns="${NS[version]}">${body}</gpx>`;
const trk = (name: string | null, ...pts: [number, number][]) =>
  `<trk>${name ? `<name>${name}</name>` : ""}<trkseg>${pts.map(([lat, lon]) => `<trkpt lat="${lat}" lon="${lon}"><ele>10.5</ele></trkpt>`).join("")}</trkseg></trk>`;
const rte = (name: string | null, ...pts: [number, number][]) => `<rte>${name ? `<name>${name}</name>` : ""}${pts.map(([lat, lon]) => `<rtept lat="${lat}" lon="${lon}"/>`).join("")}</rte>`;

function coords(r: ReturnType<typeof parseGpxRoute>) {
  if (!r.ok) throw new Error(JSON.stringify(r.issues));
  return Array.from(r.coords);
}

describe("GPX 1.0 and 1.1, tracks and routes", () => {
  for (const version of ["1.0", "1.1"] as const) {
    it(`GPX ${version}: a track is read, with no note when it is the only line`, () => {
      const r = parseGpxRoute(doc(version, trk("Loop", [54.1, -2.9], [54.2, -2.8])));
      expect(coords(r)).toEqual([-2.9, 54.1, -2.8, 54.2]);
      expect(r.ok && r.note).toBeUndefined();
    });
    it(`GPX ${version}: a route (rte) alone is read`, () => {
      expect(coords(parseGpxRoute(doc(version, rte("Planned", [10, 10], [11, 11.5]))))).toEqual([10, 10, 11.5, 11]);
    });
    it(`GPX ${version}: a track and a route: the track is used and the note says so`, () => {
      const r = parseGpxRoute(doc(version, rte("Planned", [10, 10], [11, 11]) + trk("Walked", [54.1, -2.9], [54.2, -2.8])));
      expect(coords(r)).toEqual([-2.9, 54.1, -2.8, 54.2]);
      expect(r.ok && r.note).toBe("The file holds 1 track and 1 route: the track “Walked” is the route; the route is not used.");
    });
  }

  it("several tracks are joined in order and named in the note (unnamed ones by position)", () => {
    const r = parseGpxRoute(doc("1.1", trk("Out", [1, 1], [1, 2]) + trk(null, [1, 3], [1, 4]) + rte("A", [5, 5], [6, 6]) + rte("B", [7, 7], [8, 8])));
    expect(coords(r)).toEqual([1, 1, 2, 1, 3, 1, 4, 1]);
    expect(r.ok && r.note).toBe("The file holds 2 tracks and 2 routes: the 2 tracks “Out”, no. 2 (unnamed) are joined in order (end of one to start of the next); the routes are not used.");
  });

  it("several routes and no track: the routes are joined and the note says so", () => {
    const r = parseGpxRoute(doc("1.0", rte("First", [1, 1], [1, 2]) + rte("Second", [1, 3], [1, 4])));
    expect(r.ok && r.note).toBe("The file holds 2 routes: the 2 routes “First”, “Second” are joined in order (end of one to start of the next).");
  });

  it("the upload reader passes the note on", () => {
    const r = readRouteFile("walk.gpx", doc("1.1", rte("Planned", [10, 10], [11, 11]) + trk("Walked", [54.1, -2.9], [54.2, -2.8])));
    expect(r.ok && r.note).toMatch(/^The file holds 1 track and 1 route/);
    expect(r.ok && r.geometry.coordinates).toEqual([[-2.9, 54.1, 10.5], [-2.8, 54.2, 10.5]]); // elevations kept
  });
});

describe("GeoJSON with a line and points (an exported points.geojson)", () => {
  const fc = {
    type: "FeatureCollection",
    features: [
      { type: "Feature", properties: {}, geometry: { type: "LineString", coordinates: [[0, 0], [0, 1]] } },
      { type: "Feature", properties: {}, geometry: { type: "Point", coordinates: [0, 0.5] } },
      { type: "Feature", properties: {}, geometry: { type: "Point", coordinates: [0, 0.7] } },
    ],
  };
  it("uses the line, skips the points and says so", () => {
    const r = parseGeoJsonRoute(fc);
    expect(r.ok && Array.from(r.coords)).toEqual([0, 0, 0, 1]);
    expect(r.ok && r.note).toBe("The file holds 1 line and 2 points: the line is the route; the points are not part of it.");
  });
  it("points alone are still refused", () => {
    const r = parseGeoJsonRoute({ type: "FeatureCollection", features: fc.features.slice(1) });
    expect(r.ok).toBe(false);
  });
});
