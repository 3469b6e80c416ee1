// The image pipeline (sharp): recognise an upload by its content, then make the web sizes (WebP with
// a JPEG fallback), the full-resolution print master and, in a later low-priority job, AVIF. Every
// output is auto-oriented first and carries no metadata at all (no EXIF, so no GPS position of a
// protected site); colour is converted to sRGB (the print master embeds the sRGB profile).
import { createHash } from "node:crypto";
import sharp, { type Metadata, type Sharp } from "sharp";
import { MAX_IMAGE_PIXELS, PRINT_FILE, sizeFileName, WEB_WIDTHS, widthsFor, type AcceptedFormat, type ServedFormat } from "../../app/lib/images.ts";

// A shared server: one libvips thread per operation unless told otherwise, and no operation cache.
sharp.concurrency(Number(process.env.SHARP_CONCURRENCY ?? 1) || 1);
sharp.cache(false);

/** Why an upload was refused; `status` is the HTTP answer (415 wrong type, 422 too many pixels). */
export class ImageRefusedError extends Error {
  constructor(message: string, public status: 415 | 422) {
    super(message);
    this.name = "ImageRefusedError";
  }
}

export const WRONG_TYPE = "This file is not a JPEG, PNG, WebP, AVIF or TIFF image (judged by its content, not its name). Export it in one of those formats and upload it again.";
export const TOO_MANY_PIXELS = `This image has more than ${MAX_IMAGE_PIXELS / 1e6} megapixels, more than any sign or panel needs (a 36 × 24 in panel at 300 dpi is 78 MP). Scale it down and upload it again.`;

export interface Recognised {
  format: AcceptedFormat;
  width: number;
  height: number;
}

/** What the bytes are, from their content (sharp reads the header only: nothing is decoded). */
export async function recognise(bytes: Uint8Array): Promise<Recognised> {
  let meta: Metadata;
  try {
    meta = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch {
    throw new ImageRefusedError(WRONG_TYPE, 415);
  }
  const format = meta.format === "heif" ? (meta.compression === "av1" ? "avif" : null) : meta.format === "jpeg" || meta.format === "png" || meta.format === "webp" || meta.format === "tiff" ? meta.format : null;
  if (!format || !meta.width || !meta.height) throw new ImageRefusedError(WRONG_TYPE, 415);
  // Only the first page of a multi-page TIFF is used, so only it counts.
  if (meta.width * meta.height > MAX_IMAGE_PIXELS) throw new ImageRefusedError(TOO_MANY_PIXELS, 422);
  // EXIF orientation 5–8 swaps the sides.
  const swapped = (meta.orientation ?? 1) >= 5;
  return { format, width: swapped ? meta.height : meta.width, height: swapped ? meta.width : meta.height };
}

/** One file made from the original, ready to store. */
export interface MadeFile {
  file: string;
  format: ServedFormat;
  width: number;
  height: number;
  bytes: Uint8Array;
  hash: string;
  role: "web" | "print";
}

export const CONTENT_TYPES: Record<ServedFormat, string> = { webp: "image/webp", jpeg: "image/jpeg", avif: "image/avif" };

function input(original: Uint8Array): Sharp {
  // failOn "error": a truncated or corrupt file fails the job with a reason instead of a half image.
  return sharp(original, { limitInputPixels: MAX_IMAGE_PIXELS, failOn: "error" }).rotate();
}

/** The widths to make for an image `width` px wide (pure, in app/lib/images.ts: seeders plan URLs with it). */
export { widthsFor };

async function made(pipeline: Sharp, file: string, format: ServedFormat, role: MadeFile["role"]): Promise<MadeFile> {
  const { data, info } = await pipeline.toBuffer({ resolveWithObject: true });
  const bytes = new Uint8Array(data.buffer, data.byteOffset, data.byteLength);
  return { file, format, width: info.width, height: info.height, bytes, hash: createHash("sha256").update(bytes).digest("hex").slice(0, 16), role };
}

/**
 * The largest web size decoded once into raw sRGB pixels (JPEG shrink-on-load keeps a 24 MP
 * decode cheap); every smaller size and format is made from it.
 */
async function webBase(original: Uint8Array) {
  const { data, info } = await input(original)
    .resize({ width: WEB_WIDTHS[WEB_WIDTHS.length - 1], withoutEnlargement: true })
    .toColourspace("srgb")
    .raw()
    .toBuffer({ resolveWithObject: true });
  const from = (width: number) => sharp(data, { raw: { width: info.width, height: info.height, channels: info.channels } }).resize({ width });
  return { from, widths: widthsFor(info.width) };
}

/** The web sizes: WebP and a JPEG fallback for each width (alpha flattened onto white for JPEG). */
export async function makeWebFiles(original: Uint8Array): Promise<MadeFile[]> {
  const base = await webBase(original);
  const out: MadeFile[] = [];
  for (const width of base.widths) {
    out.push(await made(base.from(width).webp({ quality: 80, effort: 4 }), sizeFileName(width, "webp"), "webp", "web"));
    out.push(await made(base.from(width).flatten({ background: "#ffffff" }).jpeg({ quality: 82, progressive: true }), sizeFileName(width, "jpeg"), "jpeg", "web"));
  }
  return out;
}

/**
 * The print master: full resolution, high-quality JPEG with full colour resolution and the sRGB
 * profile. Huffman optimisation is off: it keeps every coefficient of the whole image in memory
 * (a 24 MP master peaked near 400 MB with it, about 125 MB without, for a file ~7 % larger).
 */
export async function makePrintMaster(original: Uint8Array): Promise<MadeFile> {
  const pipeline = input(original).flatten({ background: "#ffffff" }).withIccProfile("srgb").jpeg({ quality: 92, chromaSubsampling: "4:4:4", optimiseCoding: false });
  return made(pipeline, PRINT_FILE, "jpeg", "print");
}

/** AVIF versions of the web sizes (slow to encode: a separate, low-priority job). */
export async function makeAvifFiles(original: Uint8Array): Promise<MadeFile[]> {
  const base = await webBase(original);
  const out: MadeFile[] = [];
  for (const width of base.widths) out.push(await made(base.from(width).avif({ quality: 55, effort: 2 }), sizeFileName(width, "avif"), "avif", "web"));
  return out;
}

/** A message for the designer from a processing error. */
export function processingReason(error: unknown): string {
  const text = error instanceof Error ? error.message : String(error);
  if (/pixel limit/i.test(text)) return TOO_MANY_PIXELS;
  if (/unsupported image format|bad seek|premature end|corrupt|truncated|invalid/i.test(text)) return `The image could not be read (${text.trim().split("\n")[0]}). The file may be damaged: export it again and upload the new file.`;
  return text;
}
