// Background workers started by each app server (RUN_WORKERS=true): they share one pg-boss queue.
import { startAssetWorkers } from "./assets/jobs.server.ts";
import { startMailWorker } from "./mail.server.ts";
import { getBoss } from "./queue.server.ts";
import { startSweeps } from "./sweeps.server.ts";

export async function startWorkers() {
  const boss = await getBoss();
  await startMailWorker(boss);
  await startAssetWorkers(boss);
  await startSweeps(boss);
  return boss;
}
