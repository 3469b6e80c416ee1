// Background jobs on pg-boss: the queue lives in Postgres (schema "pgboss"), so every app server
// shares it; any server with RUN_WORKERS=true takes jobs.
import PgBoss from "pg-boss";
import type { Transaction } from "sequelize";
import { env } from "./env.server.ts";
import { logger } from "./logger.server.ts";

// In development the queue survives Vite's module reloads (globalThis), so a code change does not
// start a second pg-boss; elsewhere this module is evaluated once and a module variable suffices.
const globalForBoss: { __eonscaleBoss?: Promise<PgBoss> } =
  process.env.NODE_ENV === "development" ? (globalThis as never) : {};

export function getBoss(): Promise<PgBoss> {
  globalForBoss.__eonscaleBoss ??= (async () => {
    const boss = new PgBoss({ connectionString: env().DATABASE_URL, schema: "pgboss", max: 4, application_name: "eonscale-jobs" });
    boss.on("error", (error) => logger.error({ err: error }, "job queue error"));
    await boss.start();
    return boss;
  })();
  return globalForBoss.__eonscaleBoss;
}

export async function stopBoss() {
  const pending = globalForBoss.__eonscaleBoss;
  globalForBoss.__eonscaleBoss = undefined;
  if (pending) await (await pending).stop({ graceful: true, timeout: 5000, wait: true });
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
