// Background work on images, on the shared pg-boss queue (any app server with RUN_WORKERS=true):
// - asset-process: web sizes + print master, retried with backoff while S3 is unreachable; an image
//   that cannot be read fails at once (a retry would not help) with the reason for the designer;
// - asset-avif: AVIF versions, a separate queue polled slowly, one at a time (slow to encode);
// - asset-cleanup: after a change commits, removes the objects and row of images nothing uses;
// - the hourly sweep (server/sweeps.server.ts) calls sweepAssets for orphans and unattached uploads.
import type PgBoss from "pg-boss";
import { Op, type Transaction } from "sequelize";
import { Asset, ImageUse } from "../../db/models/index.ts";
import type { AssetFile } from "../../db/models/asset.ts";
import { sequelize } from "../db.server.ts";
import { logger } from "../logger.server.ts";
import { ensureQueue, getBoss, inTransaction } from "../queue.server.ts";
import { deleteObjects, getObjectBytes, IMMUTABLE, listObjects, putObject, StorageUnavailableError } from "../storage/s3.server.ts";
import { assetIdOfKey, assetPrefix, fileKey } from "./keys.server.ts";
import { CONTENT_TYPES, makeAvifFiles, makePrintMaster, makeWebFiles, processingReason, type MadeFile } from "./process.server.ts";
import { assetMentioned } from "./usage.server.ts";

export const ASSET_PROCESS_QUEUE = "asset-process";
export const ASSET_AVIF_QUEUE = "asset-avif";
export const ASSET_CLEANUP_QUEUE = "asset-cleanup";
const RETRY = { retryLimit: 4, retryDelay: 10, retryBackoff: true } as const;

/** Objects without a row are left this long (an upload puts the object before it writes the row). */
export const ORPHAN_GRACE_MS = 60 * 60 * 1000;
/** Uploads never attached to anything are removed after this long. */
export const UNATTACHED_GRACE_MS = 24 * 60 * 60 * 1000;

export async function ensureAssetQueues(boss: PgBoss) {
  await ensureQueue(boss, ASSET_PROCESS_QUEUE, { name: ASSET_PROCESS_QUEUE, ...RETRY });
  await ensureQueue(boss, ASSET_AVIF_QUEUE, { name: ASSET_AVIF_QUEUE, ...RETRY });
  await ensureQueue(boss, ASSET_CLEANUP_QUEUE, { name: ASSET_CLEANUP_QUEUE, ...RETRY });
}

async function send(queue: string, data: object, transaction?: Transaction, options: PgBoss.SendOptions = {}) {
  const boss = await getBoss();
  await ensureAssetQueues(boss);
  await boss.send(queue, data, { ...RETRY, ...options, ...(transaction ? { db: inTransaction(transaction) } : {}) });
}

/** Queue the processing of an asset (inside the transaction that writes its row). */
export function queueProcessing(assetId: number, transaction?: Transaction) {
  return send(ASSET_PROCESS_QUEUE, { assetId }, transaction);
}

/** Queue the removal of images that may have lost their last use; runs only if the transaction commits. */
export async function queueCleanup(assetIds: readonly number[], transaction: Transaction) {
  const ids = [...new Set(assetIds)];
  if (ids.length) await send(ASSET_CLEANUP_QUEUE, { assetIds: ids }, transaction);
}

function stored(id: number, f: MadeFile): AssetFile {
  return { file: f.file, key: fileKey(id, f), format: f.format, width: f.width, height: f.height, bytes: f.bytes.byteLength, hash: f.hash, role: f.role };
}

async function store(id: number, files: MadeFile[]): Promise<AssetFile[]> {
  const out: AssetFile[] = [];
  for (const f of files) {
    const s = stored(id, f);
    await putObject(s.key, f.bytes, CONTENT_TYPES[f.format], IMMUTABLE);
    out.push(s);
  }
  return out;
}

export type ProcessOutcome = "ready" | "failed" | "skipped";

/**
 * Makes the web sizes and the print master of one asset. Throws (so the queue retries) when S3 is
 * unreachable and this is not the final attempt; otherwise records "ready" or "failed" with the reason.
 */
export async function processAsset(assetId: number, opts: { finalAttempt?: boolean } = {}): Promise<ProcessOutcome> {
  const asset = await Asset.findByPk(assetId);
  if (!asset || asset.status === "ready") return "skipped";
  const fail = async (reason: string) => {
    await asset.update({ status: "failed", error: reason });
    logger.warn({ assetId, reason }, "image processing failed");
    return "failed" as const;
  };
  try {
    const original = await getObjectBytes(asset.originalKey);
    let made: MadeFile[];
    try {
      made = [...(await makeWebFiles(original)), await makePrintMaster(original)];
    } catch (error) {
      return await fail(processingReason(error)); // the image itself is at fault: retrying would not help
    }
    const files = await store(assetId, made);
    // One set of sizes however often this runs: the keys are content-hashed (a second run writes
    // the same objects), and only the run that moves the row to "ready" records them (keeping any
    // AVIF files already there) and queues the AVIF job.
    const [, changed] = (await sequelize.query(
      `UPDATE assets SET status = 'ready', error = NULL, updated_at = now(),
         files = $1::jsonb || COALESCE((SELECT jsonb_agg(f) FROM jsonb_array_elements(files) f WHERE f->>'format' = 'avif'), '[]'::jsonb)
       WHERE id = $2 AND status <> 'ready' RETURNING avif_status`,
      { bind: [JSON.stringify(files), assetId] },
    )) as [unknown, { rowCount?: number; rows?: { avif_status: string }[] }];
    if (!changed?.rowCount) return "skipped";
    if (changed.rows?.[0]?.avif_status !== "ready") await send(ASSET_AVIF_QUEUE, { assetId }, undefined, { priority: -1 });
    return "ready";
  } catch (error) {
    if (!(error instanceof StorageUnavailableError)) throw error;
    if (opts.finalAttempt) return fail("The image store was not reachable while the image was being prepared, after several tries. Press “Try again”.");
    throw error;
  }
}

