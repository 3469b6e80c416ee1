/**
 * Visitor pages: `npm run bench:visitor` (npx tsx tests/bench/visitor.bench.ts).
 *
 * Builds the app (its own build folder), copies the demo database, and serves the production build
 * in a child process through the app's own Express stack (createApp: logging, helmet, compression,
 * static files, the visitor-page layer, React Router). The child adds one route to the build it
 * serves, only here: /bench-hello, a hello-world React Router page (root layout, hydration scripts)
 * — the baseline, served by the same stack in the same run.
 *
 * 1. Sizes, first visit in Chromium (fresh context, service worker blocked so the offline copy is
 *    not counted, images aside): every response's transferred (compressed) body — HTML, CSS, JS,
 *    fonts — for the marker page (target ≤ 50 KB) and the exhibit page with its route map (≤ 120 KB).
 *    The offline copy (every page and asset the service worker keeps) is measured apart.
 * 2. Throughput with autocannon (loopback, 50 connections, 8 s each, after a warm-up), all with
 *    Accept-Encoding: br, gzip: the hello-world page; the marker page without If-None-Match (served
 *    from the kept rendering: target ≥ 0.8× hello-world); the marker page revalidated with its ETag
 *    (304: target ≥ 5×). Requests/s, p99 latency and the ratios; the last line is one JSON object.
 *
 * Environment: EONSCALE_BUILD_DIR (default build-bench-visitor), EONSCALE_TEST_DATABASE (default
 * eonscale_bench_visitor), EONSCALE_E2E_PORT (default 3196), EONSCALE_SKIP_BUILD=1 reuses the build,
 * BENCH_SECONDS (default 8).
 */
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { get } from "node:http";
import { cpus, loadavg } from "node:os";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const here = fileURLToPath(import.meta.url);
process.env.EONSCALE_BUILD_DIR ??= "build-bench-visitor";
process.env.EONSCALE_TEST_DATABASE ??= "eonscale_bench_visitor";
process.env.EONSCALE_E2E_PORT ??= "3196";
const BUILD_DIR = path.resolve(process.env.EONSCALE_BUILD_DIR);
const MARKER = "/visit/marrowby/riverside-walk/6";
const EXHIBIT = "/visit/marrowby/riverside-walk";
const HELLO = "/bench-hello";

// ---------- the server child: the app's own stack plus the hello-world route ----------
async function serve() {
  const { applyTestEnv } = await import("../setup/test-env.ts");
  applyTestEnv();
  process.env.NODE_ENV = "production";
  const { createElement } = await import("react");
  const app = (await import(pathToFileURL(path.join(BUILD_DIR, "server/index.js")).href)) as typeof import("../../server/app.ts");
  const base = await app.loadServerBuild();
  const Hello = () => createElement("main", null, createElement("h1", null, "Hello, world"));
  const build = {
    ...base,
    routes: { ...base.routes, "bench-hello": { id: "bench-hello", parentId: "root", path: "bench-hello", module: { default: Hello } } },
    assets: {
      ...base.assets,
      routes: {
        ...base.assets.routes,
        "bench-hello": { id: "bench-hello", parentId: "root", path: "bench-hello", module: base.assets.routes.root!.module, hasLoader: false, hasAction: false, hasClientLoader: false, hasClientAction: false, hasErrorBoundary: false, hasClientMiddleware: false, imports: [], css: [] },
      },
    },
  } as unknown as typeof base;
  const running = await app.start({ build: async () => build, clientDir: path.join(BUILD_DIR, "client"), port: Number(process.env.EONSCALE_E2E_PORT), handleSignals: true });
  process.send?.({ url: running.url });
}

