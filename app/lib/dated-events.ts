/**
 * The dated-event library: kinds of age, verification levels, exact decimal ages and the form
 * schema. Pure (zod only): used by the server, the seeders and the pages.
 *
 * Ages are kept as decimal strings in Ma, exactly as entered, so "4567.30" stays "4567.30" all the
 * way from the form to Postgres (NUMERIC) and back; unit changes shift the decimal point, never
 * multiply floating-point numbers.
 */
import { z } from "zod";
import { TEXT_LIMITS } from "./limits";
import { SLUG_PATTERN, slugify } from "./slug";
import { AGE_UNITS, type AgeUnit } from "./units";

export { SLUG_PATTERN, slugify };

export const AGE_KINDS = ["point", "approximate", "onset", "minimum"] as const;
export type AgeKind = (typeof AGE_KINDS)[number];

export const AGE_KIND_LABELS: Record<AgeKind, string> = {
  point: "Dated point",
  approximate: "Approximate",
  onset: "Onset of an episode",
  minimum: "Minimum age",
};

export const AGE_KIND_HINTS: Record<AgeKind, string> = {
  point: "A dated instant with its ± uncertainty.",
  approximate: "A rounded or model figure; show it with “about”.",
  onset: "The start of something longer (a glaciation, an extinction pulse).",
  minimum: "At least this old; the event may be older.",
};

/** How far a figure has been checked (DESIGN.md: [v] read in the source, [q] quoted, [r] recalled). */
export const VERIFICATIONS = ["checked against the source", "seen quoted by a secondary source", "from memory"] as const;
export type Verification = (typeof VERIFICATIONS)[number];

/** Powers of ten from the unit to Ma (a → Ma is 10⁻⁶). */
const UNIT_EXPONENT_TO_MA: Record<AgeUnit, number> = { a: -6, ka: -3, Ma: 0, Ga: 3 };

export const AGE_UNIT_WORDS: Record<AgeUnit, string> = { a: "years", ka: "thousand years", Ma: "million years", Ga: "billion years" };

/** Oldest age the library accepts: a little over the age of the Universe (13,787 ± 20 Ma). */
export const MAX_AGE_MA = 14000;

export const LIBRARY_LIMITS = {
  name: TEXT_LIMITS.dated_events.name,
  slug: TEXT_LIMITS.dated_events.slug,
  summary: 500,
  citation: 2000,
  doi: TEXT_LIMITS.dated_events.doi,
  url: TEXT_LIMITS.dated_events.url,
  datingMethod: TEXT_LIMITS.dated_events.datingMethod,
} as const;

// ---------------------------------------------------------------------------------------------
// Exact decimals
// ---------------------------------------------------------------------------------------------

export const DECIMAL_PATTERN = /^\d+(\.\d+)?$/;

/** Removes leading zeros of the whole part (keeps one) and a bare trailing point. */
function tidy(whole: string, fraction: string): string {
  const w = whole.replace(/^0+(?=\d)/, "") || "0";
  return fraction ? `${w}.${fraction}` : w;
}

/**
 * Moves the decimal point of a plain decimal string by `places` (positive → larger number).
 * Exact. Zeros that only padded the whole part ("11700") are not turned into claimed decimals.
 */
export function shiftDecimal(value: string, places: number): string {
  if (!DECIMAL_PATTERN.test(value)) throw new RangeError(`Not a plain decimal: ${value}`);
  const [whole, fraction = ""] = value.split(".");
  const digits = whole + fraction;
  let point = whole.length + places;
  let padded = digits;
  if (point < 0) {
    padded = "0".repeat(-point) + digits;
    point = 0;
  }
  if (point > padded.length) padded = padded + "0".repeat(point - padded.length);
  let w = padded.slice(0, point);
  let f = padded.slice(point);
  if (places < 0 && fraction === "") {
    // Trailing zeros of a whole number carry no stated precision: don't keep them as decimals.
    f = f.replace(/0+$/, "");
  }
  if (w === "") w = "0";
  return tidy(w, f);
}

/** An age typed in a unit, as an exact decimal string in Ma. */
export function toMa(value: string, unit: AgeUnit): string {
  return shiftDecimal(value, UNIT_EXPONENT_TO_MA[unit]);
}

/** An exact Ma string in another unit. */
export function fromMa(ma: string, unit: AgeUnit): string {
  return shiftDecimal(ma, -UNIT_EXPONENT_TO_MA[unit]);
}

