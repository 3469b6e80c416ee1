// The local launcher: `npm start` (production build) and `npm run dev` (Vite, hot reload).
// It starts the stand-ins (Postgres, S3, SMTP), passes their addresses to the server as
// environment variables, migrates and seeds the demo, builds (npm start), and serves the app
// with the local inbox page (/dev/mail) mounted in front of it. Safe to run again: every step is
// idempotent. A start that fails stops the stand-ins this run started.
import { spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { REPO_ROOT } from "./config.ts";
import { inboxPage } from "./inbox-page.ts";
import { ServiceError, startServices, stopServices, type ServiceName } from "./services.ts";
import { pidAlive } from "./util.ts";

const dev = process.argv.includes("--dev");
process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";
let started: ServiceName[] = [];

/** A random session secret kept with the local data, so sign-ins survive restarts. */
function localSessionSecret(dataDir: string): string {
  const file = path.join(dataDir, "session-secret");
  if (existsSync(file)) return readFileSync(file, "utf8").trim();
  const secret = randomBytes(32).toString("base64url");
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

/**
 * App servers of this checkout already running (`.data/app-<port>.pid`): a second `npm start` on
 * another PORT reuses the stand-ins they use and their build instead of rebuilding under them.
 */
function runningAppServers(dataDir: string): number[] {
  return readdirSync(dataDir)
    .map((f) => /^app-(\d+)\.pid$/.exec(f))
    .filter((m): m is RegExpExecArray => m !== null)
    .filter((m) => {
      const pid = Number(readFileSync(path.join(dataDir, m[0]), "utf8"));
      if (pid !== process.pid && pidAlive(pid)) return true;
      rmSync(path.join(dataDir, m[0]), { force: true }); // left by a server that was killed
      return false;
    })
    .map((m) => Number(m[1]));
}

function recordAppServer(dataDir: string, port: number) {
  const file = path.join(dataDir, `app-${port}.pid`);
  writeFileSync(file, String(process.pid));
  process.once("exit", () => rmSync(file, { force: true }));
}

function step(label: string) {
  const t0 = Date.now();
  return () => console.log(`  ${label} (${((Date.now() - t0) / 1000).toFixed(1)} s)`);
}

try {
  let done = step("local services up");
  const config = await startServices();
  started = config.started;
  done();
  for (const [key, value] of Object.entries(config.env)) process.env[key] ??= value;
  process.env.NODE_ENV = dev ? "development" : "production";
  process.env.SESSION_SECRET ??= localSessionSecret(config.dataDir);
  process.env.APP_URL ??= `http://${process.env.HOST ?? "127.0.0.1"}:${process.env.PORT ?? 3000}`;

  done = step("database migrated and seeded");
  const { migrateAndSeed } = await import("../db/migrator.ts");
  const { createSequelize } = await import("../db/sequelize.ts");
  const db = createSequelize(process.env.DATABASE_URL!);
  try {
    await migrateAndSeed({ demo: true, quiet: true, db });
  } finally {
    await db.close();
  }
  done();

  const others = runningAppServers(config.dataDir);
  const buildDir = path.join(REPO_ROOT, process.env.EONSCALE_BUILD_DIR || "build");
  if (others.length && !dev) {
    console.log(`  another app server of this checkout is running (port ${others.join(", ")}): reusing its services${existsSync(path.join(buildDir, "server/index.js")) ? " and its build" : ""}`);
  }
  if (!dev && !process.argv.includes("--no-build") && !(others.length && existsSync(path.join(buildDir, "server/index.js")))) {
    console.log("Building the app…");
    done = step("built");
    const build = spawnSync("npx", ["react-router", "build"], { stdio: "inherit", cwd: REPO_ROOT, env: process.env });
    if (build.status !== 0) throw new ServiceError(`react-router build failed (exit ${build.status})`);
    done();
  }

  const { launch } = await import("../server/index.ts");
  const running = await launch({ dev, before: [{ path: "/dev/mail", handler: inboxPage() }] });
  recordAppServer(config.dataDir, Number(new URL(running.url).port));
  const { DEMO_PASSWORD, DEMO_USERS, DEMO_ORGANISATION } = await import("../db/seeders/demo/2026.12.01T00.00.00.marrowby-team.ts");
  const people = DEMO_USERS.map((u) => {
    const roles = (u as { roles?: string[] }).roles ?? [(u as { role?: string }).role];
    return `  ${roles.join(", ").padEnd(18)} ${u.email}`;
  });
  console.log(`
Eonscale is running at ${running.url}${dev ? " (development, hot reload)" : ""}
Local inbox (e-mail sent by the app; this computer only): ${running.url}/dev/mail

Demo organisation: ${DEMO_ORGANISATION.name}
${people.join("\n")}
  password for all: ${DEMO_PASSWORD}

Stop with Ctrl-C; stop the local services with npm run services:stop.
`);
} catch (error) {
  console.error(error instanceof ServiceError || (error instanceof Error && error.name === "StartError") ? `error: ${error.message}` : error);
  if (started.length) {
    console.error(`Stopping the local services this run started (${started.join(", ")})…`);
    await stopServices({ only: started, quiet: true }).catch(() => {});
  }
  process.exit(1);
}
