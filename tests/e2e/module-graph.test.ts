// One copy of the server code: the production server (started as `npm run serve` starts it)
// loads the app, its routes and every server and db module from the server build only, and the
// build defines each model once. On a layout where the Node entry imported db/ or server/ modules
// from source besides the build, both checks fail.
import { spawn } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { describe, expect, it } from "vitest";
import { freePort } from "../helpers/net.ts";
import { applyTestEnv } from "../setup/test-env.ts";

const ROOT = path.resolve(fileURLToPath(new URL("../..", import.meta.url)));

function jsFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? jsFiles(path.join(dir, e.name)) : e.name.endsWith(".js") ? [path.join(dir, e.name)] : []));
}


describe("one module graph", () => {
  it("the server build defines each model's table exactly once", () => {
    const code = jsFiles(path.join(ROOT, "build/server")).map((f) => readFileSync(f, "utf8")).join("\n");
    const tables = [
      "audit_events", "chart_editions", "dated_events", "decay_systems", "exhibit_media", "exhibits", "insets", "intervals",
      "invitations", "markers", "memberships", "organisations", "outbox_messages", "password_resets", "sessions", "users",
    ];
    for (const table of tables) expect([table, code.split(`tableName: "${table}"`).length - 1]).toEqual([table, 1]);
  });

  it("the running production server loads app, server and db code from the build only", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "eonscale-modules-"));
    const log = path.join(dir, "modules.txt");
    applyTestEnv();
    const port = await freePort();
    const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: "production", PORT: String(port), RUN_WORKERS: "false", EONSCALE_MODULE_LOG: log };
    for (const key of Object.keys(env)) if (key.startsWith("VITEST")) delete env[key];
    const child = spawn(process.execPath, ["--import", "tsx", "--import", "./tests/support/record-modules.mjs", "server/index.ts"], { cwd: ROOT, env, stdio: ["ignore", "ignore", "pipe"] });
    let stderr = "";
    child.stderr.on("data", (chunk) => (stderr += chunk));
    try {
      const deadline = Date.now() + 30_000;
      let health: Response | undefined;
      while (!health) {
        if (child.exitCode !== null) throw new Error(`the server exited (${child.exitCode}): ${stderr}`);
        if (Date.now() > deadline) throw new Error(`the server did not answer within 30 s: ${stderr}`);
        health = await fetch(`http://127.0.0.1:${port}/healthz`).catch(() => undefined);
        if (!health) await new Promise((r) => setTimeout(r, 200));
      }
      expect(health.status).toBe(200);
      // A page: the router, its route modules and the server modules they import get loaded.
      expect((await fetch(`http://127.0.0.1:${port}/login`)).status).toBe(200);
    } finally {
      child.kill("SIGTERM");
      await new Promise((r) => child.once("exit", r));
    }
    const loaded = [...new Set(readFileSync(log, "utf8").trim().split("\n"))];
    rmSync(dir, { recursive: true, force: true });
    const inRepo = (sub: string) => loaded.filter((u) => u.startsWith(pathToFileURL(path.join(ROOT, sub)).href + "/"));
    expect(inRepo(`${process.env.EONSCALE_BUILD_DIR || "build"}/server`).length).toBeGreaterThan(0);
    // From source: only the Node entry itself.
    expect([...inRepo("server"), ...inRepo("db"), ...inRepo("app")]).toEqual([pathToFileURL(path.join(ROOT, "server/index.ts")).href]);
  }, 60_000);
});
