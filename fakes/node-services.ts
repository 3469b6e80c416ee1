// The Node stand-ins, each a detached background process with a pid file and a log under the
// data folder: s3 (s3rver, fakes/s3.ts) and smtp (SMTP server + HTTP inbox API, fakes/smtp.ts).
import { spawn } from "node:child_process";
import { closeSync, mkdirSync, openSync, rmSync, writeFileSync } from "node:fs";
import { createRequire } from "node:module";
import { pathToFileURL } from "node:url";
import { REPO_ROOT, type ServiceConfig } from "./config.ts";
import { ServiceError, pidAlive, pidRunsScript, probePort, readPid, tail, waitUntil } from "./util.ts";

export interface NodeService {
  name: "s3" | "smtp";
  script: string; // relative to the repository root
  pidFile: string;
  logFile: string;
  ports: number[];
  portEnv: string[];
}

export function nodeServices(config: ServiceConfig): Record<"s3" | "smtp", NodeService> {
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

export function runningPid(service: NodeService): number | null {
  const pid = readPid(service.pidFile);
  return pid !== null && pidAlive(pid) && pidRunsScript(pid, service.script) ? pid : null;
}

export async function allOpen(ports: number[]): Promise<boolean> {
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

export async function startNodeService(config: ServiceConfig, service: NodeService): Promise<string> {
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

export async function stopNodeService(service: NodeService): Promise<string> {
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

export async function ensureBucket(config: ServiceConfig): Promise<string> {
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
