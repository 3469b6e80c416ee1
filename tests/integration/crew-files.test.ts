// The installation crew's files against the real database and the seeded publication: points.geojson
// checked by an RFC 7946 validator from npm (@placemarkio/check-geojson, which refuses `properties`
// on a FeatureCollection, §7.1), points.gpx validated against TopoGrafix's GPX 1.1 XSD with Debian's
// xmllint, both read back with the project's own route reader (same coordinates), waypoints equal
// to the schedule CSV's columns to the 7th decimal, drafts saying "DRAFT — not checked", the
// ?from= rule, and the public publication file route (ETag, 304, 404s, never drafts).
import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { check } from "@placemarkio/check-geojson";
import { DOMParser, type Element as XmlElement } from "@xmldom/xmldom";
import { beforeAll, describe, expect, it } from "vitest";
import * as gpxRoute from "../../app/routes/studio/exhibits.$slug.points-gpx.ts";
import * as geoRoute from "../../app/routes/studio/exhibits.$slug.points-geojson.ts";
import * as scheduleRoute from "../../app/routes/studio/exhibits.$slug.schedule-csv.ts";
import * as publicFile from "../../app/routes/api.exhibits.$org.$slug.publications.$number.$file.ts";
import * as newExhibit from "../../app/routes/studio/exhibits.new.tsx";
import * as composer from "../../app/routes/studio/exhibits.$slug.tsx";
import { parseGeoJsonRoute, parseGpxRoute } from "../../app/lib/geo/parse.ts";
import { readCsv } from "../../app/lib/timescale/csv.ts";
import type { PublicationSnapshot } from "../../app/lib/publication/types.ts";
import { Organisation, Publication, User, Exhibit } from "../../db/models/index.ts";
import { env } from "../../server/env.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle } from "../helpers/db.ts";
import { ensureDebianCommand, runCommand } from "../setup/debian-tools.ts";

const XSD = path.resolve(import.meta.dirname, "../fixtures/gpx/gpx-1.1.xsd");
const DRAFT = "DRAFT — not checked";

let designer: string;
/** A designer in another organisation (outsider to marrowby's exhibits, owner of crew-test-walk). */
let outsider: string;
let snapshot: PublicationSnapshot;
let base: string;

type Loader = (args: never) => unknown;
async function studio(loader: Loader, slug: string, file: string, query = "", cookie = designer) {
  return settle(() => loader(routeArgs(getRequest(`/studio/exhibits/${slug}/${file}${query}`, { cookie }), { slug })));
}
async function fetchText(loader: Loader, slug: string, file: string, query = "") {
  const res = (await loader(routeArgs(getRequest(`/studio/exhibits/${slug}/${file}${query}`, { cookie: designer }), { slug }))) as Response;
  expect(res.status, await res.clone().text()).toBe(200);
  return { res, text: await res.text() };
}
const publicRequest = (org: string, slug: string, number: string, file: string, headers: Record<string, string> = {}, query = "") =>
  publicFile.loader(routeArgs(new Request(`http://test.local/api/exhibits/${org}/${slug}/publications/${number}/${file}${query}`, { headers }), { org, slug, number, file })) as Promise<Response>;

async function xmllint(text: string): Promise<{ code: number; stderr: string }> {
  const xmllintPath = await ensureDebianCommand("xmllint", "libxml2-utils");
  const dir = await mkdtemp(path.join(tmpdir(), "eonscale-gpx-"));
  const file = path.join(dir, "points.gpx");
  await writeFile(file, text);
  const r = await runCommand(xmllintPath, ["--noout", "--nonet", "--schema", XSD, file]);
  return { code: r.code, stderr: r.stderr };
}

/** Elements in the GPX namespace, read with a DOM parser (not with the code under test). */
function gpxElements(text: string, name: string) {
  const doc = new DOMParser().parseFromString(text, "text/xml");
  return Array.from(doc.getElementsByTagNameNS("http://www.topografix.com/GPX/1/1", name));
}
const childText = (el: XmlElement, name: string) => Array.from(el.childNodes).find((n) => n.nodeName === name)?.textContent ?? null;

