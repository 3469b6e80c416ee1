// The environment every test process uses: the local stand-ins, an isolated database and port.
import { databaseUrl, serviceConfig } from "../../fakes/config.ts";

export const TEST_DATABASE = process.env.EONSCALE_TEST_DATABASE ?? "eonscale_test";
export const E2E_PORT = Number(process.env.EONSCALE_E2E_PORT ?? 3100);

export function applyTestEnv() {
  const config = serviceConfig();
  for (const [key, value] of Object.entries(config.env)) process.env[key] = value;
  process.env.DATABASE_URL = databaseUrl(TEST_DATABASE);
  process.env.INBOX_URL = config.INBOX_URL;
  process.env.APP_URL = `http://127.0.0.1:${E2E_PORT}`;
  process.env.PORT = String(E2E_PORT);
  process.env.MAIL_RETRY_DELAY_SECONDS = "1";
  process.env.LOG_LEVEL ??= "warn";
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = "true";
  process.env.EONSCALE_FAST_PG ??= "1";
}
