// Two app servers, one database (issue 17). Two production server processes (the build of the
// browser tests' setup, started as `npm run serve` starts it, each with RUN_WORKERS=true) share one
// Postgres database, the S3 stand-in and an SMTP stand-in of this file's own, behind a small
// loopback balancer that sends each request to the server the test names (APP_URL is the
// balancer's URL, as behind a real one). What the README's scaling section promises is shown here:
// shared sessions and sign-in counters, e-mail delivered once (also when a server stops right after
// queueing, or in the middle of the job), idempotent jobs, no stale data on the other server, one
// housekeeping job at a time, readiness, and a graceful stop.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { request as httpRequest } from "node:http";
import path from "node:path";
import { CreateBucketCommand, ListObjectsV2Command, S3Client } from "@aws-sdk/client-s3";
import PgBoss from "pg-boss";
import sharp from "sharp";
import type { Sequelize } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createSequelize } from "../../db/sequelize.ts";
import { listMessages } from "../../fakes/inbox.ts";
import { databaseUrl, dropDatabase } from "../../fakes/services.ts";
import { startSmtpStandIn } from "../../fakes/smtp.ts";
import { copyTemplateDatabase, startAppProcess, startBalancer, startSilentServer, until, type AppProcess } from "../helpers/app-process.ts";
import { freePort } from "../helpers/net.ts";
import { applyTestEnv, TEMPLATE_DATABASE, TEST_DATABASE } from "../setup/test-env.ts";

const PASSWORD = "deep-time-demo"; // the demo accounts' password (db/seeders/demo)
const DATABASE = `${TEST_DATABASE}_scaleout`;
/** Its own bucket: the housekeeping sweep of this database must not see another database's objects. */
const BUCKET = `${TEST_DATABASE}-scaleout`.toLowerCase().replace(/[^a-z0-9-]/g, "-");
type Backend = "a" | "b";

let db: Sequelize;
let boss: PgBoss;
let smtp: { close(): Promise<void> } | undefined;
let s3: S3Client;
let balancer: { url: string; close(): Promise<void> };
const servers: Partial<Record<Backend, AppProcess>> = {};
const ports: Record<Backend, number> = { a: 0, b: 0 };
let serverEnv: Record<string, string>;
const mailDir = mkdtempSync(path.join(tmpdir(), "eonscale-scaleout-mail-"));

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function rows<T>(sql: string, bind: unknown[] = []): Promise<T[]> {
  const [out] = await db.query(sql, { bind });
  return out as T[];
}

const special = new Set<Backend>();
async function startServer(which: Backend, extra: Record<string, string> = {}) {
  servers[which] = await startAppProcess(which.toUpperCase(), ports[which], { ...serverEnv, ...extra });
  if (Object.keys(extra).length) special.add(which);
  else special.delete(which);
  return servers[which]!;
}

const running = (which: Backend) => servers[which] !== undefined && servers[which]!.child.exitCode === null && servers[which]!.child.signalCode === null;

/** After a test that stops or reconfigures servers: both run again with the shared settings. */
async function restoreServers() {
  for (const which of ["a", "b"] as const) {
    if (running(which) && !special.has(which)) continue;
    if (running(which)) await servers[which]!.stop();
    await startServer(which);
  }
}

/** One visitor's browser: a cookie jar, requests through the balancer to server A or B. */
class Visitor {
  cookies = new Map<string, string>();
  async send(backend: Backend, url: string, init: { method?: string; form?: Record<string, string>; body?: FormData; cookie?: string } = {}) {
    const headers = new Headers({ "x-backend": backend });
    const cookie = init.cookie ?? [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
    if (cookie) headers.set("Cookie", cookie);
    const method = init.method ?? (init.form || init.body ? "POST" : "GET");
    if (method !== "GET") headers.set("Origin", balancer.url);
    let body: BodyInit | undefined = init.body;
    if (init.form) {
      headers.set("Content-Type", "application/x-www-form-urlencoded");
      body = new URLSearchParams(init.form).toString();
    }
    const res = await fetch(`${balancer.url}${url}`, { method, headers, body, redirect: "manual" });
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const [name, ...value] = pair.split("=");
      if (/max-age=0|expires=thu, 01 jan 1970/i.test(line) || value.join("=") === "") this.cookies.delete(name);
      else this.cookies.set(name, value.join("="));
    }
    return res;
  }
  session() {
    return `en_session=${this.cookies.get("en_session")}`;
  }
}

