// The fabrication files in the export table (server/exports/registry.server.ts): print panels (PDF,
// and SVG in a ZIP), sign sheets, the trailhead board, the slope profile, the schedule workbook
// and the whole kit in one ZIP. Each streams; a panels.pdf of many pages asked for in the studio is
// made in the background (jobs.server.ts) and answered 202 `{ jobUrl }`.
import { PassThrough, Readable } from "node:stream";
import archiver from "archiver";
import type { PublicationSnapshot } from "../../../app/lib/publication/types.ts";
import { DRAFT_NOTICE, statusLine } from "../../../app/lib/exports/common.ts";
import { tilePanels } from "../../../app/lib/fabrication/panels.ts";
import { artHeightMm, indexStrip, panelPage } from "../../../app/lib/fabrication/panel-page.ts";
import { layoutStrip } from "../../../app/lib/fabrication/strip.ts";
import { pageSvg } from "../../../app/lib/fabrication/svg.ts";
import { FABRICATION_SOURCES } from "../../../app/lib/fabrication/sources.ts";
import { writeCsv } from "../../../app/lib/timescale/csv.ts";
import { SCHEDULE_COLUMNS, scheduleCells } from "../../../app/lib/fabrication/schedule.ts";
import { snapshotProfile, trailheadFacts, NO_ELEVATIONS, PLANNING_CAUTION } from "../../../app/lib/profile/trailhead.ts";
import type { ExportContext, ExportFile } from "../registry.server.ts";
import { pointsGeoJsonFile, pointsGpxFile } from "../points.server.ts";
import { panelsDocument, writePanels, type FileOptionsContext } from "../pdf/panels.server.ts";
import { panelOptionsFor, signOptionsFor } from "./options.server.ts";
import { signsDocument, writeSigns } from "../pdf/signs.server.ts";
import { trailheadDocument, writeTrailhead } from "../pdf/trailhead.server.ts";
import { pdfStream } from "../pdf/render.server.ts";
import { signSettingsForSlug } from "./sign-settings.server.ts";
import { PANELS_IN_BACKGROUND, queueExportJob } from "./jobs.server.ts";
import { scheduleXlsxResponse, writeScheduleXlsx, XLSX_TYPE } from "./xlsx.server.ts";

const ctxOf = (c: ExportContext): FileOptionsContext => ({ draft: c.draft, publication: c.publication, baseUrl: c.baseUrl });
const fileStem = (s: PublicationSnapshot, c: ExportContext) => `${s.exhibit.slug}-${c.publication ? `publication-${c.publication.number}` : `draft-rev${s.exhibit.revision}`}`;

/** Run a writer into a stream for a Response; a failure mid-way ends the stream with the error. */
function streamed(doc: PDFKit.PDFDocument, write: () => Promise<unknown> | void): Response {
  const body = pdfStream(doc);
  Promise.resolve()
    .then(write)
    .catch((error: Error) => doc.destroy(error));
  return new Response(body, { headers: { "Content-Type": "application/pdf" } });
}

export const panelsPdfFile: ExportFile = {
  title: "Print panels at 1:1 (PDF)",
  purpose: "For the printer: the strip at true size in panels of a chosen width and height with overlap, bleed and crop marks (?width=&height=&overlap=&bleed= in mm).",
  produce: async (snapshot, context) => {
    const o = panelOptionsFor(snapshot, context.query);
    if (context.audience === "member" && context.member && o.count > PANELS_IN_BACKGROUND && context.query.get("background") !== "no") {
      return queueExportJob("panels.pdf", snapshot, context, fileStem(snapshot, context));
    }
    const doc = panelsDocument(snapshot, ctxOf(context));
    return streamed(doc, () => writePanels(doc, snapshot, o, ctxOf(context)));
  },
};

