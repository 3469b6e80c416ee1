// Pages of shapes (app/lib/fabrication/draw.ts) drawn into a pdfkit document: millimetres become
// points (72 / 25.4), the shipped fonts (IBM Plex Sans, Literata; the WOFF files of @fontsource) are
// embedded as subsets, and the document streams — each page is written out when the next begins.
import { createRequire } from "node:module";
import { readFileSync } from "node:fs";
import { Readable } from "node:stream";
import { inflateSync } from "node:zlib";
import PDFDocument from "pdfkit";
import type { FontName, Measure, Page, Shape } from "../../../app/lib/fabrication/draw.ts";
import { POINTS_PER_MM } from "../../../app/lib/fabrication/sources.ts";
import type { FontProportions } from "../../../app/lib/fabrication/signs.ts";

const require = createRequire(import.meta.url);
const FONT_FILES: Record<FontName, string> = {
  sans: "@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-normal.woff",
  "sans-bold": "@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-600-normal.woff",
  serif: "@fontsource/literata/files/literata-latin-400-normal.woff",
};

/**
 * WOFF 1.0 (W3C) → the TrueType font inside it: the same tables, each inflated with zlib when
 * compressed, behind a new sfnt header. Done once per process; fontkit would otherwise inflate a
 * WOFF's tables again on every text measurement.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString("latin1", 0, 4) !== "wOFF") return woff;
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const [tag, offset, compLength, origLength, checksum] = [0, 4, 8, 12, 16].map((k) => woff.readUInt32BE(at + k));
    const raw = woff.subarray(offset, offset + compLength);
    tables.push({ tag, checksum, data: compLength < origLength ? inflateSync(raw) : Buffer.from(raw) });
  }
  const entrySelector = Math.floor(Math.log2(numTables));
  const searchRange = 2 ** entrySelector * 16;
  const header = Buffer.alloc(12 + numTables * 16);
  header.writeUInt32BE(flavor, 0);
  header.writeUInt16BE(numTables, 4);
  header.writeUInt16BE(searchRange, 6);
  header.writeUInt16BE(entrySelector, 8);
  header.writeUInt16BE(numTables * 16 - searchRange, 10);
  const parts: Buffer[] = [header];
  let offset = header.length;
  tables.forEach((t, i) => {
    const at = 12 + i * 16;
    header.writeUInt32BE(t.tag, at);
    header.writeUInt32BE(t.checksum, at + 4);
    header.writeUInt32BE(offset, at + 8);
    header.writeUInt32BE(t.data.length, at + 12);
    const padded = Buffer.alloc((t.data.length + 3) & ~3);
    t.data.copy(padded);
    parts.push(padded);
    offset += padded.length;
  });
  return Buffer.concat(parts);
}

let fonts: Record<FontName, Buffer> | undefined;
function fontBytes(): Record<FontName, Buffer> {
  fonts ??= Object.fromEntries(Object.entries(FONT_FILES).map(([name, file]) => [name, woffToSfnt(readFileSync(require.resolve(file)))])) as Record<FontName, Buffer>;
  return fonts;
}

const pt = (mm: number) => mm * POINTS_PER_MM;

export interface PdfInfo {
  title: string;
  subject: string;
  /** "DRAFT — not checked" or the publication's status line. */
  keywords: string;
}

/** A new document with the fonts registered and no page yet. */
export function createPdf(info: PdfInfo): PDFKit.PDFDocument {
  const doc = new PDFDocument({ autoFirstPage: false, compress: true, info: { Title: info.title, Subject: info.subject, Keywords: info.keywords, Creator: "Eonscale", Producer: "Eonscale (pdfkit)" } });
  for (const [name, bytes] of Object.entries(fontBytes())) doc.registerFont(name, bytes);
  return doc;
}

/** Text widths from the embedded fonts' own metrics. */
export function pdfMeasure(doc: PDFKit.PDFDocument): Measure {
  return (text, sizeMm, font) => {
    doc.font(font).fontSize(pt(sizeMm));
    return doc.widthOfString(text) / POINTS_PER_MM;
  };
}

/** Cap height and x-height per em of the sans-serif, from its OS/2 table. */
export function sansProportions(doc: PDFKit.PDFDocument): FontProportions {
  doc.font("sans");
  const f = (doc as unknown as { _font: { font: { capHeight: number; xHeight: number; unitsPerEm: number } } })._font.font;
  return { capHeight: f.capHeight / f.unitsPerEm, xHeight: f.xHeight / f.unitsPerEm };
}

/** Stand-ins for characters the embedded Latin subsets lack (they would print as empty boxes). */
const FALLBACK: Record<string, string> = { "≤": "<=", "≥": ">=", "→": "->", "−": "-", "′": "'", "″": '"', "≈": "~" };

