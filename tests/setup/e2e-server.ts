// vitest globalSetup for browser tests: builds the app and serves it (production build, local
// stand-ins) on the test port against the test database; stopped after the run. The server is
// started the way `npm run serve` starts it: server/index.ts importing build/server/index.js.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { ensureChromium } from "./chromium.ts";
import { applyTestEnv, E2E_PORT } from "./test-env.ts";

let server: ChildProcess | undefined;

export default async function setup() {
  applyTestEnv();
  await ensureChromium();
  // Without vitest's own variables: vite.config.ts leaves the React Router plugin out under VITEST.
  const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: "production" };
  for (const key of Object.keys(env)) if (key.startsWith("VITEST") || key === "TEST") delete env[key];
  if (process.env.EONSCALE_SKIP_BUILD !== "1") {
    const build = spawnSync("npx", ["react-router", "build"], { stdio: ["ignore", "ignore", "inherit"], env });
    if (build.status !== 0) throw new Error("react-router build failed");
  }
  server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], { env, stdio: ["ignore", "inherit", "inherit"] });
  // Start-up takes 15-20 s on a busy two-core machine (the server build is large).
  const deadline = Date.now() + 90_000;
  for (;;) {
    try {
      const res = await fetch(`http://127.0.0.1:${E2E_PORT}/healthz`);
      if (res.ok) break;
    } catch {
      // not up yet
    }
    if (Date.now() > deadline) {
      server.kill("SIGKILL"); // never leave it running after a failed setup
      throw new Error(`The app did not answer on port ${E2E_PORT} within 90 s`);
    }
    if (server.exitCode !== null) throw new Error(`The app exited with code ${server.exitCode}`);
    await new Promise((r) => setTimeout(r, 250));
  }
  return async () => {
    if (server && server.exitCode === null) {
      server.kill("SIGTERM");
      await new Promise((r) => server!.once("exit", r));
    }
  };
}
