// Spreadsheet safety (OWASP CSV-injection advice: prefix cells starting with = + - @ tab CR) and
// elevations read from uploaded route files.
import { describe, expect, it } from "vitest";
import { safeText } from "~/lib/fabrication/schedule";
import { routeElevations } from "~/lib/profile/elevations";
import { readRouteFile } from "~/lib/exhibit/route-file";

describe("safeText", () => {
  it("prefixes text a spreadsheet would read as a formula, and only that", () => {
    expect(safeText('=HYPERLINK("http://x","y")')).toBe(`'=HYPERLINK("http://x","y")`);
    for (const lead of ["+", "-", "@", "\t", "\r"]) expect(safeText(`${lead}A1*2`)).toBe(`'${lead}A1*2`);
    expect(safeText("-1.5")).toBe("-1.5"); // a plain number stays as it is
    expect(safeText("Base of the Cambrian")).toBe("Base of the Cambrian");
    expect(safeText("538.8 ± 0.2 Ma")).toBe("538.8 ± 0.2 Ma");
  });
});

describe("route elevations", () => {
  const gpx = (eles: (number | null)[]) =>
    `<?xml version="1.0"?><gpx version="1.1" creator="t" xmlns="http://www.topografix.com/GPX/1/1"><trk><trkseg>${eles
      .map((e, i) => `<trkpt lat="54.${i}" lon="-2.9">${e === null ? "" : `<ele>${e}</ele>`}</trkpt>`)
      .join("")}</trkseg></trk></gpx>`;
  it("GPX track points with <ele> become a third coordinate on upload", () => {
    const r = readRouteFile("walk.gpx", gpx([41.23, 42, 44.5]));
    expect(r.ok && r.geometry.coordinates.map((c) => c[2])).toEqual([41.2, 42, 44.5]);
  });
  it("a point without elevation means no elevations at all", () => {
    const r = readRouteFile("walk.gpx", gpx([41, null, 44]));
    expect(r.ok && r.geometry.coordinates.every((c) => c.length === 2)).toBe(true);
  });
  it("GeoJSON positions with a third number", () => {
    const text = JSON.stringify({ type: "LineString", coordinates: [[-2.9, 54.1, 10], [-2.9, 54.2, 12.25]] });
    expect(routeElevations(text, false, 2)).toEqual([10, 12.3]);
    expect(routeElevations(text, false, 3)).toBeNull();
  });
});
