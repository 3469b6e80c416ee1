// Large export files made in the background (pg-boss queue "export-file"): the request answers 202
// with `{ jobUrl }`; the job writes the file to a temporary file, reporting `progress` (0–1) in
// export_jobs as pages are written, uploads it to S3 (exports/<organisation>/<job>/<name>), and the
// job's JSON then gives the download `url`. The job keeps the snapshot it was asked for, so the
// file is what the designer saw at that moment. Idempotent: a finished job is not made again.
import { randomUUID } from "node:crypto";
import { createReadStream, createWriteStream } from "node:fs";
import { mkdtemp, rm, stat } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { finished } from "node:stream/promises";
import { PutObjectCommand } from "@aws-sdk/client-s3";
import type PgBoss from "pg-boss";
import { QueryTypes } from "sequelize";
import type { PublicationMeta, PublicationSnapshot } from "../../../app/lib/publication/types.ts";
import { sequelize } from "../../db.server.ts";
import { logger } from "../../logger.server.ts";
import { ensureQueue, getBoss } from "../../queue.server.ts";
import { getObjectStream, storage } from "../../storage/s3.server.ts";
import type { ExportContext } from "../registry.server.ts";
import { panelsDocument, writePanels } from "../pdf/panels.server.ts";
import { panelOptionsFor } from "./options.server.ts";

export const EXPORT_QUEUE = "export-file";
/** Panel files with more pages than this are made in the background when a member asks for them. */
export const PANELS_IN_BACKGROUND = 20;

export interface JobSource {
  snapshot: PublicationSnapshot;
  draft: boolean;
  publication: PublicationMeta | null;
  fileStem: string;
  baseUrl: string;
}

export interface JobStatus {
  id: string;
  file: string;
  status: "queued" | "running" | "done" | "failed";
  progress: number;
  url: string | null;
  error: string | null;
  fileName: string;
}

export async function ensureExportQueue(boss: PgBoss) {
  await ensureQueue(boss, EXPORT_QUEUE, { name: EXPORT_QUEUE, retryLimit: 2, retryDelay: 5 });
}

const jobUrl = (slug: string, id: string) => `/studio/exhibits/${encodeURIComponent(slug)}/exports/${id}`;

/** Queue a file; answers 202 `{ jobUrl, progress: 0 }`. */
export async function queueExportJob(file: string, snapshot: PublicationSnapshot, ctx: ExportContext, fileStem: string): Promise<Response> {
  const member = ctx.member!;
  const id = randomUUID();
  const [exhibit] = await sequelize.query<{ id: number }>(`SELECT id FROM exhibits WHERE organisation_id = $1 AND slug = $2`, { bind: [member.organisation.id, snapshot.exhibit.slug], type: QueryTypes.SELECT });
  const query = new URLSearchParams([...ctx.query].filter(([k]) => k !== "from")).toString();
  const source: JobSource = { snapshot, draft: ctx.draft, publication: ctx.publication, fileStem, baseUrl: ctx.baseUrl };
  await sequelize.query(
    `INSERT INTO export_jobs (id, organisation_id, exhibit_id, file, query, source, status, progress, file_name, created_by_id, created_at, updated_at)
     VALUES ($1, $2, $3, $4, $5, $6, 'queued', 0, $7, $8, now(), now())`,
    { bind: [id, member.organisation.id, exhibit.id, file, query, JSON.stringify(source), `${fileStem}-${file}`, member.user.id] },
  );
  const boss = await getBoss();
  await ensureExportQueue(boss);
  await boss.send(EXPORT_QUEUE, { jobId: id });
  const url = jobUrl(snapshot.exhibit.slug, id);
  return new Response(JSON.stringify({ jobUrl: url, progress: 0, status: "queued" }), { status: 202, headers: { "Content-Type": "application/json; charset=utf-8", Location: url, "Cache-Control": "no-store" } });
}

async function setProgress(id: string, progress: number, status: JobStatus["status"] = "running") {
  await sequelize.query(`UPDATE export_jobs SET progress = $2, status = $3, updated_at = now() WHERE id = $1 AND status <> 'done'`, { bind: [id, progress, status] });
}

