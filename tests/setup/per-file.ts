// Runs in each integration test file: same environment as the global setup, and a clean close.
import { afterAll } from "vitest";
import { applyTestEnv, TEST_DATABASE } from "./test-env.ts";

applyTestEnv();
if (!process.env.DATABASE_URL?.endsWith(`/${TEST_DATABASE}`)) throw new Error("Integration tests must run against the test database");

afterAll(async () => {
  const { stopBoss } = await import("../../server/queue.server.ts");
  const { sequelize } = await import("../../db/sequelize.ts");
  await stopBoss();
  await sequelize.close();
});
