// `npm test`: typecheck, lint (ESLint and the layer rules), then unit + integration tests, then browser tests, each against the
// local stand-ins that the vitest global setup starts itself. Prints the time of every step and
// ends with a summary: counts and the time per step and in total.
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync } from "node:fs";
import path from "node:path";

const outDir = path.resolve("test-results");
mkdirSync(outDir, { recursive: true });
const env = { ...process.env, AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: "true" };
const extra = process.argv.slice(2);

function run(label: string, cmd: string, args: string[]) {
  console.log(`\n▶ ${label}: ${cmd} ${args.join(" ")}`);
  const started = Date.now();
  const result = spawnSync(cmd, args, { stdio: "inherit", env });
  console.log(`◀ ${label}: ${result.status === 0 ? "ok" : `failed (exit ${result.status})`} in ${((Date.now() - started) / 1000).toFixed(1)} s`);
  return result.status === 0;
}

interface VitestJson {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests: number;
  numTodoTests: number;
}

function counts(file: string): VitestJson {
  try {
    return JSON.parse(readFileSync(file, "utf8")) as VitestJson;
  } catch {
    return { numPassedTests: 0, numFailedTests: 1, numPendingTests: 0, numTodoTests: 0 };
  }
}

const steps: [string, () => boolean][] = [
  ["typecheck", () => run("typecheck", "npx", ["react-router", "typegen"]) && run("typecheck", "npx", ["tsc"])],
  ["lint", () => run("lint", "npx", ["eslint", ".", "--max-warnings", "0"]) && run("lint", "npx", ["depcruise", "app", "server", "db", "fakes", "tests", "--config", ".dependency-cruiser.cjs", "--output-type", "err"])],
  ["unit + integration", () => run("unit + integration", "npx", ["vitest", "run", "--project", "unit", "--project", "integration", "--reporter=default", "--reporter=json", `--outputFile.json=${outDir}/vitest-main.json`, ...extra])],
  ["browser", () => run("browser", "npx", ["vitest", "run", "--project", "e2e", "--reporter=default", "--reporter=json", `--outputFile.json=${outDir}/vitest-e2e.json`, ...extra])],
];

let ok = true;
const ran: string[] = [];
const timings: [string, number][] = [];
const runStarted = Date.now();
for (const [name, step] of steps) {
  if (process.env.EONSCALE_TEST_ONLY && !process.env.EONSCALE_TEST_ONLY.split(",").includes(name)) continue;
  ran.push(name);
  const started = Date.now();
  ok = step() && ok;
  timings.push([name, (Date.now() - started) / 1000]);
}

const results = ran.filter((n) => n !== "typecheck").map((n) => counts(`${outDir}/vitest-${n === "browser" ? "e2e" : "main"}.json`));
const passed = results.reduce((s, r) => s + r.numPassedTests, 0);
const failed = results.reduce((s, r) => s + r.numFailedTests, 0) + (ok ? 0 : failed0());
const skipped = results.reduce((s, r) => s + r.numPendingTests + r.numTodoTests, 0);
function failed0() {
  return results.every((r) => r.numFailedTests === 0) ? 1 : 0; // a failing step with no failed test (typecheck, setup) still counts
}
console.log("\nTime per step:");
console.log(timings.map(([name, s]) => `  ${name.padEnd(20)} ${s.toFixed(1).padStart(7)} s`).join("\n"));
console.log(`  ${"total".padEnd(20)} ${((Date.now() - runStarted) / 1000).toFixed(1).padStart(7)} s`);
// The closing line CI reads: keep it last.
console.log(`\n${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(ok ? 0 : 1);
