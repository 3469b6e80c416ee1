// Reading PDFs back in tests with pdfjs-dist (the PDF's own drawing operations, not our code) and
// rendering pages with Debian's poppler-utils (pdftoppm, installed by the test setup when missing).
import { mkdtemp, readFile, writeFile } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import sharp from "sharp";
import { getDocument, OPS } from "pdfjs-dist/legacy/build/pdf.mjs";
import { ensureDebianCommand, runCommand } from "../setup/debian-tools.ts";

export const MM_PER_POINT = 25.4 / 72;

export async function openPdf(bytes: Uint8Array) {
  return getDocument({ data: new Uint8Array(bytes), disableFontFace: true, useSystemFonts: false, isEvalSupported: false }).promise;
}

export interface Segment {
  x1: number;
  y1: number;
  x2: number;
  y2: number;
}

type Matrix = [number, number, number, number, number, number];
const multiply = (m: Matrix, n: Matrix): Matrix => [
  n[0] * m[0] + n[1] * m[2],
  n[0] * m[1] + n[1] * m[3],
  n[2] * m[0] + n[3] * m[2],
  n[2] * m[1] + n[3] * m[3],
  n[4] * m[0] + n[5] * m[2] + m[4],
  n[4] * m[1] + n[5] * m[3] + m[5],
];

/**
 * Every stroked straight segment of a page in page space (points, origin bottom-left), read from
 * the page's operator list with the current transformation matrix tracked through save/restore/cm.
 */
export async function strokedSegments(page: Awaited<ReturnType<Awaited<ReturnType<typeof openPdf>>["getPage"]>>): Promise<Segment[]> {
  const ops = await page.getOperatorList();
  let ctm: Matrix = [1, 0, 0, 1, 0, 0];
  const stack: Matrix[] = [];
  const out: Segment[] = [];
  const apply = (x: number, y: number) => [ctm[0] * x + ctm[2] * y + ctm[4], ctm[1] * x + ctm[3] * y + ctm[5]];
  for (let i = 0; i < ops.fnArray.length; i++) {
    const fn = ops.fnArray[i];
    const args = ops.argsArray[i] as unknown[];
    if (fn === OPS.save) stack.push(ctm);
    else if (fn === OPS.restore) ctm = stack.pop() ?? [1, 0, 0, 1, 0, 0];
    else if (fn === OPS.transform) ctm = multiply(ctm, args as Matrix);
    else if (fn === OPS.constructPath) {
      const [op, [data]] = args as [number, [Float32Array | number[]]];
      if (op !== OPS.stroke) continue;
      let cur: number[] | null = null;
      for (let k = 0; k < data.length; ) {
        const code = data[k];
        if (code === 0) {
          cur = apply(data[k + 1], data[k + 2]);
          k += 3;
        } else if (code === 1) {
          const next = apply(data[k + 1], data[k + 2]);
          if (cur) out.push({ x1: cur[0], y1: cur[1], x2: next[0], y2: next[1] });
          cur = next;
          k += 3;
        } else if (code === 2) k += 7;
        else if (code === 3) k += 5;
        else k += 1;
      }
    }
  }
  return out;
}

/** All text of a page, joined by spaces. */
export async function pageText(page: Awaited<ReturnType<Awaited<ReturnType<typeof openPdf>>["getPage"]>>): Promise<string> {
  const content = await page.getTextContent();
  return content.items.map((i) => ("str" in i ? i.str : "")).join(" ");
}

/** Render page `n` (1-based) to PNG with pdftoppm; returns the PNG path. */
export async function renderPage(pdf: Uint8Array, n: number, dpi = 72, name = "page"): Promise<string> {
  const pdftoppm = await ensureDebianCommand("pdftoppm", "poppler-utils");
  const dir = await mkdtemp(path.join(tmpdir(), "eonscale-pdf-"));
  const file = path.join(dir, "in.pdf");
  await writeFile(file, pdf);
  const outBase = path.join(dir, name);
  const r = await runCommand(pdftoppm, ["-r", String(dpi), "-f", String(n), "-l", String(n), "-png", "-singlefile", file, outBase]);
  if (r.code !== 0) throw new Error(`pdftoppm failed: ${r.stderr}`);
  return `${outBase}.png`;
}

/** RGBA pixels of a PNG file (for jsQR). */
export async function rgba(pngPath: string): Promise<{ data: Uint8ClampedArray; width: number; height: number }> {
  const { data, info } = await sharp(await readFile(pngPath)).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return { data: new Uint8ClampedArray(data.buffer, data.byteOffset, data.byteLength), width: info.width, height: info.height };
}
