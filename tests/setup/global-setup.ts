// vitest globalSetup for integration and browser tests: starts the local stand-ins, builds the
// template database once (migrated, reference data and demo scenario seeded) and copies it to the
// browser tests' database. Integration files copy it again for themselves (per-file.ts).
import { dropDatabase, ensureDatabase, startServices } from "../../fakes/services.ts";
import { applyTestEnv, TEMPLATE_DATABASE, TEST_DATABASE } from "./test-env.ts";

export default async function setup() {
  applyTestEnv();
  await startServices({ quiet: true });
  await dropDatabase(TEMPLATE_DATABASE);
  const { url } = await ensureDatabase(TEMPLATE_DATABASE);
  const { createSequelize } = await import("../../db/sequelize.ts");
  const { migrateAndSeed } = await import("../../db/migrator.ts");
  const db = createSequelize(url);
  try {
    await migrateAndSeed({ demo: true, db, quiet: true });
  } finally {
    await db.close(); // a template must have no open connections to be copied
  }
  await dropDatabase(TEST_DATABASE);
  await ensureDatabase(TEST_DATABASE, { template: TEMPLATE_DATABASE });
}
