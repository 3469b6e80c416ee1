// The environment every test process uses: the local stand-ins, isolated databases and a port.
// Databases (base name EONSCALE_TEST_DATABASE, default eonscale_test, so parallel developers on
// one machine do not collide):
//   <base>_template  migrated and seeded once per run by the global setup
//   <base>           a copy for the browser tests' server
//   <base>_w<N>      a fresh copy for each integration test file, N = the vitest worker
import { databaseUrl, serviceConfig } from "../../fakes/config.ts";

export const TEST_DATABASE = process.env.EONSCALE_TEST_DATABASE ?? "eonscale_test";
export const TEMPLATE_DATABASE = `${TEST_DATABASE}_template`;
export const E2E_PORT = Number(process.env.EONSCALE_E2E_PORT ?? 3100);

/** The database of this integration test worker. */
export function workerDatabase(): string {
  return `${TEST_DATABASE}_w${process.env.VITEST_POOL_ID ?? process.pid}`;
}

export function applyTestEnv(database = TEST_DATABASE) {
  const config = serviceConfig();
  for (const [key, value] of Object.entries(config.env)) process.env[key] = value;
  process.env.DATABASE_URL = databaseUrl(database);
  // Test databases number their images from 1 like the development one: their own bucket keeps the
  // objects apart (the demo seeder creates it).
  process.env.S3_BUCKET = `${TEST_DATABASE}-assets`.toLowerCase().replace(/[^a-z0-9-]/g, "-");
  process.env.INBOX_URL = config.INBOX_URL;
  process.env.APP_URL = `http://127.0.0.1:${E2E_PORT}`;
  process.env.PORT = String(E2E_PORT);
  process.env.SESSION_SECRET ??= "test-session-secret-only-for-local-test-runs";
  process.env.MAIL_RETRY_DELAY_SECONDS = "1";
  process.env.LOG_LEVEL ??= "warn";
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = "true";
  process.env.EONSCALE_FAST_PG ??= "1";
}
