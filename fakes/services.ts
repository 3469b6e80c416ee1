// Starts, stops and reports the local stand-ins for Eonscale's hosted services, all bound to
// 127.0.0.1 and keeping their state under <repo>/.data (EONSCALE_DATA_DIR):
//   pg    PostgreSQL from Debian's packages, a private cluster in <dataDir>/pg
//   s3    s3rver (fakes/s3.ts), objects in <dataDir>/s3
//   smtp  SMTP server + HTTP inbox API (fakes/smtp.ts), mail in <dataDir>/mail
//
// CLI: npx tsx fakes/services.ts start|stop|restart|status [pg|s3|smtp ...] [--quiet]
import { spawn } from "node:child_process";
import {
  chownSync,
  closeSync,
  existsSync,
  mkdirSync,
  openSync,
  readFileSync,
  rmSync,
  statSync,
  writeFileSync,
} from "node:fs";
import { readdir } from "node:fs/promises";
import { createRequire } from "node:module";
import net from "node:net";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { REPO_ROOT, serviceConfig, type ServiceConfig } from "./config.ts";

export { databaseUrl, servicePorts, serviceConfig, type ServiceConfig } from "./config.ts";

// pg has no bundled types (and @types/pg is not installed): describe the little used here.
interface PgClient {
  connect(): Promise<void>;
  query(sql: string, values?: unknown[]): Promise<{ rowCount: number | null; rows: unknown[] }>;
  end(): Promise<void>;
  on(event: "error", listener: (error: Error) => void): void;
}
const pg = createRequire(import.meta.url)("pg") as {
  Client: new (config: Record<string, unknown>) => PgClient;
};

export type ServiceName = "pg" | "s3" | "smtp";
export const serviceNames: readonly ServiceName[] = ["pg", "s3", "smtp"];

export interface ServiceOptions {
  only?: ServiceName[];
  quiet?: boolean;
}

export interface ServiceStatus {
  name: ServiceName;
  running: boolean;
  pid: number | null;
  ports: number[];
  detail: string;
}

/** An error whose message is meant for the person at the terminal (no stack needed). */
export class ServiceError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ServiceError";
  }
}

// ------------------------------------------------------------------------------------ helpers

const isRoot = () => typeof process.getuid === "function" && process.getuid() === 0;
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
const RUNUSER = existsSync("/usr/sbin/runuser") ? "/usr/sbin/runuser" : "runuser";

interface RunResult {
  code: number | null;
  output: string;
}

/** Runs a command, collecting stdout+stderr (or streaming it when `inherit`). */
function run(command: string, args: string[], opts: { cwd?: string; inherit?: boolean; env?: NodeJS.ProcessEnv } = {}) {
  return new Promise<RunResult>((resolve, reject) => {
    const child = spawn(command, args, {
      cwd: opts.cwd,
      env: opts.env ?? process.env,
      stdio: opts.inherit ? ["ignore", "inherit", "inherit"] : ["ignore", "pipe", "pipe"],
    });
    let output = "";
    child.stdout?.on("data", (chunk) => (output += chunk));
    child.stderr?.on("data", (chunk) => (output += chunk));
    child.on("error", reject);
    child.on("close", (code) => resolve({ code, output }));
  });
}

function probePort(port: number, host = "127.0.0.1", timeoutMs = 500): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ port, host });
    const done = (open: boolean) => {
      socket.destroy();
      resolve(open);
    };
    socket.setTimeout(timeoutMs, () => done(false));
    socket.once("connect", () => done(true));
    socket.once("error", () => done(false));
  });
}

async function waitUntil(check: () => Promise<boolean> | boolean, timeoutMs: number, intervalMs = 50) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (await check()) return true;
    if (Date.now() >= deadline) return false;
    await sleep(intervalMs);
  }
}

function pidAlive(pid: number): boolean {
  try {
    process.kill(pid, 0);
  } catch (error) {
    return (error as NodeJS.ErrnoException).code === "EPERM";
  }
  try {
    // A zombie still answers kill(0); it is gone for our purposes.
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    return stat.slice(stat.lastIndexOf(")") + 2, stat.lastIndexOf(")") + 3) !== "Z";
  } catch {
    return true;
  }
}

