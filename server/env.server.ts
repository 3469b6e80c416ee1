// Configuration from environment variables, validated once at start-up (fail fast).
// Outside production every value has a default that points at the local stand-ins in fakes/.
import { z } from "zod";
import { serviceConfig } from "../fakes/config.ts";

function schemaFor(source: NodeJS.ProcessEnv) {
  const local = serviceConfig(source);
  // A production build run against the local stand-ins (npm start) sets EONSCALE_LOCAL=1.
  const isProduction = source.NODE_ENV === "production" && source.EONSCALE_LOCAL !== "1";

  function localDefault<T extends z.ZodType>(schema: T, value: z.input<T>) {
    // In production the variable is required; elsewhere it falls back to the local stand-in.
    return isProduction ? schema : schema.default(value as never);
}

return z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  PORT: z.coerce.number().int().min(1).max(65535).default(3000),
  HOST: z.string().min(1).default("127.0.0.1"),
  APP_URL: localDefault(z.url({ error: "APP_URL must be the public base URL, e.g. https://eonscale.example" }), "http://127.0.0.1:3000"),
  DATABASE_URL: localDefault(z.string().regex(/^postgres(ql)?:\/\//, { error: "DATABASE_URL must be a postgres:// URL" }), local.DATABASE_URL),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  SESSION_SECRET: localDefault(z.string().min(32, { error: "SESSION_SECRET must be at least 32 characters (comma-separate several to rotate)" }), "local-development-secret-not-for-production-use"),
  S3_ENDPOINT: isProduction ? z.url().optional() : z.url().default(local.s3.endpoint),
  S3_REGION: z.string().default("us-east-1"),
  S3_BUCKET: localDefault(z.string().min(3), local.s3.bucket),
  S3_ACCESS_KEY_ID: localDefault(z.string().min(1), local.s3.accessKeyId),
  S3_SECRET_ACCESS_KEY: localDefault(z.string().min(1), local.s3.secretAccessKey),
  S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).default(isProduction ? "false" : "true"),
  SMTP_URL: localDefault(z.string().regex(/^smtps?:\/\//, { error: "SMTP_URL must be an smtp:// or smtps:// URL" }), local.SMTP_URL),
  MAIL_FROM: z.string().default("Eonscale <no-reply@eonscale.example>"),
  INBOX_URL: z.string().optional(),
  TRUST_PROXY: z.enum(["true", "false"]).default("false"),
  LOG_LEVEL: z.enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"]).default("info"),
  MAIL_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).default(30),
  MAIL_RETRY_LIMIT: z.coerce.number().int().min(0).default(12),
  RUN_WORKERS: z.enum(["true", "false"]).default("true"),
});
}

export type Env = z.infer<ReturnType<typeof schemaFor>>;

let cached: Env | undefined;

export function loadEnv(source: NodeJS.ProcessEnv = process.env): Env {
  const parsed = schemaFor(source).safeParse(source);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".") || "(env)"}: ${i.message}`);
    throw new Error(`Eonscale cannot start: the environment is not valid.\n${lines.join("\n")}`);
  }
  return parsed.data;
}

/** The validated environment (parsed on first use; throws a readable error). */
export function env(): Env {
  cached ??= loadEnv();
  return cached;
}

export function resetEnvForTests() {
  cached = undefined;
}
