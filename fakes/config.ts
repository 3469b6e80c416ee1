// Where the local stand-ins live and how to reach them. Pure: no I/O. Imported by the local
// launcher, the tests and the service processes themselves — never by the app (app/, server/).
import path from "node:path";
import { fileURLToPath } from "node:url";

type Env = Record<string, string | undefined>;

export const defaultPorts = {
  pg: 54329,
  s3: 54330,
  smtp: 54325,
  smtpInbox: 54326,
} as const;

export const HOST = "127.0.0.1";

function repoRoot(): string {
  try {
    // fakes/config.ts -> repository root
    return path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
  } catch {
    return process.cwd();
  }
}

export const REPO_ROOT = repoRoot();

function port(env: Env, name: string, fallback: number): number {
  const raw = env[name];
  if (raw === undefined || raw === "") return fallback;
  const value = Number(raw);
  if (!Number.isInteger(value) || value < 1 || value > 65535) {
    throw new Error(`${name}=${JSON.stringify(raw)} is not a valid TCP port`);
  }
  return value;
}

export function servicePortsFrom(env: Env = process.env) {
  return {
    pg: port(env, "PG_PORT", defaultPorts.pg),
    s3: port(env, "S3_PORT", defaultPorts.s3),
    smtp: port(env, "SMTP_PORT", defaultPorts.smtp),
    smtpInbox: port(env, "SMTP_INBOX_PORT", defaultPorts.smtpInbox),
  };
}

/** Ports resolved from the environment when this module was loaded. */
export const servicePorts = servicePortsFrom();

export type ServiceConfig = ReturnType<typeof serviceConfig>;

export function serviceConfig(env: Env = process.env) {
  const ports = servicePortsFrom(env);
  const dataDir = path.resolve(REPO_ROOT, env.EONSCALE_DATA_DIR || ".data");
  const pg = {
    port: ports.pg,
    host: HOST,
    user: "eonscale",
    password: "eonscale",
    database: "eonscale",
    dataDir: path.join(dataDir, "pg"),
    socketDir: path.join(dataDir, "pg-socket"),
    logFile: path.join(dataDir, "pg.log"),
    url: `postgres://eonscale:eonscale@${HOST}:${ports.pg}/eonscale`,
  };
  const s3 = {
    port: ports.s3,
    host: HOST,
    bucket: env.S3_BUCKET || "eonscale-assets",
    accessKeyId: "S3RVER",
    secretAccessKey: "S3RVER",
    region: "us-east-1",
    endpoint: `http://${HOST}:${ports.s3}`,
    directory: path.join(dataDir, "s3"),
    pidFile: path.join(dataDir, "s3.pid"),
    logFile: path.join(dataDir, "s3.log"),
  };
  const smtp = {
    port: ports.smtp,
    inboxPort: ports.smtpInbox,
    host: HOST,
    url: `smtp://${HOST}:${ports.smtp}`,
    inboxUrl: `http://${HOST}:${ports.smtpInbox}`,
    mailDir: path.join(dataDir, "mail"),
    pidFile: path.join(dataDir, "smtp.pid"),
    logFile: path.join(dataDir, "smtp.log"),
  };
  return {
    dataDir,
    pg,
    s3,
    smtp,
    DATABASE_URL: pg.url,
    SMTP_URL: smtp.url,
    INBOX_URL: smtp.inboxUrl,
    /** Environment variables an app or test process can merge in to reach these services. */
    env: {
      DATABASE_URL: pg.url,
      SMTP_URL: smtp.url,
      INBOX_URL: smtp.inboxUrl,
      S3_ENDPOINT: s3.endpoint,
      S3_BUCKET: s3.bucket,
      S3_REGION: s3.region,
      S3_ACCESS_KEY_ID: s3.accessKeyId,
      S3_SECRET_ACCESS_KEY: s3.secretAccessKey,
    } as Record<string, string>,
  };
}

/** postgres:// URL for another database on the same local server (test databases etc.). */
export function databaseUrl(name: string, env: Env = process.env): string {
  const { pg } = serviceConfig(env);
  return `postgres://${pg.user}:${pg.password}@${pg.host}:${pg.port}/${encodeURIComponent(name)}`;
}
