/**
 * Load check: `npm run bench:load` (issue 16 §7). Loopback only, bounded.
 *
 * One production app server (the build in EONSCALE_BUILD_DIR, default build/, made if missing;
 * started as `npm run serve` starts it, with RUN_WORKERS=true, on a fresh database with the demo
 * data, against the local stand-ins) takes 200 connections for 30 s on each of:
 *  - baseline: GET /healthz (one `SELECT 1` through the same Express stack) — the least a request costs;
 *  - a public page: GET /editions (the chart editions, server-rendered);
 *  - a signed-in page: GET /studio/exhibits as the demo designer (session read from Postgres).
 * Printed per run: requests/s, p50 and p99 latency, errors (connection errors, timeouts and any
 * answer that is not 200), and the ratio of p99 to the baseline's; the server's RSS before and
 * after (and its peak, VmHWM). Exits 1 when any run had an error. The last line is one JSON object.
 * LOAD_CONNECTIONS and LOAD_SECONDS shorten a trial run.
 */
import { spawnSync } from "node:child_process";
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";
import autocannon from "autocannon";
import { databaseUrl, dropDatabase, ensureDatabase, startServices } from "../../fakes/services.ts";
import { startAppProcess } from "../helpers/app-process.ts";
import { freePort } from "../helpers/net.ts";

const CONNECTIONS = Number(process.env.LOAD_CONNECTIONS ?? 200);
const SECONDS = Number(process.env.LOAD_SECONDS ?? 30);
const DATABASE = "eonscale_bench_load";
const buildDir = process.env.EONSCALE_BUILD_DIR || "build";

function rssMb(pid: number) {
  const status = readFileSync(`/proc/${pid}/status`, "utf8");
  const field = (name: string) => Number(new RegExp(`^${name}:\\s+(\\d+) kB`, "m").exec(status)?.[1] ?? NaN) / 1024;
  return { rss: Math.round(field("VmRSS")), peak: Math.round(field("VmHWM")) };
}

interface Run {
  name: string;
  url: string;
  requests: number;
  perSecond: number;
  p50: number;
  p99: number;
  errors: number;
  timeouts: number;
  non200: number;
}

async function load(name: string, url: string, headers: Record<string, string> = {}): Promise<Run> {
  const result = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers, timeout: 20 });
  const non200 = Object.entries(result.statusCodeStats ?? {})
    .filter(([code]) => code !== "200")
    .reduce((sum, [, s]) => sum + (s as { count: number }).count, 0);
  const run: Run = {
    name,
    url,
    requests: result.requests.total,
    perSecond: Math.round(result.requests.average),
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors,
    timeouts: result.timeouts,
    non200,
  };
  console.log(`  ${name.padEnd(12)} ${String(run.perSecond).padStart(6)} req/s  p50 ${String(run.p50).padStart(5)} ms  p99 ${String(run.p99).padStart(5)} ms  errors ${run.errors}, timeouts ${run.timeouts}, not 200: ${run.non200}  (${run.requests} requests)`);
  return run;
}

console.log(`Load check: ${CONNECTIONS} connections × ${SECONDS} s per page, loopback, one app server.`);
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = "true";
const services = await startServices({ quiet: true });
for (const [key, value] of Object.entries(services.env)) process.env[key] ??= value;

if (!existsSync(path.join(buildDir, "server/index.js"))) {
  console.log(`Building into ${buildDir}/ …`);
  const env = { ...process.env, NODE_ENV: "production" };
  if (spawnSync("npx", ["react-router", "build"], { stdio: ["ignore", "ignore", "inherit"], env }).status !== 0) throw new Error("react-router build failed");
}

await dropDatabase(DATABASE);
await ensureDatabase(DATABASE);
{
  const { createSequelize } = await import("../../db/sequelize.ts");
  const { migrateAndSeed } = await import("../../db/migrator.ts");
  const db = createSequelize(databaseUrl(DATABASE));
  try {
    await migrateAndSeed({ demo: true, db, quiet: true });
  } finally {
    await db.close();
  }
}

const port = await freePort();
const server = await startAppProcess("load", port, {
  DATABASE_URL: databaseUrl(DATABASE),
  APP_URL: `http://127.0.0.1:${port}`,
  SESSION_SECRET: "load-check-session-secret-for-loopback-only",
  RUN_WORKERS: "true",
  LOG_LEVEL: "warn", // request logs at info would measure the log pipe to this process
});
const base = server.url;
let failed: boolean;
try {
  const login = await fetch(`${base}/login`, {
    method: "POST",
    redirect: "manual",
    headers: { "Content-Type": "application/x-www-form-urlencoded", Origin: base },
    body: new URLSearchParams({ email: "designer@marrowby.example", password: "deep-time-demo", redirectTo: "/studio" }).toString(),
  });
  const cookie = login.headers.getSetCookie().map((c) => c.split(";")[0]).find((c) => c.startsWith("en_session="));
  if (login.status !== 302 || !cookie) throw new Error(`signing in the demo designer failed (${login.status})`);
  const signedIn = await fetch(`${base}/studio/exhibits`, { headers: { Cookie: cookie } });
  if (signedIn.status !== 200) throw new Error(`the signed-in page answered ${signedIn.status}`);

  // Warm up each page (route modules, connection pool) before measuring.
  for (const u of ["/healthz", "/editions"]) await fetch(`${base}${u}`).then((r) => r.arrayBuffer());
  await fetch(`${base}/studio/exhibits`, { headers: { Cookie: cookie } }).then((r) => r.arrayBuffer());

  const before = rssMb(server.child.pid!);
  console.log(`  server RSS before: ${before.rss} MB`);
  const baseline = await load("baseline", `${base}/healthz`);
  const publicPage = await load("public", `${base}/editions`);
  const studioPage = await load("signed-in", `${base}/studio/exhibits`, { Cookie: cookie });
  const after = rssMb(server.child.pid!);
  console.log(`  server RSS after: ${after.rss} MB (peak ${after.peak} MB)`);
  const runs = [baseline, publicPage, studioPage];
  const errors = runs.reduce((s, r) => s + r.errors + r.timeouts + r.non200, 0);
  failed = errors > 0;
  const ratio = (r: Run) => Math.round((r.p99 / Math.max(1, baseline.p99)) * 10) / 10;
  console.log(`  p99 against the baseline: public ${ratio(publicPage)}×, signed-in ${ratio(studioPage)}×`);
  console.log(failed ? `FAILED: ${errors} errors` : "0 errors");
  console.log(
    JSON.stringify({
      bench: "load",
      connections: CONNECTIONS,
      seconds: SECONDS,
      runs: Object.fromEntries(runs.map((r) => [r.name, { url: r.url.replace(base, ""), perSecond: r.perSecond, p50Ms: r.p50, p99Ms: r.p99, requests: r.requests, errors: r.errors + r.timeouts + r.non200 }])),
      p99RatioToBaseline: { public: ratio(publicPage), signedIn: ratio(studioPage) },
      rssMb: { before: before.rss, after: after.rss, peak: after.peak },
      errors,
    }),
  );
} finally {
  await server.stop();
  await dropDatabase(DATABASE).catch(() => {});
}
process.exit(failed ? 1 : 0);
