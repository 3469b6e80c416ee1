// Background workers started by each app server (RUN_WORKERS=true): they share one pg-boss queue.
import { startMailWorker } from "./mail.ts";
import { getBoss } from "./queue.ts";

export async function startWorkers() {
  const boss = await getBoss();
  await startMailWorker(boss);
  return boss;
}