/** One SVG per panel and a note, written into an archive. */
function appendPanelSvgs(zip: archiver.Archiver, snapshot: PublicationSnapshot, context: ExportContext, prefix = "") {
  const o = panelOptionsFor(snapshot, context.query);
  const status = statusLine(snapshot, ctxOf(context));
  const strip = layoutStrip(snapshot, { heightMm: artHeightMm(o.heightMm), status });
  const index = indexStrip(strip);
  const panels = tilePanels(strip.lengthMm, o);
  const digits = String(panels.length).length;
  for (const panel of panels) {
    const page = panelPage(strip, index, panel, { ...o, watermark: context.draft ? DRAFT_NOTICE : null, exhibitTitle: snapshot.exhibit.title });
    zip.append(pageSvg(page, `${snapshot.exhibit.title}: panel ${panel.number} of ${panel.count}${context.draft ? ` (${DRAFT_NOTICE})` : ""}`), { name: `${prefix}panel-${String(panel.number).padStart(digits, "0")}.svg` });
  }
  return o;
}

function zipResponse(build: (zip: archiver.Archiver) => Promise<void> | void): Response {
  const zip = archiver("zip", { zlib: { level: 6 } });
  const pass = new PassThrough();
  zip.pipe(pass);
  Promise.resolve()
    .then(() => build(zip))
    .then(() => zip.finalize())
    .catch((error: Error) => pass.destroy(error));
  return new Response(Readable.toWeb(pass) as unknown as ReadableStream, { headers: { "Content-Type": "application/zip" } });
}

export const panelsZipFile: ExportFile = {
  title: "Print panels at 1:1 (SVG, one file per panel, ZIP)",
  purpose: "For a designer's layout program: the same panels as the PDF, one SVG each, sized in millimetres.",
  produce: (snapshot, context) => {
    panelOptionsFor(snapshot, context.query); // 400 before any byte is sent
    return zipResponse((zip) => {
      const o = appendPanelSvgs(zip, snapshot, context);
      zip.append(readme(snapshot, context, [`Panels ${o.widthMm.toFixed(1)} × ${o.heightMm.toFixed(1)} mm, overlap ${o.overlapMm} mm, bleed ${o.bleedMm} mm.`, FABRICATION_SOURCES.overlap, FABRICATION_SOURCES.bleed]), { name: "README.txt" });
    });
  },
};

export const signsPdfFile: ExportFile = {
  title: "Sign sheets (PDF, one sign per page)",
  purpose: "For the sign maker: each marker's sign at real size with text sized for the reading distance and its QR code (?size=label|a4|letter|wayside, or width=&height= in mm; height= mounting, distance= viewing).",
  produce: async (snapshot, context) => {
    const settings = await signSettingsForSlug(snapshot.organisation.slug, snapshot.exhibit.slug);
    const o = signOptionsFor(snapshot, context.query, settings);
    const doc = signsDocument(snapshot, ctxOf(context));
    return streamed(doc, () => writeSigns(doc, snapshot, o, ctxOf(context)));
  },
};

export const trailheadPdfFile: ExportFile = {
  title: "Trailhead board (PDF)",
  purpose: "For the trailhead: length, ascent and descent, running slopes against the ABA limits, walking times, and the planning caution.",
  routeOnly: true,
  produce: (snapshot, context) => {
    const doc = trailheadDocument(snapshot, ctxOf(context));
    return streamed(doc, () => writeTrailhead(doc, snapshot, ctxOf(context)));
  },
};

/** The slope profile as JSON: samples, stretches with the ABA rule each breaks (`rule`), totals. */
export function profileJson(snapshot: PublicationSnapshot, context: Pick<ExportContext, "draft">) {
  const profile = snapshotProfile(snapshot);
  const head = { exhibit: snapshot.exhibit.slug, title: snapshot.exhibit.title, revision: snapshot.exhibit.revision, ...(context.draft ? { draft: true, notice: DRAFT_NOTICE } : { draft: false }) };
  if (!profile) return { ...head, hasElevations: false, message: NO_ELEVATIONS, caution: PLANNING_CAUTION };
  const facts = trailheadFacts(snapshot, profile);
  return {
    ...head,
    hasElevations: true,
    method: profile.method,
    totals: profile.totals,
    stretches: profile.stretches,
    samples: profile.samples,
    walking: facts.walking,
    notes: profile.notes,
    caution: PLANNING_CAUTION,
    sources: { aba: FABRICATION_SOURCES.aba, gpsHeights: FABRICATION_SOURCES.gpsHeights, walking: FABRICATION_SOURCES.walking },
  };
}

