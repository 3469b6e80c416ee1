// Chart editions on the server: reading them for pages and the public API, importing a new edition
// (parse → preview with every problem → confirm, re-validated here), exports, and the status
// changes (make current, retire, discard a draft), each in one transaction with its audit event.
import { createHash, createHmac, timingSafeEqual } from "node:crypto";
import { z } from "zod";
import { ChartEdition, Interval as IntervalRow, Membership, User } from "../db/models/index.ts";
import { sequelize } from "./db.server.ts";
import type { Role } from "../app/lib/roles.ts";
import {
  CORRECTABLE_FIELDS,
  RANKS,
  check,
  compare,
  exportCsv,
  exportJson,
  parseCsv,
  parseJson,
  parseTurtle,
  type Correction,
  type EditionComparison,
  type EditionStatus,
  type Interval,
  type Problem,
  type Rank,
} from "../app/lib/timescale/index.ts";
import { audit } from "./audit.server.ts";
import { env } from "./env.server.ts";
import { getSession } from "./session.server.ts";
import { BodyTooLargeError, jsonError, megabytes, readLimitedFormData as readFormDataWithin } from "./http.server.ts";
import type { Transaction } from "sequelize";

/** Roles that manage chart editions (import, make current, retire). */
export const EDITION_MANAGERS = ["editor", "admin"] as const satisfies readonly Role[];

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

/** A refusal meant for the person using the form: a field (or "_form") and the reason. */
export class EditionError extends Error {
  constructor(message: string, public field = "_form", public status = 400) {
    super(message);
    this.name = "EditionError";
  }
}

// ------------------------------------------------------------------------------------------
// Who is looking (pages outside the studio are open to visitors too).
// ------------------------------------------------------------------------------------------

export interface Viewer {
  userId: number;
  name: string;
  /** Role in the active organisation; null for a signed-in user without any membership. */
  role: Role | null;
  organisationId: number | null;
  /** May see drafts and manage editions. */
  canManage: boolean;
}

/** The signed-in user and their role in the active organisation, or null for a visitor. Never throws a redirect. */
export async function viewerOf(request: Request): Promise<Viewer | null> {
  const session = await getSession(request);
  const userId = session.get("userId");
  if (!userId) return null;
  const user = await User.findByPk(userId);
  if (!user) return null;
  const memberships = await Membership.findAll({ where: { userId: user.id }, order: [["createdAt", "ASC"]] });
  const active = memberships.find((m) => m.organisationId === session.get("organisationId")) ?? memberships[0];
  const role = active?.role ?? null;
  return {
    userId: user.id,
    name: user.name,
    role,
    organisationId: active?.organisationId ?? null,
    canManage: role !== null && (EDITION_MANAGERS as readonly Role[]).includes(role),
  };
}

// ------------------------------------------------------------------------------------------
// Reading.
// ------------------------------------------------------------------------------------------

/** A stored interval as the domain type. NUMERIC comes back as the decimal text that was stored. */
export function toInterval(row: IntervalRow, parentName: string | null): Interval {
  return {
    name: row.name,
    rank: row.rank,
    parent: parentName,
    baseMa: Number(row.baseMa),
    baseUncertaintyMa: row.baseUncertaintyMa === null ? null : Number(row.baseUncertaintyMa),
    topMa: Number(row.topMa),
    color: row.color,
    gssp: row.gssp,
    approximate: row.approximate,
    names: row.names ?? {},
    order: row.chartOrder,
  };
}

export type RankCounts = Record<Rank, number>;

export interface EditionSummary {
  id: number;
  slug: string;
  label: string;
  status: EditionStatus;
  source: string;
  licence: string;
  sourceFile: string | null;
  corrections: Correction[];
  counts: RankCounts;
  total: number;
  createdAt: string;
  createdBy: string | null;
  madeCurrentAt: string | null;
  madeCurrentBy: string | null;
  retiredAt: string | null;
}

const emptyCounts = (): RankCounts => Object.fromEntries(RANKS.map((r) => [r, 0])) as RankCounts;

const STATUS_ORDER: Record<EditionStatus, number> = { current: 0, draft: 1, retired: 2 };

