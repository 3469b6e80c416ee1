// Configuration from environment variables, validated once at start-up (fail fast). The server
// knows no local stand-ins: the local launcher (fakes/launch.ts, npm start / npm run dev) and the
// test setup pass their addresses as variables. Only harmless values have defaults outside
// production (a local session secret, the local URL); in production they are required too.
import { z } from "zod";

function schemaFor(source: NodeJS.ProcessEnv) {
  const isProduction = source.NODE_ENV === "production";

  function localDefault<T extends z.ZodType>(schema: T, value: z.input<T>) {
    // In production the variable is required; elsewhere it falls back to a local value.
    return isProduction ? schema : schema.default(value as never);
  }
  const required = (name: string, what: string) => ({ error: (issue: { input: unknown }) => (issue.input === undefined ? `${name} is required (${what})` : `${name} must be ${what}`) });

  return z.object({
    NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
    PORT: z.coerce.number().int().min(0).max(65535).default(3000),
    HOST: z.string().min(1).default("127.0.0.1"),
    APP_URL: localDefault(z.url({ error: "APP_URL must be the public base URL, e.g. https://eonscale.example" }), "http://127.0.0.1:3000"),
    DATABASE_URL: z.string(required("DATABASE_URL", "a postgres:// URL")).regex(/^postgres(ql)?:\/\//, { error: "DATABASE_URL must be a postgres:// URL" }),
    DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
    SESSION_SECRET: localDefault(z.string().min(32, { error: "SESSION_SECRET must be at least 32 characters (comma-separate several to rotate)" }), "local-development-secret-not-for-production-use"),
    S3_ENDPOINT: z.url().optional(),
    S3_REGION: z.string().default("us-east-1"),
    S3_BUCKET: isProduction ? z.string().min(3) : z.string().min(3).optional(),
    S3_ACCESS_KEY_ID: isProduction ? z.string().min(1) : z.string().min(1).optional(),
    S3_SECRET_ACCESS_KEY: isProduction ? z.string().min(1) : z.string().min(1).optional(),
    S3_FORCE_PATH_STYLE: z.enum(["true", "false"]).default(source.S3_ENDPOINT ? "true" : "false"),
    SMTP_URL: z.string(required("SMTP_URL", "an smtp:// or smtps:// URL")).regex(/^smtps?:\/\//, { error: "SMTP_URL must be an smtp:// or smtps:// URL" }),
    MAIL_FROM: z.string().default("Eonscale <no-reply@eonscale.example>"),
    // How many proxies in front of the app to believe about the client's address (X-Forwarded-For,
    // read from the right): 0 (or "false") for none, 1 for one load balancer, and so on. "true" is
    // read as 1 — never "every hop", which would let a client name its own address.
    TRUST_PROXY: z
      .string()
      .regex(/^(true|false|\d{1,2})$/, { error: "TRUST_PROXY must be the number of trusted proxy hops (0, 1, 2 …), or false (0) or true (1)" })
      .default("0")
      .transform((v) => (v === "false" ? 0 : v === "true" ? 1 : Number(v))),
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
