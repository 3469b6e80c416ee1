// The e-mail outbox: mail is queued in the same transaction as its cause, delivered by the pg-boss
// worker, and survives an SMTP outage (retried with backoff until the server is back). This file
// has its own SMTP stand-in on its own ports and mail folder: stopping it for the outage leaves
// the shared stand-in and the developer's inbox alone.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { OutboxMessage } from "../../db/models/index.ts";
import { sequelize } from "../../server/db.server.ts";
import { waitForMessage } from "../../fakes/inbox.ts";
import { startSmtpStandIn } from "../../fakes/smtp.ts";
import { resetEnvForTests } from "../../server/env.server.ts";
import { MAIL_QUEUE, queueEmail, startMailWorker } from "../../server/mail.server.ts";
import { getBoss } from "../../server/queue.server.ts";
import { unique } from "../helpers/db.ts";
import { freePort } from "../helpers/net.ts";

async function jobsFor(outboxId: number) {
  const [rows] = await sequelize.query(`SELECT state, retry_count FROM pgboss.job WHERE name = $1 AND (data->>'outboxId')::bigint = $2`, { bind: [MAIL_QUEUE, outboxId] });
  return rows as { state: string; retry_count: number }[];
}

async function until<T>(what: string, fn: () => Promise<T | null | undefined | false>, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await fn();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}


const mailDir = mkdtempSync(path.join(tmpdir(), "eonscale-outbox-test-"));
let smtp: Awaited<ReturnType<typeof startSmtpStandIn>> | undefined;
let own: Parameters<typeof startSmtpStandIn>[0];

describe("outbox delivery", () => {
  beforeAll(async () => {
    const [port, inboxPort] = [await freePort(), await freePort()];
    own = { host: "127.0.0.1", port, inboxPort, url: `smtp://127.0.0.1:${port}`, inboxUrl: `http://127.0.0.1:${inboxPort}`, mailDir };
    smtp = await startSmtpStandIn(own);
    process.env.SMTP_URL = own.url;
    process.env.INBOX_URL = own.inboxUrl;
    resetEnvForTests(); // the mailer reads SMTP_URL when it first sends
  });

  afterAll(async () => {
    await smtp?.close();
    rmSync(mailDir, { recursive: true, force: true });
  });

  it("a rolled-back change leaves neither a message nor a job", async () => {
    const to = `${unique("rollback")}@example.org`;
    await expect(
      sequelize.transaction(async (transaction) => {
        await queueEmail({ to, subject: "never", text: "never" }, transaction);
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    expect(await OutboxMessage.count({ where: { to } })).toBe(0);
    const [rows] = await sequelize.query(`SELECT count(*)::int AS n FROM pgboss.job WHERE name = $1 AND data->>'subject' = 'never'`, { bind: [MAIL_QUEUE] });
    expect((rows as { n: number }[])[0].n).toBe(0);
  });

  it("keeps the message while SMTP is down and delivers it once SMTP is back", async () => {
    await smtp!.close();
    smtp = undefined;
    const to = `${unique("outage")}@example.org`;
    const message = await sequelize.transaction((transaction) => queueEmail({ to, subject: "Delivered after an outage", text: "Hello from the outbox" }, transaction));
    expect(await jobsFor(message.id)).toHaveLength(1);

    const boss = await getBoss();
    await startMailWorker(boss, { pollingIntervalSeconds: 0.5 });

    const failed = await until("a failed attempt", async () => {
      await message.reload();
      return message.attempts >= 1 ? message : null;
    });
    expect(failed.status).toBe("pending");
    expect(failed.lastError).toBeTruthy();
    expect(failed.sentAt).toBeNull();

    smtp = await startSmtpStandIn(own);
    const received = await waitForMessage({ to, subjectIncludes: "outage", timeoutMs: 45_000 });
    expect(received.text).toContain("Hello from the outbox");

    await until("the outbox row marked sent", async () => {
      await message.reload();
      return message.status === "sent" ? message : null;
    });
    expect(message.sentAt).toBeInstanceOf(Date);
    expect(message.attempts).toBeGreaterThanOrEqual(2);
    const jobs = await until("the job completed", async () => {
      const rows = await jobsFor(message.id);
      return rows.some((r) => r.state === "completed") ? rows : null;
    });
    expect(jobs[0].retry_count).toBeGreaterThanOrEqual(1);
  }, 90_000);
});
