// Marker and cover images: the limits, the file names served under /media/:assetId/:file, the
// forms that attach an image, and the words designers see. Pure (runs in the browser and on the server).
import { z } from "zod";

/** Largest original accepted (bytes). */
export const MAX_IMAGE_BYTES = 60 * 1024 * 1024;
/** Decompression-bomb guard: a 36 × 24 in panel at 300 dpi is 78 MP, so print masters fit under 120 MP. */
export const MAX_IMAGE_PIXELS = 120_000_000;
/** Formats recognised from the file's content (never from its name or the browser's type). */
export const ACCEPTED_FORMATS = ["jpeg", "png", "webp", "avif", "tiff"] as const;
export type AcceptedFormat = (typeof ACCEPTED_FORMATS)[number];
/** The accepted formats as designers know them. */
const FORMAT_NAMES: Record<AcceptedFormat, string> = { jpeg: "JPEG", png: "PNG", webp: "WebP", avif: "AVIF", tiff: "TIFF" };
/** The file chooser's `accept`: the accepted formats' media types (the server still reads the content). */
export const ACCEPT_ATTRIBUTE = ACCEPTED_FORMATS.map((f) => `image/${f}`).join(",");
/** The files an image may be, as words: "JPEG, PNG, WebP, AVIF or TIFF, up to 60 MB". */
export const IMAGE_FILES_HINT = `${ACCEPTED_FORMATS.slice(0, -1).map((f) => FORMAT_NAMES[f]).join(", ")} or ${FORMAT_NAMES[ACCEPTED_FORMATS[ACCEPTED_FORMATS.length - 1]]}, up to ${MAX_IMAGE_BYTES / 1048576} MB`;
/** Web sizes (px wide); an image narrower than a size is not enlarged. */
export const WEB_WIDTHS = [480, 960, 1600] as const;
export type ServedFormat = "webp" | "jpeg" | "avif";
export const ALT_MAX = 250;
export const CREDIT_MAX = 300;

export type AssetStatus = "processing" | "ready" | "failed";

/** One served size: width in px, format, stable URL. */
export interface ImageSize {
  width: number;
  format: ServedFormat;
  url: string;
}

/** An image as a marker (or the exhibit's cover) uses it: the words belong to this use. */
export interface UsedImage {
  assetId: number;
  alt: string;
  credit: string;
  sizes: ImageSize[];
}

/** The composer's view of one use: the image plus its processing state. */
export interface ComposerImage extends UsedImage {
  status: AssetStatus;
  error: string | null;
  width: number | null;
  height: number | null;
}

export const ALT_HINT =
  "Say what a visitor would miss without the picture, in one or two plain sentences (what it shows, and why it matters here). Leave out “image of”; name the fossil or rock as the sign does.";
export const CREDIT_HINT = "Who made it and under which licence, e.g. “Photo: A. Smith, CC BY 4.0” or “Drawing: Riverside Museum”.";

const EXTENSION: Record<ServedFormat, string> = { webp: "webp", jpeg: "jpg", avif: "avif" };

/** The file name a size is served under: "960.webp", "480.jpg", "1600.avif". */
export function sizeFileName(width: number, format: ServedFormat): string {
  return `${width}.${EXTENSION[format]}`;
}

export const PRINT_FILE = "print.jpg";

/** The URL of one file of an asset (stable: snapshots and offline copies keep it). */
export function mediaUrl(assetId: number, file: string): string {
  return `/media/${assetId}/${file}`;
}

/** The web widths made for an image `width` px wide: the standard ones below it, and it (capped at the largest). */
export function widthsFor(width: number): number[] {
  const largest = WEB_WIDTHS[WEB_WIDTHS.length - 1];
  return [...new Set([...WEB_WIDTHS.filter((w) => w < width), Math.min(width, largest)])].sort((a, b) => a - b);
}

/**
 * The WebP and JPEG sizes processing makes for an image `width` px wide, with their stable URLs, in
 * the order the server lists them (by width, then format): what a snapshot can name before the files
 * exist (the demo seeder's images, processed when the server starts).
 */
export function plannedWebSizes(assetId: number, width: number): ImageSize[] {
  return widthsFor(width).flatMap((w) => (["jpeg", "webp"] as const).map((format) => ({ width: w, format, url: mediaUrl(assetId, sizeFileName(w, format)) })));
}

/** Parses the :file segment of /media/:assetId/:file ("960.webp", "print.jpg"); null if it is not one of ours. */
export function parseMediaFile(file: string): { kind: "size"; width: number; format: ServedFormat } | { kind: "print" } | null {
  if (file === PRINT_FILE) return { kind: "print" };
  const m = /^(\d{2,5})\.(webp|jpg|avif)$/.exec(file);
  if (!m) return null;
  const format = (Object.entries(EXTENSION).find(([, ext]) => ext === m[2])?.[0] ?? null) as ServedFormat | null;
  return format ? { kind: "size", width: Number(m[1]), format } : null;
}

/** The srcset for one format ("…/480.webp 480w, …/960.webp 960w"), widest last. */
export function srcSetOf(sizes: readonly ImageSize[], format: ServedFormat): string {
  return sizes
    .filter((s) => s.format === format)
    .sort((a, b) => a.width - b.width)
    .map((s) => `${s.url} ${s.width}w`)
    .join(", ");
}

/** The fallback <img> source: the widest JPEG up to 960 px. */
export function fallbackSrc(sizes: readonly ImageSize[]): string | null {
  const jpegs = sizes.filter((s) => s.format === "jpeg").sort((a, b) => a.width - b.width);
  return (jpegs.filter((s) => s.width <= 960).pop() ?? jpegs[0])?.url ?? null;
}

const idField = (what: string) => z.coerce.number({ error: `Missing ${what}.` }).int({ error: `Missing ${what}.` }).positive({ error: `Missing ${what}.` });

/** The words of one use: alt text may stay empty while drafting (the review check then fails), never longer than 250. */
export const ImageWordsSchema = z.object({
  assetId: idField("image (upload one first)"),
  alt: z.string().trim().max(ALT_MAX, { error: `Alt text: keep it to ${ALT_MAX} characters or fewer.` }).default(""),
  credit: z.string().trim().max(CREDIT_MAX, { error: `Credit: keep it to ${CREDIT_MAX} characters or fewer.` }).default(""),
});

export const MarkerImageSchema = ImageWordsSchema.safeExtend({ markerId: idField("marker") });
export const RemoveImageSchema = z.object({ markerId: z.union([z.literal("cover"), idField("marker")], { error: "Missing marker." }) });

/** Does this use lack the words a review needs? (Empty alt text fails the review check.) */
export function lacksAlt(image: { alt: string }): boolean {
  return image.alt.trim().length === 0;
}