beforeAll(async () => {
  const org = await Organisation.findOne({ where: { slug: "marrowby" } });
  designer = await cookieFor((await User.findOne({ where: { email: "designer@marrowby.example" } }))!.id, org!.id);
  const other = await createOrganisation();
  outsider = await cookieFor((await createMember(other, "designer")).user.id);
  const exhibit = await Exhibit.findOne({ where: { organisationId: org!.id, slug: "riverside-walk" } });
  snapshot = (await Publication.findOne({ where: { exhibitId: exhibit!.id, number: 1 } }))!.snapshot;
  base = env().APP_URL.replace(/\/+$/, "");
});

describe("points.geojson (RFC 7946)", () => {
  it("the published riverside walk passes @placemarkio/check-geojson; the checker itself refuses `properties` on a FeatureCollection", async () => {
    const { res, text } = await fetchText(geoRoute.loader, "riverside-walk", "points.geojson");
    expect(res.headers.get("Content-Type")).toBe("application/geo+json; charset=utf-8");
    expect(res.headers.get("Content-Disposition")).toBe('attachment; filename="riverside-walk-publication-1-points.geojson"');
    expect(res.headers.get("Cache-Control")).toBe("private, no-store");
    expect(() => check(text)).not.toThrow();
    const fc = JSON.parse(text);
    expect(fc).not.toHaveProperty("properties");
    // The validator does enforce §7.1: the same document with `properties` added is refused.
    expect(() => check(JSON.stringify({ ...fc, properties: { exhibit: "x" } }))).toThrow(/properties/);
    expect(fc.eonscale).toMatchObject({ status: "published", draft: false, publication: 1, chartEdition: "ICS 2024/12", exhibit: { slug: "riverside-walk", revision: snapshot.exhibit.revision } });
  });

  it("one Point per marker with sign number, label, age ±, source, distance and marker page; the route as a LineString; 7 decimals; bbox around everything", async () => {
    const fc = JSON.parse((await fetchText(geoRoute.loader, "riverside-walk", "points.geojson")).text);
    const [route, ...points] = fc.features;
    expect(route.geometry.type).toBe("LineString");
    // The demo route has elevations: three numbers per position, and a six-number bbox (RFC 7946 §5).
    expect(snapshot.medium.kind === "route" && snapshot.medium.hasElevations).toBe(true);
    expect(route.geometry.coordinates).toEqual(snapshot.medium.kind === "route" ? snapshot.medium.geometry.coordinates : null);
    expect(points).toHaveLength(snapshot.markers.length);
    const cambrian = snapshot.markers.find((m) => m.label === "Base of the Phanerozoic, Paleozoic and Cambrian")!;
    const f = points.find((p: { properties: { signNumber: number } }) => p.properties.signNumber === cambrian.signNumber);
    expect(f.geometry).toEqual({ type: "Point", coordinates: [cambrian.position!.lon, cambrian.position!.lat, cambrian.position!.elevationMetres] });
    expect(f.properties).toMatchObject({
      name: `${String(cambrian.signNumber).padStart(2, "0")} Cambrian`,
      label: cambrian.label,
      ageMa: 538.8,
      ageText: cambrian.ageText,
      source: cambrian.source,
      // Linear scale, 1 m per million years from the older end at 4,567 Ma (hand-computed).
      fromOlderEndMetres: Number((4567 - 538.8).toFixed(3)),
      markerPage: `${base}/visit/marrowby/riverside-walk/${cambrian.signNumber}`,
    });
    expect(cambrian.ageText).toMatch(/±/);
    for (const p of points) for (const x of p.geometry.coordinates.slice(0, 2)) expect(String(x).split(".")[1]?.length ?? 0).toBeLessThanOrEqual(7);
    expect(fc.bbox).toHaveLength(6);
    const [w, s, low, e, n, high] = fc.bbox;
    for (const [lon, lat, ele] of [...route.geometry.coordinates, ...points.map((p: { geometry: { coordinates: number[] } }) => p.geometry.coordinates)]) {
      expect(lon >= w && lon <= e && lat >= s && lat <= n && ele >= low && ele <= high).toBe(true);
    }
  });

  it("reads back through the project's own route reader with the route's coordinates (points skipped, and said)", async () => {
    const fc = JSON.parse((await fetchText(geoRoute.loader, "riverside-walk", "points.geojson")).text);
    const r = parseGeoJsonRoute(fc);
    if (!r.ok) throw new Error(JSON.stringify(r.issues));
    const expected = snapshot.medium.kind === "route" ? snapshot.medium.geometry.coordinates.flatMap((c) => [c[0], c[1]]) : [];
    expect(Array.from(r.coords)).toEqual(expected);
    expect(r.note).toMatch(/1 line and \d+ points/);
  });
});

