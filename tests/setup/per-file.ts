// Runs in each integration test file: a fresh copy of the template database for this file (files
// run in parallel, one database per worker, recreated per file), the models bound to the server's
// Sequelize instance (as the app does at start), and a clean close.
import { afterAll } from "vitest";
import { dropDatabase, ensureDatabase } from "../../fakes/services.ts";
import { applyTestEnv, TEMPLATE_DATABASE, workerDatabase } from "./test-env.ts";

const database = workerDatabase();
applyTestEnv(database);
await dropDatabase(database);
for (let attempt = 1; ; attempt++) {
  try {
    await ensureDatabase(database, { template: TEMPLATE_DATABASE });
    break;
  } catch (error) {
    // 55006: another worker's copy still has the template open for a moment; try again.
    if ((error as { code?: string }).code !== "55006" || attempt === 20) throw error;
    await new Promise((r) => setTimeout(r, 100 * attempt));
  }
}
await import("../../server/db.server.ts");

afterAll(async () => {
  const { stopBoss } = await import("../../server/queue.server.ts");
  const { closeDatabase } = await import("../../server/db.server.ts");
  await stopBoss();
  await closeDatabase();
});
