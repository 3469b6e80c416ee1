// The exhibit composer against the real database: creating, changing and exporting exhibits,
// validation that saves nothing, roles and organisations, optimistic locking, edition impact.
import geodesic from "geographiclib-geodesic";
import { beforeAll, describe, expect, it } from "vitest";
import * as composer from "../../app/routes/studio/exhibits.$slug.tsx";
import * as newExhibit from "../../app/routes/studio/exhibits.new.tsx";
import * as list from "../../app/routes/studio/exhibits.tsx";
import * as scheduleRoute from "../../app/routes/studio/exhibits.$slug.schedule-csv.ts";
import * as pointsRoute from "../../app/routes/studio/exhibits.$slug.points-geojson.ts";
import * as compareRoute from "../../app/routes/editions.compare.tsx";
import { AuditEvent, DatedEvent, DecaySystem, Exhibit, Marker, Membership, Organisation, User, WarningAcknowledgement } from "../../db/models/index.ts";
import { computeExhibit, isAcknowledged, standardDurations, withAcknowledgements } from "../../app/lib/exhibit/index.ts";
import { readCsv } from "../../app/lib/timescale/csv.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle } from "../helpers/db.ts";

type Body = Record<string, unknown> & { error?: string; fields?: Record<string, string> };

let org: Organisation;
let designerCookie: string;
let reviewerCookie: string;
let outsiderCookie: string;

function multipart(url: string, fields: Record<string, string>, file: { name: string; text: string } | null, cookie: string) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  if (file) form.set("routeFile", new File([file.text], file.name));
  return new Request(new URL(url, "http://test.local"), { method: "POST", body: form, headers: { Cookie: cookie, "x-eonscale-client-ip": "203.0.113.20" } });
}

const wall = { title: "Test wall", editionSlug: "ics-2024-12", mediumKind: "length", spanOlderValue: "538.8", spanOlderUnit: "Ma", spanYoungerValue: "0", spanYoungerUnit: "Ma", mediumType: "wall", unitsPreference: "metric", lengthValue: "10.776", lengthUnit: "m" };

async function create(fields: Record<string, string>, file: { name: string; text: string } | null = null, cookie = designerCookie) {
  return settle(() => newExhibit.action(routeArgs(multipart("/studio/exhibits/new", fields, file, cookie))));
}

async function post(slug: string, fields: Record<string, string>, cookie = designerCookie) {
  return settle(() => composer.action(routeArgs(formRequest(`/studio/exhibits/${slug}`, fields, { cookie }), { slug })));
}

async function load(slug: string, cookie = designerCookie) {
  const res = await settle(() => composer.loader(routeArgs(getRequest(`/studio/exhibits/${slug}`, { cookie }), { slug })));
  return res as { status: number; body: Awaited<ReturnType<typeof composer.loader>> };
}

