// The local PostgreSQL stand-in: a private cluster from Debian's packages, bound to 127.0.0.1.
// The cluster lives in <dataDir>/pg; when this runs as root and the postgres user cannot reach
// that folder (a checkout under /root, mode 700), it lives in /var/lib/eonscale/<hash of the
// data folder>/pg instead, and start-up says so.
import { createHash } from "node:crypto";
import { chownSync, existsSync, mkdirSync, readFileSync, rmSync, statSync, writeFileSync } from "node:fs";
import { readdir } from "node:fs/promises";
import { createRequire } from "node:module";
import path from "node:path";
import { serviceConfig, type ServiceConfig } from "./config.ts";
import { RUNUSER, ServiceError, isRoot, pidAlive, probePort, run, tail, waitUntil } from "./util.ts";

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

export async function ensurePgInstalled(log: (line: string) => void): Promise<string> {
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

/** As root: whether the postgres user can enter and write `target`. */
async function postgresCanReach(target: string): Promise<boolean> {
  return (await run(RUNUSER, ["-u", "postgres", "--", "test", "-w", target, "-a", "-x", target], { cwd: "/" })).code === 0;
}

/** As root: checks the postgres user can reach `target`, naming the first directory it cannot. */
async function checkPostgresCanReach(target: string): Promise<void> {
  if (await postgresCanReach(target)) return;
  const parts = path.resolve(target).split(path.sep).filter(Boolean);
  for (let i = 1; i <= parts.length; i++) {
    const dir = path.sep + parts.slice(0, i).join(path.sep);
    const step = await run(RUNUSER, ["-u", "postgres", "--", "test", "-x", dir], { cwd: "/" });
    if (step.code !== 0) {
      const mode = (statSync(dir).mode & 0o777).toString(8);
      throw new ServiceError(`PostgreSQL runs as the postgres user, which cannot enter ${dir} (mode ${mode}).`);
    }
  }
  throw new ServiceError(`The postgres user cannot write to ${target}`);
}

/** Where a root-run cluster goes when the repository's data folder is out of the postgres user's reach. */
export function sharedPgHome(dataDir: string): string {
  return path.join("/var/lib/eonscale", createHash("sha256").update(path.resolve(dataDir)).digest("hex").slice(0, 12));
}

function placedIn(config: ServiceConfig, home: string): ServiceConfig {
  return { ...config, pg: { ...config.pg, dataDir: path.join(home, "pg"), socketDir: path.join(home, "pg-socket"), logFile: path.join(home, "pg.log") } };
}

/**
 * The configuration with the cluster's real folders: the repository's data folder, or (as root,
 * when the postgres user cannot reach it) the per-project folder under /var/lib/eonscale. Once a
 * cluster exists in either place it stays there.
 */
export async function placePg(config: ServiceConfig, opts: { deciding?: boolean } = {}): Promise<ServiceConfig> {
  if (!isRoot() || existsSync(path.join(config.pg.dataDir, "PG_VERSION"))) return config;
  const home = sharedPgHome(config.dataDir);
  if (existsSync(path.join(home, "pg", "PG_VERSION"))) return placedIn(config, home);
  if (!opts.deciding || !(await findPgBin())) return config;
  mkdirSync(config.dataDir, { recursive: true });
  // The cluster's folders inside are made and handed to postgres; it only has to get there.
  const canEnter = await run(RUNUSER, ["-u", "postgres", "--", "test", "-x", config.dataDir], { cwd: "/" });
  if (canEnter.code === 0) return config;
  mkdirSync(home, { recursive: true, mode: 0o755 });
  return placedIn(config, home);
}

interface PostmasterInfo {
  pid: number;
  port: number;
}

export function postmasterInfo(config: ServiceConfig): PostmasterInfo | null {
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

export async function pgAccepts(config: ServiceConfig): Promise<boolean> {
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

export async function startPg(config: ServiceConfig, log: (line: string) => void): Promise<string> {
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
  mkdirSync(path.dirname(cfg.dataDir), { recursive: true });
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
    const pwfile = path.join(path.dirname(cfg.dataDir), `.pg-pwfile-${process.pid}`);
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
        path.dirname(cfg.dataDir),
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

  const result = await pgTool(bin, "pg_ctl", ["start", "-D", cfg.dataDir, "-l", cfg.logFile, "-w", "-t", "60", "-s"], path.dirname(cfg.dataDir));
  if (result.code !== 0 || !(await waitUntil(() => pgAccepts(config), 30_000, 100))) {
    throw new ServiceError(
      `PostgreSQL did not start (pg_ctl exit ${result.code}). ${result.output.trim()}\n` +
        `Last lines of ${cfg.logFile}:\n${tail(cfg.logFile)}`,
    );
  }
  await ensureDatabase(cfg.database);
  return status;
}

export async function stopPg(config: ServiceConfig): Promise<string> {
  const running = postmasterInfo(config);
  if (!running) return "not running";
  const bin = await findPgBin();
  if (!bin) throw new ServiceError("Postgres is running but pg_ctl was not found to stop it");
  const result = await pgTool(bin, "pg_ctl", ["stop", "-D", config.pg.dataDir, "-m", "fast", "-w", "-t", "60", "-s"], path.dirname(config.pg.dataDir));
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
