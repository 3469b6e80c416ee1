// Liveness and readiness for a load balancer, and the "draining" state of a stopping server.
//   GET /healthz  liveness: the process answers and its database answers (200 / 503)
//   GET /readyz   readiness: Postgres, S3 and the job queue each answer within a few seconds, and
//                 the server is not shutting down (200 / 503, with each check's result)
// While a server drains (SIGTERM), /readyz answers 503 so the balancer stops sending new requests,
// and every response says `Connection: close` so kept-alive connections end after their request.
import { HeadBucketCommand } from "@aws-sdk/client-s3";
import type { NextFunction, Request, Response } from "express";
import type { Sequelize } from "sequelize";
import { sequelize } from "./db.server.ts";
import { env } from "./env.server.ts";
import { queueState } from "./queue.server.ts";
import { storage } from "./storage/s3.server.ts";

export interface CheckResult {
  ok: boolean;
  ms: number;
  error?: string;
  detail?: string;
}

const CHECK_TIMEOUT_MS = 3_000;

let draining = false;

/** Marks this server as stopping: /readyz answers 503 from now on. */
export function startDraining() {
  draining = true;
}

export function isDraining() {
  return draining;
}

async function timed(run: () => Promise<string | void>): Promise<CheckResult> {
  const started = performance.now();
  let timer: NodeJS.Timeout | undefined;
  try {
    const detail = await Promise.race([
      run(),
      new Promise<never>((_, reject) => {
        timer = setTimeout(() => reject(new Error(`no answer within ${CHECK_TIMEOUT_MS / 1000} s`)), CHECK_TIMEOUT_MS);
      }),
    ]);
    return { ok: true, ms: Math.round(performance.now() - started), ...(detail ? { detail } : {}) };
  } catch (error) {
    return { ok: false, ms: Math.round(performance.now() - started), error: error instanceof Error ? error.message || error.name : String(error) };
  } finally {
    clearTimeout(timer);
  }
}

/**
 * Liveness: the database answers. No time limit (unlike readiness): a server that is merely busy
 * (every pooled connection in use) must not be reported dead and restarted.
 */
export async function healthCheck(db: Sequelize = sequelize): Promise<boolean> {
  try {
    await db.query("SELECT 1");
    return true;
  } catch {
    return false;
  }
}

export function checkDatabase(db: Sequelize = sequelize) {
  return timed(async () => void (await db.query("SELECT 1")));
}

/** The bucket exists and answers (HEAD bucket). Outside production S3 may be left unconfigured. */
export function checkStorage() {
  return timed(async () => {
    if (!env().S3_BUCKET && env().NODE_ENV !== "production") return "not configured";
    const s = storage();
    try {
      await s.client.send(new HeadBucketCommand({ Bucket: s.bucket }));
    } catch (error) {
      const status = (error as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode;
      throw new Error(status ? `S3 answered ${status} for bucket ${s.bucket}` : `S3 unreachable (${(error as Error).name})`, { cause: error });
    }
  });
}

/** The queue's tables answer; with RUN_WORKERS=true this server's workers are also running. */
export function checkQueue(db: Sequelize = sequelize) {
  return timed(async () => {
    await db.query("SELECT version FROM pgboss.version");
    if (env().RUN_WORKERS !== "true") return "workers off on this server";
    const state = queueState();
    if (state !== "started") throw new Error(`workers ${state}`);
  });
}

export async function readiness() {
  const [database, storageCheck, queue] = await Promise.all([checkDatabase(), checkStorage(), checkQueue()]);
  const checks = { database, storage: storageCheck, queue };
  const ok = !draining && Object.values(checks).every((c) => c.ok);
  return { ok, ...(draining ? { draining: true } : {}), checks };
}

/** Express handlers for /healthz and /readyz, and the Connection: close of a draining server. */
export function healthRoutes() {
  return {
    drain(_req: Request, res: Response, next: NextFunction) {
      if (draining) res.set("Connection", "close");
      next();
    },
    async healthz(_req: Request, res: Response) {
      const ok = await healthCheck();
      res.status(ok ? 200 : 503).set("Cache-Control", "no-store").json(ok ? { ok: true } : { ok: false, error: "database unreachable" });
    },
    async readyz(_req: Request, res: Response) {
      const body = await readiness();
      res.status(body.ok ? 200 : 503).set("Cache-Control", "no-store").json(body);
    },
  };
}
