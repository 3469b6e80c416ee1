// TEST ORACLE (test-only): the scale engine as it was before the single formatter module (issue 10),
// with the figures issue's rounding rules. Labels of app/lib/scale are compared with it. Do not change.
/**
 * Request schema of the scale engine (zod 4) and its validation, shared by the API route and the
 * designer's preview.
 */
import { z } from "zod";
import { parseGeoJsonRoute, parseGpxRoute, MAX_ROUTE_VERTICES } from "./geo-parse";
import { prepareRoute, type PreparedRoute } from "./route";
import {
  AGE_UNITS,
  LENGTH_UNITS,
  toMetres,
  toYears,
  unknownAgeUnitMessage,
  unknownLengthUnitMessage,
} from "./units";
import { MEDIUM_TYPES } from "./legibility";

export const MAX_POINTS = 5_000;
export const MAX_DURATIONS = 1_000;
export const MAX_INSETS = 50;
/** Oldest accepted age: 20 Ga, well past the age of the universe, to catch unit slips. */
export const MAX_AGE_YEARS = 2e10;

const finiteNumber = (what: string) =>
  z.number({
    error: (iss) => (iss.input === undefined ? `${what} is required.` : `${what} must be a finite number.`),
  });

const ageUnit = z.enum(AGE_UNITS, { error: (iss) => unknownAgeUnitMessage(iss.input) });
const lengthUnit = z.enum(LENGTH_UNITS, { error: (iss) => unknownLengthUnitMessage(iss.input) });

const objectOf = <T extends z.ZodRawShape>(what: string, shape: T) =>
  z.object(shape, { error: (iss) => (iss.input === undefined ? `${what} is required.` : `${what} must be an object.`) });

export const AgeSchema = objectOf("An age", {
  value: finiteNumber("An age value")
    .min(0, { error: "An age must not be negative (ages are years before present)." })
    .refine((v) => v <= MAX_AGE_YEARS, { error: "That age is older than 20 billion years; check the unit." }),
  unit: ageUnit,
});

/** Age uncertainty: same shape as an age, strictly positive. */
export const UncertaintySchema = objectOf("An uncertainty", {
  value: finiteNumber("An uncertainty value").min(0, { error: "An uncertainty must not be negative." }),
  unit: ageUnit,
});

export const LengthSchema = objectOf("A length", {
  value: finiteNumber("A length value").positive({ error: "A length must be greater than zero." }),
  unit: lengthUnit,
});

const idSchema = z
  .string({ error: "An id (string) is required." })
  .min(1, { error: "An id must not be empty." })
  .max(200, { error: "An id must be at most 200 characters." });

const labelSchema = z.string({ error: "A label must be a string." }).max(500, { error: "A label must be at most 500 characters." });

export const PointSchema = objectOf("A point", {
  id: idSchema,
  label: labelSchema.optional(),
  age: AgeSchema,
  uncertainty: UncertaintySchema.optional(),
});

export const DurationSchema = objectOf("A duration", {
  id: idSchema,
  label: labelSchema.optional(),
  years: finiteNumber("Duration years").positive({ error: "A duration must be longer than zero years." }).optional(),
  duration: objectOf("A duration", {
    value: finiteNumber("A duration value").positive({ error: "A duration must be longer than zero." }),
    unit: ageUnit,
  }).optional(),
}).superRefine((d, ctx) => {
  if ((d.years === undefined) === (d.duration === undefined)) {
    ctx.addIssue({ code: "custom", message: 'Give a duration either as "years": 67 or as "duration": {"value": 67, "unit": "a"}.', path: ["years"] });
  }
});

export const InsetSchema = objectOf("An inset", {
  id: idSchema.optional(),
  label: labelSchema.optional(),
  older: AgeSchema,
  younger: AgeSchema,
  magnification: finiteNumber("Magnification")
    .gt(1, { error: "An inset magnification must be greater than 1." })
    .max(1e12, { error: "An inset magnification must be at most 10¹²." }),
});

const LengthMediumSchema = z.object({
  kind: z.literal("length"),
  length: LengthSchema,
});

const RouteMediumSchema = z
  .object({
    kind: z.literal("route"),
    geometry: z.unknown().optional(),
    gpx: z.string({ error: "gpx must be the GPX document as a string." }).optional(),
  })
  .superRefine((m, ctx) => {
    if ((m.geometry === undefined) === (m.gpx === undefined)) {
      ctx.addIssue({
        code: "custom",
        message: 'A route medium needs exactly one of "geometry" (GeoJSON) or "gpx" (GPX text).',
        path: ["geometry"],
      });
    }
  });

export const MediumSchema = z.discriminatedUnion("kind", [LengthMediumSchema, RouteMediumSchema], {
  error: (iss) =>
    iss.input === undefined
      ? "A medium is required."
      : 'medium.kind must be "length" (a straight wall, rope or banner) or "route" (GeoJSON or GPX).',
});

const LegibilitySchema = z.object({
  minVisibleMetres: finiteNumber("minVisibleMetres").positive({ error: "minVisibleMetres must be greater than zero." }).optional(),
  minSpacingMetres: finiteNumber("minSpacingMetres").positive({ error: "minSpacingMetres must be greater than zero." }).optional(),
});