/** Postgres may hand NUMERIC back as "4567.30"; numbers from JS code are turned into plain decimals. */
export function plainDecimal(value: string | number): string {
  if (typeof value === "string" && DECIMAL_PATTERN.test(value)) return value;
  const n = Number(value);
  if (!Number.isFinite(n) || n < 0) throw new RangeError(`Not a non-negative decimal: ${value}`);
  const s = String(n);
  if (!s.includes("e")) return s;
  return n.toFixed(20).replace(/0+$/, "").replace(/\.$/, "");
}

/** The unit an age reads best in: Ma from 1 Ma up, ka from 1 ka, else years. */
export function displayUnit(ma: string): AgeUnit {
  const n = Number(ma);
  if (n >= 1) return "Ma";
  if (n >= 0.001) return "ka";
  return "a";
}

export interface AgeDisplay {
  unit: AgeUnit;
  age: string;
  uncertainty: string | null;
  /** "4567.30 ± 0.16 Ma", "315 ± 34 ka", "about 5.2 ka", "at least 4510 Ma". */
  text: string;
}

/** An age (and ±) in the unit it reads best in, exactly as stored, with its kind's wording. */
export function formatAge(ageMa: string | number, uncertaintyMa: string | number | null, kind: AgeKind = "point"): AgeDisplay {
  const age = plainDecimal(ageMa);
  const unc = uncertaintyMa === null ? null : plainDecimal(uncertaintyMa);
  const unit = displayUnit(age);
  const a = fromMa(age, unit);
  const u = unc === null ? null : fromMa(unc, unit);
  const figure = u === null ? `${a} ${unit}` : `${a} ± ${u} ${unit}`;
  const prefix = kind === "approximate" ? "about " : kind === "minimum" ? "at least " : kind === "onset" ? "from " : "";
  return { unit, age: a, uncertainty: u, text: prefix + figure };
}

/**
 * A duration in years (exact decimal string, e.g. a half-life) in the unit symbol it reads best in,
 * every stated digit kept: Ga from 1 Ga, Ma from 1 Ma, ka from 100 ka, else years ("4.4683 Ga",
 * "705 ka", "5730 a"). Years in words, rounded, for sentences: formatYears in app/lib/scale/format.ts.
 */
export function formatExactYears(years: string | number, uncertaintyYears: string | number | null = null): string {
  const y = plainDecimal(years);
  const u = uncertaintyYears === null ? null : plainDecimal(uncertaintyYears);
  const n = Number(y);
  const unit: AgeUnit = n >= 1e9 ? "Ga" : n >= 1e6 ? "Ma" : n >= 1e5 ? "ka" : "a";
  const shift = (s: string) => shiftDecimal(s, -{ a: 0, ka: 3, Ma: 6, Ga: 9 }[unit]);
  return u === null ? `${shift(y)} ${unit}` : `${shift(y)} ± ${shift(u)} ${unit}`;
}

// ---------------------------------------------------------------------------------------------
// The form
// ---------------------------------------------------------------------------------------------