/** Make one job's file (the worker calls this; tests too). */
export async function runExportJob(id: string): Promise<void> {
  const [job] = await sequelize.query<{ id: string; organisation_id: number; file: string; query: string; source: JobSource; status: string; file_name: string }>(
    `SELECT id, organisation_id, file, query, source, status, file_name FROM export_jobs WHERE id = $1`,
    { bind: [id], type: QueryTypes.SELECT },
  );
  if (!job || job.status === "done") return;
  await setProgress(id, 0);
  const dir = await mkdtemp(path.join(tmpdir(), "eonscale-export-"));
  const file = path.join(dir, "out");
  try {
    const { snapshot } = job.source;
    const ctx = { draft: job.source.draft, publication: job.source.publication, baseUrl: job.source.baseUrl };
    if (job.file !== "panels.pdf") throw new Error(`no background writer for ${job.file}`);
    const options = panelOptionsFor(snapshot, new URLSearchParams(job.query));
    const doc = panelsDocument(snapshot, ctx);
    const out = createWriteStream(file);
    doc.pipe(out);
    let last = Date.now();
    await writePanels(doc, snapshot, options, ctx, async (done, total) => {
      if (Date.now() - last > 300 || done === total) {
        last = Date.now();
        await setProgress(id, Math.min(0.99, done / total));
      }
    });
    await finished(out);
    const bytes = (await stat(file)).size;
    const key = `exports/${job.organisation_id}/${id}/${job.file}`;
    const s = storage();
    await s.client.send(new PutObjectCommand({ Bucket: s.bucket, Key: key, Body: createReadStream(file), ContentLength: bytes, ContentType: "application/pdf", CacheControl: "private, no-store" }));
    await sequelize.query(`UPDATE export_jobs SET status = 'done', progress = 1, s3_key = $2, bytes = $3, updated_at = now() WHERE id = $1`, { bind: [id, key, bytes] });
  } catch (error) {
    logger.error({ err: error, job: id }, "export job failed");
    await sequelize.query(`UPDATE export_jobs SET status = 'failed', error = $2, updated_at = now() WHERE id = $1`, { bind: [id, error instanceof Error ? error.message : String(error)] });
    throw error;
  } finally {
    await rm(dir, { recursive: true, force: true });
  }
}

export async function startExportWorker(boss: PgBoss) {
  await ensureExportQueue(boss);
  await boss.work<{ jobId: string }>(EXPORT_QUEUE, { batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
    await runExportJob(job.data.jobId);
  });
}

/** A member's view of a job of their organisation's exhibit, or null (404). */
export async function exportJobStatus(organisationId: number, slug: string, id: string): Promise<JobStatus | null> {
  if (!/^[0-9a-f-]{36}$/.test(id)) return null;
  const [row] = await sequelize.query<{ id: string; file: string; status: JobStatus["status"]; progress: number; error: string | null; file_name: string }>(
    `SELECT j.id, j.file, j.status, j.progress, j.error, j.file_name FROM export_jobs j JOIN exhibits e ON e.id = j.exhibit_id
      WHERE j.id = $1 AND j.organisation_id = $2 AND e.slug = $3`,
    { bind: [id, organisationId, slug], type: QueryTypes.SELECT },
  );
  if (!row) return null;
  return { id: row.id, file: row.file, status: row.status, progress: Number(row.progress), error: row.error, fileName: row.file_name, url: row.status === "done" ? `${jobUrl(slug, row.id)}/file` : null };
}

/** The finished file, streamed from S3. */
export async function exportJobFile(organisationId: number, slug: string, id: string): Promise<Response | null> {
  const status = await exportJobStatus(organisationId, slug, id);
  if (!status || status.status !== "done") return null;
  const [row] = await sequelize.query<{ s3_key: string; bytes: string }>(`SELECT s3_key, bytes FROM export_jobs WHERE id = $1`, { bind: [id], type: QueryTypes.SELECT });
  const object = await getObjectStream(row.s3_key);
  if (!object?.Body) return null;
  return new Response(object.Body.transformToWebStream(), {
    headers: { "Content-Type": "application/pdf", "Content-Length": String(row.bytes), "Content-Disposition": `attachment; filename="${status.fileName}"`, "Cache-Control": "private, no-store" },
  });
}
