/**
 * Typing in the composer, in the browser: `npm run bench:composer-typing`.
 *
 * Builds and serves the app (production build, its own build folder, port and database), signs in
 * as the demo designer, opens the 42-marker riverside walk and types into the span field (older
 * end) while the preview follows. Chromium's Event Timing API reports each keystroke's
 * interaction-to-next-paint (from the key press to the next frame painted after the handlers ran);
 * per interaction the longest of its events counts, as for INP. Event Timing reports only events of
 * 16 ms or more: a keystroke it does not report took less than 16 ms and is counted as 16 ms here
 * (an upper bound). Two rhythms: steady typing (a key every 120 ms) and fast typing (every 30 ms).
 * The last line printed is one JSON object; the target is p95 < 50 ms for steady typing.
 *
 * Environment: EONSCALE_BUILD_DIR (default build-bench), EONSCALE_E2E_PORT (default 3190),
 * EONSCALE_TEST_DATABASE (default eonscale_bench), EONSCALE_SKIP_BUILD=1 to reuse the last build.
 */
import { cpus, loadavg } from "node:os";

process.env.EONSCALE_BUILD_DIR ??= "build-bench";
process.env.EONSCALE_E2E_PORT ??= "3190";
process.env.EONSCALE_TEST_DATABASE ??= "eonscale_bench";

const { default: prepareDatabases } = await import("../setup/global-setup.ts");
const { default: serveApp } = await import("../setup/e2e-server.ts");
const { launchBrowser } = await import("../setup/chromium.ts");
const { E2E_PORT } = await import("../setup/test-env.ts");

const BASE = `http://127.0.0.1:${E2E_PORT}`;
const VALUES = ["541", "1000", "2500", "4000", "4567"];
const ROUNDS = 4;

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const i = Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1);
  return sorted[Math.max(0, i)];
}

await prepareDatabases();
const stop = await serveApp();
const browser = await launchBrowser();
try {
  const page = await browser.newPage({ viewport: { width: 1366, height: 900 } });
  await page.goto(`${BASE}/login`);
  await page.getByLabel("E-mail address").fill("designer@marrowby.example");
  await page.getByLabel("Password").fill("deep-time-demo");
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL(/\/studio/);
  await page.goto(`${BASE}/studio/exhibits/riverside-walk`, { waitUntil: "networkidle" });
  const markers = await page.locator("#markers-h").innerText();
  const field = page.locator("input[name=spanOlderValue]");
  await field.scrollIntoViewIfNeeded();
  await page.waitForTimeout(1000);

  const results: Record<string, { keystrokes: number; reported: number; p50Ms: number; p95Ms: number; maxMs: number }> = {};
  for (const [rhythm, delay] of [["steady", 120], ["fast", 30]] as const) {
    await page.evaluate(() => {
      const w = window as unknown as { __inp: Map<number, number>; __obs?: PerformanceObserver };
      w.__obs?.disconnect();
      w.__inp = new Map();
      w.__obs = new PerformanceObserver((list) => {
        for (const e of list.getEntries() as (PerformanceEntry & { interactionId?: number })[]) {
          if (!e.interactionId) continue;
          w.__inp.set(e.interactionId, Math.max(w.__inp.get(e.interactionId) ?? 0, e.duration));
        }
      });
      w.__obs.observe({ type: "event", durationThreshold: 16, buffered: false } as PerformanceObserverInit);
    });
    let keystrokes = 0;
    for (let r = 0; r < ROUNDS; r++) {
      for (const value of VALUES) {
        await field.fill("");
        await field.focus();
        await page.keyboard.type(value, { delay });
        keystrokes += value.length;
        await page.waitForTimeout(150);
      }
    }
    await page.waitForTimeout(500);
    const reported = await page.evaluate(() => [...(window as unknown as { __inp: Map<number, number> }).__inp.values()]);
    // Keystrokes Event Timing did not report took under 16 ms: counted as 16 ms.
    const all = [...reported, ...Array(Math.max(0, keystrokes - reported.length)).fill(16)].sort((a, b) => a - b);
    results[rhythm] = { keystrokes, reported: reported.length, p50Ms: percentile(all, 50), p95Ms: percentile(all, 95), maxMs: all[all.length - 1] };
    console.log(`${rhythm} typing (a key every ${delay} ms): ${keystrokes} keystrokes, ${reported.length} interactions of 16 ms or more; p50 ${results[rhythm].p50Ms} ms, p95 ${results[rhythm].p95Ms} ms, max ${results[rhythm].maxMs} ms`);
  }
  const load = loadavg()[0];
  console.log(`(${markers.trim()} on the riverside walk; Chromium ${browser.version()}; ${cpus().length} CPUs, load average ${load.toFixed(1)} — other work on the machine lengthens every figure)`);
  console.log(JSON.stringify({ bench: "composer-typing", markers: markers.trim(), cpus: cpus().length, loadAverage1m: Number(load.toFixed(1)), steadyP95Ms: results.steady.p95Ms, fastP95Ms: results.fast.p95Ms, targetP95Ms: 50, ...Object.fromEntries(Object.entries(results).map(([k, v]) => [k, v])) }));
} finally {
  await browser.close();
  await stop();
}
