// E-mail through the transactional outbox: a message is written to outbox_messages in the same
// transaction as the change that causes it, together with a pg-boss job; the worker delivers it
// with nodemailer, retrying with backoff while SMTP is unreachable.
import nodemailer, { type Transporter } from "nodemailer";
import type PgBoss from "pg-boss";
import type { Transaction } from "sequelize";
import { OutboxMessage } from "../db/models/index.ts";
import { env } from "./env.server.ts";
import { logger } from "./logger.server.ts";
import { getBoss, inTransaction } from "./queue.server.ts";

export const MAIL_QUEUE = "mail-deliver";

export interface Email {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
}

let transporter: Transporter | undefined;
function transport(): Transporter {
  transporter ??= nodemailer.createTransport(env().SMTP_URL, { from: env().MAIL_FROM });
  return transporter;
}

export async function ensureMailQueue(boss: PgBoss) {
  await boss.createQueue(MAIL_QUEUE, {
    name: MAIL_QUEUE,
    retryLimit: env().MAIL_RETRY_LIMIT,
    retryDelay: env().MAIL_RETRY_DELAY_SECONDS,
    retryBackoff: true,
  });
}

/** Queue an e-mail inside the caller's transaction. Nothing is sent unless the transaction commits. */
export async function queueEmail(email: Email, transaction: Transaction): Promise<OutboxMessage> {
  const message = await OutboxMessage.create(
    { to: email.to, subject: email.subject, text: email.text, html: email.html ?? null, lastError: null, sentAt: null },
    { transaction },
  );
  const boss = await getBoss();
  await ensureMailQueue(boss);
  await boss.send(
    MAIL_QUEUE,
    { outboxId: message.id },
    {
      db: inTransaction(transaction),
      retryLimit: env().MAIL_RETRY_LIMIT,
      retryDelay: env().MAIL_RETRY_DELAY_SECONDS,
      retryBackoff: true,
    },
  );
  return message;
}

/** Deliver one outbox message. Throws when SMTP fails so the queue retries it. */
export async function deliverOutboxMessage(id: number, opts: { finalAttempt?: boolean } = {}) {
  const message = await OutboxMessage.findByPk(id);
  if (!message || message.status === "sent") return;
  try {
    await transport().sendMail({ from: env().MAIL_FROM, to: message.to, subject: message.subject, text: message.text, html: message.html ?? undefined });
    await message.update({ status: "sent", sentAt: new Date(), attempts: message.attempts + 1, lastError: null });
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    await message.update({ attempts: message.attempts + 1, lastError: reason, status: opts.finalAttempt ? "failed" : "pending" });
    logger.warn({ outboxId: id, attempts: message.attempts, err: reason }, "e-mail delivery failed; the queue will retry");
    throw error;
  }
}

export async function startMailWorker(boss: PgBoss, opts: { pollingIntervalSeconds?: number } = {}) {
  await ensureMailQueue(boss);
  return boss.work<{ outboxId: number }>(
    MAIL_QUEUE,
    { includeMetadata: true, batchSize: 5, pollingIntervalSeconds: opts.pollingIntervalSeconds ?? 2 },
    async (jobs) => {
      for (const job of jobs) {
        await deliverOutboxMessage(job.data.outboxId, { finalAttempt: job.retryCount >= job.retryLimit });
      }
    },
  );
}
