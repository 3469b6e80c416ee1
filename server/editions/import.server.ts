// Importing a chart edition: upload → preview (every problem, nothing saved) → confirm (parsed and
// checked again from scratch; saved as a draft only when no problem remains and the server signed
// the preview). A chart steward imports shared editions; an organisation's editor or admin imports
// the organisation's own editions, which are always labelled as its own (never as an ICS edition).
import { createHash, createHmac, timingSafeEqual } from "node:crypto";
import { z } from "zod";
import { ChartEdition, Interval as IntervalRow } from "../../db/models/index.ts";
import { decide, type Subject } from "../../app/lib/permissions.ts";
import {
  CORRECTABLE_FIELDS,
  RANKS,
  check,
  compare,
  parseCsv,
  parseJson,
  parseTurtle,
  type Correction,
  type EditionComparison,
  type Interval,
  type Problem,
} from "../../app/lib/timescale/index.ts";
import { audit } from "../audit.server.ts";
import { sequelize } from "../db.server.ts";
import { env } from "../env.server.ts";
import { BodyTooLargeError, megabytes, readLimitedFormData as readFormDataWithin } from "../http.server.ts";
import { currentEditionFor, editionIntervals, EditionError, emptyCounts, type RankCounts } from "./reads.server.ts";

/** Largest file an editor may upload: 5 MB. */
export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
/** Largest import request: the file (or, on confirm, its text in base64) plus the form fields. */
export const MAX_IMPORT_REQUEST_BYTES = Math.ceil(MAX_UPLOAD_BYTES / 3) * 4 + 256 * 1024;

export const IMPORT_FORMATS = ["csv", "json", "turtle"] as const;
export type ImportFormat = (typeof IMPORT_FORMATS)[number];
export const FORMAT_LABELS: Record<ImportFormat, string> = {
  csv: "Eonscale interval CSV",
  json: "Eonscale interval JSON",
  turtle: "ICS chart linked data (Turtle)",
};

// ------------------------------------------------------------------------------------------
// Import: upload → preview (every problem, nothing saved) → confirm (parsed and checked again).
// ------------------------------------------------------------------------------------------

/** Words the edition pages use themselves (/editions/compare). */
const RESERVED_SLUGS = ["compare", "import", "new"];

const trimmed = (schema: z.ZodString) => z.preprocess((v) => (typeof v === "string" ? v.trim() : v), schema);

export const EditionMetaSchema = z.object({
  slug: trimmed(
    z
      .string({ error: "Enter a slug for the edition's web address, like ics-2025-06." })
      .min(3, { error: "Slug: use at least 3 characters, like ics-2025-06." })
      .max(60, { error: "Slug: use at most 60 characters." })
      .regex(/^[a-z0-9]+(-[a-z0-9]+)*$/, { error: "Slug: use lower-case letters, digits and single hyphens only, like ics-2025-06." })
      .refine((s) => !RESERVED_SLUGS.includes(s), { error: "Slug: this word is used by the site's own pages; choose another, like ics-2025-06." }),
  ),
  label: trimmed(
    z
      .string({ error: "Enter a label, like ICS 2025/06." })
      .min(1, { error: "Enter a label, like ICS 2025/06." })
      .max(100, { error: "Label: use at most 100 characters." }),
  ),
  source: trimmed(
    z
      .string({ error: "Enter the source citation: the chart edition and where the data file came from." })
      .min(10, { error: "Source: give the full citation of the chart edition and the data file (at least 10 characters)." })
      .max(4000, { error: "Source: use at most 4000 characters." }),
  ),
  licence: trimmed(
    z
      .string({ error: "Enter the licence the data is published under, like CC BY 4.0." })
      .min(2, { error: "Enter the licence the data is published under, like CC BY 4.0." })
      .max(1000, { error: "Licence: use at most 1000 characters." }),
  ),
});
export type EditionMetaInput = z.output<typeof EditionMetaSchema>;

const FormatChoice = z.enum(["auto", ...IMPORT_FORMATS], { error: "Choose the file format: CSV, JSON or Turtle." });


export const UploadSchema = EditionMetaSchema.extend({
  format: FormatChoice.default("auto"),
  // A file input left empty still sends a part: a nameless, empty file.
  file: z.preprocess(
    (v) => (v instanceof File && v.size === 0 && v.name === "" ? undefined : v),
    z
      .file({ error: "Choose a file to upload: CSV, JSON or Turtle (.csv, .json, .ttl)." })
      .min(1, { error: "The file is empty. Choose the file with the edition's intervals." })
      .max(MAX_UPLOAD_BYTES, { error: `The file is larger than ${megabytes(MAX_UPLOAD_BYTES)}. Upload at most ${megabytes(MAX_UPLOAD_BYTES)}.` }),
  ),
});

