// Sign sheets: one page per marker at the sign's real size, its text sized for the reading
// distance. The marker's name meets the ADA §703.5.5 uppercase height for the mounting height and
// viewing distance; running text meets the x-height table (and on wayside panels the NPS 24 pt
// floor). Text that does not fit at those sizes is cut and reported, never shrunk below the rule.
// Wayside panels get a dark background (no white backgrounds outdoors); every text colour is
// checked at ≥ 4.5:1. Pure: millimetres; fonts and QR modules come from the caller.
import { z } from "zod";
import { contrastRatio, textOn } from "../chart/colour";
import type { PublicationSnapshot, SnapshotMarker } from "../publication/types";
import { adaMinimumHeight, minimumXHeight, NPS_MIN_FONT_MM } from "./ada";
import { roughMeasure, wrapText, type Measure, type Page, type Shape } from "./draw";
import { checkLabelLength, plainText, LABEL_LIMITS } from "./label-length";
import { issuesToFields, mmField as mm, type Parsed } from "./panels";
import { qrRuns, qrSize } from "./qr";
import { FABRICATION_SOURCES, MM_PER_INCH } from "./sources";
import { watermark } from "./panel-page";

export const SIGN_SIZES = {
  label: { label: "Small wall label, 210 × 148 mm (A5 across; our default)", widthMm: 210, heightMm: 148, outdoor: false },
  a4: { label: "A4 upright, 210 × 297 mm (ISO 216)", widthMm: 210, heightMm: 297, outdoor: false },
  letter: { label: "US Letter upright, 8.5 × 11 in", widthMm: 8.5 * MM_PER_INCH, heightMm: 11 * MM_PER_INCH, outdoor: false },
  wayside: { label: "Wayside panel, 36 × 24 in (from memory)", widthMm: 36 * MM_PER_INCH, heightMm: 24 * MM_PER_INCH, outdoor: true },
} as const;
export type SignSize = keyof typeof SIGN_SIZES | "custom";

/** Defaults kept with an exhibit until the designer sets its own: a wall label's centre [q], read from 1 m. */
export const SIGN_SETTING_DEFAULTS = { mountingHeightMm: 1370, viewingDistanceMm: 1000 } as const;
/** Assumption, not a standard: a phone is held about half a metre from a code, nearer if the sign is read nearer. */
export const SCANNING_DISTANCE_MM = 500;


export const signSettingsSchema = z.object({
  mountingHeightMm: mm("mountingHeightMm", 300, 6000),
  viewingDistanceMm: mm("viewingDistanceMm", 200, 30000),
});
export type SignSettings = z.infer<typeof signSettingsSchema>;

const signQuerySchema = z
  .object({
    size: z.enum(["label", "a4", "letter", "wayside", "custom"], { error: "size: one of label, a4, letter, wayside (or give width and height in mm)" }).optional(),
    width: mm("width", 50, 3000).optional(),
    height: mm("height", 50, 3000).optional(),
    /** Mounting height (the text's height above the floor or grade), mm. */
    mounting: mm("mounting", 300, 6000).optional(),
    distance: mm("distance", 200, 30000).optional(),
  })
  .strict();

export interface SignOptions {
  size: SignSize;
  widthMm: number;
  heightMm: number;
  outdoor: boolean;
  mountingHeightMm: number;
  viewingDistanceMm: number;
}

/**
 * The query (`size=`, custom `width=&height=`, `height=` alone is the mounting height as the issue
 * writes it, `distance=`) over the exhibit's sign settings. With `size=custom` or `width=`,
 * `height=` is the sign's height; otherwise `height=` is the mounting height.
 */
export function parseSignOptions(query: Record<string, string>, settings: SignSettings, defaultSize: keyof typeof SIGN_SIZES): Parsed<SignOptions> {
  const q = Object.fromEntries(Object.entries(query).filter(([, v]) => v !== ""));
  const custom = q.size === "custom" || q.width !== undefined;
  if (!custom && q.height !== undefined && q.mounting === undefined) {
    q.mounting = q.height;
    delete q.height;
  }
  const parsed = signQuerySchema.safeParse(q);
  if (!parsed.success) return { ok: false, errors: issuesToFields(parsed.error.issues) };
  const v = parsed.data;
  if (custom && (v.width === undefined || v.height === undefined)) return { ok: false, errors: { [v.width === undefined ? "width" : "height"]: "A custom sign needs both width and height in mm." } };
  if (custom && v.size && v.size !== "custom") return { ok: false, errors: { size: `size: "${v.size}" has its own width and height; use size=custom with width and height` } };
  const preset = custom ? null : SIGN_SIZES[(v.size ?? defaultSize) as keyof typeof SIGN_SIZES];
  return {
    ok: true,
    value: {
      size: custom ? "custom" : ((v.size ?? defaultSize) as SignSize),
      widthMm: preset ? preset.widthMm : v.width!,
      heightMm: preset ? preset.heightMm : v.height!,
      outdoor: preset ? preset.outdoor : false,
      mountingHeightMm: v.mounting ?? settings.mountingHeightMm,
      viewingDistanceMm: v.distance ?? settings.viewingDistanceMm,
    },
  };
}

