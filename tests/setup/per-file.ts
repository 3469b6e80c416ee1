// Runs in each integration test file: same environment as the global setup, the models bound to
// the server's Sequelize instance (as the app does at start), and a clean close.
import { afterAll } from "vitest";
import { applyTestEnv, TEST_DATABASE } from "./test-env.ts";

applyTestEnv();
if (!process.env.DATABASE_URL?.endsWith(`/${TEST_DATABASE}`)) throw new Error("Integration tests must run against the test database");
await import("../../server/db.server.ts");

afterAll(async () => {
  const { stopBoss } = await import("../../server/queue.server.ts");
  const { closeDatabase } = await import("../../server/db.server.ts");
  await stopBoss();
  await closeDatabase();
});