/** The confirm step carries the previewed text back base64-encoded, byte for byte (form encodings rewrite line ends). */
export const ConfirmSchema = EditionMetaSchema.extend({
  format: z.enum(IMPORT_FORMATS, { error: "The file format is missing; upload the file again." }),
  fileName: z.string().max(300).default(""),
  content: z
    .string({ error: "The previewed file is missing; upload it again." })
    .min(1, { error: "The previewed file is missing; upload it again." })
    .max(Math.ceil(MAX_UPLOAD_BYTES / 3) * 4 + 4, { error: `The file is larger than ${megabytes(MAX_UPLOAD_BYTES)}.` })
    .regex(/^[A-Za-z0-9+/]*={0,2}$/, { error: "The previewed file is damaged; upload it again." })
    .transform((b64) => Buffer.from(b64, "base64").toString("utf8")),
  token: z.string({ error: "The preview has expired; upload the file again." }).min(1, { error: "The preview has expired; upload the file again." }),
});

/** Read a form body of at most `limit` bytes (by header, then by counting the stream). */
/** The import form (file text travels base64 in the confirm step, hence the larger limit). */
export async function readLimitedFormData(request: Request, limit = MAX_IMPORT_REQUEST_BYTES): Promise<FormData> {
  try {
    return await readFormDataWithin(request, limit);
  } catch (error) {
    if (error instanceof BodyTooLargeError) {
      throw new EditionError(`The upload is larger than ${megabytes(MAX_UPLOAD_BYTES)}. Upload a file of at most ${megabytes(MAX_UPLOAD_BYTES)}.`, "file", 413);
    }
    throw error;
  }
}

export function detectFormat(fileName: string, text: string): ImportFormat {
  const lower = fileName.toLowerCase();
  if (lower.endsWith(".csv")) return "csv";
  if (lower.endsWith(".json")) return "json";
  if (lower.endsWith(".ttl") || lower.endsWith(".turtle")) return "turtle";
  const start = text.replace(/^\uFEFF/, "").trimStart();
  if (start.startsWith("[") || start.startsWith("{")) return "json";
  if (/^(@prefix|@base|PREFIX|BASE)\b/i.test(start)) return "turtle";
  return "csv";
}

/** Decode an uploaded file as UTF-8 text, refusing anything that is not. */
export async function fileText(file: File): Promise<string> {
  const bytes = new Uint8Array(await file.arrayBuffer());
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes).replace(/^\uFEFF/, "");
  } catch {
    throw new EditionError("The file is not UTF-8 text. Save it as UTF-8 (CSV, JSON or Turtle) and upload it again.", "file");
  }
}

const CorrectionSchema = z.strictObject({
  interval: z.string().min(1),
  field: z.enum(CORRECTABLE_FIELDS),
  from: z.union([z.string(), z.number(), z.boolean(), z.null()]),
  to: z.union([z.string(), z.number(), z.boolean(), z.null()]),
  reason: z.string().min(1),
  source: z.string().min(1),
});

const CSV_COLUMN_OF: Record<string, string> = {
  baseMa: "base_ma",
  baseUncertaintyMa: "base_uncertainty_ma",
  topMa: "top_ma",
  names: "names_json",
};

export interface ParsedUpload {
  format: ImportFormat;
  intervals: Interval[];
  problems: Problem[];
  /** Corrections carried by a JSON edition file ({ edition: { corrections }, intervals }). */
  corrections: Correction[];
}

/** Parse and check a file in one of the import formats. Every problem is returned; nothing is saved. */
export function parseUpload(format: ImportFormat, text: string): ParsedUpload {
  if (format === "csv") {
    const r = parseCsv(text);
    // check() names Interval fields; in a CSV the person fixing the file looks for the column.
    const problems = r.problems.map((p) => (CSV_COLUMN_OF[p.field] ? { ...p, field: CSV_COLUMN_OF[p.field] } : p));
    return { format, intervals: r.intervals, problems, corrections: [] };
  }
  if (format === "turtle") {
    const r = parseTurtle(text);
    return { format, intervals: r.intervals, problems: r.problems, corrections: [] };
  }
  const r = parseJson(text);
  const problems = [...r.problems];
  let corrections: Correction[] = [];
  try {
    const data = JSON.parse(text) as unknown;
    const list = data && typeof data === "object" && !Array.isArray(data) ? (data as { edition?: { corrections?: unknown } }).edition?.corrections : undefined;
    if (list !== undefined) {
      const parsed = z.array(CorrectionSchema).safeParse(list);
      if (parsed.success) corrections = parsed.data as Correction[];
      else {
        for (const issue of parsed.error.issues) {
          problems.push({ interval: "", field: `edition.corrections.${issue.path.join(".")}`, message: `a correction is not valid: ${issue.message}`, rule: "row" });
        }
      }
    }
  } catch {
    // parseJson has reported the syntax error already
  }
  return { format, intervals: r.intervals, problems, corrections };
}

