// Tiling a straight exhibit (wall, banner, rope) into print panels: each panel shows `width` mm of
// the exhibit at 1:1, consecutive panels share `overlap` mm, and every page carries `bleed` mm
// around the panel. Panel i (from 0) starts at i × (width − overlap) from the older end. Pure.
import { z } from "zod";
import { FABRICATION_SOURCES, MM_PER_INCH } from "./sources";

/** Common roll widths (no standard exists): 24, 36, 44 in [v]; 54, 60, 64 in [r]. */
export const ROLL_PRESETS = [24, 36, 44, 54, 60, 64].map((inches) => ({ id: `${inches}in`, label: `${inches} in roll (${(inches * MM_PER_INCH).toFixed(1)} mm)`, widthMm: Number((inches * MM_PER_INCH).toFixed(4)) }));

export const PANEL_DEFAULTS = { widthMm: 36 * MM_PER_INCH, heightMm: 500, overlapMm: 20, bleedMm: 3 } as const;
export const MAX_PANELS = 2000;

/** A length in millimetres from a form or query, refused with the field's name and the reason. */
export const mmField = (name: string, min: number, max: number) =>
  z.coerce
    .number({ error: `${name}: a number of millimetres` })
    .refine(Number.isFinite, { error: `${name}: a number of millimetres` })
    .min(min, { error: `${name}: at least ${min} mm` })
    .max(max, { error: `${name}: at most ${max} mm` });

export const panelOptionsSchema = z
  .object({
    width: mmField("width", 100, 5000).optional(),
    height: mmField("height", 50, 5000).optional(),
    overlap: mmField("overlap", 0, 500).optional(),
    bleed: mmField("bleed", 0, 50).optional(),
  })
  .strict();

export interface PanelOptions {
  widthMm: number;
  heightMm: number;
  overlapMm: number;
  bleedMm: number;
}

export type Parsed<T> = { ok: true; value: T } | { ok: false; errors: Record<string, string> };

/** Query parameters → options (defaults for what is missing); the medium's own panel width first. */
export function parsePanelOptions(query: Record<string, string>, mediumPanelWidthMm: number | null = null): Parsed<PanelOptions> {
  const parsed = panelOptionsSchema.safeParse(Object.fromEntries(Object.entries(query).filter(([, v]) => v !== "")));
  if (!parsed.success) return { ok: false, errors: issuesToFields(parsed.error.issues) };
  const v = parsed.data;
  const widthMm = v.width ?? mediumPanelWidthMm ?? PANEL_DEFAULTS.widthMm;
  const overlapMm = v.overlap ?? PANEL_DEFAULTS.overlapMm;
  if (overlapMm >= widthMm / 2) return { ok: false, errors: { overlap: `overlap: must be less than half the panel width (${(widthMm / 2).toFixed(1)} mm)` } };
  return { ok: true, value: { widthMm, heightMm: v.height ?? PANEL_DEFAULTS.heightMm, overlapMm, bleedMm: v.bleed ?? PANEL_DEFAULTS.bleedMm } };
}

export function issuesToFields(issues: readonly { path: PropertyKey[]; message: string; code: string; keys?: string[] }[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const i of issues) {
    if (i.code === "unrecognized_keys" && i.keys) for (const k of i.keys) out[k] = `${k}: not a parameter of this file`;
    else out[String(i.path[0] ?? "_form")] ??= i.message;
  }
  return out;
}

export interface Panel {
  /** 1-based. */
  number: number;
  count: number;
  /** The part of the exhibit the panel shows (trim), mm from the older end. */
  startMm: number;
  endMm: number;
  /** Shared with the previous / next panel, mm. */
  overlapBeforeMm: number;
  overlapAfterMm: number;
}

/** The panels covering `lengthMm` of exhibit: n = ceil((L − overlap) / (width − overlap)), at least 1. */
export function tilePanels(lengthMm: number, o: Pick<PanelOptions, "widthMm" | "overlapMm">): Panel[] {
  const step = o.widthMm - o.overlapMm;
  const count = Math.max(1, Math.ceil((lengthMm - o.overlapMm) / step - 1e-9));
  return Array.from({ length: count }, (_, i) => ({
    number: i + 1,
    count,
    startMm: i * step,
    endMm: i * step + o.widthMm,
    overlapBeforeMm: i === 0 ? 0 : o.overlapMm,
    overlapAfterMm: i === count - 1 ? 0 : o.overlapMm,
  }));
}

export function panelCount(lengthMm: number, o: Pick<PanelOptions, "widthMm" | "overlapMm">): number {
  return Math.max(1, Math.ceil((lengthMm - o.overlapMm) / (o.widthMm - o.overlapMm) - 1e-9));
}

export const PANEL_SOURCES = [FABRICATION_SOURCES.rolls, FABRICATION_SOURCES.overlap, FABRICATION_SOURCES.bleed] as const;
