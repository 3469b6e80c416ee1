// E-mail through the transactional outbox: a message is written to outbox_messages in the same
// transaction as the change that causes it, together with a pg-boss job; the worker delivers it
// with nodemailer, retrying with backoff while SMTP is unreachable.
import nodemailer, { type Transporter } from "nodemailer";
import type PgBoss from "pg-boss";
import type { Transaction } from "sequelize";
import { OutboxMessage } from "../db/models/index.ts";
import { sequelize } from "./db.server.ts";
import { env } from "./env.server.ts";
import { logger } from "./logger.server.ts";
import { ensureQueue, getBoss, inTransaction } from "./queue.server.ts";

export const MAIL_QUEUE = "mail-deliver";
const MAIL_JOB_EXPIRE_SECONDS = 300;

export interface Email {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
}

let transporter: Transporter | undefined;
function transport(): Transporter {
  // Short timeouts: a hung SMTP server fails the attempt (the queue retries) instead of holding the
  // message's row lock for minutes.
  transporter ??= nodemailer.createTransport({ url: env().SMTP_URL, connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 30_000 } as never, { from: env().MAIL_FROM });
  return transporter;
}

export async function ensureMailQueue(boss: PgBoss) {
  await ensureQueue(boss, MAIL_QUEUE, {
    name: MAIL_QUEUE,
    retryLimit: env().MAIL_RETRY_LIMIT,
    retryDelay: env().MAIL_RETRY_DELAY_SECONDS,
    retryBackoff: true,
    expireInSeconds: MAIL_JOB_EXPIRE_SECONDS,
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
      // A server killed mid-delivery: its job is given to another after this long (default 15 min).
      expireInSeconds: MAIL_JOB_EXPIRE_SECONDS,
    },
  );
  return message;
}

/** The Message-ID of an outbox message: the same on every attempt, so a receiver can drop a repeat. */
export function outboxMessageId(id: number) {
  return `<outbox-${id}@${new URL(env().APP_URL).hostname}>`;
}

/**
 * Deliver one outbox message. Throws when SMTP fails so the queue retries it. Idempotent: the row is
 * locked while it is sent, so a second delivery of the same job (a retry, a job handed back by a
 * stopping server) waits for the first and then finds it sent. Only a crash between the SMTP
 * server's acceptance and the commit can repeat a message, with the same Message-ID.
 */
export async function deliverOutboxMessage(id: number, opts: { finalAttempt?: boolean } = {}) {
  const failure = await sequelize.transaction(async (transaction) => {
    const message = await OutboxMessage.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
    if (!message || message.status === "sent") return null;
    try {
      await transport().sendMail({ from: env().MAIL_FROM, to: message.to, subject: message.subject, text: message.text, html: message.html ?? undefined, messageId: outboxMessageId(id) });
      await message.update({ status: "sent", sentAt: new Date(), attempts: message.attempts + 1, lastError: null }, { transaction });
      return null;
    } catch (error) {
      const reason = error instanceof Error ? error.message : String(error);
      await message.update({ attempts: message.attempts + 1, lastError: reason, status: opts.finalAttempt ? "failed" : "pending" }, { transaction });
      logger.warn({ outboxId: id, attempts: message.attempts, err: reason }, "e-mail delivery failed; the queue will retry");
      return error;
    }
  });
  if (failure) throw failure;
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
