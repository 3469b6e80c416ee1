// Faults under a running app (issue 16 §7): S3, SMTP and Postgres go away and come back while one
// production app server (RUN_WORKERS=true) keeps running — clear errors meanwhile, nothing lost,
// recovery without a restart. The shared stand-ins are never stopped: the app reaches Postgres and
// S3 through TCP relays this file cuts and restores (to the app, a cut relay is the service going
// away: open connections reset, new ones refused), and it sends mail to an SMTP stand-in of this
// file's own, which is really stopped and started again. Prints "faults survived: N of 3".
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import sharp from "sharp";
import type { Sequelize } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createSequelize } from "../../db/sequelize.ts";
import { listMessages } from "../../fakes/inbox.ts";
import { databaseUrl, dropDatabase, serviceConfig } from "../../fakes/services.ts";
import { startSmtpStandIn } from "../../fakes/smtp.ts";
import { copyTemplateDatabase, startAppProcess, startCuttableRelay, until, type AppProcess } from "../helpers/app-process.ts";
import { freePort } from "../helpers/net.ts";
import { applyTestEnv, TEMPLATE_DATABASE, TEST_DATABASE } from "../setup/test-env.ts";

const DATABASE = `${TEST_DATABASE}_faults`;
const PASSWORD = "deep-time-demo"; // the demo accounts' password (db/seeders/demo)
const mailDir = mkdtempSync(path.join(tmpdir(), "eonscale-faults-mail-"));

let db: Sequelize;
let app: AppProcess;
let pg: Awaited<ReturnType<typeof startCuttableRelay>>;
let s3: Awaited<ReturnType<typeof startCuttableRelay>>;
let smtp: { close(): Promise<void> } | undefined;
let smtpOptions: Parameters<typeof startSmtpStandIn>[0];
const survived: string[] = [];


async function rows<T>(sql: string, bind: unknown[] = []): Promise<T[]> {
  const [out] = await db.query(sql, { bind });
  return out as T[];
}

function post(url: string, init: { form?: Record<string, string>; body?: FormData; cookie?: string }) {
  const headers = new Headers({ Origin: app.url });
  if (init.cookie) headers.set("Cookie", init.cookie);
  let body: BodyInit | undefined = init.body;
  if (init.form) {
    headers.set("Content-Type", "application/x-www-form-urlencoded");
    body = new URLSearchParams(init.form).toString();
  }
  return fetch(`${app.url}${url}`, { method: "POST", headers, body, redirect: "manual" });
}

async function signIn(email: string) {
  const res = await post("/login", { form: { email, password: PASSWORD, redirectTo: "/studio" } });
  const cookie = res.headers.getSetCookie().map((c) => c.split(";")[0]).find((c) => c.startsWith("en_session="));
  expect([res.status, Boolean(cookie)]).toEqual([302, true]);
  return cookie!;
}

async function ready() {
  const res = await fetch(`${app.url}/readyz`);
  return { status: res.status, body: (await res.json()) as { ok: boolean; checks: Record<string, { ok: boolean; error?: string }> } };
}

