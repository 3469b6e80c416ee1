// `npm start`: bring up the local stand-ins (Postgres, S3, SMTP), migrate and seed the demo,
// build the app and serve it on http://127.0.0.1:3000. Safe to run again: every step is idempotent.
import { spawnSync } from "node:child_process";
import { startServices } from "../fakes/services.ts";

process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";
const config = await startServices();
for (const [key, value] of Object.entries(config.env)) process.env[key] ??= value;
process.env.NODE_ENV = "production";
process.env.EONSCALE_LOCAL = "1"; // production build, local stand-ins: keeps /dev/mail and local defaults
process.env.INBOX_URL ??= config.INBOX_URL;

const { migrateAndSeed } = await import("../db/migrator.ts");
const { createSequelize } = await import("../db/sequelize.ts");
const db = createSequelize(process.env.DATABASE_URL!);
await migrateAndSeed({ demo: true, quiet: true, db });
await db.close();
const { DEMO_PASSWORD, DEMO_USERS, DEMO_ORGANISATION } = await import("../db/seeders/demo/2026.12.01T00.00.00.marrowby-team.ts");

if (!process.argv.includes("--no-build")) {
  console.log("Building the app…");
  const build = spawnSync("npx", ["react-router", "build"], { stdio: "inherit", env: { ...process.env } });
  if (build.status !== 0) process.exit(build.status ?? 1);
}

const { startServer } = await import("./index.ts");
const { env } = await import("./env.server.ts");
await startServer();
const url = `http://${env().HOST}:${env().PORT}`;
console.log(`
Eonscale is running at ${url}
Local inbox (e-mail sent by the app): ${url}/dev/mail

Demo organisation: ${DEMO_ORGANISATION.name}
${DEMO_USERS.map((u) => `  ${u.role.padEnd(9)} ${u.email}`).join("\n")}
  password for all: ${DEMO_PASSWORD}

Stop with Ctrl-C; stop the local services with npm run services:stop.
`);
