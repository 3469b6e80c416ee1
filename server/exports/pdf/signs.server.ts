// signs.pdf: one page per marker at the sign's real size (`?size=label|a4|letter|wayside`, custom
// `width=&height=` in mm, mounting `height=` and viewing `distance=` over the exhibit's sign
// settings). The first page is the production note: the rules applied with their sources and every
// warning (text that does not fit at the rule's size is cut and listed, never shrunk). Each sign's QR
// code (level Q, 4-module quiet zone) opens the marker's visitor page.
import QRCode from "qrcode";
import type { PublicationSnapshot, SnapshotMarker } from "../../../app/lib/publication/types.ts";
import { alongText, DRAFT_NOTICE, markerPageUrl, statusLine } from "../../../app/lib/exports/common.ts";
import { layoutSign, signRules, SIGN_SIZES, type SignOptions, type SignRules } from "../../../app/lib/fabrication/signs.ts";
import { FABRICATION_SOURCES } from "../../../app/lib/fabrication/sources.ts";
import { wrapText, type Page, type Shape } from "../../../app/lib/fabrication/draw.ts";
import { Asset } from "../../../db/models/index.ts";
import type { AssetFile } from "../../../db/models/asset.ts";
import { getObjectBytes } from "../../storage/s3.server.ts";
import { logger } from "../../logger.server.ts";
import type { FileOptionsContext } from "./panels.server.ts";
import { addPage, createPdf, drained, pdfMeasure, sansProportions } from "./render.server.ts";

/** The marker's visitor page; for a draft the address it will have if published as it stands. */
export function signUrl(snapshot: PublicationSnapshot, marker: SnapshotMarker, ctx: FileOptionsContext): string {
  return markerPageUrl(snapshot, marker, ctx) ?? `${ctx.baseUrl}/visit/${encodeURIComponent(snapshot.organisation.slug)}/${encodeURIComponent(snapshot.exhibit.slug)}/${marker.signNumber}`;
}

/** The largest JPEG web size of a marker's image, for the sign (pdfkit embeds JPEG and PNG). */
async function imageBytes(marker: SnapshotMarker): Promise<Buffer | null> {
  if (!marker.image) return null;
  try {
    const asset = await Asset.findByPk(Number(marker.image.assetId));
    const files = ((asset?.files ?? []) as AssetFile[]).filter((f) => f.format === "jpeg");
    const best = files.sort((a, b) => b.width - a.width)[0];
    return best ? Buffer.from(await getObjectBytes(best.key)) : null;
  } catch (error) {
    logger.warn({ err: error, marker: marker.id }, "sign sheet: image left out");
    return null;
  }
}

function notesPage(o: SignOptions, rules: SignRules, warnings: string[], heading: string, status: string, measure: ReturnType<typeof pdfMeasure>): Page {
  const W = o.widthMm;
  const H = o.heightMm;
  const m = Math.max(8, 0.06 * Math.min(W, H));
  const size = Math.max(2.6, Math.min(W, H) / 70);
  const shapes: Shape[] = [{ kind: "rect", x: 0, y: 0, w: W, h: H, fill: "#ffffff" }];
  let y = m;
  const put = (text: string, font: "sans" | "sans-bold", s = size) => {
    for (const line of wrapText(text, W - 2 * m, s, font, measure)) {
      y += s * 1.35;
      if (y > H - m) return;
      shapes.push({ kind: "text", x: m, y, text: line, sizeMm: s, font, fill: "#1a1a1a", anchor: "start" });
    }
  };
  put(`${heading} — production note (not a sign)`, "sans-bold", size * 1.4);
  put(status, "sans");
  put(`Sign: ${o.size === "custom" ? "custom" : SIGN_SIZES[o.size].label}, ${o.widthMm.toFixed(1)} × ${o.heightMm.toFixed(1)} mm; text mounted ${o.mountingHeightMm} mm above the floor or grade, read from ${o.viewingDistanceMm} mm.`, "sans");
  y += size;
  put("Rules applied", "sans-bold");
  for (const t of rules.texts) put(`• ${t}`, "sans");
  put(`• Names: capitals ${rules.titleCapMm.toFixed(1)} mm high (font ${rules.titleFontMm.toFixed(1)} mm); running text: x-height ${rules.bodyXMm.toFixed(1)} mm (font ${rules.bodyFontMm.toFixed(1)} mm).`, "sans");
  for (const s of [FABRICATION_SOURCES.labelLength, FABRICATION_SOURCES.contrast, FABRICATION_SOURCES.qrQuietZone, FABRICATION_SOURCES.qrSize, ...(o.size === "wayside" ? [FABRICATION_SOURCES.wayside] : [])]) put(`• ${s}`, "sans");
  y += size;
  put(warnings.length ? `Warnings (${warnings.length})` : "Warnings: none", "sans-bold");
  for (const w of warnings) put(`• ${w}`, "sans");
  return { widthMm: W, heightMm: H, shapes };
}

/** Write the notes page and one page per sign; returns the warnings. */
export async function writeSigns(doc: PDFKit.PDFDocument, snapshot: PublicationSnapshot, o: SignOptions, ctx: FileOptionsContext): Promise<string[]> {
  const measure = pdfMeasure(doc);
  const rules = signRules(o, sansProportions(doc));
  const pages: { page: Page; image: Buffer | null }[] = [];
  const warnings: string[] = [];
  for (const marker of snapshot.markers) {
    const url = signUrl(snapshot, marker, ctx);
    const qr = QRCode.create(url, { errorCorrectionLevel: "Q" });
    const image = await imageBytes(marker);
    let aspect: number | null = null;
    if (image) {
      const img = (doc as unknown as { openImage(b: Buffer): { width: number; height: number } }).openImage(image);
      aspect = img.width / img.height;
    }
    const sign = layoutSign({
      snapshot,
      marker,
      options: o,
      rules,
      url,
      qr: { size: qr.modules.size, dark: (r, c) => Boolean(qr.modules.get(r, c)) },
      imageAspect: aspect,
      along: alongText(snapshot, marker),
      watermark: ctx.draft ? DRAFT_NOTICE : null,
      measure,
    });
    warnings.push(...sign.warnings);
    pages.push({ page: sign.page, image });
  }
  const notes = notesPage(o, rules, warnings, `${snapshot.exhibit.title}: ${snapshot.markers.length} signs`, statusLine(snapshot, ctx), measure);
  if (ctx.draft) notes.shapes.push({ kind: "text", x: o.widthMm / 2, y: o.heightMm - 10, text: DRAFT_NOTICE, sizeMm: 8, font: "sans-bold", fill: "#c0392b", anchor: "middle" });
  addPage(doc, notes);
  for (const p of pages) {
    addPage(doc, p.page, p.image ? new Map([["marker-image", p.image]]) : new Map());
    await drained(doc);
  }
  doc.end();
  return warnings;
}

export function signsDocument(snapshot: PublicationSnapshot, ctx: FileOptionsContext) {
  return createPdf({ title: `${snapshot.exhibit.title}: sign sheets`, subject: `One sign per marker; ${snapshot.edition.label}`, keywords: ctx.draft ? DRAFT_NOTICE : statusLine(snapshot, ctx) });
}