async function signIn(backend: Backend, email: string) {
  const v = new Visitor();
  const res = await v.send(backend, "/login", { form: { email, password: PASSWORD, redirectTo: "/studio" } });
  expect([res.status, res.headers.get("location")]).toEqual([302, "/studio"]);
  expect(v.cookies.get("en_session")).toBeTruthy();
  return v;
}

async function messagesTo(to: string) {
  return (await listMessages({ to })).length;
}

/** Queues a password-reset e-mail through the given server (the outbox row and job are written there). */
async function requestReset(backend: Backend, email: string) {
  const res = await new Visitor().send(backend, "/forgot-password", { form: { email } });
  expect(res.status).toBe(200);
  // The answer comes at once; a job writes the outbox row (the same work for every address).
  const row = await until("the outbox row", async () => (await rows<{ id: number }>(`SELECT id FROM outbox_messages WHERE "to" = $1 ORDER BY id DESC LIMIT 1`, [email]))[0], 20_000);
  return row.id;
}

async function mailJobs(outboxId: number) {
  return rows<{ state: string; retry_count: number }>(`SELECT state, retry_count FROM pgboss.job WHERE name = 'mail-deliver' AND (data->>'outboxId')::bigint = $1`, [outboxId]);
}

describe("two app servers, one database", () => {
  beforeAll(async () => {
    applyTestEnv();
    await copyTemplateDatabase(DATABASE, TEMPLATE_DATABASE);
    const url = databaseUrl(DATABASE);
    db = createSequelize(url);
    const [smtpPort, inboxPort] = [await freePort(), await freePort()];
    smtp = await startSmtpStandIn({ host: "127.0.0.1", port: smtpPort, inboxPort, url: `smtp://127.0.0.1:${smtpPort}`, inboxUrl: `http://127.0.0.1:${inboxPort}`, mailDir });
    process.env.INBOX_URL = `http://127.0.0.1:${inboxPort}`;
    balancer = await startBalancer(() => ports);
    s3 = new S3Client({ endpoint: process.env.S3_ENDPOINT, region: "us-east-1", forcePathStyle: true, credentials: { accessKeyId: process.env.S3_ACCESS_KEY_ID!, secretAccessKey: process.env.S3_SECRET_ACCESS_KEY! } });
    await s3.send(new CreateBucketCommand({ Bucket: BUCKET })).catch((error: Error) => {
      if (!/BucketAlready/.test(error.name)) throw error;
    });
    [ports.a, ports.b] = [await freePort(), await freePort()];
    serverEnv = {
      DATABASE_URL: url,
      SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
      APP_URL: balancer.url,
      S3_BUCKET: BUCKET,
      RUN_WORKERS: "true",
      MAIL_RETRY_DELAY_SECONDS: "1",
      LOG_LEVEL: "warn",
    };
    await Promise.all([startServer("a"), startServer("b")]);
    boss = new PgBoss({ connectionString: url, schema: "pgboss", supervise: false, schedule: false, migrate: false, max: 2 });
    await boss.start();
  }, 240_000);

  afterAll(async () => {
    await Promise.all(Object.values(servers).map((s) => s?.stop()));
    await boss?.stop({ graceful: false, wait: true }).catch(() => {});
    await balancer?.close();
    await smtp?.close();
    s3?.destroy();
    await db?.close();
    rmSync(mailDir, { recursive: true, force: true });
    await dropDatabase(DATABASE).catch(() => {});
  }, 60_000);

  it("both servers are live and ready: Postgres, S3 and the job queue answer", async () => {
    for (const backend of ["a", "b"] as const) {
      const res = await new Visitor().send(backend, "/readyz");
      const body = await res.json();
      expect([backend, res.status, res.headers.get("cache-control")]).toEqual([backend, 200, "no-store"]);
      expect(body).toMatchObject({ ok: true, checks: { database: { ok: true }, storage: { ok: true }, queue: { ok: true } } });
      expect((await new Visitor().send(backend, "/healthz")).status).toBe(200);
    }
  });

  it("a session made on A works on B, and signing out on B ends it on A", async () => {
    const v = await signIn("a", "designer@marrowby.example");
    const onB = await v.send("b", "/studio");
    expect(onB.status).toBe(200);
    expect(await onB.text()).toContain("Sign out");
    const cookie = v.session();
    const out = await v.send("b", "/logout", { form: {} });
    expect(out.status).toBe(302);
    const onA = await new Visitor().send("a", "/studio", { cookie });
    expect([onA.status, onA.headers.get("location")]).toEqual([302, "/login?redirectTo=%2Fstudio"]);
  });

  it("sign-in counters are shared: failures split across A and B are refused as soon as failures on one server alone", async () => {
    // How many wrong passwords it takes to be refused (429), all on A, then alternating A and B.
    const refusedAfter = async (email: string, route: (i: number) => Backend) => {
      for (let i = 0; i < 12; i++) {
        const res = await new Visitor().send(route(i), "/login", { form: { email, password: "not the password", redirectTo: "/studio" } });
        if (res.status === 429) return i;
        expect(res.status).toBe(400);
      }
      return Infinity;
    };
    try {
      const alone = await refusedAfter("reviewer@marrowby.example", () => "a");
      const split = await refusedAfter("editor@marrowby.example", (i) => (i % 2 ? "b" : "a"));
      expect(alone).toBeLessThan(12);
      expect(split).toBe(alone); // not twice as many: both servers count in the same Postgres rows
    } finally {
      await db.query(`DELETE FROM rate_limits`);
    }
  });

  it("an e-mail queued on A is delivered once", async () => {
    const to = "reviewer@marrowby.example";
    const id = await requestReset("a", to);
    await until("the reset e-mail", async () => (await messagesTo(to)) >= 1);
    await sleep(3000); // both servers poll every 2 s: give a second delivery the chance to happen
    expect(await messagesTo(to)).toBe(1);
    const [row] = await rows<{ status: string; attempts: number }>(`SELECT status, attempts FROM outbox_messages WHERE id = $1`, [id]);
    expect(row).toEqual({ status: "sent", attempts: 1 });
  });

  it("an e-mail queued on A just before A stops is delivered once, by A while it drains or by B", async () => {
    const to = "editor@marrowby.example";
    await requestReset("a", to);
    const stopped = await servers.a!.stop();
    expect(stopped.code).toBe(0);
    await until("the e-mail", async () => (await messagesTo(to)) >= 1);
    await sleep(3000);
    expect(await messagesTo(to)).toBe(1);
    await restoreServers();
  }, 150_000);

  it("stopping A in the middle of a job hands the job to B, which delivers it once", async () => {
    // A alone, with an SMTP server that accepts and never answers: A's delivery hangs.
    const silent = await startSilentServer();
    try {
      await servers.b!.stop();
      await servers.a!.stop();
      await startServer("a", { SMTP_URL: `smtp://127.0.0.1:${silent.port}` });
      const to = "curator@marrowby.example";
      const id = await requestReset("a", to);
      await until("A working on the job", async () => (await mailJobs(id)).some((j) => j.state === "active"));
      await startServer("b");
      const stopped = await servers.a!.stop();
      expect(stopped.code).toBe(0);
      expect(stopped.ms).toBeLessThan(15_000);
      await until("B delivering the e-mail", async () => (await messagesTo(to)) >= 1, 45_000);
      await sleep(3000);
      expect(await messagesTo(to)).toBe(1);
      const jobs = await until("the job completed", async () => {
        const all = await mailJobs(id);
        return all.some((j) => j.state === "completed") ? all : null;
      });
      expect(jobs).toHaveLength(1);
      expect(jobs[0].retry_count).toBeGreaterThanOrEqual(1); // handed back by A, taken again by B
    } finally {
      await silent.close();
      await restoreServers();
    }
  }, 300_000);

  it("every job is idempotent: the same e-mail job run twice at once on two servers sends one message", async () => {
    const to = "nobody-twice@example.org";
    const [[{ id }]] = (await db.query(
      `INSERT INTO outbox_messages ("to", subject, text, status, attempts, created_at, updated_at) VALUES ($1, 'Twice', 'Sent once', 'pending', 0, now(), now()) RETURNING id`,
      { bind: [to] },
    )) as [{ id: number }[], unknown];
    await Promise.all([boss.send("mail-deliver", { outboxId: id }), boss.send("mail-deliver", { outboxId: id }), boss.send("mail-deliver", { outboxId: id })]);
    await until("three completed jobs", async () => (await mailJobs(id)).filter((j) => j.state === "completed").length === 3);
    expect(await messagesTo(to)).toBe(1);
  }, 60_000);

  it("every job is idempotent: an image processed twice at once keeps one set of sizes", async () => {
    const designer = await signIn("a", "designer@marrowby.example");
    const png = await sharp({ create: { width: 1700, height: 1100, channels: 3, background: { r: 120, g: 90, b: 60 } } }).png().toBuffer();
    const form = new FormData();
    form.set("file", new Blob([new Uint8Array(png)], { type: "image/png" }), "cliff.png");
    const up = await designer.send("a", "/api/assets", { body: form });
    expect(up.status).toBe(201);
    const { id } = (await up.json()) as { id: number };
    const ready = async () => {
      const res = await designer.send("b", `/api/assets/${id}`);
      const body = (await res.json()) as { status: string };
      return body.status === "ready" ? body : null;
    };
    await until("the image ready", ready, 60_000);
    const keys = async () => ((await s3.send(new ListObjectsV2Command({ Bucket: BUCKET, Prefix: `assets/${id}/` }))).Contents ?? []).map((o) => o.Key!).sort();
    const filesOf = async () => (await rows<{ files: { key: string }[]; avif_status: string }>(`SELECT files, avif_status FROM assets WHERE id = $1`, [id]))[0];
    await until("the AVIF versions", async () => (await filesOf()).avif_status === "ready", 60_000);
    const before = { keys: await keys(), files: (await filesOf()).files.map((f) => f.key).sort() };

    // Back to the state before processing ended (the AVIF versions not made yet), then both
    // servers run the processing job four times and the AVIF job twice, all at once.
    await db.query(
      `UPDATE assets SET status = 'processing', avif_status = 'pending', files = (SELECT jsonb_agg(f) FROM jsonb_array_elements(files) f WHERE f->>'format' <> 'avif') WHERE id = $1`,
      { bind: [id] },
    );
    await Promise.all([1, 2, 3, 4].map(() => boss.send("asset-process", { assetId: id })));
    await Promise.all([1, 2].map(() => boss.send("asset-avif", { assetId: id })));
    await until("the jobs done", async () => {
      const [{ open }] = await rows<{ open: number }>(`SELECT count(*)::int AS open FROM pgboss.job WHERE name IN ('asset-process', 'asset-avif') AND (data->>'assetId')::bigint = $1 AND state NOT IN ('completed', 'failed', 'cancelled')`, [id]);
      return open === 0 && (await filesOf()).avif_status === "ready";
    }, 90_000);
    const after = { keys: await keys(), files: (await filesOf()).files.map((f) => f.key).sort() };
    expect(after).toEqual(before);
    expect(new Set(after.files).size).toBe(after.files.length); // no size listed twice
  }, 180_000);

  it("a change made on A is seen on B at once: current edition, latest shared edition, permissions, publications", async () => {
    // The organisation's current edition (an editor on A, the page on B).
    const editor = await signIn("a", "editor@marrowby.example");
    const currentOn = async (b: Backend) => /<strong[^>]*>([^<]+)<\/strong>\s*is the current edition/.exec(await (await editor.send(b, "/studio/editions")).text())?.[1];
    expect(await currentOn("b")).toBe("ICS 2024/12");
    expect((await editor.send("a", "/studio/editions", { form: { intent: "set-current", slug: "ics-2023-09" } })).status).toBe(302);
    expect(await currentOn("b")).toBe("ICS 2023/09");

    // The latest shared edition (a chart steward on A, the public API on B).
    const [{ id: adminId }] = await rows<{ id: number }>(`SELECT id FROM users WHERE email = 'admin@marrowby.example'`);
    await db.query(`INSERT INTO chart_stewards (user_id) VALUES ($1) ON CONFLICT DO NOTHING`, { bind: [adminId] });
    const admin = await signIn("a", "admin@marrowby.example");
    const latestOn = async (b: Backend) => ((await (await new Visitor().send(b, "/api/timescales")).json()) as { latest: string }).latest;
    expect(await latestOn("b")).toBe("ics-2024-12");
    expect((await admin.send("a", "/studio/editions", { form: { intent: "make-latest", slug: "ics-2023-09" } })).status).toBe(302);
    expect(await latestOn("b")).toBe("ics-2023-09");

    // Permissions: the admin on A takes the designer role from the curator; on B the curator may
    // no longer create exhibits, the very next request.
    const curator = await signIn("b", "curator@marrowby.example");
    expect((await curator.send("b", "/studio/exhibits/new")).status).toBe(200);
    const [{ id: membershipId }] = await rows<{ id: number }>(`SELECT m.id FROM memberships m JOIN users u ON u.id = m.user_id WHERE u.email = 'curator@marrowby.example'`);
    const setRoles = await admin.send("a", "/studio/team", { form: { intent: "set-roles", membershipId: String(membershipId), roles: "reviewer" } });
    expect(setRoles.status).toBe(302);
    expect((await curator.send("b", "/studio/exhibits/new")).status).toBe(403);

    // Publications: approved and published on A, served by B's public API at once.
    expect((await new Visitor().send("b", "/api/exhibits/marrowby/school-rope")).status).toBe(404);
    const [{ revision }] = await rows<{ revision: number }>(`SELECT revision FROM exhibits WHERE slug = 'school-rope'`);
    const reviewer = await signIn("a", "reviewer@marrowby.example");
    expect((await reviewer.send("a", "/studio/exhibits/school-rope/review", { form: { intent: "approve", revision: String(revision) } })).status).toBe(302);
    const designer = await signIn("a", "designer@marrowby.example");
    const published = await designer.send("a", "/studio/exhibits/school-rope", { form: { intent: "publish", revision: String(revision) } });
    expect(published.status).toBe(302);
    const onB = await new Visitor().send("b", "/api/exhibits/marrowby/school-rope");
    expect(onB.status).toBe(200);
    expect(((await onB.json()) as { publication: { number: number } }).publication.number).toBe(1);
  }, 60_000);

  it("the housekeeping job runs on one server at a time", async () => {
    const [queue] = await rows<{ policy: string }>(`SELECT policy FROM pgboss.queue WHERE name = 'housekeeping-sweep'`);
    expect(queue.policy).toBe("singleton");
    const [{ n: scheduled }] = await rows<{ n: number }>(`SELECT count(*)::int AS n FROM pgboss.schedule WHERE name = 'housekeeping-sweep'`);
    expect(scheduled).toBe(1); // both servers scheduled it: one schedule
    const ids = (await Promise.all([1, 2, 3, 4, 5, 6].map(() => boss.send("housekeeping-sweep", {})))).filter(Boolean) as string[];
    const runs = await until("the sweeps done", async () => {
      const all = await rows<{ state: string; started_on: Date; completed_on: Date }>(`SELECT state, started_on, completed_on FROM pgboss.job WHERE id = ANY($1::uuid[])`, [ids]);
      return all.length === ids.length && all.every((r) => r.state === "completed") ? all : null;
    }, 60_000);
    const sorted = runs.map((r) => [r.started_on.getTime(), r.completed_on.getTime()]).sort((x, y) => x[0] - y[0]);
    for (let i = 1; i < sorted.length; i++) expect(sorted[i][0]).toBeGreaterThanOrEqual(sorted[i - 1][1]); // never two at once
  }, 90_000);

  it("a server told to stop finishes the request it is serving", async () => {
    // The body of a POST /api/scale arrives in two halves; B is told to stop in between.
    const body = JSON.stringify({
      span: { older: { value: 4567, unit: "Ma" }, younger: { value: 0, unit: "Ma" } },
      medium: { kind: "length", length: { value: 4567, unit: "m" } },
      points: [{ id: "kpg", age: { value: 66, unit: "Ma" } }],
    });
    const answer = new Promise<{ status: number; text: string }>((resolve, reject) => {
      const req = httpRequest(`${balancer.url}/api/scale`, { method: "POST", headers: { "x-backend": "b", "Content-Type": "application/json", "Content-Length": Buffer.byteLength(body), Origin: balancer.url } }, (res) => {
        let text = "";
        res.on("data", (c: Buffer) => (text += c.toString()));
        res.on("end", () => resolve({ status: res.statusCode ?? 0, text }));
      });
      req.on("error", reject);
      req.write(body.slice(0, 20));
      setTimeout(() => req.end(body.slice(20)), 1500);
    });
    await sleep(500);
    const stopping = servers.b!.stop();
    const res = await answer;
    expect(res.status).toBe(200);
    expect(JSON.parse(res.text).points[0].id).toBe("kpg");
    expect((await stopping).code).toBe(0);
    await restoreServers();
  }, 150_000);
});
