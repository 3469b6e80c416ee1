// Housekeeping on the shared job queue: once an hour, delete expired sessions, sign-in rate-limit
// counters whose window has passed, and spent or expired reset links. pg-boss runs a scheduled job
// on one server only, however many app servers there are.
import type PgBoss from "pg-boss";
import { Op } from "sequelize";
import { PasswordReset, Session } from "../db/models/index.ts";
import { sweepAssets } from "./assets/jobs.server.ts";
import { sequelize } from "./db.server.ts";
import { logger } from "./logger.server.ts";
import { ensureQueue } from "./queue.server.ts";

export const SWEEP_QUEUE = "housekeeping-sweep";

export async function sweepExpired(now = new Date()) {
  const sessions = await Session.destroy({ where: { expiresAt: { [Op.lt]: now } } });
  const [, meta] = (await sequelize.query(`DELETE FROM rate_limits WHERE expire IS NOT NULL AND expire < $1`, { bind: [now.getTime()] })) as [unknown, { rowCount?: number }];
  const resets = await PasswordReset.destroy({ where: { [Op.or]: [{ usedAt: { [Op.ne]: null } }, { expiresAt: { [Op.lt]: now } }], createdAt: { [Op.lt]: new Date(now.getTime() - 86400_000) } } });
  return { sessions, rateLimits: meta?.rowCount ?? 0, resets };
}

export async function startSweeps(boss: PgBoss) {
  await ensureQueue(boss, SWEEP_QUEUE, { name: SWEEP_QUEUE, policy: "singleton", retryLimit: 2 });
  await boss.schedule(SWEEP_QUEUE, "17 * * * *", {}, { tz: "UTC" });
  await boss.work(SWEEP_QUEUE, async () => {
    const removed = await sweepExpired();
    logger.info({ removed }, "housekeeping sweep");
    // S3 objects of interrupted uploads (no row) and uploads never attached to anything.
    const images = await sweepAssets();
    logger.info({ images }, "image sweep");
  });
}
