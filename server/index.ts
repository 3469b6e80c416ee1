// Node entry: validates the environment, serves the React Router build (or Vite in --dev),
// runs the background workers and shuts down gracefully on SIGTERM/SIGINT.
import type { Server } from "node:http";
import { sequelize } from "./db.server.ts";
import { createApp } from "./app.ts";
import { env, loadEnv } from "./env.server.ts";
import { logger } from "./logger.server.ts";
import { stopBoss } from "./queue.server.ts";
import { startWorkers } from "./workers.server.ts";

export async function startServer(opts: { dev?: boolean } = {}): Promise<Server> {
  try {
    loadEnv();
  } catch (error) {
    console.error((error as Error).message);
    process.exit(1);
  }
  const config = env();
  let app;
  if (opts.dev) {
    const vite = await import("vite");
    const viteServer = await vite.createServer({ server: { middlewareMode: true }, appType: "custom" });
    app = createApp({
      devMiddleware: viteServer.middlewares,
      build: () => viteServer.ssrLoadModule("virtual:react-router/server-build") as never,
    });
  } else {
    const buildPath = new URL("../build/server/index.js", import.meta.url).href;
    app = createApp({ build: await import(/* @vite-ignore */ buildPath) });
  }
  if (config.RUN_WORKERS === "true") await startWorkers();

  const server = app.listen(config.PORT, config.HOST, () => {
    logger.info({ url: `http://${config.HOST}:${config.PORT}` }, "Eonscale is listening");
  });

  let stopping = false;
  const shutdown = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, "shutting down");
    const force = setTimeout(() => process.exit(1), 10_000);
    force.unref();
    server.close();
    server.closeIdleConnections?.();
    await stopBoss().catch(() => {});
    await sequelize.close().catch(() => {});
    process.exit(0);
  };
  process.once("SIGTERM", () => void shutdown("SIGTERM"));
  process.once("SIGINT", () => void shutdown("SIGINT"));
  return server;
}

if (process.argv[1]?.endsWith("server/index.ts")) {
  await startServer({ dev: process.argv.includes("--dev") });
}
