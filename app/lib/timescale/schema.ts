// Row validation for imports (CSV and JSON), with zod 4.

import { z } from "zod";
import { INT4, TEXT_LIMITS } from "../limits";
import { CONTROL_CHARACTER_REASON, hasNoControlCharacters } from "../validation";
import { BOUNDARY_KINDS, RANKS, type Interval, type Problem } from "./types";

const HEX = /^#[0-9A-Fa-f]{6}$/;

export const intervalSchema = z.strictObject(
  {
    name: z
      .string({ error: "name must be text" })
      .min(1, { error: "name is required" })
      .max(TEXT_LIMITS.intervals.name, { error: `name must be at most ${TEXT_LIMITS.intervals.name} characters` })
      .refine((s) => s.trim() === s, { error: "name must not start or end with spaces" })
      .refine(hasNoControlCharacters, { error: `name ${CONTROL_CHARACTER_REASON}` }),
    rank: z.enum(RANKS, { error: `rank must be one of ${RANKS.join(", ")}` }),
    parent: z
      .string({ error: "parent must be the name of another interval, or empty for an eon" })
      .min(1, { error: "parent must be the name of another interval, or empty for an eon" })
      .nullable(),
    baseMa: z.number({ error: "base age must be a number of Ma" }).min(0, { error: "base age must not be below 0 Ma" }),
    baseUncertaintyMa: z
      .number({ error: "base uncertainty must be a number of Ma, or empty" })
      .min(0, { error: "base uncertainty must not be negative" })
      .nullable(),
    topMa: z.number({ error: "top age must be a number of Ma" }).min(0, { error: "top age must not be below 0 Ma" }),
    color: z.string({ error: "colour must be text" }).regex(HEX, { error: 'colour must be a hex colour "#RRGGBB"' }),
    gssp: z.boolean({ error: "gssp must be true, false or empty (not stated)" }).nullable(),
    // Files written before boundary kinds existed have no such field: read as "not stated".
    boundaryKind: z.enum(BOUNDARY_KINDS, { error: "boundary kind must be GSSP, GSSA or empty (not stated)" }).nullable().optional().default(null),
    approximate: z.boolean({ error: "approximate must be true or false" }),
    names: z.record(z.string(), z.string({ error: "each translated name must be text" }), {
      error: "names must be an object of language → name",
    }),
    order: z
      .number({ error: "order must be a whole number" })
      .int({ error: "order must be a whole number" })
      .positive({ error: "order must be 1 or more" })
      .max(INT4.max, { error: `order must be at most ${INT4.max}` }),
  },
  { error: "each interval must be an object" },
);

/** Validate one row; `fieldName` maps Interval field names to the file format's own names. */
export function validateInterval(
  value: unknown,
  line: number,
  fieldName: (field: string) => string = (f) => f,
): { interval?: Interval; problems: Problem[] } {
  const r = intervalSchema.safeParse(value);
  if (r.success) return { interval: r.data as Interval, problems: [] };
  const name =
    value && typeof value === "object" && typeof (value as { name?: unknown }).name === "string"
      ? (value as { name: string }).name
      : "";
  const problems: Problem[] = r.error.issues.map((issue) => {
    let field = issue.path.length ? String(issue.path[0]) : "";
    if (issue.code === "unrecognized_keys") field = issue.keys.join(",");
    const message =
      issue.code === "unrecognized_keys"
        ? `unknown field${issue.keys.length > 1 ? "s" : ""}: ${issue.keys.join(", ")}`
        : issue.message;
    return { interval: name, field: field ? fieldName(field) : "", message, line, rule: "row" as const };
  });
  return { problems };
}