/** Adds the AVIF versions (the web sizes are already served in WebP and JPEG meanwhile). */
export async function processAvif(assetId: number, opts: { finalAttempt?: boolean } = {}): Promise<ProcessOutcome> {
  const asset = await Asset.findByPk(assetId);
  if (!asset || asset.status !== "ready" || asset.avifStatus === "ready") return "skipped";
  try {
    const files = await store(assetId, await makeAvifFiles(await getObjectBytes(asset.originalKey)));
    // The AVIF files replace any listed before (never appended twice), once: a second run finds
    // avif_status already "ready".
    await sequelize.query(
      `UPDATE assets SET avif_status = 'ready', updated_at = now(),
         files = COALESCE((SELECT jsonb_agg(f) FROM jsonb_array_elements(files) f WHERE f->>'format' <> 'avif'), '[]'::jsonb) || $1::jsonb
       WHERE id = $2 AND avif_status <> 'ready'`,
      { bind: [JSON.stringify(files), assetId] },
    );
    return "ready";
  } catch (error) {
    if (error instanceof StorageUnavailableError && !opts.finalAttempt) throw error;
    await asset.update({ avifStatus: "failed" });
    logger.warn({ assetId, err: error }, "AVIF versions failed; WebP and JPEG are served");
    return "failed";
  }
}

/** Start a failed asset again (the designer's "Try again"). */
export async function retryAsset(asset: Asset) {
  await sequelize.transaction(async (transaction) => {
    await asset.update({ status: "processing", error: null }, { transaction });
    await queueProcessing(asset.id, transaction);
  });
}

/**
 * Removes an asset that nothing uses any more: no marker or cover, no publication, no kept
 * revision. The row goes first (the foreign key refuses while a use exists); its objects after.
 */
export async function cleanupAsset(assetId: number): Promise<"removed" | "in use" | "gone"> {
  const asset = await Asset.findByPk(assetId);
  if (!asset) return "gone";
  if (await assetMentioned(assetId)) return "in use";
  try {
    await sequelize.transaction(async (transaction) => {
      if (await ImageUse.count({ where: { assetId }, transaction })) throw new Error("in use");
      await asset.destroy({ transaction });
    });
  } catch (error) {
    if (error instanceof Error && (error.message === "in use" || error.name === "SequelizeForeignKeyConstraintError")) return "in use";
    throw error;
  }
  const keys = (await listObjects(assetPrefix(assetId)).catch(() => [])).map((o) => o.key);
  // If S3 refuses now, the objects have no row: the sweep removes them later.
  await deleteObjects(keys.length ? keys : [asset.originalKey, ...asset.files.map((f) => f.key)]).catch((error) => logger.warn({ assetId, err: error }, "S3 objects left for the sweep"));
  return "removed";
}

/** The hourly sweep: objects with no row (interrupted uploads, refused deletes) and uploads never attached. */
export async function sweepAssets(now = new Date()) {
  const objects = await listObjects("assets/");
  const ids = [...new Set(objects.map((o) => assetIdOfKey(o.key)).filter((id): id is number => id !== null))];
  const rows = new Set(ids.length ? (await Asset.findAll({ where: { id: ids }, attributes: ["id"] })).map((a) => a.id) : []);
  const orphans = objects.filter((o) => {
    const id = assetIdOfKey(o.key);
    return id !== null && !rows.has(id) && now.getTime() - o.lastModified.getTime() > ORPHAN_GRACE_MS;
  });
  await deleteObjects(orphans.map((o) => o.key));
  const unattached = await Asset.findAll({
    where: { createdAt: { [Op.lt]: new Date(now.getTime() - UNATTACHED_GRACE_MS) }, id: { [Op.notIn]: sequelize.literal("(SELECT asset_id FROM image_uses)") } },
    attributes: ["id"],
  });
  let removed = 0;
  for (const a of unattached) if ((await cleanupAsset(a.id)) === "removed") removed++;
  return { orphanObjects: orphans.length, unattachedAssets: removed };
}

type Job<T> = PgBoss.JobWithMetadata<T>;
const final = (job: Job<unknown>) => job.retryCount >= job.retryLimit;

/** Queues every asset still "processing" (the demo seeder's, or one whose job was lost); processing twice is harmless. */
export async function requeueProcessing() {
  const stuck = await Asset.findAll({ where: { status: "processing" }, attributes: ["id"] });
  for (const a of stuck) await queueProcessing(a.id);
  return stuck.length;
}

export async function startAssetWorkers(boss: PgBoss) {
  await ensureAssetQueues(boss);
  await requeueProcessing();
  await boss.work<{ assetId: number }>(ASSET_PROCESS_QUEUE, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 1 }, async ([job]) => {
    await processAsset(job.data.assetId, { finalAttempt: final(job) });
  });
  // Low priority: polled slowly, one at a time.
  await boss.work<{ assetId: number }>(ASSET_AVIF_QUEUE, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 10 }, async ([job]) => {
    await processAvif(job.data.assetId, { finalAttempt: final(job) });
  });
  await boss.work<{ assetIds: number[] }>(ASSET_CLEANUP_QUEUE, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 2 }, async ([job]) => {
    for (const id of job.data.assetIds) await cleanupAsset(id);
  });
}
