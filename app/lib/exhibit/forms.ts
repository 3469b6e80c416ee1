// zod schemas of the composer's forms. Pure: the server validates with them, and the browser
// preview uses the same rules for its live messages.
import { z } from "zod";
import { MEDIUM_TYPES } from "../scale/legibility";
import { AGE_UNITS, LENGTH_UNITS, YEARS_PER_AGE_UNIT as f } from "../units";
import { RANKS } from "../timescale/types";
import { INT4, MAX_INSET_MAGNIFICATION, TEXT_LIMITS } from "../limits";
import { SLUG_PATTERN, slugify } from "../slug";
import { UNITS_PREFERENCES } from "./types";

const blankToUndefined = (v: unknown) => (typeof v === "string" && v.trim() === "" ? undefined : v);

export const numberField = (what: string, opts: { min?: number; positive?: boolean } = {}) =>
  z.preprocess(
    blankToUndefined,
    z.coerce
      .number({ error: (iss) => (iss.input === undefined ? `Enter ${what}.` : `${cap(what)} must be a number.`) })
      .refine(Number.isFinite, { error: `${cap(what)} must be a number.` })
      .refine((v) => (opts.positive ? v > 0 : true), { error: `${cap(what)} must be greater than zero.` })
      .refine((v) => (opts.min !== undefined ? v >= opts.min : true), { error: `${cap(what)} must be at least ${opts.min}.` }),
  );

const optionalNumber = (what: string, opts: { min?: number; positive?: boolean } = {}) => z.preprocess(blankToUndefined, numberField(what, opts).optional());

function cap(s: string) {
  return s.charAt(0).toUpperCase() + s.slice(1);
}

const ageUnit = z.enum(AGE_UNITS, { error: `Choose an age unit: ${AGE_UNITS.join(", ")}.` });
const lengthUnit = z.enum(LENGTH_UNITS, { error: `Choose a length unit: ${LENGTH_UNITS.join(", ")}.` });

export const TitleSchema = z.string({ error: "Give the exhibit a title." }).trim().min(1, { error: "Give the exhibit a title." }).max(TEXT_LIMITS.exhibits.title, { error: `Keep the title under ${TEXT_LIMITS.exhibits.title} characters.` });

export const SlugSchema = z
  .string({ error: "Give the exhibit a web address (slug)." })
  .trim()
  .toLowerCase()
  .regex(SLUG_PATTERN, { error: "Use lower-case letters, digits and single hyphens, like riverside-walk." })
  .max(TEXT_LIMITS.exhibits.slug, { error: `Keep the slug under ${TEXT_LIMITS.exhibits.slug} characters.` });

export { slugify };

/** The span and medium settings (new exhibit and the settings form of the composer). */
export const SettingsSchema = z
  .object({
    title: TitleSchema,
    spanOlderValue: numberField("the older age", { min: 0 }),
    spanOlderUnit: ageUnit,
    spanYoungerValue: numberField("the younger age", { min: 0 }),
    spanYoungerUnit: ageUnit,
    mediumType: z.enum(MEDIUM_TYPES, { error: `Choose what the exhibit is: ${MEDIUM_TYPES.join(", ")}.` }),
    unitsPreference: z.enum(UNITS_PREFERENCES, { error: "Choose metric or US customary units." }),
    minVisibleMm: optionalNumber("the smallest visible length", { positive: true }),
    minSpacingMm: optionalNumber("the smallest marker spacing", { positive: true }),
  })
  .superRefine((v, ctx) => {
    if (!(v.spanOlderValue * f[v.spanOlderUnit] > v.spanYoungerValue * f[v.spanYoungerUnit])) {
      ctx.addIssue({ code: "custom", path: ["spanOlderValue"], message: "The older end of the span must be older than the younger end." });
    }
  });

export const LengthMediumSchema = z.object({
  lengthValue: numberField("the length", { positive: true }),
  lengthUnit,
  panelWidthValue: optionalNumber("the panel width", { positive: true }),
  panelWidthUnit: z.preprocess(blankToUndefined, lengthUnit.optional()),
});

