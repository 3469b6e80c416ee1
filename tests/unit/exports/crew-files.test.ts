// The crew's files from a hand-made snapshot: waypoint names, XML escaping, the antimeridian,
// elevations (six-number bbox, <ele>), and validity under the outside checkers (RFC 7946 checker
// from npm; TopoGrafix's GPX 1.1 XSD with xmllint).
import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { check } from "@placemarkio/check-geojson";
import { describe, expect, it } from "vitest";
import { waypointName } from "../../../app/lib/exports/common";
import { pointsGeoJson } from "../../../app/lib/exports/geojson";
import { escapeXml, lonText, pointsGpx } from "../../../app/lib/exports/gpx";
import type { PublicationSnapshot, SnapshotMarker } from "../../../app/lib/publication/types";
import { ensureDebianCommand, runCommand } from "../../setup/debian-tools";

const XSD = path.resolve(import.meta.dirname, "../../fixtures/gpx/gpx-1.1.xsd");

function marker(over: Partial<SnapshotMarker>): SnapshotMarker {
  return {
    id: "1", signNumber: 1, order: 1, kind: "boundary", label: "Base of the Cambrian", ageMa: 538.8, uncertaintyMa: 0.6, approximate: false, ageText: "538.8 ± 0.6 Ma",
    intervalName: "Cambrian", intervalRank: "period", eventName: null, source: "ICS 2024/12", text: { markdown: "", html: "" }, color: "#7FA056", within: [],
    distance: { fromOlderEndMetres: 10, fromYoungerEndMetres: 20, uncertaintyMetres: null, display: { fromOlderEnd: "10 m", fromYoungerEnd: "20 m", uncertainty: null } },
    position: { lon: 179.9999999, lat: -16.5, elevationMetres: 12.25, bearing: 90 }, walking: null, decay: null, insets: [], image: null,
    ...over,
  };
}

/** A route across the antimeridian (Fiji's longitude), with elevations: hand-made, not a real trail. */
function snapshot(markers: SnapshotMarker[]): PublicationSnapshot {
  return {
    schemaVersion: 1,
    organisation: { slug: "org", name: "Org & Co <museum>" },
    exhibit: { slug: "walk", title: "Walk", revision: 3, unitsPreference: "metric", span: { older: { value: 541, unit: "Ma" }, younger: { value: 0, unit: "Ma" }, olderMa: 541, youngerMa: 0 } },
    scale: { totalMetres: 30, metresPerYear: 30 / 541e6, metresPerMillionYears: 30 / 541, statement: { lengthPerTime: "1 m per 18 million years", timePerLength: "" } },
    medium: {
      kind: "route", mediumType: "trail", lengthMetres: 30, sourceName: "hand.gpx",
      geometry: { type: "LineString", coordinates: [[179.9999, -16.5, 10], [180, -16.5001, 11.5], [-179.9999, -16.5002, 13]] },
      vertexCount: 3, hasElevations: true, start: "older",
      walking: { speedMps: 1.2, accessibleSpeedMps: 0.9, stepLengthRangeM: [0.6, 0.8], seconds: 25, accessibleSeconds: 33, steps: 40, stepsUpTo: 50 },
    },
    edition: { slug: "ics-2024-12", label: "ICS 2024/12", source: "", licence: "", languages: ["en"], intervals: [] },
    markers, insets: [], durations: [], retiredSigns: [], cautions: ["Planning figures, not a survey."], sources: {},
  };
}
const published = { draft: false, baseUrl: "https://eonscale.example", publication: { number: 2, hash: "ab", publishedAt: "2026-12-03T10:00:00.000Z", approvedBy: "R. Basalt", edition: { slug: "ics-2024-12", label: "ICS 2024/12" } } };