/** Guards against a recycled pid: the process must be running our script. */
function pidRunsScript(pid: number, script: string): boolean {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, "utf8").includes(script);
  } catch {
    return existsSync("/proc/self") ? false : true;
  }
}

function readPid(file: string): number | null {
  try {
    const pid = Number.parseInt(readFileSync(file, "utf8").trim().split("\n")[0] ?? "", 10);
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

function tail(file: string, lines = 25): string {
  try {
    return readFileSync(file, "utf8").trimEnd().split("\n").slice(-lines).join("\n");
  } catch {
    return "(no log yet)";
  }
}

/** Serialises start/stop across processes (e.g. two test runners starting at once). */
async function withLock<T>(config: ServiceConfig, fn: () => Promise<T>): Promise<T> {
  mkdirSync(config.dataDir, { recursive: true });
  const lockFile = path.join(config.dataDir, ".services.lock");
  const deadline = Date.now() + 15 * 60_000; // a first start may include apt-get install
  let fd: number | undefined;
  while (fd === undefined) {
    try {
      fd = openSync(lockFile, "wx");
      writeFileSync(fd, `${process.pid}\n`);
    } catch (error) {
      if ((error as NodeJS.ErrnoException).code !== "EEXIST") throw error;
      const holder = readPid(lockFile);
      if (holder !== null && !pidAlive(holder)) {
        rmSync(lockFile, { force: true }); // left behind by a killed process
        continue;
      }
      if (Date.now() > deadline) throw new ServiceError(`Timed out waiting for ${lockFile} (held by pid ${holder})`);
      await sleep(100);
    }
  }
  try {
    return await fn();
  } finally {
    closeSync(fd);
    rmSync(lockFile, { force: true });
  }
}

function selected(opts?: ServiceOptions): ServiceName[] {
  const only = opts?.only?.length ? opts.only : serviceNames;
  for (const name of only) {
    if (!serviceNames.includes(name)) throw new ServiceError(`Unknown service "${name}" (use pg, s3 or smtp)`);
  }
  return serviceNames.filter((name) => only.includes(name));
}

// ----------------------------------------------------------------------------------- Postgres

const PG_ROOT = "/usr/lib/postgresql";

async function findPgBin(): Promise<string | null> {
  let versions: string[];
  try {
    versions = await readdir(PG_ROOT);
  } catch {
    return null;
  }
  const usable = versions
    .filter((v) => /^\d+(\.\d+)?$/.test(v) && existsSync(path.join(PG_ROOT, v, "bin", "pg_ctl")))
    .sort((a, b) => Number.parseFloat(b) - Number.parseFloat(a));
  return usable.length ? path.join(PG_ROOT, usable[0]!, "bin") : null;
}

async function ensurePgInstalled(log: (line: string) => void): Promise<string> {
  const found = await findPgBin();
  if (found) return found;
  if (!isRoot()) {
    throw new ServiceError(
      "PostgreSQL is not installed (nothing in /usr/lib/postgresql/*/bin). Install Debian's package:\n" +
        "  sudo apt-get install postgresql\n" +
        "then run `npm run services:start` again.",
    );
  }
  log("PostgreSQL is not installed; installing Debian's postgresql package:");
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  for (const args of [["update"], ["install", "-y", "postgresql"]]) {
    log(`  $ apt-get ${args.join(" ")}`);
    const result = await run("apt-get", args, { inherit: true, env });
    if (result.code !== 0) throw new ServiceError(`apt-get ${args.join(" ")} failed (exit ${result.code})`);
  }
  const installed = await findPgBin();
  if (!installed) throw new ServiceError("apt-get installed postgresql but no /usr/lib/postgresql/*/bin/pg_ctl was found");
  return installed;
}

/** Postgres refuses to run as root: as root, run its tools as the postgres user. */
function pgTool(bin: string, tool: string, args: string[], cwd: string) {
  const file = path.join(bin, tool);
  return isRoot() ? run(RUNUSER, ["-u", "postgres", "--", file, ...args], { cwd }) : run(file, args, { cwd });
}

function postgresIds(): { uid: number; gid: number } {
  const line = readFileSync("/etc/passwd", "utf8")
    .split("\n")
    .find((l) => l.startsWith("postgres:"));
  if (!line) throw new ServiceError("Running as root, but there is no `postgres` user to run PostgreSQL as (is the postgresql package installed?)");
  const [, , uid, gid] = line.split(":");
  return { uid: Number(uid), gid: Number(gid) };
}

/** As root: checks the postgres user can reach `target`, naming the first directory it cannot. */
async function checkPostgresCanReach(target: string): Promise<void> {
  const ok = await run(RUNUSER, ["-u", "postgres", "--", "test", "-w", target, "-a", "-x", target], { cwd: "/" });
  if (ok.code === 0) return;
  const parts = path.resolve(target).split(path.sep).filter(Boolean);
  for (let i = 1; i <= parts.length; i++) {
    const dir = path.sep + parts.slice(0, i).join(path.sep);
    const step = await run(RUNUSER, ["-u", "postgres", "--", "test", "-x", dir], { cwd: "/" });
    if (step.code !== 0) {
      const mode = (statSync(dir).mode & 0o777).toString(8);
      throw new ServiceError(
        `PostgreSQL runs as the postgres user, which cannot enter ${dir} (mode ${mode}).\n` +
          `Either allow traversal:  chmod o+x ${dir}\n` +
          `or keep the data elsewhere: EONSCALE_DATA_DIR=/var/tmp/eonscale-data npm run services:start`,
      );
    }
  }
  throw new ServiceError(`The postgres user cannot write to ${target}:\n${ok.output}`);
}

interface PostmasterInfo {
  pid: number;
  port: number;
}

function postmasterInfo(config: ServiceConfig): PostmasterInfo | null {
  try {
    const lines = readFileSync(path.join(config.pg.dataDir, "postmaster.pid"), "utf8").split("\n");
    const pid = Number.parseInt(lines[0] ?? "", 10);
    const port = Number.parseInt(lines[3] ?? "", 10);
    return Number.isInteger(pid) && pid > 0 && pidAlive(pid) ? { pid, port } : null;
  } catch {
    return null;
  }
}

function pgClient(config: ServiceConfig, database = "postgres") {
  return new pg.Client({
    host: config.pg.host,
    port: config.pg.port,
    user: config.pg.user,
    password: config.pg.password,
    database,
    connectionTimeoutMillis: 2000,
  });
}

async function pgAccepts(config: ServiceConfig): Promise<boolean> {
  const client = pgClient(config);
  client.on("error", () => {});
  try {
    await client.connect();
    await client.query("select 1");
    return true;
  } catch {
    return false;
  } finally {
    await client.end().catch(() => {});
  }
}

const sqlString = (value: string) => `'${value.replace(/'/g, "''")}'`;
const sqlIdent = (value: string) => `"${value.replace(/"/g, '""')}"`;

function writeOwned(file: string, content: string, owner?: { uid: number; gid: number }, mode = 0o600) {
  writeFileSync(file, content, { mode });
  if (owner) chownSync(file, owner.uid, owner.gid);
}

function eonscaleConf(config: ServiceConfig): string {
  const lines = [
    "# Written by fakes/services.ts on every start; edit that file, not this one.",
    "listen_addresses = '127.0.0.1'",
    `port = ${config.pg.port}`,
    `unix_socket_directories = ${sqlString(config.pg.socketDir)}`,
  ];
  if (process.env.EONSCALE_FAST_PG === "1") {
    lines.push(
      "# EONSCALE_FAST_PG=1: throwaway test data, trade durability for speed",
      "fsync = off",
      "synchronous_commit = off",
      "full_page_writes = off",
    );
  }
  return `${lines.join("\n")}\n`;
}

const PG_HBA = `# Written by fakes/services.ts.
# Unix socket: only reachable by the cluster's owner (the socket directory is mode 0700).
local   all   all                  trust
# TCP: loopback only, password required.
host    all   all   127.0.0.1/32   scram-sha-256
`;

async function startPg(config: ServiceConfig, log: (line: string) => void): Promise<string> {
  const { pg: cfg } = config;
  const running = postmasterInfo(config);
  if (running) {
    if (running.port !== cfg.port) {
      throw new ServiceError(
        `Eonscale's Postgres (${cfg.dataDir}, pid ${running.pid}) is running on port ${running.port}, not ${cfg.port}. ` +
          `Stop it first (npm run services:stop) or set PG_PORT=${running.port}.`,
      );
    }
    if (await waitUntil(() => pgAccepts(config), 30_000, 200)) {
      await ensureDatabase(cfg.database);
      return `already running (pid ${running.pid})`;
    }
    throw new ServiceError(`Postgres (pid ${running.pid}) is running but not accepting connections; see ${cfg.logFile}`);
  }
  if (await probePort(cfg.port)) {
    throw new ServiceError(
      `Port ${cfg.port} on 127.0.0.1 is already in use by another program; stop it or choose another port with PG_PORT.`,
    );
  }

  const bin = await ensurePgInstalled(log);
  const owner = isRoot() ? postgresIds() : undefined;
  mkdirSync(config.dataDir, { recursive: true });
  for (const dir of [cfg.dataDir, cfg.socketDir]) {
    mkdirSync(dir, { recursive: true, mode: 0o700 });
    if (owner) chownSync(dir, owner.uid, owner.gid);
  }
  if (!existsSync(cfg.logFile)) writeFileSync(cfg.logFile, "", { mode: 0o640 });
  if (owner) {
    chownSync(cfg.logFile, owner.uid, owner.gid);
    await checkPostgresCanReach(cfg.dataDir);
    await checkPostgresCanReach(cfg.socketDir);
  }

  let status = "started";
  if (!existsSync(path.join(cfg.dataDir, "PG_VERSION"))) {
    const started = Date.now();
    log(`  initialising a new PostgreSQL cluster in ${cfg.dataDir} (${bin}) …`);
    const pwfile = path.join(config.dataDir, `.pg-pwfile-${process.pid}`);
    writeOwned(pwfile, `${cfg.password}\n`, owner);
    try {
      const result = await pgTool(
        bin,
        "initdb",
        [
          "-D", cfg.dataDir,
          "-U", cfg.user,
          `--pwfile=${pwfile}`,
          "-E", "UTF8",
          "--locale=C",
          "--auth-local=trust",
          "--auth-host=scram-sha-256",
        ],
        config.dataDir,
      );
      if (result.code !== 0) throw new ServiceError(`initdb failed (exit ${result.code}):\n${result.output}`);
    } finally {
      rmSync(pwfile, { force: true });
    }
    writeFileSync(path.join(cfg.dataDir, "pg_hba.conf"), PG_HBA); // keeps initdb's owner and mode
    status = `initialised and started in ${((Date.now() - started) / 1000).toFixed(1)}s`;
  }
  const mainConf = path.join(cfg.dataDir, "postgresql.conf");
  const confText = readFileSync(mainConf, "utf8");
  if (!confText.includes("include_if_exists = 'eonscale.conf'")) {
    writeFileSync(mainConf, `${confText}\n# Eonscale local settings (fakes/services.ts)\ninclude_if_exists = 'eonscale.conf'\n`);
  }
  writeOwned(path.join(cfg.dataDir, "eonscale.conf"), eonscaleConf(config), owner);

  const result = await pgTool(bin, "pg_ctl", ["start", "-D", cfg.dataDir, "-l", cfg.logFile, "-w", "-t", "60", "-s"], config.dataDir);
  if (result.code !== 0 || !(await waitUntil(() => pgAccepts(config), 30_000, 100))) {
    throw new ServiceError(
      `PostgreSQL did not start (pg_ctl exit ${result.code}). ${result.output.trim()}\n` +
        `Last lines of ${cfg.logFile}:\n${tail(cfg.logFile)}`,
    );
  }
  await ensureDatabase(cfg.database);
  return status;
}

async function stopPg(config: ServiceConfig): Promise<string> {
  const running = postmasterInfo(config);
  if (!running) return "not running";
  const bin = await findPgBin();
  if (!bin) throw new ServiceError("Postgres is running but pg_ctl was not found to stop it");
  const result = await pgTool(bin, "pg_ctl", ["stop", "-D", config.pg.dataDir, "-m", "fast", "-w", "-t", "60", "-s"], config.dataDir);
  if (result.code !== 0) throw new ServiceError(`pg_ctl stop failed (exit ${result.code}): ${result.output}`);
  return `stopped (was pid ${running.pid})`;
}

/**
 * Creates database `name` on the local server unless it exists (optionally as a copy of
 * `template`). Connects to the "postgres" database as the eonscale superuser.
 */
export async function ensureDatabase(
  name: string,
  opts: { template?: string } = {},
): Promise<{ created: boolean; url: string }> {
  const config = serviceConfig();
  const url = `postgres://${config.pg.user}:${config.pg.password}@${config.pg.host}:${config.pg.port}/${encodeURIComponent(name)}`;
  const client = pgClient(config);
  await client.connect();
  try {
    const existing = await client.query("select 1 from pg_database where datname = $1", [name]);
    if (existing.rowCount) return { created: false, url };
    const template = opts.template ? ` template ${sqlIdent(opts.template)}` : "";
    try {
      await client.query(`create database ${sqlIdent(name)}${template}`);
    } catch (error) {
      const code = (error as { code?: string }).code;
      if (code === "42P04" || code === "23505") return { created: false, url }; // created concurrently
      throw error;
    }
    return { created: true, url };
  } finally {
    await client.end();
  }
}

/** Drops database `name` if it exists, disconnecting its sessions. */
export async function dropDatabase(name: string): Promise<void> {
  const client = pgClient(serviceConfig());
  await client.connect();
  try {
    await client.query(`drop database if exists ${sqlIdent(name)} with (force)`);
  } finally {
    await client.end();
  }
}

// ------------------------------------------------------------------- node services (s3, smtp)

interface NodeService {
  name: "s3" | "smtp";
  script: string; // relative to the repository root
  pidFile: string;
  logFile: string;
  ports: number[];
  portEnv: string[];
}

function nodeServices(config: ServiceConfig): Record<"s3" | "smtp", NodeService> {
  return {
    s3: {
      name: "s3",
      script: "fakes/s3.ts",
      pidFile: config.s3.pidFile,
      logFile: config.s3.logFile,
      ports: [config.s3.port],
      portEnv: ["S3_PORT"],
    },
    smtp: {
      name: "smtp",
      script: "fakes/smtp.ts",
      pidFile: config.smtp.pidFile,
      logFile: config.smtp.logFile,
      ports: [config.smtp.port, config.smtp.inboxPort],
      portEnv: ["SMTP_PORT", "SMTP_INBOX_PORT"],
    },
  };
}

function runningPid(service: NodeService): number | null {
  const pid = readPid(service.pidFile);
  return pid !== null && pidAlive(pid) && pidRunsScript(pid, service.script) ? pid : null;
}

async function allOpen(ports: number[]): Promise<boolean> {
  return (await Promise.all(ports.map((p) => probePort(p)))).every(Boolean);
}

function tsxLoader(): string {
  try {
    return pathToFileURL(createRequire(import.meta.url).resolve("tsx")).href;
  } catch {
    return "tsx"; // resolved from the repository root (cwd of the child)
  }
}

function childEnv(config: ServiceConfig): NodeJS.ProcessEnv {
  return {
    ...process.env,
    EONSCALE_DATA_DIR: config.dataDir,
    PG_PORT: String(config.pg.port),
    S3_PORT: String(config.s3.port),
    S3_BUCKET: config.s3.bucket,
    SMTP_PORT: String(config.smtp.port),
    SMTP_INBOX_PORT: String(config.smtp.inboxPort),
  };
}

async function startNodeService(config: ServiceConfig, service: NodeService): Promise<string> {
  const existing = runningPid(service);
  if (existing !== null) {
    if (await waitUntil(() => allOpen(service.ports), 10_000)) return `already running (pid ${existing})`;
    await stopNodeService(service); // alive but not listening: replace it
  }
  rmSync(service.pidFile, { force: true });
  for (const [i, port] of service.ports.entries()) {
    if (await probePort(port)) {
      throw new ServiceError(
        `Port ${port} on 127.0.0.1 is already in use by another program, so ${service.name} cannot start; ` +
          `stop that program or choose another port with ${service.portEnv[i]}.`,
      );
    }
  }
  mkdirSync(config.dataDir, { recursive: true });
  const logFd = openSync(service.logFile, "a");
  let exited: string | null = null;
  try {
    const child = spawn(process.execPath, ["--import", tsxLoader(), service.script], {
      cwd: REPO_ROOT,
      detached: true,
      stdio: ["ignore", logFd, logFd],
      env: childEnv(config),
    });
    child.on("exit", (code, signal) => (exited = signal ?? `exit ${code}`));
    child.on("error", (error) => (exited = String(error)));
    child.unref();
    if (child.pid === undefined) throw new ServiceError(`Could not start ${service.name}: ${exited ?? "spawn failed"}`);
    writeFileSync(service.pidFile, `${child.pid}\n`);
    const up = await waitUntil(async () => exited !== null || (await allOpen(service.ports)), 30_000);
    if (!up || exited !== null) {
      if (exited === null) process.kill(child.pid, "SIGKILL");
      rmSync(service.pidFile, { force: true });
      throw new ServiceError(
        `${service.name} did not start (${exited ?? "timed out"}). Last lines of ${service.logFile}:\n${tail(service.logFile)}`,
      );
    }
    return `started (pid ${child.pid})`;
  } finally {
    closeSync(logFd);
  }
}

async function stopNodeService(service: NodeService): Promise<string> {
  const pid = runningPid(service);
  if (pid === null) {
    rmSync(service.pidFile, { force: true });
    return "not running";
  }
  process.kill(pid, "SIGTERM");
  if (!(await waitUntil(() => !pidAlive(pid), 5000, 25))) {
    process.kill(pid, "SIGKILL");
    await waitUntil(() => !pidAlive(pid), 2000, 25);
  }
  await waitUntil(async () => !(await Promise.all(service.ports.map((p) => probePort(p)))).some(Boolean), 3000, 25);
  rmSync(service.pidFile, { force: true });
  return `stopped (was pid ${pid})`;
}

async function ensureBucket(config: ServiceConfig): Promise<string> {
  const { S3Client, HeadBucketCommand, CreateBucketCommand } = await import("@aws-sdk/client-s3");
  const client = new S3Client({
    endpoint: config.s3.endpoint,
    region: config.s3.region,
    forcePathStyle: true,
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
    credentials: { accessKeyId: config.s3.accessKeyId, secretAccessKey: config.s3.secretAccessKey },
  });
  try {
    await client.send(new HeadBucketCommand({ Bucket: config.s3.bucket }));
    return "bucket ok";
  } catch (error) {
    const status = (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
    if (status !== 404 && (error as Error).name !== "NotFound") throw error;
    await client.send(new CreateBucketCommand({ Bucket: config.s3.bucket }));
    return "bucket created";
  } finally {
    client.destroy();
  }
}

// ------------------------------------------------------------------------------- public API

/**
 * Starts the selected services (all by default). Idempotent: services already running are left
 * alone. Resolves with the configuration once every service accepts connections.
 */
export async function startServices(opts: ServiceOptions = {}): Promise<ServiceConfig> {
  const config = serviceConfig();
  const names = selected(opts);
  const log = (line: string) => {
    if (!opts.quiet) console.log(line);
  };
  const results = await withLock(config, async () => {
    const services = nodeServices(config);
    const outcome: Partial<Record<ServiceName, string>> = {};
    await Promise.all(
      names.map(async (name) => {
        if (name === "pg") outcome.pg = await startPg(config, log);
        else {
          outcome[name] = await startNodeService(config, services[name]);
          if (name === "s3") outcome.s3 += `, ${await ensureBucket(config)}`;
        }
      }),
    );
    return outcome;
  });
  if (!opts.quiet) {
    const lines = [`Eonscale local services (127.0.0.1 only, data in ${config.dataDir}):`];
    if (results.pg) lines.push(`  pg    ${results.pg.padEnd(36)} DATABASE_URL=${config.DATABASE_URL}`);
    if (results.s3) {
      lines.push(
        `  s3    ${results.s3.padEnd(36)} S3_ENDPOINT=${config.s3.endpoint} bucket=${config.s3.bucket} key=${config.s3.accessKeyId}/${config.s3.secretAccessKey}`,
      );
    }
    if (results.smtp) lines.push(`  smtp  ${results.smtp.padEnd(36)} SMTP_URL=${config.SMTP_URL} INBOX_URL=${config.INBOX_URL}`);
    console.log(lines.join("\n"));
  }
  return config;
}

/** Stops the selected services (all by default); a service that is not running is skipped. */
export async function stopServices(opts: ServiceOptions = {}): Promise<void> {
  const config = serviceConfig();
  const names = selected(opts);
  const results = await withLock(config, async () => {
    const services = nodeServices(config);
    const outcome: Partial<Record<ServiceName, string>> = {};
    await Promise.all(
      names.map(async (name) => {
        outcome[name] = name === "pg" ? await stopPg(config) : await stopNodeService(services[name]);
      }),
    );
    return outcome;
  });
  if (!opts.quiet) {
    console.log(names.map((name) => `  ${name.padEnd(5)} ${results[name]}`).join("\n"));
  }
}

/** Reports whether each selected service is running and reachable. */
export async function serviceStatus(opts: Pick<ServiceOptions, "only"> = {}): Promise<ServiceStatus[]> {
  const config = serviceConfig();
  const services = nodeServices(config);
  return Promise.all(
    selected(opts).map(async (name): Promise<ServiceStatus> => {
      if (name === "pg") {
        const info = postmasterInfo(config);
        const accepting = info !== null && (await pgAccepts(config));
        return {
          name,
          running: accepting,
          pid: info?.pid ?? null,
          ports: [config.pg.port],
          detail: info === null ? `${config.DATABASE_URL} (not running)` : accepting ? config.DATABASE_URL : `pid ${info.pid} but not accepting connections on ${config.pg.port}`,
        };
      }
      const service = services[name];
      const pid = runningPid(service);
      const open = pid !== null && (await allOpen(service.ports));
      const where = name === "s3" ? `${config.s3.endpoint} bucket=${config.s3.bucket}` : `${config.SMTP_URL} inbox=${config.INBOX_URL}`;
      return {
        name,
        running: open,
        pid,
        ports: service.ports,
        detail: pid === null ? `${where} (not running)` : open ? where : `pid ${pid} but ports ${service.ports.join(", ")} not open`,
      };
    }),
  );
}

// -------------------------------------------------------------------------------------- CLI

async function main(argv: string[]): Promise<number> {
  const quiet = argv.includes("--quiet") || argv.includes("-q");
  const [command = "status", ...rest] = argv.filter((a) => !a.startsWith("-"));
  const only = rest as ServiceName[];
  switch (command) {
    case "start":
      await startServices({ only, quiet });
      return 0;
    case "stop":
      await stopServices({ only, quiet });
      return 0;
    case "restart":
      await stopServices({ only, quiet });
      await startServices({ only, quiet });
      return 0;
    case "status": {
      const statuses = await serviceStatus({ only });
      for (const s of statuses) {
        console.log(`  ${s.name.padEnd(5)} ${(s.running ? "running" : "stopped").padEnd(8)} ${s.pid ? `pid ${s.pid}`.padEnd(11) : "".padEnd(11)} ${s.detail}`);
      }
      return statuses.every((s) => s.running) ? 0 : 1;
    }
    default:
      console.error("usage: npx tsx fakes/services.ts start|stop|restart|status [pg|s3|smtp ...] [--quiet]");
      return 2;
  }
}

const invokedDirectly = process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url);
if (invokedDirectly) {
  // The AWS SDK warns on every run that future releases will need Node 22; not actionable here.
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";
  main(process.argv.slice(2)).then(
    (code) => process.exit(code),
    (error: unknown) => {
      console.error(error instanceof ServiceError ? `error: ${error.message}` : error);
      process.exit(1);
    },
  );
}