// ---------- the parent: build, databases, sizes, load ----------
async function main() {
  const seconds = Number(process.env.BENCH_SECONDS ?? 8);
  const loadBefore = round2(loadavg()[0]);
  const { default: prepareDatabases } = await import("../setup/global-setup.ts");
  await prepareDatabases();
  if (process.env.EONSCALE_SKIP_BUILD !== "1") {
    const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: "production" };
    const built = spawnSync("npx", ["react-router", "build"], { stdio: ["ignore", "ignore", "inherit"], env });
    if (built.status !== 0) throw new Error("react-router build failed");
  }
  const child: ChildProcess = spawn(process.execPath, ["--import", "tsx", here, "--serve"], { stdio: ["ignore", "inherit", "inherit", "ipc"], env: process.env });
  const url = await new Promise<string>((resolve, reject) => {
    child.once("message", (m) => resolve((m as { url: string }).url));
    child.once("exit", (code) => reject(new Error(`server exited with ${code}`)));
  });
  try {
    const sizes = await measureSizes(url);
    const load = await measureLoad(url, seconds);
    // A baseline that served nothing (a starved machine) gives no ratio rather than Infinity.
    const ratio = (x: number) => (load.hello.rps > 0 ? round2(x / load.hello.rps) : null);
    const ratios = { markerVsHello: ratio(load.marker.rps), revalidatedVsHello: ratio(load.revalidated.rps) };
    console.log("");
    console.log(`Marker page, first visit:  ${kb(sizes.marker.total)} transferred (target ≤ 50 KB) — ${describe(sizes.marker)}`);
    console.log(`Exhibit page, first visit: ${kb(sizes.exhibit.total)} transferred (target ≤ 120 KB) — ${describe(sizes.exhibit)}`);
    console.log(`Offline copy (apart):      ${kb(sizes.offline.bytes)} for ${sizes.offline.files} files (Brotli)`);
    for (const [name, r] of Object.entries(load)) console.log(`${name.padEnd(12)} ${String(r.rps).padStart(7)} req/s  p99 ${r.p99Ms} ms  (${r.requests} requests, ${r.non2xx} other than ${name === "revalidated" ? "304" : "200"}, ${r.errors} errors or timeouts)`);
    console.log(`marker / hello-world = ${ratios.markerVsHello} (target ≥ 0.8); 304 / hello-world = ${ratios.revalidatedVsHello} (target ≥ 5)`);
    console.log(
      JSON.stringify({
        bench: "visitor",
        cpus: cpus().length,
        // The 1-minute load average before and after: on a shared machine the figures move with it.
        load1: { before: loadBefore, after: round2(loadavg()[0]) },
        sizesKb: { marker: round1(sizes.marker.total / 1024), exhibit: round1(sizes.exhibit.total / 1024), offlineCopy: round1(sizes.offline.bytes / 1024) },
        sizeByTypeKb: { marker: byTypeKb(sizes.marker), exhibit: byTypeKb(sizes.exhibit) },
        rps: { hello: load.hello.rps, marker: load.marker.rps, revalidated: load.revalidated.rps },
        p99Ms: { hello: load.hello.p99Ms, marker: load.marker.p99Ms, revalidated: load.revalidated.p99Ms },
        ratios,
        targets: { markerKb: 50, exhibitKb: 120, markerVsHello: 0.8, revalidatedVsHello: 5 },
        met: { markerSize: sizes.marker.total <= 50 * 1024, exhibitSize: sizes.exhibit.total <= 120 * 1024, markerVsHello: ratios.markerVsHello !== null && ratios.markerVsHello >= 0.8, revalidatedVsHello: ratios.revalidatedVsHello !== null && ratios.revalidatedVsHello >= 5 },
      }),
    );
  } finally {
    child.kill("SIGTERM");
    await new Promise((r) => child.once("exit", r));
  }
}

interface PageSizes {
  total: number;
  byType: Record<string, number>;
  files: number;
}