function previewToken(userId: number, format: ImportFormat, content: string): string {
  const digest = createHash("sha256").update(content).digest("hex");
  const secret = env().SESSION_SECRET.split(",")[0].trim();
  return createHmac("sha256", secret).update(`edition-import\n${userId}\n${format}\n${digest}`).digest("base64url");
}

function tokenMatches(userId: number, format: ImportFormat, content: string, token: string): boolean {
  const expected = Buffer.from(previewToken(userId, format, content));
  const given = Buffer.from(token);
  return expected.length === given.length && timingSafeEqual(expected, given);
}

export interface ImportPreview {
  meta: EditionMetaInput;
  format: ImportFormat;
  fileName: string;
  bytes: number;
  counts: RankCounts;
  problems: Problem[];
  /** Problems with the edition's own fields (slug taken, …), by form field. */
  metaErrors: Record<string, string>;
  intervals: Interval[];
  corrections: Correction[];
  /** Against the current edition, when there are intervals to compare. */
  comparedWith: { slug: string; label: string; moved: number; added: number; removed: number; renamed: number } | null;
  /** Only when nothing stands in the way: the text (base64) and a server-signed token for the confirm step. */
  confirm: { content: string; token: string } | null;
}

/** Build the preview of an upload (also used on confirm, which re-does every check). */
export async function previewImport(input: {
  meta: EditionMetaInput;
  format: ImportFormat;
  fileName: string;
  content: string;
  userId: number;
  /** The organisation that will own the edition; null for a shared edition. */
  ownerId: number | null;
}): Promise<ImportPreview> {
  const parsed = parseUpload(input.format, input.content);
  const metaErrors: Record<string, string> = {};
  if (await ChartEdition.findOne({ where: { slug: input.meta.slug }, attributes: ["id"] })) {
    metaErrors.slug = `Slug: "${input.meta.slug}" is already used by another edition. Choose another, like ${input.meta.slug}-draft.`;
  }
  if (input.ownerId !== null && OFFICIAL_LABEL.test(input.meta.label)) {
    metaErrors.label = "Label: an organisation's own edition must not be named like an ICS edition. Name it as your own, like “Marrowby working chart 2025”.";
  }
  const counts = emptyCounts();
  for (const iv of parsed.intervals) counts[iv.rank]++;
  let comparedWith: ImportPreview["comparedWith"] = null;
  const current = await currentEditionFor(input.ownerId);
  if (current && parsed.intervals.length) {
    const c: EditionComparison = compare(await editionIntervals(current.id), parsed.intervals);
    comparedWith = { slug: current.slug, label: current.label, moved: c.moved.length, added: c.added.length, removed: c.removed.length, renamed: c.renamed.length };
  }
  const ok = parsed.problems.length === 0 && Object.keys(metaErrors).length === 0 && parsed.intervals.length > 0;
  return {
    meta: input.meta,
    format: input.format,
    fileName: input.fileName,
    bytes: Buffer.byteLength(input.content, "utf8"),
    counts,
    problems: parsed.problems,
    metaErrors,
    intervals: parsed.intervals,
    corrections: parsed.corrections,
    comparedWith,
    confirm: ok ? { content: Buffer.from(input.content, "utf8").toString("base64"), token: previewToken(input.userId, input.format, input.content) } : null,
  };
}

/** A label that reads like an official chart edition ("ICS 2025/06", "International Chronostratigraphic Chart …"). */
const OFFICIAL_LABEL = /^\s*(ics\b|international\s+chronostratigraphic)/i;

/** A steward imports shared editions; an organisation's editor or admin imports its own. */
export function assertMayImport(subject: Subject, ownerId: number | null) {
  const decision = decide(subject, ownerId === null ? "edition.manage-shared" : "edition.import", { editionOwnerId: ownerId });
  if (!decision.ok) throw new EditionError(decision.reason, "_form", 403);
}

