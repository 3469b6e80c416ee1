// panels.pdf: a straight exhibit (wall, banner, rope) at 1:1, tiled into print panels
// (`?width=&height=&overlap=&bleed=` in mm). Every page is the panel plus its bleed; the strip is
// laid out once (app/lib/fabrication/strip.ts) and each page cuts its window out of it, so memory
// stays flat however many panels there are. Large files from the studio go to a background job
// (exports/fabrication/jobs.server.ts) that reports its progress. Options are read in
// exports/fabrication/options.server.ts; this module only draws (no database, no HTTP).
import type { PublicationSnapshot } from "../../../app/lib/publication/types.ts";
import { DRAFT_NOTICE, statusLine } from "../../../app/lib/exports/common.ts";
import { tilePanels, type PanelOptions } from "../../../app/lib/fabrication/panels.ts";
import { artHeightMm, indexStrip, panelPage } from "../../../app/lib/fabrication/panel-page.ts";
import { layoutStrip } from "../../../app/lib/fabrication/strip.ts";
import { addPage, createPdf, drained, pdfMeasure } from "./render.server.ts";

export interface FileOptionsContext {
  draft: boolean;
  publication: import("../../../app/lib/publication/types.ts").PublicationMeta | null;
  baseUrl: string;
}

/** The file's own query parameters (the source's `from` and any in `ignore` left out). */
export function fileQuery(query: URLSearchParams, ignore: readonly string[] = []): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of query) if (k !== "from" && !ignore.includes(k)) out[k] = v;
  return out;
}

/**
 * Write every panel into a new document; `onPage(done, total)` after each. The caller pipes the
 * document (a Readable) somewhere before calling, and the writer waits whenever more than a few
 * megabytes are unread.
 */
export async function writePanels(doc: PDFKit.PDFDocument, snapshot: PublicationSnapshot, o: PanelOptions, ctx: FileOptionsContext, onPage?: (done: number, total: number) => void | Promise<void>) {
  const measure = pdfMeasure(doc);
  const status = statusLine(snapshot, ctx);
  const strip = layoutStrip(snapshot, { heightMm: artHeightMm(o.heightMm), measure, status });
  const index = indexStrip(strip, measure);
  const panels = tilePanels(strip.lengthMm, o);
  for (const panel of panels) {
    addPage(doc, panelPage(strip, index, panel, { ...o, watermark: ctx.draft ? DRAFT_NOTICE : null, exhibitTitle: snapshot.exhibit.title, measure }));
    await onPage?.(panel.number, panel.count);
    await drained(doc);
  }
  doc.end();
}

export function panelsDocument(snapshot: PublicationSnapshot, ctx: FileOptionsContext) {
  return createPdf({
    title: `${snapshot.exhibit.title}: print panels at 1:1`,
    subject: `${snapshot.scale.statement.lengthPerTime}; ${snapshot.edition.label}`,
    keywords: ctx.draft ? DRAFT_NOTICE : statusLine(snapshot, ctx),
  });
}
