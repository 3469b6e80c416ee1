// Background workers started by each app server (RUN_WORKERS=true): they share one pg-boss queue.
// Every job may run more than once (a stopped server hands its running jobs back; pg-boss delivers
// at least once), so every handler is idempotent: running it twice has one visible effect.
import { ASSET_AVIF_QUEUE, ASSET_CLEANUP_QUEUE, ASSET_PROCESS_QUEUE, startAssetWorkers } from "./assets/jobs.server.ts";
import { MAIL_QUEUE, startMailWorker } from "./mail.server.ts";
import { RESET_QUEUE, startResetWorker } from "./accounts.server.ts";
import { getBoss, pauseWorkers } from "./queue.server.ts";
import { startSweeps, SWEEP_QUEUE } from "./sweeps.server.ts";
import { EXPORT_QUEUE, startExportWorker } from "./exports/fabrication/jobs.server.ts";

/** Every queue this server takes jobs from. */
export const WORKER_QUEUES = [MAIL_QUEUE, ASSET_PROCESS_QUEUE, ASSET_AVIF_QUEUE, ASSET_CLEANUP_QUEUE, SWEEP_QUEUE, RESET_QUEUE, EXPORT_QUEUE] as const;

export async function startWorkers() {
  const boss = await getBoss();
  await startMailWorker(boss);
  await startResetWorker(boss);
  await startAssetWorkers(boss);
  await startSweeps(boss);
  await startExportWorker(boss);
  return boss;
}

/** First step of a graceful stop: take no new jobs (running ones go on; see stopBoss). */
export function stopTakingJobs() {
  return pauseWorkers(WORKER_QUEUES);
}