export type ConfirmResult = { saved: true; edition: ChartEdition } | { saved: false; preview: ImportPreview; message: string };

/**
 * The confirm step: the text comes back from the browser, so it is parsed and checked again from
 * scratch; it is saved (as a draft) only when no problem remains and the server signed the preview.
 */
export async function confirmImport(input: {
  meta: EditionMetaInput;
  format: ImportFormat;
  fileName: string;
  content: string;
  token: string;
  actor: { id: number; subject: Subject };
  ownerId: number | null;
}): Promise<ConfirmResult> {
  assertMayImport(input.actor.subject, input.ownerId);
  const preview = await previewImport({ ...input, userId: input.actor.id });
  if (!tokenMatches(input.actor.id, input.format, input.content, input.token)) {
    return { saved: false, preview: { ...preview, confirm: null }, message: "This file was not previewed by you here. Upload it again to see its preview before importing." };
  }
  if (!preview.confirm) {
    const n = preview.problems.length + Object.keys(preview.metaErrors).length;
    return { saved: false, preview, message: `Nothing was saved: ${n} problem${n === 1 ? "" : "s"} must be fixed first.` };
  }
  try {
    const edition = await createDraftEdition({
      meta: input.meta,
      intervals: preview.intervals,
      corrections: preview.corrections,
      sourceFile: input.fileName || null,
      actor: input.actor,
      ownerId: input.ownerId,
      format: input.format,
    });
    return { saved: true, edition };
  } catch (error) {
    if (error instanceof EditionError) {
      return { saved: false, preview: { ...preview, confirm: null, metaErrors: { ...preview.metaErrors, [error.field]: error.message } }, message: error.message };
    }
    throw error;
  }
}

/** Save checked intervals as a new draft edition (parents first, in one transaction, audited). */
export async function createDraftEdition(input: {
  meta: EditionMetaInput;
  intervals: readonly Interval[];
  corrections: Correction[];
  sourceFile: string | null;
  actor: { id: number };
  /** The owning organisation (also where the import is audited); null for a shared edition. */
  ownerId: number | null;
  format: ImportFormat | "seed";
}): Promise<ChartEdition> {
  const problems = check(input.intervals);
  if (problems.length) throw new EditionError(`The intervals do not pass the checks (${problems.length} problem${problems.length === 1 ? "" : "s"}); nothing was saved.`);
  try {
    return await sequelize.transaction(async (transaction) => {
      const edition = await ChartEdition.create(
        {
          slug: input.meta.slug,
          label: input.meta.label,
          status: "draft",
          source: input.meta.source,
          licence: input.meta.licence,
          sourceFile: input.sourceFile,
          corrections: input.corrections,
          organisationId: input.ownerId,
          createdById: input.actor.id,
          madeCurrentById: null,
          madeCurrentAt: null,
          retiredAt: null,
        },
        { transaction },
      );
      // check() guarantees every parent is of a shallower rank: insert rank by rank.
      const ids = new Map<string, number>();
      for (const rank of RANKS) {
        const batch = input.intervals.filter((iv) => iv.rank === rank);
        if (!batch.length) continue;
        const rows = await IntervalRow.bulkCreate(
          batch.map((iv) => ({
            editionId: edition.id,
            name: iv.name,
            rank: iv.rank,
            parentId: iv.parent === null ? null : ids.get(iv.parent)!,
            baseMa: String(iv.baseMa),
            baseUncertaintyMa: iv.baseUncertaintyMa === null ? null : String(iv.baseUncertaintyMa),
            topMa: String(iv.topMa),
            color: iv.color,
            gssp: iv.gssp,
            boundaryKind: iv.boundaryKind ?? null,
            approximate: iv.approximate,
            names: iv.names,
            chartOrder: iv.order,
          })),
          { transaction, returning: ["id", "name"] },
        );
        for (const r of rows) ids.set(r.name, r.id);
      }
      await audit(
        {
          organisationId: input.ownerId,
          actorId: input.actor.id,
          action: "edition.import",
          objectType: "chart_edition",
          objectId: edition.id,
          details: { slug: edition.slug, label: edition.label, format: input.format, intervals: input.intervals.length, sourceFile: input.sourceFile },
        },
        transaction,
      );
      return edition;
    });
  } catch (error) {
    const name = (error as { name?: string }).name;
    if (name === "SequelizeUniqueConstraintError") {
      throw new EditionError(`Slug: "${input.meta.slug}" is already used by another edition. Choose another.`, "slug");
    }
    throw error;
  }
}