/** "https://doi.org/10.1038/35051550", "doi:10.1038/35051550" → "10.1038/35051550". */
export function normaliseDoi(input: string): string {
  return input
    .trim()
    .replace(/^https?:\/\/(dx\.)?doi\.org\//i, "")
    .replace(/^doi:\s*/i, "");
}

const DOI_PATTERN = /^10\.\d{4,9}\/\S+$/;

const text = (message: string) => z.string({ error: message }).trim();
const optionalText = (max: number, message: string) =>
  z
    .string({ error: message })
    .trim()
    .max(max, { error: message })
    .optional()
    .transform((s) => (s ? s : null));

const decimalField = (label: string) =>
  z
    .string({ error: `${label}: enter a number.` })
    .trim()
    .refine((s) => s === "" || DECIMAL_PATTERN.test(s), {
      error: `${label}: write a plain number such as 4567.30 or 0.315 — digits with a decimal point, no spaces, commas or signs.`,
    });

/**
 * The dated-event form. Every message names the field and the reason. The age arrives as a value
 * and a unit and leaves as exact decimal strings in Ma (`ageMa`, `uncertaintyMa`).
 */
export const DatedEventFormSchema = z
  .object({
    name: text("Name: enter the event's name.")
      .min(3, { error: "Name: use at least 3 characters." })
      .max(LIBRARY_LIMITS.name, { error: `Name: use at most ${LIBRARY_LIMITS.name} characters.` }),
    slug: z
      .string({ error: "Slug: use lower-case letters, digits and hyphens." })
      .trim()
      .max(LIBRARY_LIMITS.slug, { error: `Slug: use at most ${LIBRARY_LIMITS.slug} characters.` })
      .refine((s) => s === "" || SLUG_PATTERN.test(s), { error: "Slug: use lower-case letters, digits and single hyphens, like jack-hills-zircon." })
      .optional(),
    summary: text("Summary: write a sentence or two about the event.")
      .min(10, { error: "Summary: write at least 10 characters — a sentence a visitor can read." })
      .max(LIBRARY_LIMITS.summary, { error: `Summary: keep it to ${LIBRARY_LIMITS.summary} characters; put the detail in the citation.` }),
    ageValue: decimalField("Age").refine((s) => s !== "", { error: "Age: enter the age, e.g. 4404 (Ma) or 315 (ka)." }),
    ageUnit: z.enum(AGE_UNITS, { error: "Age unit: choose a, ka, Ma or Ga." }),
    uncertaintyValue: decimalField("Uncertainty").optional(),
    ageKind: z.enum(AGE_KINDS, { error: "Kind of age: choose dated point, approximate, onset or minimum." }),
    citation: text("Citation: give the full reference.")
      .min(20, { error: "Citation: give the full reference — authors, year, title, journal or publisher, volume and pages." })
      .max(LIBRARY_LIMITS.citation, { error: `Citation: use at most ${LIBRARY_LIMITS.citation} characters.` })
      .refine((s) => s === "" || /\b(1[5-9]\d\d|20\d\d)\b/.test(s), { error: "Citation: include the year of publication." }),
    doi: z
      .string({ error: "DOI: enter a DOI such as 10.1038/35051550." })
      .optional()
      .transform((s) => (s ? normaliseDoi(s) : null))
      .refine((s) => s === null || (s.length <= LIBRARY_LIMITS.doi && DOI_PATTERN.test(s)), {
        error: "DOI: enter a DOI such as 10.1038/35051550 (a doi.org link works too).",
      }),
    url: optionalText(LIBRARY_LIMITS.url, `Link: use at most ${LIBRARY_LIMITS.url} characters.`).refine(
      (s) => s === null || /^https?:\/\/[^\s/$.?#][^\s]*$/i.test(s),
      { error: "Link: enter a web address starting with https:// (or http://)." },
    ),
    datingMethod: optionalText(LIBRARY_LIMITS.datingMethod, `Dating method: use at most ${LIBRARY_LIMITS.datingMethod} characters.`),
    verification: z.enum(VERIFICATIONS, { error: "Checked: say whether the figure was checked against the source, seen quoted, or is from memory." }),
  })
  .superRefine((v, ctx) => {
    if (!DECIMAL_PATTERN.test(v.ageValue)) return;
    const ageMa = toMa(v.ageValue, v.ageUnit);
    if (Number(ageMa) > MAX_AGE_MA) {
      ctx.addIssue({ code: "custom", path: ["ageValue"], message: `Age: ${v.ageValue} ${v.ageUnit} is older than the Universe; the library takes ages up to ${MAX_AGE_MA} Ma.` });
    }
    if (v.uncertaintyValue && DECIMAL_PATTERN.test(v.uncertaintyValue)) {
      const uMa = toMa(v.uncertaintyValue, v.ageUnit);
      if (Number(uMa) > Number(ageMa)) {
        ctx.addIssue({ code: "custom", path: ["uncertaintyValue"], message: "Uncertainty: the ± cannot be larger than the age itself (it is in the same unit as the age)." });
      }
    }
  })
  .transform((v) => ({
    name: v.name,
    slug: v.slug ? v.slug : slugify(v.name, LIBRARY_LIMITS.slug, "event"),
    summary: v.summary,
    ageMa: toMa(v.ageValue, v.ageUnit),
    uncertaintyMa: v.uncertaintyValue ? toMa(v.uncertaintyValue, v.ageUnit) : null,
    ageKind: v.ageKind,
    citation: v.citation,
    doi: v.doi,
    url: v.url,
    datingMethod: v.datingMethod,
    verification: v.verification,
  }));

export type DatedEventInput = z.output<typeof DatedEventFormSchema>;

/** One library entry as pages and the search API see it. */
export interface DatedEventView {
  id: number;
  slug: string;
  name: string;
  summary: string;
  /** Exact decimal string, Ma. */
  ageMa: string;
  uncertaintyMa: string | null;
  ageKind: AgeKind;
  /** Display text, e.g. "4404 ± 8 Ma". */
  ageText: string;
  citation: string;
  doi: string | null;
  url: string | null;
  datingMethod: string | null;
  verification: Verification;
  /** Shared entries: the source the figures were checked against (null = not reached; own entries: null). */
  checkedAgainst: string | null;
  /** "shared" = the Eonscale library every organisation sees; "organisation" = this organisation's own. */
  scope: "shared" | "organisation";
}
