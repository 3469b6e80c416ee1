// The fabrication files against the real database, S3 stand-in and the seeded demo: a panel PDF's
// page size (points → mm) and its marker ticks read back from the PDF's own drawing operations
// (pdfjs-dist operator lists) against the scale engine's distances; sign sheets whose QR codes,
// rendered by Debian's pdftoppm and decoded by jsQR, give the marker's visitor page; the trailhead
// board and profile.json of the published riverside walk (its demo elevations have one stretch
// over the ABA limits); the schedule workbook read back by exceljs; the kit ZIP's entries; the
// background job for many panels (202 → progress → the file from S3); refusals that name the field.
import { execFileSync } from "node:child_process";
import { mkdtemp, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import ExcelJS from "exceljs";
import jsQR from "jsqr";
import { beforeAll, describe, expect, it } from "vitest";
import * as panelsRoute from "../../app/routes/studio/exhibits.$slug.panels-pdf.ts";
import * as panelsZipRoute from "../../app/routes/studio/exhibits.$slug.panels-zip.ts";
import * as signsRoute from "../../app/routes/studio/exhibits.$slug.signs-pdf.ts";
import * as profileRoute from "../../app/routes/studio/exhibits.$slug.profile-json.ts";
import * as xlsxRoute from "../../app/routes/studio/exhibits.$slug.schedule-xlsx.ts";
import * as kitRoute from "../../app/routes/studio/exhibits.$slug.kit-zip.ts";
import * as jobRoute from "../../app/routes/studio/exhibits.$slug.exports.$jobId.ts";
import * as jobFileRoute from "../../app/routes/studio/exhibits.$slug.exports.$jobId.file.ts";
import * as signsPage from "../../app/routes/studio/exhibits.$slug.signs.tsx";
import * as publicFile from "../../app/routes/api.exhibits.$org.$slug.publications.$number.$file.ts";
import { artHeightMm } from "../../app/lib/fabrication/panel-page.ts";
import { tilePanels } from "../../app/lib/fabrication/panels.ts";
import { Organisation, User } from "../../db/models/index.ts";
import { env } from "../../server/env.server.ts";
import { loadBundle, resultOf } from "../../server/exhibits/load.server.ts";
import { runExportJob } from "../../server/exports/fabrication/jobs.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle } from "../helpers/db.ts";
import { AuditEvent } from "../../db/models/index.ts";
import { MM_PER_POINT, openPdf, pageText, renderPage, rgba, strokedSegments } from "../helpers/pdf.ts";

let designer: string;
let outsider: string;
let orgId: number;
let base: string;
type Loader = (args: never) => unknown;

async function get(loader: Loader, slug: string, file: string, query = "", cookie = designer): Promise<Response> {
  return (await loader(routeArgs(getRequest(`/studio/exhibits/${slug}/${file}${query}`, { cookie }), { slug }))) as Response;
}
async function bytesOf(res: Response): Promise<Uint8Array> {
  expect(res.status, res.status === 200 ? "" : await res.clone().text()).toBe(200);
  return new Uint8Array(await res.arrayBuffer());
}

beforeAll(async () => {
  const org = await Organisation.findOne({ where: { slug: "marrowby" } });
  orgId = org!.id;
  designer = await cookieFor((await User.findOne({ where: { email: "designer@marrowby.example" } }))!.id, org!.id);
  outsider = await cookieFor((await createMember(await createOrganisation(), "designer")).user.id);
  base = env().APP_URL.replace(/\/+$/, "");
});

describe("panels.pdf (corridor-wall, 18 m)", () => {
  const W = 600;
  const H = 400;
  const B = 3;
  const query = `?from=draft&width=${W}&height=${H}&overlap=20&bleed=${B}&background=no`;

  it("page size = panel + bleed (points → mm), one page per panel, every page says DRAFT", async () => {
    const res = await get(panelsRoute.loader, "corridor-wall", "panels.pdf", query);
    expect(res.headers.get("Content-Type")).toBe("application/pdf");
    expect(res.headers.get("Content-Disposition")).toMatch(/corridor-wall-draft-rev\d+-panels\.pdf/);
    const pdf = await openPdf(await bytesOf(res));
    expect(pdf.numPages).toBe(tilePanels(18000, { widthMm: W, overlapMm: 20 }).length); // ⌈(18000 − 20) / 580⌉ = 31
    expect(pdf.numPages).toBe(31);
    for (const n of [1, 16, 31]) {
      const page = await pdf.getPage(n);
      const [x0, y0, x1, y1] = page.view;
      expect((x1 - x0) * MM_PER_POINT).toBeCloseTo(W + 2 * B, 2);
      expect((y1 - y0) * MM_PER_POINT).toBeCloseTo(H + 2 * B, 2);
      const text = await pageText(page);
      expect(text).toContain("DRAFT — not checked");
      expect(text).toContain(`Panel ${n} of 31`);
    }
  });

  it("each marker's tick sits at the scale engine's distance to 0.1 mm (read from the PDF's stroke operations)", async () => {
    const bundle = (await loadBundle(orgId, "corridor-wall"))!;
    const engine = resultOf(bundle).points; // the engine's own figures, metres from the older end
    const pdf = await openPdf(await bytesOf(await get(panelsRoute.loader, "corridor-wall", "panels.pdf", query)));
    const panels = tilePanels(18000, { widthMm: W, overlapMm: 20 });
    const tickLength = 0.37 * artHeightMm(H); // the tick crosses the interval bands: from 13 % to 50 % of the drawing's height
    const byPage = new Map<number, Awaited<ReturnType<typeof strokedSegments>>>();
    let checked = 0;
    for (const p of engine) {
      const x = p.fromOlderEndMetres * 1000;
      const panel = panels.find((q) => x >= q.startMm && x < q.endMm) ?? panels[panels.length - 1];
      if (!byPage.has(panel.number)) byPage.set(panel.number, await strokedSegments(await pdf.getPage(panel.number)));
      const ticks = byPage.get(panel.number)!.filter((s) => Math.abs(s.x1 - s.x2) < 1e-6 && Math.abs(Math.abs(s.y2 - s.y1) * MM_PER_POINT - tickLength) < 0.05);
      const expected = B + x - panel.startMm;
      const nearest = Math.min(...ticks.map((s) => Math.abs(s.x1 * MM_PER_POINT - expected)));
      expect(nearest, `marker ${p.id} at ${x.toFixed(2)} mm on panel ${panel.number}`).toBeLessThanOrEqual(0.1);
      checked++;
    }
    expect(checked).toBe(bundle.markers.length);
    expect(checked).toBeGreaterThan(5);
  });

  it("bad options answer 400 naming the field; a route exhibit has no panels; another organisation gets 404", async () => {
    const bad = await settle(() => panelsRoute.loader(routeArgs(getRequest("/studio/exhibits/corridor-wall/panels.pdf?from=draft&width=abc", { cookie: designer }), { slug: "corridor-wall" })));
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain("width: a number of millimetres");
    const overlap = await settle(() => panelsRoute.loader(routeArgs(getRequest("/studio/exhibits/corridor-wall/panels.pdf?from=draft&width=600&overlap=400", { cookie: designer }), { slug: "corridor-wall" })));
    expect(JSON.stringify(overlap.body)).toMatch(/overlap: must be less than half/);
    const route = await settle(() => panelsRoute.loader(routeArgs(getRequest("/studio/exhibits/riverside-walk/panels.pdf", { cookie: designer }), { slug: "riverside-walk" })));
    expect(route.status).toBe(404);
    const other = await settle(() => panelsRoute.loader(routeArgs(getRequest("/studio/exhibits/corridor-wall/panels.pdf?from=draft", { cookie: outsider }), { slug: "corridor-wall" })));
    expect(other.status).toBe(404);
  });

  it("many panels go to a background job: 202 { jobUrl } → progress → the file from S3", async () => {
    const res = await get(panelsRoute.loader, "corridor-wall", "panels.pdf", `?from=draft&width=${W}&height=${H}`);
    expect(res.status).toBe(202);
    const { jobUrl, progress } = (await res.json()) as { jobUrl: string; progress: number };
    expect(progress).toBe(0);
    const jobId = jobUrl.split("/").pop()!;
    const status = async () => (await (jobRoute.loader(routeArgs(getRequest(jobUrl, { cookie: designer }), { slug: "corridor-wall", jobId })) as Promise<Response>)).json();
    expect(await status()).toMatchObject({ progress: 0, url: null });
    await runExportJob(jobId); // what the worker does
    const done = await status();
    expect(done).toMatchObject({ status: "done", progress: 1, url: `${jobUrl}/file` });
    const file = (await jobFileRoute.loader(routeArgs(getRequest(done.url, { cookie: designer }), { slug: "corridor-wall", jobId }))) as Response;
    const pdf = await openPdf(await bytesOf(file));
    expect(pdf.numPages).toBe(31);
    const other = await settle(() => jobRoute.loader(routeArgs(getRequest(jobUrl, { cookie: outsider }), { slug: "corridor-wall", jobId })));
    expect(other.status).toBe(404);
  });

  it("panels.zip holds one SVG per panel, sized in millimetres", async () => {
    const zip = await bytesOf(await get(panelsZipRoute.loader, "corridor-wall", "panels.zip", `?from=draft&width=${W}&height=${H}`));
    const names = await zipEntries(zip);
    expect(names.filter((n) => n.endsWith(".svg"))).toHaveLength(31);
    expect(names).toContain("README.txt");
  });
});

/** Entry names of a ZIP, listed by Python's zipfile (not by the code under test). */
async function zipEntries(bytes: Uint8Array): Promise<string[]> {
  const dir = await mkdtemp(path.join(tmpdir(), "eonscale-zip-"));
  const file = path.join(dir, "f.zip");
  await writeFile(file, bytes);
  const out = execFileSync("python3", ["-c", "import sys, zipfile; z = zipfile.ZipFile(sys.argv[1]); assert z.testzip() is None; print('\\n'.join(z.namelist()))", file]).toString();
  return out.trim().split("\n");
}

describe("signs.pdf (riverside-walk, publication 1)", () => {
  it("a production note then one wayside page per marker; the QR decodes to the marker's visitor page", async () => {
    const bytes = await bytesOf(await get(signsRoute.loader, "riverside-walk", "signs.pdf"));
    const pdf = await openPdf(bytes);
    const bundle = (await loadBundle(orgId, "riverside-walk"))!;
    expect(pdf.numPages).toBe(bundle.markers.length + 1);
    const note = await pageText(await pdf.getPage(1));
    expect(note).toContain("ADA §703.5.5");
    expect(note).toContain("production note");
    const page = await pdf.getPage(2);
    const [, , w, h] = page.view;
    expect(w * MM_PER_POINT).toBeCloseTo(914.4, 1); // 36 in wayside preset
    expect(h * MM_PER_POINT).toBeCloseTo(609.6, 1);
    const text = await pageText(page);
    const signNumber = Number(/^\s*(\d+)/.exec(text)?.[1]);
    const png = await renderPage(bytes, 2, 72, "sign");
    const { data, width, height } = await rgba(png);
    const code = jsQR(data, width, height);
    expect(code?.data).toBe(`${base}/visit/marrowby/riverside-walk/${signNumber}`);
  });

  it("custom size and reading distance: the note states the rule it applied; bad sizes are refused by field", async () => {
    const bytes = await bytesOf(await get(signsRoute.loader, "riverside-walk", "signs.pdf", "?size=custom&width=300&height=200&distance=3050&mounting=1500"));
    const pdf = await openPdf(bytes);
    const note = await pageText(await pdf.getPage(1));
    expect(note).toContain("16 + 3.2 × 1220 / 305 = 28.8 mm"); // ADA: baseline 1015–1780 mm read from 3050 mm
    expect(note).toMatch(/do not fit/); // 28.8 mm capitals on a 300 × 200 mm sign: text is cut and reported, not shrunk
    const [, , w] = (await pdf.getPage(2)).view;
    expect(w * MM_PER_POINT).toBeCloseTo(300, 2);
    const bad = await settle(() => signsRoute.loader(routeArgs(getRequest("/studio/exhibits/riverside-walk/signs.pdf?size=poster", { cookie: designer }), { slug: "riverside-walk" })));
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain("size: one of label, a4, letter, wayside");
  });
});

describe("trail profile (riverside-walk demo elevations)", () => {
  it("profile.json: samples, the stretch over the ABA limits with its `rule`, ascentMetres/descentMetres", async () => {
    const res = await get(profileRoute.loader, "riverside-walk", "profile.json");
    const body = JSON.parse(new TextDecoder().decode(await bytesOf(res)));
    expect(body.hasElevations).toBe(true);
    expect(body.method).toMatchObject({ sampleMetres: 5, windowMetres: 30 });
    expect(body.totals.ascentMetres).toBeGreaterThan(14);
    expect(body.totals.descentMetres).toBeGreaterThan(14);
    const flagged = body.stretches.filter((s: { rule: string | null }) => s.rule);
    expect(flagged).toHaveLength(1);
    expect(flagged[0].fromMetres).toBeGreaterThanOrEqual(1790);
    expect(flagged[0].toMetres).toBeLessThanOrEqual(1975);
    expect(flagged[0].rule).toMatch(/^ABA §1017/);
    expect(body.caution).toMatch(/does not replace a trail assessment/);
  });

  it("trailhead.pdf: an A3 board with ascent, the flagged stretch, walking times and the caution; public for the publication", async () => {
    const res = (await publicFile.loader(routeArgs(new Request(`http://test.local/api/exhibits/marrowby/riverside-walk/publications/1/trailhead.pdf`), { org: "marrowby", slug: "riverside-walk", number: "1", file: "trailhead.pdf" }))) as Response;
    const pdf = await openPdf(await bytesOf(res));
    const page = await pdf.getPage(1);
    expect(page.view[2] * MM_PER_POINT).toBeCloseTo(297, 1);
    const text = await pageText(page);
    for (const s of ["Total ascent", "Walking at 1.2 m/s", "Walking at 0.9 m/s", "ABA §1017", "does not replace a trail assessment"]) expect(text).toContain(s);
  });
});

describe("schedule.xlsx and kit.zip", () => {
  it("the workbook has a row per marker, numbers as numbers", async () => {
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load((await bytesOf(await get(xlsxRoute.loader, "riverside-walk", "schedule.xlsx"))) as never);
    const sheet = wb.getWorksheet("Markers")!;
    const bundle = (await loadBundle(orgId, "riverside-walk"))!;
    expect(sheet.rowCount).toBe(bundle.markers.length + 1);
    expect(typeof sheet.getRow(2).getCell(5).value).toBe("number");
    expect(sheet.getRow(1).getCell(1).value).toBe("Sign");
  });

  it("kit.zip of the publication holds the route's files", async () => {
    const names = await zipEntries(await bytesOf(await get(kitRoute.loader, "riverside-walk", "kit.zip")));
    expect(names.sort()).toEqual(["README.txt", "points.geojson", "points.gpx", "profile.json", "schedule.csv", "schedule.xlsx", "signs.pdf", "trailhead.pdf"]);
  });
});

describe("sign settings", () => {
  it("a designer saves them (audited) and the sign sheets use them; bad values answer 400 by field and change nothing; a reviewer may not", async () => {
    const post = (fields: Record<string, string>, cookie = designer) => settle(() => signsPage.action(routeArgs(formRequest("/studio/exhibits/riverside-walk/signs", fields, { cookie }), { slug: "riverside-walk" })));
    const bad = await post({ mountingHeightMm: "abc", viewingDistanceMm: "100" });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toContain("mountingHeightMm: a number of millimetres");
    expect(JSON.stringify(bad.body)).toContain("viewingDistanceMm: at least 200 mm");
    const before = await settle(() => signsPage.loader(routeArgs(getRequest("/studio/exhibits/riverside-walk/signs", { cookie: designer }), { slug: "riverside-walk" })));
    expect(before.body).toMatchObject({ settings: { mountingHeightMm: 1370, viewingDistanceMm: 1000, saved: false } });
    const ok = await post({ mountingHeightMm: "1500", viewingDistanceMm: "3050" });
    expect(ok.status).toBe(302);
    expect(await AuditEvent.count({ where: { action: "exhibit.sign-settings" } })).toBe(1);
    const note = await pageText(await (await openPdf(await bytesOf(await get(signsRoute.loader, "riverside-walk", "signs.pdf")))).getPage(1));
    expect(note).toContain("16 + 3.2 × 1220 / 305 = 28.8 mm"); // ADA Table 703.5.5 first row, read from 3050 mm (hand-computed)
    const reviewer = await cookieFor((await createMember((await Organisation.findOne({ where: { slug: "marrowby" } }))!, "reviewer")).user.id, orgId);
    expect((await post({ mountingHeightMm: "1200", viewingDistanceMm: "1000" }, reviewer)).status).toBe(403);
  });
});