describe("faults under a running app", () => {
  beforeAll(async () => {
    applyTestEnv();
    await copyTemplateDatabase(DATABASE, TEMPLATE_DATABASE);
    db = createSequelize(databaseUrl(DATABASE));
    const shared = serviceConfig();
    pg = await startCuttableRelay(shared.pg.port);
    s3 = await startCuttableRelay(shared.s3.port);
    const [port, inboxPort] = [await freePort(), await freePort()];
    smtpOptions = { host: "127.0.0.1", port, inboxPort, url: `smtp://127.0.0.1:${port}`, inboxUrl: `http://127.0.0.1:${inboxPort}`, mailDir };
    smtp = await startSmtpStandIn(smtpOptions);
    process.env.INBOX_URL = smtpOptions.inboxUrl;
    const appPort = await freePort();
    app = await startAppProcess("faults", appPort, {
      DATABASE_URL: databaseUrl(DATABASE).replace(`:${shared.pg.port}/`, `:${pg.port}/`),
      S3_ENDPOINT: `http://127.0.0.1:${s3.port}`,
      SMTP_URL: smtpOptions.url,
      APP_URL: `http://127.0.0.1:${appPort}`,
      RUN_WORKERS: "true",
      MAIL_RETRY_DELAY_SECONDS: "1",
      LOG_LEVEL: "fatal",
    });
  }, 240_000);

  afterAll(async () => {
    console.log(`faults survived: ${survived.length} of 3 (${survived.join(", ") || "none"})`);
    await app?.stop();
    await smtp?.close();
    await pg?.restore().catch(() => {});
    await s3?.restore().catch(() => {});
    await db?.close();
    rmSync(mailDir, { recursive: true, force: true });
    await dropDatabase(DATABASE).catch(() => {});
  }, 60_000);

  it("SMTP stopped: the reset answer is unchanged, mail waits in the outbox and is delivered once SMTP is back", async () => {
    await smtp!.close();
    smtp = undefined;
    const to = "reviewer@marrowby.example";
    const res = await post("/forgot-password", { form: { email: to } });
    expect(res.status).toBe(200);
    const pending = await until("a failed delivery attempt", async () => {
      const [row] = await rows<{ status: string; attempts: number; last_error: string | null }>(`SELECT status, attempts, last_error FROM outbox_messages WHERE "to" = $1`, [to]);
      return row && row.attempts >= 1 ? row : null;
    }, 60_000);
    expect(pending.status).toBe("pending");
    expect(pending.last_error).toMatch(/ECONNREFUSED|connect/i);
    smtp = await startSmtpStandIn(smtpOptions);
    await until("the e-mail delivered", async () => (await listMessages({ to })).length >= 1, 90_000);
    await new Promise((r) => setTimeout(r, 2500));
    expect((await listMessages({ to })).length).toBe(1);
    survived.push("SMTP");
  }, 180_000);

  it("S3 stopped: readiness names it, an upload is refused with 503 and nothing kept, an image in processing finishes once S3 is back", async () => {
    const cookie = await signIn("designer@marrowby.example");
    const png = await sharp({ create: { width: 1200, height: 800, channels: 3, background: { r: 70, g: 110, b: 90 } } }).png().toBuffer();
    const upload = () => {
      const form = new FormData();
      form.set("file", new Blob([new Uint8Array(png)], { type: "image/png" }), "outcrop.png");
      return post("/api/assets", { body: form, cookie });
    };
    const [{ n: before }] = await rows<{ n: number }>(`SELECT count(*)::int AS n FROM assets`);
    await s3.cut();
    try {
      const r = await ready();
      expect(r.status).toBe(503);
      expect(r.body.checks.storage.ok).toBe(false);
      expect(r.body.checks.database.ok).toBe(true);
      const refused = await upload();
      expect(refused.status).toBe(503);
      expect(JSON.stringify(await refused.json())).toMatch(/image store is not reachable/i);
      const [{ n: during }] = await rows<{ n: number }>(`SELECT count(*)::int AS n FROM assets`);
      expect(during).toBe(before);
    } finally {
      await s3.restore();
    }
    expect((await ready()).status).toBe(200);
    // S3 goes away again while the image is being processed: the job is retried and finishes.
    const accepted = await upload();
    expect(accepted.status).toBe(201);
    const { id } = (await accepted.json()) as { id: number };
    await s3.cut();
    await new Promise((r) => setTimeout(r, 3000));
    await s3.restore();
    const done = await until("the image processed", async () => {
      const [row] = await rows<{ status: string; files: unknown[] }>(`SELECT status, files FROM assets WHERE id = $1`, [id]);
      return row && row.status !== "processing" ? row : null;
    }, 120_000);
    expect(done.status).toBe("ready");
    survived.push("S3");
  }, 240_000);

  it("Postgres stopped: health 503 and clear errors, no crash; after it is back, sign-in, pages and the job queue work without a restart", async () => {
    await pg.cut();
    try {
      // a failure here says whether the server went away (its exit code and last log lines) or only the connection did
      const health = await fetch(`${app.url}/healthz`).catch((error: Error) => {
        throw new Error(`GET /healthz failed (${error.message}; ${String((error.cause as Error | undefined)?.message)}); server exit code ${app.child.exitCode}, signal ${app.child.signalCode}; its last output:\n${app.output().slice(-4000)}`);
      });
      expect(health.status).toBe(503);
      const r = await ready();
      expect([r.status, r.body.checks.database.ok]).toEqual([503, false]);
      const page = await fetch(`${app.url}/editions`);
      expect(page.status).toBeGreaterThanOrEqual(500);
      const api = await fetch(`${app.url}/api/timescales`);
      expect(api.status).toBeGreaterThanOrEqual(500);
      expect(app.child.exitCode).toBeNull(); // still running
    } finally {
      await pg.restore();
    }
    await until("health back", async () => (await fetch(`${app.url}/healthz`)).ok, 60_000);
    await until("ready again", async () => (await ready()).status === 200, 60_000);
    expect((await fetch(`${app.url}/editions`)).status).toBe(200);
    await signIn("editor@marrowby.example");
    const to = "curator@marrowby.example";
    expect((await post("/forgot-password", { form: { email: to } })).status).toBe(200);
    await until("mail through the queue after the restart", async () => (await listMessages({ to })).length >= 1, 90_000);
    expect(app.child.exitCode).toBeNull();
    survived.push("Postgres");
  }, 240_000);
});