export const NewExhibitSchema = z.object({
  slug: z.preprocess(blankToUndefined, SlugSchema.optional()),
  editionSlug: z.string({ error: "Choose the chart edition to pin." }).min(1, { error: "Choose the chart edition to pin." }),
  mediumKind: z.enum(["length", "route"], { error: "Choose a straight length or a route." }),
});

export const BoundaryMarkersSchema = z
  .object({
    intervalName: z.preprocess(blankToUndefined, z.string().optional()),
    rank: z.preprocess(blankToUndefined, z.enum(RANKS, { error: `Choose a rank: ${RANKS.join(", ")}.` }).optional()),
  })
  .refine((v) => Boolean(v.intervalName) !== Boolean(v.rank), { path: ["intervalName"], error: "Choose one interval, or a whole rank (e.g. all periods)." });

export const EventMarkerSchema = z.object({
  eventId: z.coerce.number({ error: "Choose an event from the library." }).int().positive({ error: "Choose an event from the library." }),
});

export const CustomMarkerSchema = z.object({
  label: z.string({ error: "Give the marker a label." }).trim().min(1, { error: "Give the marker a label." }).max(TEXT_LIMITS.markers.label, { error: `Keep the label under ${TEXT_LIMITS.markers.label} characters.` }),
  ageValue: numberField("the age", { min: 0 }),
  ageUnit,
  uncertaintyValue: optionalNumber("the uncertainty", { min: 0 }),
  source: z.string({ error: "Name the source of this age." }).trim().min(3, { error: "Name the source of this age (a citation, a dataset, a named expert)." }).max(1000, { error: "Keep the source under 1,000 characters." }),
  text: z.string().max(2000, { error: "Keep the text under 2,000 characters." }).default(""),
});

export const MarkerTextSchema = z.object({
  markerId: z.coerce.number({ error: "Missing marker." }).int().positive({ error: "Missing marker." }),
  label: z.string({ error: "Give the marker a label." }).trim().min(1, { error: "Give the marker a label." }).max(TEXT_LIMITS.markers.label, { error: `Keep the label under ${TEXT_LIMITS.markers.label} characters.` }),
  text: z.string().max(2000, { error: "Keep the text under 2,000 characters (about 75–100 words is the usual label length)." }).default(""),
  decaySystemId: z.preprocess(blankToUndefined, z.coerce.number({ error: "Choose a decay system from the list." }).int().positive({ error: "Choose a decay system from the list." }).optional()),
});

export const InsetFormSchema = z
  .object({
    olderValue: numberField("the inset's older age", { min: 0 }),
    olderUnit: ageUnit,
    youngerValue: numberField("the inset's younger age", { min: 0 }),
    youngerUnit: ageUnit,
    magnification: numberField("the magnification")
      .refine((m) => m > 1, { error: "The magnification must be greater than 1×." })
      .refine((m) => m <= MAX_INSET_MAGNIFICATION, { error: `The magnification must be at most ${MAX_INSET_MAGNIFICATION.toLocaleString("en-GB")}×.` }),
    label: z.preprocess(blankToUndefined, z.string().trim().max(TEXT_LIMITS.markers.label, { error: `Keep the label under ${TEXT_LIMITS.markers.label} characters.` }).optional()),
  })
  .superRefine((v, ctx) => {
    if (!(v.olderValue * f[v.olderUnit] > v.youngerValue * f[v.youngerUnit])) {
      ctx.addIssue({ code: "custom", path: ["olderValue"], message: "The inset's older age must be older than its younger age." });
    }
  });

export const RevisionSchema = z.coerce.number({ error: "The form lost its revision number; reload the page." }).int({ error: "The form lost its revision number; reload the page." }).positive({ error: "The form lost its revision number; reload the page." }).max(INT4.max, { error: "The form's revision number is not one this exhibit can have; reload the page." });
