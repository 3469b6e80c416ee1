// Small helpers shared by the stand-in managers (fakes/postgres.ts, fakes/node-services.ts,
// fakes/services.ts): running commands, probing ports, pids, log tails, a cross-process lock.
import { spawn } from "node:child_process";
import { closeSync, existsSync, mkdirSync, openSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import net from "node:net";
import path from "node:path";

/** An error whose message is meant for the person at the terminal (no stack needed). */
export class ServiceError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "ServiceError";
  }
}

export const isRoot = () => typeof process.getuid === "function" && process.getuid() === 0;
export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));
export const RUNUSER = existsSync("/usr/sbin/runuser") ? "/usr/sbin/runuser" : "runuser";

export interface RunResult {
  code: number | null;
  output: string;
}

/** Runs a command, collecting stdout+stderr (or streaming it when `inherit`). */
export function run(command: string, args: string[], opts: { cwd?: string; inherit?: boolean; env?: NodeJS.ProcessEnv } = {}) {
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

export function probePort(port: number, host = "127.0.0.1", timeoutMs = 500): Promise<boolean> {
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

export async function waitUntil(check: () => Promise<boolean> | boolean, timeoutMs: number, intervalMs = 50) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    if (await check()) return true;
    if (Date.now() >= deadline) return false;
    await sleep(intervalMs);
  }
}

export function pidAlive(pid: number): boolean {
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
export function pidRunsScript(pid: number, script: string): boolean {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, "utf8").includes(script);
  } catch {
    return existsSync("/proc/self") ? false : true;
  }
}

export function readPid(file: string): number | null {
  try {
    const pid = Number.parseInt(readFileSync(file, "utf8").trim().split("\n")[0] ?? "", 10);
    return Number.isInteger(pid) && pid > 0 ? pid : null;
  } catch {
    return null;
  }
}

export function tail(file: string, lines = 25): string {
  try {
    return readFileSync(file, "utf8").trimEnd().split("\n").slice(-lines).join("\n");
  } catch {
    return "(no log yet)";
  }
}


/** Serialises start/stop across processes (e.g. two test runners starting at once). */
export async function withLock<T>(dataDir: string, fn: () => Promise<T>): Promise<T> {
  mkdirSync(dataDir, { recursive: true });
  const lockFile = path.join(dataDir, ".services.lock");
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