export interface SignRules {
  /** Minimum heights and the font sizes that meet them. */
  titleCapMm: number;
  titleFontMm: number;
  bodyXMm: number;
  bodyFontMm: number;
  /** Each rule as printed on the sheet's notes page. */
  texts: string[];
}

/** Fonts' proportions (from the embedded fonts' OS/2 tables): cap height and x-height per em. */
export interface FontProportions {
  capHeight: number;
  xHeight: number;
}

export function signRules(o: SignOptions, font: FontProportions): SignRules {
  const ada = adaMinimumHeight(o.mountingHeightMm, o.viewingDistanceMm);
  const x = minimumXHeight(o.viewingDistanceMm);
  let bodyFontMm = x.heightMm / font.xHeight;
  const texts = [ada.text, ...ada.notes, x.text];
  if (o.outdoor && bodyFontMm < NPS_MIN_FONT_MM) {
    bodyFontMm = NPS_MIN_FONT_MM;
    texts.push(`${FABRICATION_SOURCES.nps24pt}: running text raised to 24 pt (${NPS_MIN_FONT_MM.toFixed(1)} mm)`);
  }
  const titleFontMm = Math.max(ada.heightMm / font.capHeight, bodyFontMm * 1.15);
  return { titleCapMm: ada.heightMm, titleFontMm, bodyXMm: bodyFontMm * font.xHeight, bodyFontMm, texts };
}

export interface SignInput {
  snapshot: PublicationSnapshot;
  marker: SnapshotMarker;
  options: SignOptions;
  rules: SignRules;
  url: string;
  qr: { size: number; dark: (row: number, col: number) => boolean };
  /** Width / height of the marker's image when the server has one to place. */
  imageAspect: number | null;
  along: string;
  watermark: string | null;
  measure?: Measure;
}

export interface SignResult {
  page: Page;
  warnings: string[];
  /** The QR code's place on the page, mm (tests decode it there). */
  qrBox: { x: number; y: number; size: number };
  contrast: { pair: string; ratio: number }[];
}

/** Background and ink of a sign: outdoors a dark ground (no white), indoors paper white. */
export function signColours(outdoor: boolean) {
  return outdoor ? { ground: "#2f2a24", ink: "#ffffff", muted: "#e8e2d6" } : { ground: "#ffffff", ink: "#1a1a1a", muted: "#3d3d3d" };
}