describe("points.gpx (GPX 1.1)", () => {
  let text: string;
  beforeAll(async () => {
    const got = await fetchText(gpxRoute.loader, "riverside-walk", "points.gpx");
    expect(got.res.headers.get("Content-Type")).toBe("application/gpx+xml; charset=utf-8");
    text = got.text;
  });

  it("validates against TopoGrafix's GPX 1.1 schema with xmllint; a document breaking the schema is refused (the check bites)", async () => {
    const ok = await xmllint(text);
    expect(ok.stderr).toMatch(/validates/);
    expect(ok.code).toBe(0);
    // <name> after <desc> breaks wptType's sequence.
    const broken = text.replace(/<name>([^<]*)<\/name><desc>([^<]*)<\/desc>/, "<desc>$2</desc><name>$1</name>");
    expect(broken).not.toBe(text);
    const bad = await xmllint(broken);
    expect(bad.code).not.toBe(0);
    expect(bad.stderr).toMatch(/fails to validate/);
  });

  it("one wpt per marker at the schedule CSV's coordinates to the 7th decimal, with a short name, desc, link to the marker page", async () => {
    const res = (await scheduleRoute.loader(routeArgs(getRequest("/studio/exhibits/riverside-walk/schedule.csv", { cookie: designer }), { slug: "riverside-walk" }))) as Response;
    const [header, ...rows] = readCsv(await res.text()).records.map((r) => r.fields) as string[][];
    const col = (name: string) => header.indexOf(name);
    const wpts = gpxElements(text, "wpt");
    expect(wpts).toHaveLength(rows.length);
    wpts.forEach((w, i) => {
      expect(w.getAttribute("lat")).toBe(rows[i][col("latitude")]);
      expect(w.getAttribute("lon")).toBe(rows[i][col("longitude")]);
    });
    const names = wpts.map((w) => childText(w, "name")!);
    expect(names.every((n) => n.length <= 24 && /^\d{2,} \S/.test(n))).toBe(true);
    const cambrian = snapshot.markers.find((m) => m.label === "Base of the Phanerozoic, Paleozoic and Cambrian")!;
    const w = wpts[cambrian.order - 1];
    expect(childText(w, "name")).toBe(`${String(cambrian.signNumber).padStart(2, "0")} Cambrian`);
    expect(childText(w, "desc")).toContain(`${cambrian.label} — ${cambrian.ageText}`);
    expect(childText(w, "desc")).toContain(`Source: ${cambrian.source}`);
    expect(childText(w, "ele")).toBe(String(cambrian.position!.elevationMetres)); // the demo route has elevations
    const link = Array.from(w.childNodes).find((n) => n.nodeName === "link") as XmlElement;
    expect(link.getAttribute("href")).toBe(`${base}/visit/marrowby/riverside-walk/${cambrian.signNumber}`);
    expect(gpxElements(text, "cmt")).toHaveLength(0);
  });

  it("the route as one trk reads back through the project's GPX reader with the same coordinates", async () => {
    expect(gpxElements(text, "trk")).toHaveLength(1);
    const r = parseGpxRoute(text);
    if (!r.ok) throw new Error(JSON.stringify(r.issues));
    const expected = snapshot.medium.kind === "route" ? snapshot.medium.geometry.coordinates.flatMap((c) => [c[0], c[1]]) : [];
    expect(Array.from(r.coords)).toEqual(expected);
    expect(r.note).toBeUndefined();
  });
});