function summarise(e: ChartEdition, counts: RankCounts): EditionSummary {
  return {
    id: e.id,
    slug: e.slug,
    label: e.label,
    status: e.status,
    source: e.source,
    licence: e.licence,
    sourceFile: e.sourceFile,
    corrections: e.corrections ?? [],
    counts,
    total: Object.values(counts).reduce((a, b) => a + b, 0),
    createdAt: e.createdAt.toISOString(),
    createdBy: e.createdBy?.name ?? null,
    madeCurrentAt: e.madeCurrentAt?.toISOString() ?? null,
    madeCurrentBy: e.madeCurrentBy?.name ?? null,
    retiredAt: e.retiredAt?.toISOString() ?? null,
  };
}

const WITH_PEOPLE = [
  { model: User, as: "createdBy", attributes: ["id", "name"] },
  { model: User, as: "madeCurrentBy", attributes: ["id", "name"] },
];

async function countsByEdition(ids: number[]): Promise<Map<number, RankCounts>> {
  const out = new Map<number, RankCounts>(ids.map((id) => [id, emptyCounts()]));
  if (!ids.length) return out;
  const [rows] = (await sequelize.query(
    `SELECT edition_id, rank, count(*)::int AS n FROM intervals WHERE edition_id IN (:ids) GROUP BY edition_id, rank`,
    { replacements: { ids } },
  )) as [{ edition_id: number; rank: Rank; n: number }[], unknown];
  for (const r of rows) out.get(r.edition_id)![r.rank] = r.n;
  return out;
}

/** Every edition (drafts only when asked), current first, then drafts, then retired; newest first within each. */
export async function listEditions(opts: { includeDrafts: boolean }): Promise<EditionSummary[]> {
  const rows = await ChartEdition.findAll({
    where: opts.includeDrafts ? {} : { status: ["current", "retired"] },
    include: WITH_PEOPLE,
    order: [["createdAt", "DESC"], ["id", "DESC"]],
  });
  const counts = await countsByEdition(rows.map((r) => r.id));
  return rows
    .map((r) => summarise(r, counts.get(r.id)!))
    .sort((a, b) => STATUS_ORDER[a.status] - STATUS_ORDER[b.status]);
}

/** The intervals of an edition in chart order. */
export async function editionIntervals(editionId: number, transaction?: Transaction): Promise<Interval[]> {
  return (await editionIntervalRows(editionId, transaction)).map((r) => r.interval);
}

/** The edition's intervals in chart order, each with its database id (for rows that reference one). */
export async function editionIntervalRows(editionId: number, transaction?: Transaction): Promise<{ id: number; interval: Interval }[]> {
  const rows = await IntervalRow.findAll({ where: { editionId }, order: [["chartOrder", "ASC"]], transaction });
  const nameOf = new Map(rows.map((r) => [r.id, r.name] as const));
  return rows.map((r) => ({ id: r.id, interval: toInterval(r, r.parentId === null ? null : (nameOf.get(r.parentId) ?? null)) }));
}

export interface LoadedEdition {
  edition: EditionSummary;
  intervals: Interval[];
}

/** An edition by slug with its intervals; null when missing, or a draft and drafts are not allowed. */
export async function loadEdition(slug: string, opts: { includeDrafts: boolean }): Promise<LoadedEdition | null> {
  const row = await ChartEdition.findOne({ where: { slug }, include: WITH_PEOPLE });
  if (!row || (row.status === "draft" && !opts.includeDrafts)) return null;
  const intervals = await editionIntervals(row.id);
  const counts = emptyCounts();
  for (const iv of intervals) counts[iv.rank]++;
  return { edition: summarise(row, counts), intervals };
}

export async function currentEdition(): Promise<ChartEdition | null> {
  return ChartEdition.findOne({ where: { status: "current" } });
}

// ------------------------------------------------------------------------------------------
// Public JSON and exports.
// ------------------------------------------------------------------------------------------

export function apiInterval(iv: Interval) {
  return {
    name: iv.name,
    rank: iv.rank,
    parent: iv.parent,
    baseMa: iv.baseMa,
    baseUncertaintyMa: iv.baseUncertaintyMa,
    topMa: iv.topMa,
    color: iv.color,
    gssp: iv.gssp,
    approximate: iv.approximate,
  };
}