describe("waypoint names", () => {
  it("the sign number, zero-padded, and the last interval of a combined boundary: 07 Cambrian", () => {
    expect(waypointName(marker({ signNumber: 7, label: "Base of the Phanerozoic, Paleozoic and Cambrian" }), 48)).toBe("07 Cambrian");
    expect(waypointName(marker({ signNumber: 7, label: "Base of the Phanerozoic, Paleozoic and Cambrian" }), 120)).toBe("007 Cambrian");
  });
  it("events by their event name, custom markers by their label, cut at a word to 24 characters", () => {
    expect(waypointName(marker({ kind: "event", eventName: "Chicxulub impact", label: "Dinosaurs (non-avian) die out" }), 9)).toBe("01 Chicxulub impact");
    const long = waypointName(marker({ kind: "custom", label: "Marrowby mill built beside the old footbridge" }), 9);
    expect(long).toBe("01 Marrowby mill built");
    expect(long.length).toBeLessThanOrEqual(24);
    expect(waypointName(marker({ kind: "custom", label: "Supercalifragilisticexpialidocious" }), 9)).toBe("01 Supercalifragilistice") // 3 + 21 characters;
  });
});

describe("XML text", () => {
  it("escapes markup and both quotes, and drops characters XML 1.0 cannot carry (keeping real astral characters)", () => {
    expect(escapeXml(`<a href="x">Tom's & co</a>`)).toBe("&lt;a href=&quot;x&quot;&gt;Tom&apos;s &amp; co&lt;/a&gt;");
    expect(escapeXml("bell\u0007 tab\t nul\u0000 lone\uD800 pair\uD83E\uDD95 end\uFFFF")).toBe("bell tab\t nul lone pair\uD83E\uDD95 end");
  });
  it("longitude 180 is written as −180 (GPX: −180 ≤ lon < 180)", () => {
    expect(lonText(180)).toBe("-180.0000000");
    expect(lonText(-2.9876)).toBe("-2.9876000");
  });
});

describe("files from the hand-made snapshot", () => {
  const markers = [
    marker({ id: "1", signNumber: 1, order: 1 }),
    marker({ id: "2", signNumber: 2, order: 2, kind: "custom", label: `]]></desc><script>alert(1)</script>`, source: "Parish <records> & \"notes\"", position: { lon: -179.9999, lat: -16.5002, elevationMetres: 13, bearing: 90 } }),
  ];
  const snap = snapshot(markers);

  it("GeoJSON with elevations: three numbers per position, a six-number bbox, valid under RFC 7946", () => {
    const fc = pointsGeoJson(snap, published);
    expect(() => check(JSON.stringify(fc))).not.toThrow();
    expect(fc.bbox).toEqual([-179.9999, -16.5002, 10, 180, -16.5, 13]);
    expect(fc.features[1].geometry.coordinates).toEqual([179.9999999, -16.5, 12.25]);
    expect(fc.features[1].properties.markerPage).toBe("https://eonscale.example/visit/org/walk/1");
    expect(fc.eonscale.statusText).toBe("Publication 2 (revision 3, published 2026-12-03), checked against ICS 2024/12 by R. Basalt.");
  });

  it("GPX: <ele> on waypoints and track points, hostile text escaped, valid against the GPX 1.1 XSD", async () => {
    const gpx = pointsGpx(snap, published);
    expect(gpx).toContain("<ele>12.25</ele>");
    expect(gpx).toContain('<trkpt lat="-16.5001000" lon="-180.0000000"><ele>11.5</ele></trkpt>');
    expect(gpx).not.toContain("<script>");
    expect(gpx).toContain("<author><name>Org &amp; Co &lt;museum&gt;</name></author>");
    const xmllint = await ensureDebianCommand("xmllint", "libxml2-utils");
    const file = path.join(await mkdtemp(path.join(tmpdir(), "eonscale-gpx-")), "hand.gpx");
    await writeFile(file, gpx);
    const r = await runCommand(xmllint, ["--noout", "--nonet", "--schema", XSD, file]);
    expect(r.stderr).toMatch(/validates/);
    expect(r.code).toBe(0);
  });
});
