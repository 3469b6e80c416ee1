// Benchmark: check() of both seeded editions and compare() between them.
//
//   npx tsx tests/bench/timescale.bench.ts      (npm run bench:timescale)
//
// Median of RUNS timed runs after WARMUP untimed ones, in ms. Target: check + compare < 20 ms.
// The last line printed is a JSON object {checkMs, compareMs, totalMs}.

import { readFileSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { check, compare, type Edition } from "../../app/lib/timescale";

const WARMUP = 5;
const RUNS = 31;
const TARGET_MS = 20;

const root = join(dirname(fileURLToPath(import.meta.url)), "..", "..");
const load = (slug: string) => JSON.parse(readFileSync(join(root, "db", "data", "ics", `${slug}.json`), "utf8")) as Edition;
const a = load("ics-2023-09").intervals;
const b = load("ics-2024-12").intervals;

function median(xs: number[]): number {
  const s = [...xs].sort((x, y) => x - y);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid] : (s[mid - 1] + s[mid]) / 2;
}

function time(fn: () => unknown): number {
  for (let i = 0; i < WARMUP; i++) fn();
  const samples: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const t0 = performance.now();
    fn();
    samples.push(performance.now() - t0);
  }
  return median(samples);
}

let sink = 0;
const checkMs = time(() => {
  sink += check(a).length + check(b).length;
});
const compareMs = time(() => {
  sink += compare(a, b).moved.length;
});
const totalMs = checkMs + compareMs;
const r = (x: number) => Math.round(x * 1000) / 1000;

console.log(`editions: ICS 2023/09 (${a.length} intervals), ICS 2024/12 (${b.length} intervals); median of ${RUNS} runs after ${WARMUP} warm-up`);
console.log(`check (both editions): ${r(checkMs)} ms`);
console.log(`compare (2023/09 → 2024/12): ${r(compareMs)} ms`);
console.log(`total: ${r(totalMs)} ms (target < ${TARGET_MS} ms: ${totalMs < TARGET_MS ? "met" : "NOT met"})`);
if (sink < 0) console.log(sink); // keep the work observable
console.log(JSON.stringify({ checkMs: r(checkMs), compareMs: r(compareMs), totalMs: r(totalMs) }));