export function apiEditionMeta(e: EditionSummary) {
  return { slug: e.slug, label: e.label, status: e.status, source: e.source, licence: e.licence };
}

/** The body of GET /api/timescales/:slug (or null: unknown or a draft). */
export async function apiEditionBody(slug: string) {
  const loaded = await loadEdition(slug, { includeDrafts: false });
  if (!loaded) return null;
  const { edition, intervals } = loaded;
  return {
    edition: { ...apiEditionMeta(edition), madeCurrentAt: edition.madeCurrentAt, corrections: edition.corrections },
    intervals: intervals.map(apiInterval),
  };
}

/** A strong ETag of a response body. */
export function etagOf(body: string): string {
  return `"${createHash("sha256").update(body).digest("base64url").slice(0, 32)}"`;
}

/** Does If-None-Match name this ETag (weak comparison, as RFC 9110 asks for GET)? */
export function notModified(request: Request, etag: string): boolean {
  const header = request.headers.get("If-None-Match");
  if (!header) return false;
  const bare = etag.replace(/^W\//, "");
  return header.split(",").some((t) => {
    const tag = t.trim();
    return tag === "*" || tag.replace(/^W\//, "") === bare;
  });
}

/** Editions change rarely: caches may keep a copy for five minutes, then revalidate with the ETag. */
export const PUBLIC_CACHE_CONTROL = "public, max-age=300, stale-while-revalidate=3600";

/** A cacheable JSON response with an ETag; 304 when the client already has it. */
export function cachedJson(request: Request, body: unknown, extra: Record<string, string> = {}): Response {
  const text = JSON.stringify(body);
  const etag = etagOf(text);
  const headers = {
    ETag: etag,
    "Cache-Control": PUBLIC_CACHE_CONTROL,
    "Access-Control-Allow-Origin": "*",
    "Access-Control-Expose-Headers": "ETag",
    Vary: "Accept-Encoding",
    ...extra,
  };
  if (notModified(request, etag)) return new Response(null, { status: 304, headers });
  return new Response(text, { status: 200, headers: { ...headers, "Content-Type": "application/json; charset=utf-8" } });
}

/** A JSON error of the public timescale API (readable from any origin). */
export function publicJsonError(status: number, message: string): Response {
  return jsonError(status, message, { "Access-Control-Allow-Origin": "*" });
}

/** The CSV or JSON download of an edition (exactly what the importer reads back). */
export async function exportResponse(request: Request, slug: string, format: "csv" | "json"): Promise<Response> {
  const viewer = await viewerOf(request);
  const loaded = await loadEdition(slug, { includeDrafts: Boolean(viewer?.canManage) });
  if (!loaded) {
    return new Response(`No chart edition "${slug}" is published here.\n`, { status: 404, headers: { "Content-Type": "text/plain; charset=utf-8" } });
  }
  const text = format === "csv" ? exportCsv(loaded.intervals) : exportJson(loaded.intervals);
  const etag = etagOf(text);
  const draft = loaded.edition.status === "draft";
  const headers: Record<string, string> = {
    ETag: etag,
    // Drafts are for managers only: never keep them in a shared cache.
    "Cache-Control": draft ? "private, no-cache" : PUBLIC_CACHE_CONTROL,
    "Content-Disposition": `attachment; filename="${slug}-intervals.${format}"`,
  };
  if (notModified(request, etag)) return new Response(null, { status: 304, headers });
  return new Response(text, {
    headers: { ...headers, "Content-Type": format === "csv" ? "text/csv; charset=utf-8" : "application/json; charset=utf-8" },
  });
}

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
}): Promise<ImportPreview> {
  const parsed = parseUpload(input.format, input.content);
  const metaErrors: Record<string, string> = {};
  if (await ChartEdition.findOne({ where: { slug: input.meta.slug }, attributes: ["id"] })) {
    metaErrors.slug = `Slug: "${input.meta.slug}" is already used by another edition. Choose another, like ${input.meta.slug}-draft.`;
  }
  const counts = emptyCounts();
  for (const iv of parsed.intervals) counts[iv.rank]++;
  let comparedWith: ImportPreview["comparedWith"] = null;
  const current = await currentEdition();
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
  actor: { id: number };
  organisationId: number | null;
}): Promise<ConfirmResult> {
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
      organisationId: input.organisationId,
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
  organisationId: number | null;
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
          organisationId: input.organisationId,
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

// ------------------------------------------------------------------------------------------
// Status changes.
// ------------------------------------------------------------------------------------------

interface Actor {
  id: number;
}

/** Serialises status changes so two editors cannot make two editions current at once. */
async function lockEditions(transaction: import("sequelize").Transaction) {
  await sequelize.query(`SELECT pg_advisory_xact_lock(hashtext('eonscale:chart-editions:status'))`, { transaction });
}

/**
 * Make an edition current: the previous current edition becomes retired, in the same transaction,
 * with one audit event. The stored intervals are checked again first.
 */
export async function makeCurrent(slug: string, actor: Actor, organisationId: number | null) {
  return sequelize.transaction(async (transaction) => {
    await lockEditions(transaction);
    const edition = await ChartEdition.findOne({ where: { slug }, transaction, lock: transaction.LOCK.UPDATE });
    if (!edition) throw new EditionError(`There is no chart edition "${slug}".`, "_form", 404);
    if (edition.status === "current") throw new EditionError(`${edition.label} is already the current edition.`);
    const problems = check(await editionIntervals(edition.id));
    if (problems.length) {
      throw new EditionError(`${edition.label} cannot be made current: its intervals fail ${problems.length} check${problems.length === 1 ? "" : "s"} (first: ${problems[0].interval} — ${problems[0].message}).`);
    }
    const now = new Date();
    const previous = await ChartEdition.findOne({ where: { status: "current" }, transaction, lock: transaction.LOCK.UPDATE });
    if (previous) await previous.update({ status: "retired", retiredAt: now }, { transaction });
    const from = edition.status;
    await edition.update({ status: "current", madeCurrentAt: now, madeCurrentById: actor.id, retiredAt: null }, { transaction });
    await audit(
      {
        organisationId,
        actorId: actor.id,
        action: "edition.make-current",
        objectType: "chart_edition",
        objectId: edition.id,
        details: { slug: edition.slug, from, previous: previous ? { slug: previous.slug, id: previous.id } : null },
      },
      transaction,
    );
    return { edition, previous };
  });
}

/** Retire a draft (kept, readable, never current). The current edition is retired only by making another one current. */
export async function retireEdition(slug: string, actor: Actor, organisationId: number | null) {
  return sequelize.transaction(async (transaction) => {
    await lockEditions(transaction);
    const edition = await ChartEdition.findOne({ where: { slug }, transaction, lock: transaction.LOCK.UPDATE });
    if (!edition) throw new EditionError(`There is no chart edition "${slug}".`, "_form", 404);
    if (edition.status === "current") {
      throw new EditionError(`${edition.label} is the current edition. Make another edition current instead; this one is then retired.`);
    }
    if (edition.status === "retired") throw new EditionError(`${edition.label} is already retired.`);
    await edition.update({ status: "retired", retiredAt: new Date() }, { transaction });
    await audit(
      { organisationId, actorId: actor.id, action: "edition.retire", objectType: "chart_edition", objectId: edition.id, details: { slug: edition.slug, from: "draft" } },
      transaction,
    );
    return edition;
  });
}

/** Delete a draft and its intervals (only drafts: a retired or current edition may be pinned by exhibits). */
export async function discardDraft(slug: string, actor: Actor, organisationId: number | null) {
  return sequelize.transaction(async (transaction) => {
    await lockEditions(transaction);
    const edition = await ChartEdition.findOne({ where: { slug }, transaction, lock: transaction.LOCK.UPDATE });
    if (!edition) throw new EditionError(`There is no chart edition "${slug}".`, "_form", 404);
    if (edition.status !== "draft") throw new EditionError(`Only drafts can be discarded; ${edition.label} is ${edition.status}.`);
    await audit(
      { organisationId, actorId: actor.id, action: "edition.discard", objectType: "chart_edition", objectId: edition.id, details: { slug: edition.slug, label: edition.label } },
      transaction,
    );
    await edition.destroy({ transaction });
    return edition;
  });
}