export const ScaleRequestSchema = z
  .object(
    {
      span: objectOf("A span", { older: AgeSchema, younger: AgeSchema }),
      medium: MediumSchema,
      mediumType: z
        .enum(MEDIUM_TYPES, { error: () => "mediumType must be one of trail, wall, rope, banner, other." })
        .optional(),
      legibility: LegibilitySchema.optional(),
      points: z.array(PointSchema, { error: "points must be an array." }).max(MAX_POINTS, { error: `At most ${MAX_POINTS.toLocaleString("en-US")} points are accepted in one request.` }).default([]),
      durations: z.array(DurationSchema, { error: "durations must be an array." }).max(MAX_DURATIONS, { error: `At most ${MAX_DURATIONS.toLocaleString("en-US")} durations are accepted in one request.` }).default([]),
      insets: z.array(InsetSchema, { error: "insets must be an array." }).max(MAX_INSETS, { error: `At most ${MAX_INSETS} insets are accepted in one request.` }).default([]),
      walkingSpeedMps: finiteNumber("walkingSpeedMps").positive({ error: "walkingSpeedMps must be greater than zero." }).max(10, { error: "walkingSpeedMps must be at most 10 m/s." }).optional(),
      accessibleSpeedMps: finiteNumber("accessibleSpeedMps").positive({ error: "accessibleSpeedMps must be greater than zero." }).max(10, { error: "accessibleSpeedMps must be at most 10 m/s." }).optional(),
      stepLengthM: finiteNumber("stepLengthM").positive({ error: "stepLengthM must be greater than zero." }).max(5, { error: "stepLengthM must be at most 5 m." }).optional(),
      routeStart: z.enum(["older", "younger"], { error: () => 'routeStart must be "older" or "younger".' }).optional(),
      lengthUnit: lengthUnit.optional(),
    },
    { error: (iss) => (iss.input === undefined ? "A request body is required." : "The request body must be a JSON object.") },
  )
  .superRefine((req, ctx) => {
    const older = toYears(req.span.older);
    const younger = toYears(req.span.younger);
    if (!(older > younger)) {
      ctx.addIssue({
        code: "custom",
        path: ["span", "older"],
        message: `span.older (${older.toLocaleString("en-US")} years) must be older — a larger age before present — than span.younger (${younger.toLocaleString("en-US")} years).`,
      });
      return;
    }
    const seen = new Set<string>();
    req.points.forEach((p, i) => {
      const a = toYears(p.age);
      if (a > older || a < younger) {
        ctx.addIssue({
          code: "custom",
          path: ["points", i, "age"],
          message: `Point "${p.id}" (${a.toLocaleString("en-US")} years) lies outside the span ${older.toLocaleString("en-US")}–${younger.toLocaleString("en-US")} years.`,
        });
      }
      if (seen.has(p.id)) ctx.addIssue({ code: "custom", path: ["points", i, "id"], message: `Duplicate point id "${p.id}".` });
      seen.add(p.id);
    });
    const seenD = new Set<string>();
    req.durations.forEach((d, i) => {
      if (seenD.has(d.id)) ctx.addIssue({ code: "custom", path: ["durations", i, "id"], message: `Duplicate duration id "${d.id}".` });
      seenD.add(d.id);
    });
    const seenI = new Set<string>();
    req.insets.forEach((ins, i) => {
      const o = toYears(ins.older);
      const y = toYears(ins.younger);
      if (!(o > y)) {
        ctx.addIssue({ code: "custom", path: ["insets", i, "older"], message: "An inset's older end must be older than its younger end." });
      } else if (o > older || y < younger) {
        ctx.addIssue({ code: "custom", path: ["insets", i], message: "An inset must lie inside the exhibit's span." });
      }
      if (ins.id !== undefined) {
        if (seenI.has(ins.id)) ctx.addIssue({ code: "custom", path: ["insets", i, "id"], message: `Duplicate inset id "${ins.id}".` });
        seenI.add(ins.id);
      }
    });
    if (req.medium.kind === "length") {
      const m = toMetres(req.medium.length);
      if (!(m <= 1e8)) ctx.addIssue({ code: "custom", path: ["medium", "length", "value"], message: "A length medium must be at most 100,000 km." });
    }
  });

export type ScaleRequestInput = z.input<typeof ScaleRequestSchema>;
export type ScaleRequest = z.output<typeof ScaleRequestSchema>;

export interface ValidationIssue {
  path: string;
  message: string;
}

export interface ValidationError {
  message: string;
  issues: ValidationIssue[];
}

export type ParsedScaleRequest =
  | { ok: true; request: ScaleRequest; route?: PreparedRoute }
  | { ok: false; error: ValidationError };

function summarise(issues: ValidationIssue[]): string {
  const first = issues[0];
  const where = first.path ? `${first.path}: ` : "";
  const more = issues.length > 1 ? ` (and ${issues.length - 1} more problem${issues.length > 2 ? "s" : ""})` : "";
  return `Invalid request — ${where}${first.message}${more}`;
}

/** Validate a decoded JSON body; on success a route medium comes back prepared. */
export function parseScaleRequest(body: unknown, options: { maxVertices?: number } = {}): ParsedScaleRequest {
  const r = ScaleRequestSchema.safeParse(body);
  if (!r.success) {
    const issues = r.error.issues.map((i) => ({ path: i.path.map(String).join("."), message: i.message }));
    return { ok: false, error: { message: summarise(issues), issues } };
  }
  const request = r.data;
  if (request.medium.kind === "route") {
    const maxVertices = options.maxVertices ?? MAX_ROUTE_VERTICES;
    const parsed =
      request.medium.gpx !== undefined
        ? parseGpxRoute(request.medium.gpx, "medium.gpx", { maxVertices })
        : parseGeoJsonRoute(request.medium.geometry, "medium.geometry", { maxVertices });
    if (!parsed.ok) return { ok: false, error: { message: summarise(parsed.issues), issues: parsed.issues } };
    return { ok: true, request, route: prepareRoute(parsed.coords) };
  }
  return { ok: true, request };
}
