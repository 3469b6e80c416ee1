// Background jobs on pg-boss: the queue lives in Postgres (schema "pgboss"), so every app server
// shares it; any server with RUN_WORKERS=true takes jobs.
import PgBoss from "pg-boss";
import type { Transaction } from "sequelize";
import { sequelize } from "./db.server.ts";
import { env } from "./env.server.ts";
import { logger } from "./logger.server.ts";

// In development the queue survives Vite's module reloads (globalThis), so a code change does not
// start a second pg-boss; elsewhere this module is evaluated once and a module variable suffices.
const globalForBoss: { __eonscaleBoss?: Promise<PgBoss>; __eonscaleBossState?: QueueState } =
  process.env.NODE_ENV === "development" ? (globalThis as never) : {};

/** "idle" until the queue is first used, "started", then "stopping"/"stopped" on shutdown. */
export type QueueState = "idle" | "starting" | "started" | "stopping" | "stopped";

export function queueState(): QueueState {
  return globalForBoss.__eonscaleBossState ?? "idle";
}

/** Jobs still active when a stopping server gives up waiting go back to the queue (see stopBoss). */
const STOP_WAIT_MS = 5_000;

/**
 * pg-boss 10.4.2's worker marks a job done or failed without waiting for it (manager.js, onFetch:
 * `this.complete(…)`, `this.fail(…)` unawaited), so when Postgres is unreachable at that moment the
 * rejection is unhandled and Node would end the server — seen in the faults test, where the server
 * must live through a Postgres outage. A lost database connection is logged instead (the job stays
 * active and is retried when it expires, as for a stopped server); any other unhandled rejection
 * still ends the process, as Node's default does.
 */
export function onUnhandledRejection(reason: unknown): void {
  if (isConnectionLoss(reason)) {
    logger.error({ err: reason }, "job queue: the database was unreachable while a job was being marked done or failed");
    return;
  }
  throw reason;
}

/** Postgres connection codes (class 08, and 57P01–57P03: the server shut down or is starting) and socket errors. */
function isConnectionLoss(reason: unknown): boolean {
  const e = reason as { code?: unknown; message?: unknown } | null;
  if (!e || typeof e !== "object") return false;
  const code = typeof e.code === "string" ? e.code : "";
  if (/^08/.test(code) || /^57P0[123]$/.test(code) || ["ECONNREFUSED", "ECONNRESET", "EPIPE", "ETIMEDOUT"].includes(code)) return true;
  return typeof e.message === "string" && /^Connection terminated/.test(e.message);
}

let guarded = false;

export function getBoss(): Promise<PgBoss> {
  if (!guarded) {
    guarded = true;
    process.on("unhandledRejection", onUnhandledRejection);
  }
  globalForBoss.__eonscaleBoss ??= (async () => {
    globalForBoss.__eonscaleBossState = "starting";
    const boss = new PgBoss({ connectionString: env().DATABASE_URL, schema: "pgboss", max: 4, application_name: "eonscale-jobs" });
    boss.on("error", (error) => logger.error({ err: error }, "job queue error"));
    await boss.start();
    globalForBoss.__eonscaleBossState = "started";
    return boss;
  })();
  return globalForBoss.__eonscaleBoss;
}

/**
 * Stops taking new jobs at once; the requests still running may queue jobs meanwhile (the queue
 * stays open for sending). Used at the start of a graceful shutdown.
 */
export async function pauseWorkers(queues: readonly string[]) {
  const pending = globalForBoss.__eonscaleBoss;
  if (!pending) return;
  const boss = await pending;
  globalForBoss.__eonscaleBossState = "stopping";
  await Promise.all(queues.map((q) => boss.offWork(q)));
}

/**
 * Graceful stop: waits up to 5 s for the jobs this server is running, then hands any still running
 * back to the queue (pg-boss fails them as "shut down while active", so they are retried — by
 * another server if this one does not come back). Every job is idempotent, so a job this server
 * was about to finish and another server runs again has one visible effect.
 */
export async function stopBoss() {
  const pending = globalForBoss.__eonscaleBoss;
  globalForBoss.__eonscaleBoss = undefined;
  if (!pending) return;
  globalForBoss.__eonscaleBossState = "stopping";
  await (await pending).stop({ graceful: true, timeout: STOP_WAIT_MS, wait: true });
  globalForBoss.__eonscaleBossState = "stopped";
}

/** Postgres's error code for a transaction it aborted to break a deadlock. */
const DEADLOCK = "40P01";
const CREATE_ATTEMPTS = 5;

/**
 * Create a queue if it does not exist, whatever other servers start at the same moment. pg-boss's
 * create_queue makes the queue's partition and attaches it to the job table: two servers creating
 * queues at once lock the same tables in opposite orders, and Postgres aborts one with "deadlock
 * detected" (it stopped a server when two started together on a fresh database;
 * tests/integration/queue-create.test.ts makes it happen). So every server creates queues one at
 * a time under one advisory lock, held by a transaction of our own while pg-boss creates the queue;
 * a creation Postgres still aborts for a deadlock (with other work on the job table) changed
 * nothing and is tried again after a short random pause, as Postgres advises. Creating an existing
 * queue does nothing; each server creates a queue once (`ensured`).
 */
export function ensureQueue(boss: PgBoss, name: string, options: PgBoss.Queue): Promise<void> {
  let created = ensured.get(boss);
  if (created === undefined) ensured.set(boss, (created = new Map()));
  let done = created.get(name);
  if (done === undefined) {
    created.set(name, (done = createQueue(boss, name, options)));
    // a creation that failed is tried again by the next caller
    done.catch(() => created.delete(name));
  }
  return done;
}

/**
 * The queues each pg-boss instance (one per server) has created, or is creating: a queue is
 * created once per server, not on every job sent (sending an e-mail inside a request's transaction
 * must not wait for a second connection and the lock).
 */
const ensured = new WeakMap<PgBoss, Map<string, Promise<void>>>();

async function createQueue(boss: PgBoss, name: string, options: PgBoss.Queue): Promise<void> {
  for (let attempt = 1; ; attempt++) {
    try {
      await sequelize.transaction(async (transaction) => {
        await sequelize.query(`SELECT pg_advisory_xact_lock(hashtext('eonscale:pgboss:create-queue'))`, { transaction });
        await boss.createQueue(name, options);
      });
      return;
    } catch (error) {
      if (!isDeadlock(error) || attempt >= CREATE_ATTEMPTS) throw error;
      logger.warn({ queue: name, attempt }, "queue creation met a deadlock; trying again");
      await new Promise((resolve) => setTimeout(resolve, 50 + Math.random() * 200 * attempt));
    }
  }
}

/** A Postgres deadlock abort, as pg reports it (error.code) or as Sequelize wraps it (error.parent.code). */
function isDeadlock(error: unknown): boolean {
  const e = error as { code?: string; parent?: { code?: string } };
  return e.code === DEADLOCK || e.parent?.code === DEADLOCK;
}

/** Lets pg-boss write its job row inside a Sequelize transaction, so the job exists only if the change commits. */
export function inTransaction(transaction: Transaction): PgBoss.Db {
  // Sequelize keeps the transaction's pg client on `connection`; pg-boss's SQL goes to it as is.
  const client = (transaction as unknown as { connection: { query(text: string, values: unknown[]): Promise<{ rows: unknown[] }> } }).connection;
  return {
    async executeSql(text, values) {
      const result = await client.query(text, values);
      return { rows: result.rows };
    },
  };
}