export const profileJsonFile: ExportFile = {
  title: "Trail slope profile (JSON)",
  purpose: "For accessibility planning: the route's elevation and running slope, stretches over the ABA §1017 limits with the rule each breaks, total ascent and descent.",
  routeOnly: true,
  produce: (snapshot, context) => new Response(JSON.stringify(profileJson(snapshot, context)), { headers: { "Content-Type": "application/json; charset=utf-8" } }),
};

export const scheduleXlsxFile: ExportFile = {
  title: "Marker schedule (Excel workbook)",
  purpose: "For the project manager: the schedule as a spreadsheet, numbers as numbers.",
  produce: (snapshot, context) => scheduleXlsxResponse(snapshot, ctxOf(context)),
};

function readme(snapshot: PublicationSnapshot, context: ExportContext, extra: string[] = []): string {
  return [
    `${snapshot.exhibit.title} (${snapshot.organisation.name})`,
    statusLine(snapshot, ctxOf(context)),
    `${snapshot.scale.statement.lengthPerTime}; ${snapshot.scale.statement.timePerLength}`,
    `Chart: ${snapshot.edition.label}`,
    ...extra,
    ...snapshot.cautions,
    "",
  ].join("\r\n");
}

async function appendResponse(zip: archiver.Archiver, name: string, response: Response | Promise<Response>) {
  const r = await response;
  if (r.status !== 200 || !r.body) return;
  const stream = Readable.fromWeb(r.body as never);
  await new Promise<void>((resolve, reject) => {
    zip.once("entry", () => resolve());
    stream.once("error", reject);
    zip.append(stream, { name });
  });
}

export const kitZipFile: ExportFile = {
  title: "Fabrication kit (ZIP)",
  purpose: "Everything for one publication in one download: panels or signs, trailhead board, profile, schedule, points.",
  produce: (snapshot, context) => {
    const route = snapshot.medium.kind === "route";
    const plain = { ...context, query: new URLSearchParams(), audience: "public" as const };
    return zipResponse(async (zip) => {
      zip.append(readme(snapshot, context, ["Files: " + (route ? "signs.pdf, trailhead.pdf, profile.json, schedule.xlsx, schedule.csv, points.geojson, points.gpx" : "panels.pdf, panels/*.svg, signs.pdf, schedule.xlsx, schedule.csv")]), { name: "README.txt" });
      if (!route) {
        const doc = panelsDocument(snapshot, ctxOf(context));
        const o = panelOptionsFor(snapshot, new URLSearchParams());
        const writing = writePanels(doc, snapshot, o, ctxOf(context));
        await appendResponse(zip, "panels.pdf", new Response(pdfStream(doc)));
        await writing;
        appendPanelSvgs(zip, snapshot, plain, "panels/");
      }
      await appendResponse(zip, "signs.pdf", signsPdfFile.produce(snapshot, plain));
      if (route) {
        await appendResponse(zip, "trailhead.pdf", trailheadPdfFile.produce(snapshot, plain));
        zip.append(JSON.stringify(profileJson(snapshot, context), null, 1), { name: "profile.json" });
        await appendResponse(zip, "points.geojson", pointsGeoJsonFile.produce(snapshot, plain));
        await appendResponse(zip, "points.gpx", pointsGpxFile.produce(snapshot, plain));
      }
      const xlsx = new PassThrough();
      const writing = writeScheduleXlsx(xlsx, snapshot, ctxOf(context));
      await appendResponse(zip, "schedule.xlsx", new Response(Readable.toWeb(xlsx) as unknown as ReadableStream, { headers: { "Content-Type": XLSX_TYPE } }));
      await writing;
      zip.append(writeCsv([SCHEDULE_COLUMNS.map((c) => c.header), ...scheduleCells(snapshot).map((r) => r.map((c) => (c === null ? "" : String(c))))]), { name: "schedule.csv" });
    });
  },
};

export const FABRICATION_FILES = {
  "panels.pdf": panelsPdfFile,
  "panels.zip": panelsZipFile,
  "signs.pdf": signsPdfFile,
  "trailhead.pdf": trailheadPdfFile,
  "profile.json": profileJsonFile,
  "schedule.xlsx": scheduleXlsxFile,
  "kit.zip": kitZipFile,
} as const satisfies Record<string, ExportFile>;
