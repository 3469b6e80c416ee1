// Two app servers starting together on a fresh database create the same pg-boss queues at the same
// moment; pg-boss's create_queue can then deadlock (Postgres aborts one: "deadlock detected", which
// once stopped a server in the scale-out test). ensureQueue tries an aborted creation again.
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { env } from "../../server/env.server.ts";
import { ensureQueue } from "../../server/queue.server.ts";

describe("ensureQueue", () => {
  const bosses: PgBoss[] = [];
  beforeAll(async () => {
    for (let i = 0; i < 2; i++) {
      const boss = new PgBoss({ connectionString: env().DATABASE_URL, schema: "pgboss", supervise: false, schedule: false, max: 4 });
      await boss.start();
      bosses.push(boss);
    }
  });
  afterAll(async () => {
    await Promise.all(bosses.map((b) => b.stop({ graceful: false, wait: true })));
  });

  it("creates each queue once when two servers create the same new queues at the same moment", async () => {
    for (let round = 0; round < 3; round++) {
      const names = Array.from({ length: 6 }, (_, i) => `ensure-test-${Date.now()}-${round}-${i}`);
      // both servers, every queue, all at once — as two starting servers do
      await Promise.all(bosses.flatMap((boss) => names.map((name) => ensureQueue(boss, name, { name, retryLimit: 2 }))));
      for (const name of names) expect((await bosses[0].getQueue(name))?.name, name).toBe(name);
      for (const name of names) await bosses[0].deleteQueue(name); // one at a time: dropping partitions at once can deadlock too
    }
  }, 60_000);

  it("tries a creation Postgres aborted for a deadlock again, and gives up after five", async () => {
    const deadlock = Object.assign(new Error("deadlock detected"), { code: "40P01" });
    let calls = 0;
    const flaky = { createQueue: async () => (++calls <= 2 ? Promise.reject(deadlock) : undefined) } as unknown as PgBoss;
    await ensureQueue(flaky, "q", { name: "q" });
    expect(calls).toBe(3);
    calls = 0;
    const stuck = { createQueue: async () => (++calls, Promise.reject(deadlock)) } as unknown as PgBoss;
    await expect(ensureQueue(stuck, "q", { name: "q" })).rejects.toThrow("deadlock detected");
    expect(calls).toBe(5);
    calls = 0;
    const broken = { createQueue: async () => (++calls, Promise.reject(new Error("permission denied"))) } as unknown as PgBoss;
    await expect(ensureQueue(broken, "q", { name: "q" })).rejects.toThrow("permission denied");
    expect(calls).toBe(1); // any other error is not retried
  }, 20_000);

  it("creates a queue once per server: later calls (every e-mail sent) do not go to the database again, unless the creation failed", async () => {
    let calls = 0;
    let fail = true;
    const boss = { createQueue: async () => (++calls, fail ? Promise.reject(new Error("connection lost")) : undefined) } as unknown as PgBoss;
    await expect(ensureQueue(boss, "mail", { name: "mail" })).rejects.toThrow("connection lost");
    fail = false;
    await ensureQueue(boss, "mail", { name: "mail" }); // tried again after the failure
    await Promise.all([ensureQueue(boss, "mail", { name: "mail" }), ensureQueue(boss, "mail", { name: "mail" })]);
    expect(calls).toBe(2);
    await ensureQueue(boss, "other", { name: "other" });
    expect(calls).toBe(3);
    const second = { createQueue: async () => void ++calls } as unknown as PgBoss; // another server creates its own
    await ensureQueue(second, "mail", { name: "mail" });
    expect(calls).toBe(4);
  });
});

describe("an unhandled rejection from the job queue's bookkeeping", () => {
  it("is logged when the database connection was lost, and still ends the process otherwise", async () => {
    const { onUnhandledRejection } = await import("../../server/queue.server.ts");
    // what pg-pool and Postgres give when the database goes away mid-query
    for (const lost of [new Error("Connection terminated unexpectedly"), Object.assign(new Error("terminating connection due to administrator command"), { code: "57P01" }), Object.assign(new Error("connect ECONNREFUSED 127.0.0.1:5432"), { code: "ECONNREFUSED" }), Object.assign(new Error("connection failure"), { code: "08006" })]) {
      expect(() => onUnhandledRejection(lost), lost.message).not.toThrow();
    }
    for (const other of [new Error("relation \"pgboss.job\" does not exist"), Object.assign(new Error("deadlock detected"), { code: "40P01" }), "a string", null]) {
      expect(() => onUnhandledRejection(other), String(other)).toThrow();
    }
  });
});
