// Node entry. It loads nothing of the app itself: in production it imports the server build
// (build/server/index.js, whose entry is server/app.ts), in development (--dev) it lets Vite load
// server/app.ts — the same module — in middleware mode. Either way one module graph serves.
//   npm run serve   production: refuses to run on a database with migrations not yet run
//   npm run dev     development with hot reload (the local launcher, fakes/launch.ts, starts it)
import { fileURLToPath } from "node:url";
import type { RequestHandler } from "express";

type AppModule = typeof import("./app.ts");

export interface LaunchOptions {
  dev?: boolean;
  /** Handlers mounted in front of the app (the local launcher's /dev/mail inbox). */
  before?: { path: string; handler: RequestHandler }[];
  /** Check that the schema is up to date before serving (production default). */
  checkSchema?: boolean;
}

const root = fileURLToPath(new URL("..", import.meta.url));
/** The build folder (EONSCALE_BUILD_DIR, relative to the repository; default "build"). */
const buildDir = new URL(`../${(process.env.EONSCALE_BUILD_DIR || "build").replace(/\/+$/, "")}/`, import.meta.url);

export async function launch(options: LaunchOptions = {}) {
  if (options.dev) {
    process.env.NODE_ENV ??= "development";
    const { createServer } = await import("vite");
    const vite = await createServer({ root, server: { middlewareMode: true }, appType: "custom" });
    const app = (await vite.ssrLoadModule("/server/app.ts")) as AppModule;
    return app.start({ devMiddleware: vite.middlewares, before: options.before, onStop: () => vite.close() });
  }
  const buildUrl = new URL("server/index.js", buildDir).href;
  const app = (await import(/* @vite-ignore */ buildUrl)) as AppModule;
  return app.start({
    before: options.before,
    clientDir: fileURLToPath(new URL("client", buildDir)),
    migrationsDir: options.checkSchema === false ? undefined : fileURLToPath(new URL("../db/migrations", import.meta.url)),
  });
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  try {
    await launch({ dev: process.argv.includes("--dev") });
  } catch (error) {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  }
}
