// What creating or changing an exhibit takes (settings and medium), and the new-exhibit form read
// into it: every field checked, every problem reported on its field, nothing half-read.
import type { LengthUnit } from "../units";
import type { AgeUnit } from "../units";
import type { MediumType } from "../scale/legibility";
import { parseForm, type FieldErrors } from "../validation";
import { slugify } from "../slug";
import { LengthMediumSchema, NewExhibitSchema, SettingsSchema } from "./forms";
import { readRouteFile } from "./route-file";
import type { LineStringGeometry, UnitsPreference } from "./types";
import { TEXT_LIMITS } from "../limits";

export interface SettingsInput {
  title: string;
  spanOlderValue: number;
  spanOlderUnit: AgeUnit;
  spanYoungerValue: number;
  spanYoungerUnit: AgeUnit;
  mediumType: MediumType;
  unitsPreference: UnitsPreference;
  minVisibleMm?: number;
  minSpacingMm?: number;
}

export type RouteMediumInput = { kind: "route"; geometry: LineStringGeometry; lengthMetres: number; vertexCount: number; sourceName: string; /** Which tracks/routes of the file were used, when it holds several. */ note?: string };

export type MediumInput = { kind: "length"; lengthValue: number; lengthUnit: LengthUnit; panelWidthValue?: number; panelWidthUnit?: LengthUnit } | RouteMediumInput;

export interface NewExhibitInput {
  slug: string;
  editionSlug: string;
  settings: SettingsInput;
  medium: MediumInput;
}

/** An uploaded GPX or GeoJSON file as a route medium, or the reason it cannot be one. */
export async function routeMediumOf(file: File): Promise<{ ok: true; medium: RouteMediumInput } | { ok: false; message: string }> {
  const r = readRouteFile(file.name, await file.text());
  if (!r.ok) return { ok: false, message: r.message };
  return { ok: true, medium: { kind: "route", geometry: r.geometry, lengthMetres: r.lengthMetres, vertexCount: r.vertexCount, sourceName: file.name, ...(r.note ? { note: r.note } : {}) } };
}

export const NO_ROUTE_UPLOAD = "Upload the route as a GeoJSON or GPX file.";

/** The new-exhibit form: slug (or one made from the title), edition, span, and a length or an uploaded route. */
export async function readNewExhibitForm(form: FormData): Promise<{ ok: true; input: NewExhibitInput } | { ok: false; fields: FieldErrors }> {
  const fields: FieldErrors = {};
  const base = parseForm(NewExhibitSchema, form);
  const settings = parseForm(SettingsSchema, form);
  if (!base.ok) Object.assign(fields, base.fieldErrors);
  if (!settings.ok) Object.assign(fields, settings.fieldErrors);
  let medium: MediumInput | null = null;
  if (base.ok && base.data.mediumKind === "length") {
    const m = parseForm(LengthMediumSchema, form);
    if (m.ok) medium = { kind: "length", ...m.data };
    else Object.assign(fields, m.fieldErrors);
  } else if (base.ok) {
    const file = form.get("routeFile");
    if (!(file instanceof File) || file.size === 0) fields.routeFile = NO_ROUTE_UPLOAD;
    else {
      const r = await routeMediumOf(file);
      if (r.ok) medium = r.medium;
      else fields.routeFile = r.message;
    }
  }
  if (!base.ok || !settings.ok || !medium) return { ok: false, fields };
  const slug = base.data.slug ?? slugify(settings.data.title, TEXT_LIMITS.exhibits.slug, "exhibit");
  if (!slug) return { ok: false, fields: { slug: "Give the exhibit a slug made of letters and digits." } };
  return { ok: true, input: { slug, editionSlug: base.data.editionSlug, settings: settings.data, medium } };
}