async function measureSizes(url: string): Promise<{ marker: PageSizes; exhibit: PageSizes; offline: { bytes: number; files: number } }> {
  const { launchBrowser } = await import("../setup/chromium.ts");
  const browser = await launchBrowser();
  try {
    const visit = async (pagePath: string): Promise<PageSizes> => {
      const context = await browser.newContext({ viewport: { width: 390, height: 844 }, serviceWorkers: "block" });
      const page = await context.newPage();
      const done: Promise<void>[] = [];
      const out: PageSizes = { total: 0, byType: {}, files: 0 };
      page.on("requestfinished", (request) => {
        const type = request.resourceType();
        if (type === "image") return; // images aside
        done.push(
          request.sizes().then((s) => {
            out.total += s.responseBodySize;
            out.byType[type] = (out.byType[type] ?? 0) + s.responseBodySize;
            out.files++;
          }),
        );
      });
      await page.goto(`${url}${pagePath}`, { waitUntil: "networkidle" });
      await Promise.all(done);
      await context.close();
      return out;
    };
    const marker = await visit(MARKER);
    const exhibit = await visit(EXHIBIT);
    // The offline copy: what public/visit.js asks the service worker to keep (pages, styles, the script).
    const html = await (await fetch(`${url}${EXHIBIT}`)).text();
    const precache = JSON.parse(decodeEntities(/data-precache="([^"]*)"/.exec(html)![1])) as string[];
    const assets = [...html.matchAll(/<link rel="stylesheet" href="([^"]+)"/g)].map((m) => m[1]).concat("/visit.js");
    let bytes = 0;
    for (const file of [...precache, ...assets]) bytes += await transferred(`${url}${file}`);
    return { marker, exhibit, offline: { bytes, files: precache.length + assets.length } };
  } finally {
    await browser.close();
  }
}

async function measureLoad(url: string, seconds: number) {
  const autocannon = (await import("autocannon")).default;
  const headers = { "Accept-Encoding": "br, gzip", "Accept-Language": "en-GB,en;q=0.9" };
  const etag = (await fetch(`${url}${MARKER}`, { headers })).headers.get("etag")!;
  const run = async (pagePath: string, extra: Record<string, string> = {}) => {
    const opts = { url: `${url}${pagePath}`, connections: 50, headers: { ...headers, ...extra } };
    await autocannon({ ...opts, duration: 2 }); // warm-up
    const r = await autocannon({ ...opts, duration: seconds });
    return { rps: Math.round(r.requests.average), p99Ms: r.latency.p99, requests: r.requests.total, non2xx: r.non2xx, errors: r.errors + r.timeouts };
  };
  const hello = await run(HELLO);
  const marker = await run(MARKER);
  const revalidated = await run(MARKER, { "If-None-Match": etag });
  // autocannon counts a 304 as "non 2xx": in the revalidation run every request should be one.
  return { hello, marker, revalidated: { ...revalidated, non2xx: revalidated.requests - revalidated.non2xx } };
}

/** Bytes of a response body as sent (Brotli where the server compresses), not decompressed. */
function transferred(address: string): Promise<number> {
  return new Promise((resolve, reject) => {
    get(address, { headers: { "Accept-Encoding": "br" } }, (res) => {
      let n = 0;
      res.on("data", (chunk: Buffer) => (n += chunk.length));
      res.on("end", () => resolve(n));
      res.on("error", reject);
    }).on("error", reject);
  });
}

function decodeEntities(s: string): string {
  return s.replace(/&quot;/g, '"').replace(/&amp;/g, "&");
}
const kb = (b: number) => `${(b / 1024).toFixed(1)} KB`;
const round1 = (x: number) => Math.round(x * 10) / 10;
const round2 = (x: number) => Math.round(x * 100) / 100;
const byTypeKb = (s: PageSizes) => Object.fromEntries(Object.entries(s.byType).map(([k, v]) => [k, round1(v / 1024)]));
const describe = (s: PageSizes) => Object.entries(s.byType).map(([k, v]) => `${k} ${kb(v)}`).join(", ");

if (process.argv.includes("--serve")) await serve();
else await main();
