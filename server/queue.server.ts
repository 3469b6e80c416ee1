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

export function getBoss(): Promise<PgBoss> {
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
