// Background jobs on pg-boss: the queue lives in Postgres (schema "pgboss"), so every app server
// shares it; any server with RUN_WORKERS=true takes jobs.
import PgBoss from "pg-boss";
import type { Transaction } from "sequelize";
import { sequelize } from "../db/sequelize.ts";
import { env } from "./env.ts";
import { logger } from "./logger.ts";

const globalForBoss = globalThis as unknown as { __eonscaleBoss?: Promise<PgBoss> };

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
  return {
    async executeSql(text, values) {
      const [rows] = await sequelize.query(text, { bind: values, transaction });
      return { rows: rows as unknown[] };
    },
  };
}