export function layoutSign(input: SignInput): SignResult {
  const { marker, options: o, rules } = input;
  const measure = input.measure ?? roughMeasure;
  const W = o.widthMm;
  const H = o.heightMm;
  const margin = Math.max(8, 0.06 * Math.min(W, H));
  const colours = signColours(o.outdoor);
  const shapes: Shape[] = [{ kind: "rect", x: 0, y: 0, w: W, h: H, fill: colours.ground }];
  const warnings: string[] = [];
  const name = `Sign ${marker.signNumber} (${marker.label})`;
  const band = Math.max(8, 0.05 * H);
  shapes.push({ kind: "rect", x: 0, y: 0, w: W, h: band, fill: marker.color });

  // QR code, bottom right, at least the rule-of-thumb size.
  const scanning = Math.min(SCANNING_DISTANCE_MM, o.viewingDistanceMm);
  const qs = qrSize(input.qr.size, scanning);
  const qrX = W - margin - qs.totalMm;
  const qrY = H - margin - qs.totalMm;
  shapes.push({ kind: "rect", x: qrX, y: qrY, w: qs.totalMm, h: qs.totalMm, fill: "#ffffff" });
  const q0 = 4 * qs.moduleMm;
  for (const r of qrRuns(input.qr.size, input.qr.dark)) shapes.push({ kind: "rect", x: qrX + q0 + r.col * qs.moduleMm, y: qrY + q0 + r.row * qs.moduleMm, w: r.length * qs.moduleMm + 0.01, h: qs.moduleMm + 0.01, fill: "#000000" });
  if (qs.totalMm > Math.min(W, H) - 2 * margin) warnings.push(`${name}: the QR code needs ${qs.totalMm.toFixed(0)} mm with its quiet zone; the sign is too small for it.`);

  // Title: sign number and name, at the ADA height.
  const textW = W - 2 * margin;
  let y = band + margin;
  const titleLines = wrapText(`${marker.signNumber}  ${marker.label}`, textW, rules.titleFontMm, "sans-bold", measure);
  for (const line of titleLines) {
    y += rules.titleFontMm;
    shapes.push({ kind: "text", x: margin, y, text: line, sizeMm: rules.titleFontMm, font: "sans-bold", fill: colours.ink, anchor: "start" });
    y += rules.titleFontMm * 0.35;
  }
  if (titleLines.some((l) => measure(l, rules.titleFontMm, "sans-bold") > textW)) warnings.push(`${name}: a word of the name is wider than the sign at ${rules.titleCapMm.toFixed(1)} mm capitals.`);
  const line = rules.bodyFontMm * 1.4;

  // The age and where it sits, then the text column beside the QR code (at most 55 characters a line).
  const column = Math.min(W - 2 * margin - qs.totalMm - margin, measure("n".repeat(LABEL_LIMITS.lineChars), rules.bodyFontMm, "sans"));
  const facts = [`${marker.ageText}${marker.within.length ? ` · ${marker.within[marker.within.length - 1]}` : ""}`, input.along];
  const body = plainText(marker.text.markdown);
  const lines: { text: string; font: "sans" | "sans-bold"; fill: string }[] = [];
  for (const f of facts) for (const l of wrapText(f, textW, rules.bodyFontMm, "sans-bold", measure)) lines.push({ text: l, font: "sans-bold", fill: colours.ink });
  const rest: typeof lines = [];
  for (const l of wrapText(body, Math.max(column, 10), rules.bodyFontMm, "sans", measure)) rest.push({ text: l, font: "sans", fill: colours.ink });
  for (const l of wrapText(`Source: ${marker.source}`, Math.max(column, 10), rules.bodyFontMm, "sans", measure)) rest.push({ text: l, font: "sans", fill: colours.muted });
  y += rules.bodyFontMm * 0.4;
  for (const l of lines) {
    y += line;
    shapes.push({ kind: "text", x: margin, y, text: l.text, sizeMm: rules.bodyFontMm, font: l.font, fill: l.fill, anchor: "start" });
  }
  // The image above the QR code when there is room in the right column.
  const rightX = W - margin - qs.totalMm;
  const imageTop = y + margin * 0.5;
  if (input.imageAspect) {
    const room = qrY - margin * 0.5 - imageTop;
    const w = Math.min(qs.totalMm * 1.4, W - 2 * margin - column - margin);
    const h = w / input.imageAspect;
    if (room >= h && w > 20) shapes.push({ kind: "image", x: W - margin - w, y: imageTop, w, h, ref: "marker-image" });
    else warnings.push(`${name}: no room for the image at this size.`);
  }
  const bottom = H - margin;
  let shown = 0;
  for (const l of rest) {
    if (y + line > bottom) break;
    y += line;
    shapes.push({ kind: "text", x: margin, y, text: l.text, sizeMm: rules.bodyFontMm, font: l.font, fill: l.fill, anchor: "start" });
    shown++;
  }
  if (shown < rest.length) warnings.push(`${name}: ${rest.length - shown} of ${rest.length} lines of text do not fit at ${rules.bodyXMm.toFixed(1)} mm x-height (the rule applied); shorten the text or choose a larger sign — it is not shrunk.`);
  if (rightX < margin + column && y > qrY) warnings.push(`${name}: the text runs beside the QR code.`);
  warnings.push(...checkLabelLength(body, name).warnings);

  const contrast = [
    { pair: "text on ground", ratio: contrastRatio(colours.ink, colours.ground) },
    { pair: "source on ground", ratio: contrastRatio(colours.muted, colours.ground) },
    { pair: "chart band", ratio: contrastRatio(textOn(marker.color), marker.color) },
  ];
  for (const c of contrast) if (c.ratio < 4.5) warnings.push(`${name}: ${c.pair} contrast ${c.ratio.toFixed(2)}:1 is under 4.5:1 (${FABRICATION_SOURCES.contrast}).`);
  if (input.watermark) watermark(shapes, input.watermark, W, H);
  return { page: { widthMm: W, heightMm: H, shapes }, warnings, qrBox: { x: qrX, y: qrY, size: qs.totalMm }, contrast };
}
