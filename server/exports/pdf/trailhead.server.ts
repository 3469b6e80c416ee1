// trailhead.pdf: the trailhead board of a route exhibit (A3 upright): length, ascent and descent,
// typical and steepest running slope, the stretches that break an ABA §1017 limit with their
// distances, walking times at 1.2 and 0.9 m/s with sources, the profile drawn with flagged
// stretches hatched as well as coloured, and the planning caution. Without elevations the board
// says so and asks for a track with them.
import type { PublicationSnapshot } from "../../../app/lib/publication/types.ts";
import { DRAFT_NOTICE, statusLine } from "../../../app/lib/exports/common.ts";
import { wrapText, type Page, type Shape } from "../../../app/lib/fabrication/draw.ts";
import { watermark } from "../../../app/lib/fabrication/panel-page.ts";
import { profileChartShapes } from "../../../app/lib/profile/chart.ts";
import { snapshotProfile, trailheadFacts } from "../../../app/lib/profile/trailhead.ts";
import type { FileOptionsContext } from "./panels.server.ts";
import { addPage, createPdf, pdfMeasure } from "./render.server.ts";

const A3 = { w: 297, h: 420 };
const INK = "#1a1a1a";

export function writeTrailhead(doc: PDFKit.PDFDocument, snapshot: PublicationSnapshot, ctx: FileOptionsContext) {
  const measure = pdfMeasure(doc);
  const profile = snapshotProfile(snapshot);
  const facts = trailheadFacts(snapshot, profile);
  const m = 18;
  const W = A3.w;
  const shapes: Shape[] = [{ kind: "rect", x: 0, y: 0, w: W, h: A3.h, fill: "#ffffff" }];
  let y = m;
  const put = (text: string, font: "sans" | "sans-bold" | "serif", size: number, fill = INK, indent = 0) => {
    for (const line of wrapText(text, W - 2 * m - indent, size, font, measure)) {
      y += size * 1.3;
      shapes.push({ kind: "text", x: m + indent, y, text: line, sizeMm: size, font, fill, anchor: "start" });
    }
  };
  put(facts.title, "serif", 14);
  put("Trailhead facts", "sans-bold", 7);
  y += 3;
  for (const f of facts.facts) {
    y += 6.5;
    shapes.push({ kind: "text", x: m, y, text: f.label, sizeMm: 5, font: "sans", fill: INK, anchor: "start" });
    shapes.push({ kind: "text", x: W - m, y, text: f.value, sizeMm: 5, font: "sans-bold", fill: INK, anchor: "end" });
  }
  y += 4;
  for (const w of facts.walking) put(`Walking at ${w.speed}: ${w.time} (${w.source})`, "sans", 4);
  if (profile) {
    y += 4;
    const chart = profileChartShapes(profile, { x: m, y, w: W - 2 * m, h: 70, units: snapshot.exhibit.unitsPreference });
    shapes.push(...chart);
    y += 78;
    put(facts.flagged.length ? "Stretches over the ABA §1017 limits (hatched on the profile)" : "No stretch over the ABA §1017 limits at this resolution", "sans-bold", 5);
    for (const f of facts.flagged) put(`${f.from} to ${f.to}: ${f.slope} — ${f.rule}`, "sans", 4, INK, 3);
    y += 2;
    put(`Method: ${facts.method}`, "sans", 3.2);
  }
  y += 2;
  for (const n of facts.notes) put(n, "sans", 3.6);
  y += 2;
  put(facts.caution, "sans-bold", 3.8);
  y += 2;
  for (const s of facts.sources) put(`Source: ${s}`, "sans", 2.8, "#3d3d3d");
  put(statusLine(snapshot, ctx), "sans", 2.8, "#3d3d3d");
  if (ctx.draft) watermark(shapes, DRAFT_NOTICE, W, A3.h);
  const page: Page = { widthMm: W, heightMm: A3.h, shapes };
  addPage(doc, page);
  doc.end();
}

export function trailheadDocument(snapshot: PublicationSnapshot, ctx: FileOptionsContext) {
  return createPdf({ title: `${snapshot.exhibit.title}: trailhead board`, subject: "Length, ascent, slopes and walking times", keywords: ctx.draft ? DRAFT_NOTICE : statusLine(snapshot, ctx) });
}