async function revisionOf(slug: string) {
  return (await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!.revision;
}

beforeAll(async () => {
  org = await createOrganisation();
  designerCookie = await cookieFor((await createMember(org, "designer")).user.id);
  reviewerCookie = await cookieFor((await createMember(org, "reviewer")).user.id);
  outsiderCookie = await cookieFor((await createMember(await createOrganisation(), "designer")).user.id);
});

describe("creating an exhibit", () => {
  it("creates a wall exhibit and audits it", async () => {
    const res = await create({ ...wall, slug: "test-wall" });
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe("/studio/exhibits/test-wall");
    const e = await Exhibit.findOne({ where: { organisationId: org.id, slug: "test-wall" } });
    expect(e).toMatchObject({ title: "Test wall", revision: 1, status: "draft" });
    expect(await AuditEvent.count({ where: { objectType: "exhibit", objectId: String(e!.id), action: "exhibit.create" } })).toBe(1);
  });

  it.each([
    [{ title: "" }, "title", /title/],
    [{ spanOlderValue: "abc" }, "spanOlderValue", /must be a number/],
    [{ spanOlderValue: "10", spanYoungerValue: "20" }, "spanOlderValue", /older end of the span must be older/],
    [{ spanOlderUnit: "Myr" }, "spanOlderUnit", /age unit/],
    [{ lengthValue: "-3" }, "lengthValue", /greater than zero/],
    [{ lengthUnit: "furlong" }, "lengthUnit", /length unit/],
    [{ mediumType: "mural" }, "mediumType", /Choose what the exhibit is/],
    [{ unitsPreference: "imperial" }, "unitsPreference", /metric or US/],
    [{ slug: "Not A Slug!" }, "slug", /lower-case letters/],
    [{ editionSlug: "ics-1999-01" }, "editionSlug", /published chart edition/],
  ])("refuses %o with a message on %s and saves nothing", async (change, field, message) => {
    const before = await Exhibit.count();
    const res = await create({ ...wall, slug: `bad-${Math.random().toString(36).slice(2, 8)}`, ...change });
    expect(res.status).toBe(400);
    expect((res.body as Body).fields?.[field]).toMatch(message);
    expect(await Exhibit.count()).toBe(before);
  });

  it("refuses a duplicate slug in the same organisation", async () => {
    const res = await create({ ...wall, slug: "test-wall" });
    expect((res.body as Body).fields?.slug).toMatch(/already has an exhibit/);
  });

  it("creates a route exhibit from a GPX file and measures it on the ellipsoid", async () => {
    const gpx = `<?xml version="1.0"?><gpx version="1.1" creator="test" xmlns="http://www.topografix.com/GPX/1/1"><trk><name>t</name><trkseg>
      <trkpt lat="54.0" lon="-3.0"></trkpt><trkpt lat="54.001" lon="-2.999"></trkpt><trkpt lat="54.002" lon="-2.997"></trkpt></trkseg></trk></gpx>`;
    const res = await create({ ...wall, slug: "test-route", mediumKind: "route", mediumType: "trail" }, { name: "path.gpx", text: gpx });
    expect(res.status).toBe(302);
    const { body } = await load("test-route");
    const medium = body.spec.medium;
    expect(medium.kind).toBe("route");
    // GeographicLib (Karney 2013) as the reference for the two legs.
    const g = geodesic.Geodesic.WGS84;
    const ref = g.Inverse(54.0, -3.0, 54.001, -2.999).s12! + g.Inverse(54.001, -2.999, 54.002, -2.997).s12!;
    expect(medium.kind === "route" && Math.abs(medium.lengthMetres - ref)).toBeLessThan(1e-6);
  });

  it("replaces the route of a route exhibit from the composer; a broken file changes nothing", async () => {
    const rev = await revisionOf("test-route");
    const geojson = JSON.stringify({ type: "Feature", properties: {}, geometry: { type: "LineString", coordinates: [[-3, 54], [-3, 54.01]] } });
    const ok = await settle(() => composer.action(routeArgs(multipart("/studio/exhibits/test-route", { intent: "replace-route", revision: String(rev) }, { name: "new.geojson", text: geojson }, designerCookie), { slug: "test-route" })));
    expect(ok.status).toBe(302);
    const { body } = await load("test-route");
    const g = geodesic.Geodesic.WGS84;
    expect(body.spec.medium.kind === "route" && Math.abs(body.spec.medium.lengthMetres - g.Inverse(54, -3, 54.01, -3).s12!)).toBeLessThan(1e-6);
    const bad = await settle(() => composer.action(routeArgs(multipart("/studio/exhibits/test-route", { intent: "replace-route", revision: String(rev + 1) }, { name: "bad.geojson", text: "{" }, designerCookie), { slug: "test-route" })));
    expect(bad.status).toBe(400);
    expect((bad.body as Body).fields?.routeFile).toMatch(/neither GPX nor valid GeoJSON/);
    expect(await revisionOf("test-route")).toBe(rev + 1);
  });

  it("refuses a broken route file with the reason", async () => {
    const res = await create({ ...wall, slug: "broken-route", mediumKind: "route", mediumType: "trail" }, { name: "x.geojson", text: '{"type":"LineString","coordinates":[[200,10],[1,2]]}' });
    expect(res.status).toBe(400);
    expect((res.body as Body).fields?.routeFile).toMatch(/longitude/i);
    expect(await Exhibit.count({ where: { slug: "broken-route" } })).toBe(0);
  });
});

describe("composing", () => {
  it("adds every period base, a library event and a custom age; numbers them from the older end", async () => {
    let rev = await revisionOf("test-wall");
    expect((await post("test-wall", { intent: "add-boundaries", rank: "period", revision: String(rev) })).status).toBe(302);
    rev++;
    const event = await DatedEvent.findOne({ where: { organisationId: null }, order: [["ageMa", "ASC"]] });
    expect((await post("test-wall", { intent: "add-event", eventId: String(event!.id), revision: String(rev) })).status).toBe(302);
    rev++;
    expect((await post("test-wall", { intent: "add-custom", label: "Local quarry opened", ageValue: "150", ageUnit: "a", uncertaintyValue: "10", source: "Parish records (invented test source)", text: "A *small* quarry.", revision: String(rev) })).status).toBe(302);
    const { body } = await load("test-wall");
    expect(body.markers.filter((m) => m.kind === "boundary").map((m) => m.intervalName)).toEqual(["Cambrian", "Ordovician", "Silurian", "Devonian", "Carboniferous", "Permian", "Triassic", "Jurassic", "Cretaceous", "Paleogene", "Neogene", "Quaternary"]);
    expect(body.markers[0]).toMatchObject({ number: 1, intervalName: "Cambrian", ageMa: 538.8 });
    const custom = body.markers.find((m) => m.kind === "custom")!;
    expect(custom).toMatchObject({ label: "Local quarry opened", ageMa: 0.00015, uncertaintyMa: 0.00001 });
    expect(custom.html).toBe("<p>A <em>small</em> quarry.</p>");
    expect(body.exhibit.revision).toBe(rev + 1);
  });

  it("sanitises marker Markdown", async () => {
    const rev = await revisionOf("test-wall");
    const marker = await Marker.findOne({ where: { kind: "custom" }, order: [["id", "DESC"]] });
    await post("test-wall", { intent: "edit-marker", markerId: String(marker!.id), label: "Quarry", text: 'Hi <script>alert(1)</script><img src=x onerror=alert(1)> [link](javascript:alert(1))', revision: String(rev) });
    const { body } = await load("test-wall");
    const html = body.markers.find((m) => m.id === String(marker!.id))!.html;
    expect(html).not.toMatch(/script|onerror|javascript:/i);
  });

  it("a marker with a decay system says how much of the parent is left (Jaffey et al. 1971 half-life of U-238)", async () => {
    const rev = await revisionOf("test-wall");
    const cambrian = (await load("test-wall")).body.markers.find((m) => m.intervalName === "Cambrian")!;
    const u238 = await DecaySystem.findOne({ where: { slug: "u238-pb206" } }) ?? (await DecaySystem.findAll()).find((d) => /238/.test(d.parent))!;
    expect((await post("test-wall", { intent: "edit-marker", markerId: cambrian.id, label: cambrian.label, text: "", decaySystemId: String(u238.id), revision: String(rev) })).status).toBe(302);
    const after = (await load("test-wall")).body.markers.find((m) => m.id === cambrian.id)!;
    // e^(−ln2 · 538.8 / 4468.3) = 0.9198: about 92 % of the U-238 is left after 538.8 million years.
    expect(after.howWeKnow).toMatch(/92(\.\d+)?\s?%/);
    expect(after.decaySystemId).toBe(u238.id);
    const bad = await post("test-wall", { intent: "edit-marker", markerId: cambrian.id, label: cambrian.label, text: "", decaySystemId: "999999", revision: String(rev + 1) });
    expect((bad.body as Body).fields?.decaySystemId).toMatch(/not in the library/);
  });

  it.each([
    [{ intent: "add-custom", label: "No source", ageValue: "100", ageUnit: "Ma", source: "" }, "source", /Name the source/],
    [{ intent: "add-custom", label: "", ageValue: "100", ageUnit: "Ma", source: "Someone (2020)" }, "label", /label/],
    // by table number, label and age (not the engine's "points.3.age", a database id or years)
    [{ intent: "add-custom", label: "Too old", ageValue: "600", ageUnit: "Ma", source: "Someone (2020)" }, "_form", /^Not saved: Marker 1 “Too old” \(600 Ma\) lies outside the span \(538\.8 Ma to the present\)\.$/],
    [{ intent: "add-custom", label: "Bad unit", ageValue: "1", ageUnit: "Myr", source: "Someone (2020)" }, "ageUnit", /age unit/],
    [{ intent: "add-boundaries", intervalName: "Hadean" }, "intervalName", /outside this exhibit's span/],
    [{ intent: "add-boundaries" }, "intervalName", /Choose one interval, or a whole rank/],
    [{ intent: "add-inset", olderValue: "5", olderUnit: "ka", youngerValue: "10", youngerUnit: "ka", magnification: "100" }, "olderValue", /older age must be older/],
    [{ intent: "add-inset", olderValue: "10", olderUnit: "ka", youngerValue: "0", youngerUnit: "ka", magnification: "1" }, "magnification", /greater than 1/],
    [{ intent: "settings", ...wall, lengthValue: "0" }, "lengthValue", /greater than zero/],
    [{ intent: "settings", ...wall, spanOlderValue: "100" }, "_form", /^Not saved: \d+ markers lie outside the span \(100 Ma to the present\): 1 “[^”]+” \(5\d\d(\.\d+)? Ma\), 2 “/],
  ])("refuses %o (%s) and saves nothing", async (fields, field, message) => {
    const rev = await revisionOf("test-wall");
    const markers = await Marker.count();
    const res = await post("test-wall", { ...fields, revision: String(rev) } as Record<string, string>);
    expect(res.status).toBe(400);
    const body = res.body as Body;
    expect(field === "_form" ? body.error : body.fields?.[field]).toMatch(message);
    expect(await revisionOf("test-wall")).toBe(rev);
    expect(await Marker.count()).toBe(markers);
  });

  it("refuses a save based on an older revision and keeps the other person's change", async () => {
    const rev = await revisionOf("test-wall");
    const first = await post("test-wall", { intent: "settings", ...wall, title: "Renamed by the first designer", revision: String(rev) });
    expect(first.status).toBe(302);
    const second = await post("test-wall", { intent: "settings", ...wall, title: "Renamed by the second designer", revision: String(rev) });
    expect(second.status).toBe(409);
    expect((second.body as Body).error).toMatch(/Not saved: .* saved a newer version of this exhibit \(revision \d+\)/);
    const e = await Exhibit.findOne({ where: { organisationId: org.id, slug: "test-wall" } });
    expect(e!.title).toBe("Renamed by the first designer");
    expect(e!.revision).toBe(rev + 1);
  });

  it("lists the exhibit with its medium, length and edition", async () => {
    const res = await settle(() => list.loader(routeArgs(getRequest("/studio/exhibits?sort=title", { cookie: reviewerCookie }))));
    const rows = (res.body as Awaited<ReturnType<typeof list.loader>>).rows;
    expect(rows.find((r) => r.slug === "test-wall")).toMatchObject({ medium: "wall", length: "10.776 m", edition: "ICS 2024/12", needsRecheck: false });
  });
});

describe("roles and organisations", () => {
  it("a reviewer can read but not change an exhibit (403), and cannot create one", async () => {
    expect((await load("test-wall", reviewerCookie)).status).toBe(200);
    const res = await post("test-wall", { intent: "add-boundaries", rank: "era", revision: "1" }, reviewerCookie);
    expect(res.status).toBe(403);
    expect((await create({ ...wall, slug: "by-reviewer" }, null, reviewerCookie)).status).toBe(403);
  });

  it("another organisation's designer gets 404 on the page, the action and the exports", async () => {
    expect((await load("test-wall", outsiderCookie)).status).toBe(404);
    expect((await post("test-wall", { intent: "add-boundaries", rank: "era", revision: String(await revisionOf("test-wall")) }, outsiderCookie)).status).toBe(404);
    expect((await settle(() => scheduleRoute.loader(routeArgs(getRequest("/studio/exhibits/test-wall/schedule.csv", { cookie: outsiderCookie }), { slug: "test-wall" })))).status).toBe(404);
  });
});

describe("the demo exhibits", () => {
  let marrowby: { designer: string; reviewer: string };
  beforeAll(async () => {
    const org = await Organisation.findOne({ where: { slug: "marrowby" } });
    const cookieOf = async (email: string) => cookieFor((await User.findOne({ where: { email } }))!.id, org!.id);
    marrowby = { designer: await cookieOf("designer@marrowby.example"), reviewer: await cookieOf("reviewer@marrowby.example") };
    expect(await Membership.count({ where: { organisationId: org!.id } })).toBeGreaterThanOrEqual(4);
  });

  it("riverside-walk is 4,567 m on the ellipsoid (GeographicLib) with an inset for the last 10,000 years", async () => {
    const { body } = await load("riverside-walk", marrowby.designer);
    const medium = body.spec.medium;
    if (medium.kind !== "route") throw new Error("riverside-walk must be a route");
    const g = geodesic.Geodesic.WGS84;
    const c = medium.geometry.coordinates as number[][];
    let ref = 0;
    for (let i = 1; i < c.length; i++) ref += g.Inverse(c[i - 1][1], c[i - 1][0], c[i][1], c[i][0]).s12!;
    expect(Math.abs(ref - 4567)).toBeLessThan(0.5);
    expect(body.spec.insets.map((i) => i.label)).toContain("last 10,000 years at 1,000×");
    const kinds = body.markers.map((m) => m.kind);
    expect(kinds.filter((k) => k === "event").length).toBeGreaterThanOrEqual(10);
    // The base of every eon, era and period; boundaries sharing an age share one marker.
    for (const name of ["Hadean", "Archean", "Eoarchean", "Proterozoic", "Siderian", "Phanerozoic", "Paleozoic", "Cambrian", "Mesozoic", "Triassic", "Cenozoic", "Paleogene", "Cretaceous", "Quaternary"]) {
      expect(body.markers.some((m) => m.kind === "boundary" && new RegExp(`\\b${name}\\b`).test(m.label))).toBe(true);
    }
    expect(body.markers.find((m) => m.label === "Base of the Phanerozoic, Paleozoic and Cambrian")).toMatchObject({ intervalName: "Phanerozoic", ageMa: 538.8 });
  });

  it("the schedule CSV has the documented header and distances from the scale engine", async () => {
    const res = await scheduleRoute.loader(routeArgs(getRequest("/studio/exhibits/school-rope/schedule.csv", { cookie: marrowby.reviewer }), { slug: "school-rope" }));
    expect(res.headers.get("Content-Type")).toMatch(/text\/csv/);
    const rows = readCsv(await res.text()).records.map((r) => r.fields);
    const [header, ...data] = rows as string[][];
    // The header as README.md documents it for fabricators (written out, not read from the code).
    expect(header).toEqual(["number", "label", "kind", "interval", "event", "age_ma", "age_uncertainty_ma", "source", "from_start_m", "to_end_m", "latitude", "longitude", "walk_minutes"]);
    const archean = data.find((r) => r[3] === "Archean")!;
    // Linear scale (common practice): (older − age) / (older − younger) × length.
    expect(archean.slice(0, 6)).toEqual([archean[0], "Base of the Archean and Eoarchean", "boundary", "Archean", "", "4031"]);
    expect(archean[8]).toBe((((4567 - 4031) / 4567) * 46).toFixed(3));
    expect(archean[9]).toBe(((4031 / 4567) * 46).toFixed(3));
    expect(archean.slice(10)).toEqual(["", "", ""]);
    const event = data.find((r) => r[2] === "event")!;
    expect(event[3]).toBe("");
    expect(event[4]).not.toBe("");
    expect(event[7].length).toBeGreaterThan(10);
  });

  it("the riverside schedule and GeoJSON carry coordinates (7 decimals) and walking minutes", async () => {
    const res = await scheduleRoute.loader(routeArgs(getRequest("/studio/exhibits/riverside-walk/schedule.csv", { cookie: marrowby.designer }), { slug: "riverside-walk" }));
    const data = (readCsv(await res.text()).records.map((r) => r.fields) as string[][]).slice(1);
    const hadean = data.find((r) => r[3] === "Hadean")!;
    expect(hadean[8]).toBe("0.000");
    expect(hadean[10]).toMatch(/^54\.4321000$/);
    expect(hadean[11]).toMatch(/^-2\.9876000$/);
    const quaternary = data.find((r) => r[3] === "Quaternary")!;
    expect(Number(quaternary[8])).toBeCloseTo(4567 - 2.58, 3);
    expect(Number(quaternary[12])).toBeCloseTo((4567 - 2.58) / 1.2 / 60, 1);
    const geo = await pointsRoute.loader(routeArgs(getRequest("/studio/exhibits/riverside-walk/points.geojson", { cookie: marrowby.designer }), { slug: "riverside-walk" }));
    const fc = JSON.parse(await geo.text());
    expect(fc.type).toBe("FeatureCollection");
    expect(fc.features.length).toBe(data.length + 1); // the route (a LineString), then a Point per marker
  });

  it("the edition compare page lists the organisation's exhibits each moved boundary affects", async () => {
    const res = await settle(() => compareRoute.loader(routeArgs(getRequest("/editions/compare?from=ics-2023-09&to=ics-2024-12", { cookie: marrowby.designer }))));
    const pair = (res.body as { pair: { moved: { names: string[]; exhibits: { slug: string }[] }[]; affected: number; showExhibits: boolean } }).pair;
    expect(pair.showExhibits).toBe(true);
    const cretaceous = pair.moved.find((m) => m.names.includes("Cretaceous"))!;
    expect(cretaceous.exhibits.map((e) => e.slug)).toEqual(["corridor-wall"]);
    expect(pair.affected).toBe(1);
    // Visitors see the comparison but no exhibits.
    const anon = await settle(() => compareRoute.loader(routeArgs(getRequest("/editions/compare?from=ics-2023-09&to=ics-2024-12"))));
    expect((anon.body as { pair: { showExhibits: boolean } }).pair.showExhibits).toBe(false);
  });

  it("corridor-wall needs re-check: the Cretaceous base moves from 145 to 143.1 Ma, 6.3 cm towards the present; re-pinning clears it", async () => {
    const { body } = await load("corridor-wall", marrowby.designer);
    expect(body.impact).not.toBeNull();
    const row = body.impact!.report.rows.find((r) => r.intervalName === "Cretaceous")!;
    // ICS chart 2023/09 vs 2024/12: base of the Cretaceous ~145.0 → 143.1 Ma.
    expect(row).toMatchObject({ oldAgeMa: 145, newAgeMa: 143.1 });
    // 1.9 Ma on an 18 m wall spanning 538.8 Ma.
    expect(row.shiftMetres!).toBeCloseTo((1.9e6 * 18) / 538.8e6, 9);
    const devonian = body.impact!.report.rows.find((r) => r.intervalName === "Devonian")!;
    expect(devonian).toMatchObject({ oldAgeMa: 419.2, newAgeMa: 419.62 });
    const res = await post("corridor-wall", { intent: "repin", revision: String(body.exhibit.revision) }, marrowby.designer);
    expect(res.status).toBe(302);
    const after = await load("corridor-wall", marrowby.designer);
    expect(after.body.impact).toBeNull();
    expect(after.body.edition.slug).toBe("ics-2024-12");
    expect(after.body.markers.find((m) => m.intervalName === "Cretaceous")!.ageMa).toBe(143.1);
  });
});

describe("same-age markers, acknowledging and combining (issue 10)", () => {
  const rope = { ...wall, title: "Acknowledge rope", spanOlderValue: "4567", mediumType: "rope", lengthValue: "46" };
  const slug = "ack-rope";
  async function warnings() {
    const view = (await load(slug)).body;
    const c = computeExhibit(view.spec, view.markers, standardDurations(80));
    if (!c.ok) throw new Error(c.message);
    return { view, warnings: c.result.warnings };
  }
  const ackRows = async () => WarningAcknowledgement.count({ where: { exhibitId: (await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!.id } });

  beforeAll(async () => {
    expect((await create({ ...rope, slug })).status).toBe(302);
    expect((await post(slug, { intent: "add-boundaries", rank: "eon", revision: String(await revisionOf(slug)) })).status).toBe(302);
    expect((await post(slug, { intent: "add-boundaries", rank: "era", revision: String(await revisionOf(slug)) })).status).toBe(302);
  });

  it("says which markers share an age, by table number and label, with a stable key of their ids", async () => {
    const { view, warnings: ws } = await warnings();
    const same = ws.filter((w) => w.code === "markers-same-age");
    // ICS 2024/12: the Archean and Eoarchean begin at 4031 Ma, the Proterozoic and Paleoproterozoic at 2500 Ma, the Phanerozoic and Paleozoic at 538.8 Ma.
    expect(same.map((w) => w.markers.map((m) => m.label))).toEqual([
      ["Base of the Archean", "Base of the Eoarchean"],
      ["Base of the Proterozoic", "Base of the Paleoproterozoic"],
      ["Base of the Phanerozoic", "Base of the Paleozoic"],
    ]);
    const archean = view.markers.find((m) => m.intervalName === "Archean")!;
    const eoarchean = view.markers.find((m) => m.intervalName === "Eoarchean")!;
    expect(same[0].key).toBe(`markers-same-age:${[archean.id, eoarchean.id].sort((a, b) => Number(a) - Number(b)).join(",")}`);
    expect(same[0].markers.map((m) => m.number)).toEqual([archean.number, eoarchean.number]);
    expect(same[0].message).toContain(`Markers ${archean.number} “Base of the Archean” and ${eoarchean.number} “Base of the Eoarchean” have the same age (4.031 billion years ago)`);
  });

  it.each([
    [{ warningKey: "markers-same-age:1,2", reason: "" }, "reason", /Say why this warning is acceptable/],
    [{ warningKey: "markers-same-age:1,2", reason: "short" }, "reason", /at least 10 characters/],
    [{ warningKey: "markers-same-age:1,2", reason: "x".repeat(1001) }, "reason", /under 1,000 characters/],
    [{ warningKey: "", reason: "The signs share one post." }, "warningKey", /lost which warning/],
    [{ warningKey: "markers-too-close:999998,999999", reason: "The signs share one post." }, "warningKey", /not on this exhibit any more/],
  ])("refuses acknowledging %o with a message on %s, storing nothing", async (fields, field, message) => {
    const rev = await revisionOf(slug);
    const res = await post(slug, { intent: "acknowledge-warning", revision: String(rev), ...fields });
    expect(res.status).toBe(400);
    expect((res.body as Body).fields?.[field]).toMatch(message);
    expect(await ackRows()).toBe(0);
    expect(await revisionOf(slug)).toBe(rev);
  });

  it("stores an acknowledgement with its reason, revision-checked and audited; the composer shows it", async () => {
    const { warnings: ws } = await warnings();
    const w = ws.find((x) => x.code === "markers-same-age")!;
    const rev = await revisionOf(slug);
    const stale = await post(slug, { intent: "acknowledge-warning", revision: String(rev - 1), warningKey: w.key, reason: "The two signs share one post." });
    expect(stale.status).toBe(409);
    expect(await ackRows()).toBe(0);
    const res = await post(slug, { intent: "acknowledge-warning", revision: String(rev), warningKey: w.key, reason: "The two signs share one post." });
    expect(res.status).toBe(302);
    expect(await revisionOf(slug)).toBe(rev + 1);
    const { view, warnings: after } = await warnings();
    expect(view.acknowledgements).toEqual([expect.objectContaining({ warningKey: w.key, reason: "The two signs share one post.", revision: rev + 1 })]);
    const shown = withAcknowledgements(after, view.acknowledgements);
    expect(shown.filter((x) => x.acknowledgement).map((x) => x.key)).toEqual([w.key]);
    expect(isAcknowledged(w, view.acknowledgements)).toBe(true);
    const audit = await AuditEvent.findOne({ where: { action: "exhibit.warnings.acknowledge" }, order: [["id", "DESC"]] });
    expect(audit!.details).toMatchObject({ warningKey: w.key, reason: "The two signs share one post." });
  });

  it("combines same-age markers into one labelled with every name; the old warning and its acknowledgement no longer apply", async () => {
    const { view, warnings: ws } = await warnings();
    const w = ws.find((x) => x.code === "markers-same-age")!;
    const before = await Marker.count({ where: { exhibitId: (await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!.id } });
    const rev = await revisionOf(slug);
    const res = await post(slug, { intent: "combine-markers", revision: String(rev), markerIds: w.pointIds.join(",") });
    expect(res.status).toBe(302);
    const { view: after, warnings: now } = await warnings();
    expect(after.markers).toHaveLength(before - 1);
    const kept = after.markers.find((m) => m.ageMa === 4031)!;
    expect(kept).toMatchObject({ label: "Base of the Archean and Eoarchean", intervalName: "Archean", kind: "boundary" });
    expect(now.some((x) => x.key === w.key)).toBe(false);
    expect(withAcknowledgements(now, after.acknowledgements).some((x) => x.acknowledgement)).toBe(false); // stored, but its warning is gone
    expect(now.filter((x) => x.code === "markers-same-age")).toHaveLength(2);
    const audit = await AuditEvent.findOne({ where: { action: "exhibit.markers.combine" }, order: [["id", "DESC"]] });
    expect(audit!.details).toMatchObject({ label: "Base of the Archean and Eoarchean", kept: Number(kept.id) });
    // adding every era again does not bring the Eoarchean back as its own marker
    const again = await post(slug, { intent: "add-boundaries", rank: "era", revision: String(await revisionOf(slug)) });
    expect((again.body as Body).fields?.rank).toMatch(/Every era base is already a marker/);
    void view;
  });

  it.each([
    ["one marker", (ids: string[]) => ids.slice(0, 1).join(","), /at least two markers/],
    ["markers of different ages", (ids: string[]) => ids.join(","), /Only markers of the same age can be combined/],
    ["a marker of another exhibit", () => "999998,999999", /not on this exhibit/],
    ["the same marker twice", (ids: string[]) => `${ids[0]},${ids[0]}`, /named twice/],
  ])("refuses to combine %s, changing nothing", async (_what, pick, message) => {
    const { view } = await warnings();
    const ids = view.markers.slice(0, 2).map((m) => m.id);
    const rev = await revisionOf(slug);
    const count = await Marker.count();
    const res = await post(slug, { intent: "combine-markers", revision: String(rev), markerIds: pick(ids) });
    expect(res.status).toBe(400);
    expect((res.body as Body).fields?.markerIds).toMatch(message);
    expect(await Marker.count()).toBe(count);
    expect(await revisionOf(slug)).toBe(rev);
  });
});
