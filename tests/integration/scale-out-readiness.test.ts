// Readiness for a load balancer (issue 17): GET /readyz checks Postgres, the S3 bucket and the job
// queue, names the one that fails (503), and turns 503 while the server drains, when every answer
// also says `Connection: close`. The two-server behaviour is in tests/e2e/scale-out.test.ts.
import { once } from "node:events";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../server/app.ts";
import { resetEnvForTests } from "../../server/env.server.ts";
import { getBoss } from "../../server/queue.server.ts";
import { isDraining, startDraining } from "../../server/readiness.server.ts";
import { freePort } from "../helpers/net.ts";

const fakeBuild = async () => {
  throw new Error("no React Router build in this test");
};

let base = "";
let close: () => void = () => {};

async function ready() {
  const res = await fetch(`${base}/readyz`);
  return { status: res.status, connection: res.headers.get("connection"), cache: res.headers.get("cache-control"), body: (await res.json()) as Record<string, any> };
}

describe("readiness", () => {
  beforeAll(async () => {
    await getBoss(); // what start() does on a server with RUN_WORKERS=true
    const server = createApp({ build: fakeBuild as never, clientDir: "/nonexistent" }).listen(0, "127.0.0.1");
    await once(server, "listening");
    base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    close = () => server.close();
  });
  afterAll(() => close());

  it("answers 200 with each check when Postgres, S3 and the job queue answer", async () => {
    const r = await ready();
    expect([r.status, r.cache]).toEqual([200, "no-store"]);
    expect(r.body).toMatchObject({ ok: true, checks: { database: { ok: true }, storage: { ok: true }, queue: { ok: true } } });
    expect(r.body.draining).toBeUndefined();
  });

  it("answers 503 naming S3 when the bucket cannot be reached, and 200 again when it can", async () => {
    const saved = process.env.S3_ENDPOINT;
    process.env.S3_ENDPOINT = `http://127.0.0.1:${await freePort()}`; // nothing listens there
    resetEnvForTests();
    try {
      const r = await ready();
      expect(r.status).toBe(503);
      expect(r.body.ok).toBe(false);
      expect(r.body.checks.storage).toMatchObject({ ok: false, error: expect.stringMatching(/S3 unreachable/) });
      expect(r.body.checks.database.ok).toBe(true);
    } finally {
      process.env.S3_ENDPOINT = saved;
      resetEnvForTests();
    }
    expect((await ready()).status).toBe(200);
  });

  it("answers 503 naming the bucket when S3 answers but the bucket is missing", async () => {
    const saved = process.env.S3_BUCKET;
    process.env.S3_BUCKET = "eonscale-no-such-bucket";
    resetEnvForTests();
    try {
      const r = await ready();
      expect(r.status).toBe(503);
      expect(r.body.checks.storage.error).toMatch(/S3 answered 404 for bucket eonscale-no-such-bucket/);
    } finally {
      process.env.S3_BUCKET = saved;
      resetEnvForTests();
    }
  });

  it("while draining: 503 with draining, liveness still 200, and every answer closes its connection", async () => {
    expect(isDraining()).toBe(false);
    startDraining();
    const r = await ready();
    expect([r.status, r.body.draining, r.body.ok, r.connection]).toEqual([503, true, false, "close"]);
    const live = await fetch(`${base}/healthz`);
    expect([live.status, live.headers.get("connection")]).toEqual([200, "close"]);
  });
});