describe("?from=publication|draft", () => {
  it("from=draft: both files say DRAFT — not checked in their metadata, have no marker page links, and stay valid", async () => {
    const gpx = (await fetchText(gpxRoute.loader, "riverside-walk", "points.gpx", "?from=draft")).text;
    const meta = gpxElements(gpx, "metadata")[0];
    expect(childText(meta, "name")).toContain(DRAFT);
    expect(childText(meta, "desc")).toMatch(/^DRAFT — not checked: working copy at revision \d+/);
    expect(gpxElements(gpx, "link")).toHaveLength(0);
    expect(gpxElements(gpx, "cmt").every((c) => c.textContent === DRAFT)).toBe(true);
    expect((await xmllint(gpx)).code).toBe(0);
    const { res, text } = await fetchText(geoRoute.loader, "riverside-walk", "points.geojson", "?from=draft");
    expect(res.headers.get("Content-Disposition")).toMatch(/riverside-walk-draft-rev\d+-points\.geojson/);
    const fc = JSON.parse(text);
    expect(() => check(text)).not.toThrow();
    expect(fc.eonscale).toMatchObject({ status: DRAFT, draft: true, publication: null });
    expect(fc.features.slice(1).every((f: { properties: { markerPage: unknown; status: string } }) => f.properties.markerPage === null && f.properties.status === DRAFT)).toBe(true);
  });

  it("a bad from is a 400 naming the parameter; from=publication without a publication is a 404; a straight length has no points", async () => {
    const bad = await studio(gpxRoute.loader, "riverside-walk", "points.gpx", "?from=latest");
    expect(bad.status).toBe(400);
    expect((bad.body as { message: string }).message).toMatch(/^from: must be "publication" .* or "draft"/);
    // school-rope is a rope (straight length): no points at all, whatever the source.
    const rope = await studio(gpxRoute.loader, "school-rope", "points.gpx", "?from=draft");
    expect(rope.status).toBe(404);
    expect((rope.body as { message: string }).message).toMatch(/only for route exhibits/);
    const none = await studio(gpxRoute.loader, "school-rope", "points.gpx", "?from=publication");
    expect(none.status).toBe(404);
    expect((none.body as { message: string }).message).toMatch(/no publication yet.*\?from=draft/);
  });

  it("another organisation's member gets 404; signed out is sent to sign in", async () => {
    expect((await studio(gpxRoute.loader, "riverside-walk", "points.gpx", "", outsider)).status).toBe(404);
    const out = await settle(() => gpxRoute.loader(routeArgs(getRequest("/studio/exhibits/riverside-walk/points.gpx"), { slug: "riverside-walk" })));
    expect(out.status).toBe(302);
  });
});