function printable(doc: PDFKit.PDFDocument, text: string): string {
  const font = (doc as unknown as { _font: { font: { hasGlyphForCodePoint(cp: number): boolean } } })._font.font;
  let out = "";
  for (const ch of text) out += font.hasGlyphForCodePoint(ch.codePointAt(0)!) ? ch : (FALLBACK[ch] ?? "?");
  return out;
}

function drawShape(doc: PDFKit.PDFDocument, s: Shape, images: ReadonlyMap<string, Buffer>) {
  switch (s.kind) {
    case "rect": {
      doc.save();
      if (s.hatch) {
        doc.rect(pt(s.x), pt(s.y), pt(s.w), pt(s.h)).clip();
        doc.lineWidth(pt(0.25)).strokeColor("#bbbbbb");
        for (let d = -s.h; d < s.w; d += 4) doc.moveTo(pt(s.x + d), pt(s.y + s.h)).lineTo(pt(s.x + d + s.h), pt(s.y)).stroke();
        doc.restore();
        return;
      }
      doc.rect(pt(s.x), pt(s.y), pt(s.w), pt(s.h));
      if (s.fill && s.stroke) doc.lineWidth(pt(s.strokeMm ?? 0.2)).fillAndStroke(s.fill, s.stroke);
      else if (s.fill) doc.fill(s.fill);
      else if (s.stroke) doc.lineWidth(pt(s.strokeMm ?? 0.2)).stroke(s.stroke);
      doc.restore();
      return;
    }
    case "line":
      doc.save();
      doc.lineWidth(pt(s.strokeMm)).strokeColor(s.stroke);
      if (s.dashMm) doc.dash(pt(s.dashMm[0]), { space: pt(s.dashMm[1]) });
      doc.moveTo(pt(s.x1), pt(s.y1)).lineTo(pt(s.x2), pt(s.y2)).stroke();
      doc.restore();
      return;
    case "text": {
      doc.save();
      doc.font(s.font).fontSize(pt(s.sizeMm)).fillColor(s.fill, s.opacity ?? 1);
      const text = printable(doc, s.text);
      const w = doc.widthOfString(text);
      const dx = s.anchor === "middle" ? -w / 2 : s.anchor === "end" ? -w : 0;
      if (s.rotate) doc.rotate(s.rotate, { origin: [pt(s.x), pt(s.y)] });
      doc.text(text, pt(s.x) + dx, pt(s.y), { lineBreak: false, baseline: "alphabetic" });
      doc.restore();
      return;
    }
    case "image": {
      const bytes = images.get(s.ref);
      if (!bytes) return;
      doc.image(bytes, pt(s.x), pt(s.y), { fit: [pt(s.w), pt(s.h)], align: "center", valign: "center" });
      return;
    }
    case "clip-start":
      doc.save();
      doc.rect(pt(s.x), pt(s.y), pt(s.w), pt(s.h)).clip();
      return;
    case "clip-end":
      doc.restore();
      return;
  }
}

/** Add one page of exactly the page's size (points from millimetres), with its trim box when it has one. */
export function addPage(doc: PDFKit.PDFDocument, page: Page, images: ReadonlyMap<string, Buffer> = new Map()) {
  doc.addPage({ size: [pt(page.widthMm), pt(page.heightMm)], margin: 0 });
  if (page.trim) {
    const t = page.trim;
    const H = pt(page.heightMm);
    // PDF boxes are bottom-up: [x0, y0, x1, y1] in points.
    const box = [pt(t.x), H - pt(t.y + t.h), pt(t.x + t.w), H - pt(t.y)];
    const dict = (doc.page as unknown as { dictionary: { data: Record<string, unknown> } }).dictionary.data;
    dict.TrimBox = box;
    dict.BleedBox = [0, 0, pt(page.widthMm), H];
  }
  for (const s of page.shapes) drawShape(doc, s, images);
}

/** Wait while more than `limit` bytes of the document are waiting to be read (back-pressure). */
export async function drained(doc: PDFKit.PDFDocument, limit = 4 * 1024 * 1024) {
  while (doc.readableLength > limit && !doc.destroyed) await new Promise((r) => setTimeout(r, 5));
  await new Promise((r) => setImmediate(r));
}

/** The document as a web stream for a Response body. */
export function pdfStream(doc: PDFKit.PDFDocument): ReadableStream<Uint8Array> {
  return Readable.toWeb(doc) as unknown as ReadableStream<Uint8Array>;
}

export const PDF_HEADERS = { "Content-Type": "application/pdf" } as const;
