// vitest globalSetup for integration and browser tests: starts the local stand-ins, then builds a
// fresh test database (dropped, created, migrated, reference data and demo scenario seeded).
import { dropDatabase, ensureDatabase, startServices } from "../../fakes/services.ts";
import { applyTestEnv, TEST_DATABASE } from "./test-env.ts";

export default async function setup() {
  applyTestEnv();
  await startServices({ quiet: true });
  await dropDatabase(TEST_DATABASE);
  await ensureDatabase(TEST_DATABASE);
  const { createSequelize } = await import("../../db/sequelize.ts");
  const { migrateAndSeed } = await import("../../db/migrator.ts");
  const db = createSequelize(process.env.DATABASE_URL!);
  try {
    await migrateAndSeed({ demo: true, db, quiet: true });
  } finally {
    await db.close();
  }
}