describe("GET /api/exhibits/:org/:slug/publications/:number/:file (public)", () => {
  it("serves publication 1's files without sign-in: public cache, ETag, 304 on If-None-Match, same body as the studio's", async () => {
    const res = await publicRequest("marrowby", "riverside-walk", "1", "points.gpx");
    expect(res.status).toBe(200);
    expect(res.headers.get("Cache-Control")).toMatch(/^public/);
    expect(res.headers.get("Access-Control-Allow-Origin")).toBe("*");
    const etag = res.headers.get("ETag")!;
    expect(etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(await res.text()).toBe((await fetchText(gpxRoute.loader, "riverside-walk", "points.gpx", "?from=publication")).text);
    const again = await publicRequest("marrowby", "riverside-walk", "1", "points.gpx", { "If-None-Match": etag });
    expect(again.status).toBe(304);
    const geo = await publicRequest("marrowby", "riverside-walk", "1", "points.geojson");
    expect(geo.status).toBe(200);
    expect(geo.headers.get("ETag")).not.toBe(etag);
    const geoText = await geo.text();
    expect(() => check(geoText)).not.toThrow();
  });

  it("404 JSON for an unknown file name, a publication that does not exist, an unpublished exhibit and any draft", async () => {
    for (const [org, slug, number, file, query, pattern] of [
      ["marrowby", "riverside-walk", "1", "points.kml", "", /No file "points.kml" here/],
      ["marrowby", "riverside-walk", "2", "points.gpx", "", /no publication 2/],
      ["marrowby", "school-rope", "1", "points.gpx", "", /Drafts are never public/],
      ["marrowby", "riverside-walk", "1", "points.gpx", "?from=draft", /Drafts are never public/],
    ] as const) {
      const res = await publicRequest(org, slug, number, file, {}, query);
      expect(res.status, `${slug}/${number}/${file}${query}`).toBe(404);
      expect(res.headers.get("Content-Type")).toMatch(/application\/json/);
      expect((await res.json()).error.message).toMatch(pattern);
    }
    expect((await publicRequest("marrowby", "riverside-walk", "0", "points.gpx")).status).toBe(400);
  });
});

describe("an unpublished route exhibit with awkward text", () => {
  const slug = "crew-test-walk";
  // A hand-written GPX 1.0 file with a route and a track: the track is used.
  const upload = `<?xml version="1.0"?><gpx version="1.0" creator="hand" xmlns="http://www.topografix.com/GPX/1/0"><rte><name>Plan</name><rtept lat="51" lon="-1"/><rtept lat="51.001" lon="-1"/></rte><trk><name>Walked</name><trkseg><trkpt lat="51.5" lon="-0.12"/><trkpt lat="51.5045" lon="-0.12"/><trkpt lat="51.509" lon="-0.1199999"/></trkseg></trk></gpx>`;
  const hostile = `Quarry <b>&</b> "mill" ]]></name><script>x</script>`;

  beforeAll(async () => {
    const form = new FormData();
    for (const [k, v] of Object.entries({ slug, title: "Crew test walk", editionSlug: "ics-2024-12", mediumKind: "route", spanOlderValue: "541", spanOlderUnit: "Ma", spanYoungerValue: "0", spanYoungerUnit: "Ma", mediumType: "trail", unitsPreference: "metric" })) form.set(k, v);
    form.set("routeFile", new File([upload], "walk.gpx"));
    const created = await settle(() => newExhibit.action(routeArgs(new Request("http://test.local/studio/exhibits/new", { method: "POST", body: form, headers: { Cookie: outsider } }))));
    expect(created.status).toBe(302);
    const exhibit = (await Exhibit.findOne({ where: { slug } }))!;
    const added = await settle(() =>
      composer.action(routeArgs(formRequest(`/studio/exhibits/${slug}`, { intent: "add-custom", label: hostile, ageValue: "100", ageUnit: "Ma", source: "Invented <source> & test", text: "", revision: String(exhibit.revision) }, { cookie: outsider }), { slug })),
    );
    expect(added.status).toBe(302);
  });

  it("without a publication the default is the draft; the GPX stays valid and escapes every text; GeoJSON stays valid", async () => {
    const res = (await gpxRoute.loader(routeArgs(getRequest(`/studio/exhibits/${slug}/points.gpx`, { cookie: outsider }), { slug }))) as Response;
    expect(res.status).toBe(200);
    expect(res.headers.get("Content-Disposition")).toMatch(/crew-test-walk-draft-rev\d+-points\.gpx/);
    const text = await res.text();
    expect(text).not.toContain("<script>");
    const v = await xmllint(text);
    expect(v.code, v.stderr).toBe(0);
    const wpt = gpxElements(text, "wpt")[0];
    expect(childText(wpt, "desc")).toContain(`Quarry <b>&</b> "mill" ]]></name><script>x</script>`);
    expect(childText(wpt, "cmt")).toBe(DRAFT);
    expect(childText(wpt, "name")).toMatch(/^01 Quarry/);
    // The track (not the route) of the upload is the exhibit's route, read back unchanged.
    const back = parseGpxRoute(text);
    expect(back.ok && Array.from(back.coords)).toEqual([-0.12, 51.5, -0.12, 51.5045, -0.1199999, 51.509]);
    const geo = (await geoRoute.loader(routeArgs(getRequest(`/studio/exhibits/${slug}/points.geojson`, { cookie: outsider }), { slug }))) as Response;
    const geoText = await geo.text();
    expect(() => check(geoText)).not.toThrow();
    expect(JSON.parse(geoText).eonscale.status).toBe(DRAFT);
  });
});
