// The Express application and its life cycle. This module is the entry of the server build
// (vite.config.ts: the SSR build's input), so the app, the React Router routes and every server
// module are one module graph: one env cache, one logger, one Sequelize, one pg-boss. The Node
// entry (server/index.ts) only loads this module: build/server/index.js in production, Vite's
// ssrLoadModule("./server/app.ts") in development.
import "react-router";
import { randomBytes } from "node:crypto";
import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import path from "node:path";
import { createRequestHandler } from "@react-router/express";
import { createRequestHandler as createFetchHandler } from "react-router";
import express, { type Request, type Response, type NextFunction } from "express";
import helmet from "helmet";
import { pinoHttp } from "pino-http";
import type { ServerBuild } from "react-router";
import { pendingMigrations } from "../db/migrator.ts";
import { CLIENT_IP_HEADER } from "./auth.server.ts";
import { compressedResponses } from "./compression.server.ts";
import { closeDatabase, sequelize } from "./db.server.ts";
import { env } from "./env.server.ts";
import { logger as appLogger, requestForLog } from "./logger.server.ts";
import { originGuard, publicUrl } from "./origin.server.ts";
import { privateResponses } from "./cache-policy.server.ts";
import { stopBoss } from "./queue.server.ts";
import { healthRoutes, startDraining } from "./readiness.server.ts";
import { startWorkers, stopTakingJobs } from "./workers.server.ts";
import { allowFraming, isEmbedPath, isVisitorPath, visitorPages } from "./visit/http.server.ts";

export { healthCheck } from "./readiness.server.ts";

declare module "react-router" {
  interface AppLoadContext {
    cspNonce: string;
  }
}

/** The React Router server build of this module graph (the same import the request handler uses). */
export const loadServerBuild = (): Promise<ServerBuild> => import("virtual:react-router/server-build");

export interface AppOptions {
  /**
   * The React Router build: a resolved build (production: start() resolves it once, so the route
   * table is derived once, not on every request), or a function (development: a fresh build per
   * request for hot reload; tests pass their own). Defaults to the build bundled with this module.
   */
  build?: ServerBuild | (() => Promise<ServerBuild>);
  /** Vite's dev middleware (development only). */
  devMiddleware?: express.RequestHandler;
  /** Handlers mounted first, e.g. the local launcher's /dev/mail inbox (never in production). */
  before?: { path: string; handler: express.RequestHandler }[];
  clientDir?: string;
  /** The request log's logger (tests pass one writing to memory). */
  logger?: typeof appLogger;
}

export function createApp(options: AppOptions = {}) {
  const app = express();
  const dev = Boolean(options.devMiddleware);
  app.disable("x-powered-by");
  // Express reads the client address from the right of X-Forwarded-For, skipping this many proxies.
  app.set("trust proxy", env().TRUST_PROXY);
  for (const { path: at, handler } of options.before ?? []) app.use(at, handler);

  app.use(
    pinoHttp({
      logger: options.logger ?? appLogger,
      serializers: { req: requestForLog },
      autoLogging: { ignore: (req) => req.url === "/healthz" || req.url === "/readyz" || req.url?.startsWith("/assets/") === true },
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? "error" : res.statusCode >= 400 ? "warn" : "info"),
    }),
  );

  app.use((req: Request, res: Response, next: NextFunction) => {
    // Visitor pages carry no inline script and must be the same bytes for everyone: no nonce.
    if (!isVisitorPath(req.path)) res.locals.cspNonce = randomBytes(16).toString("base64");
    // The client address the sign-in rate limit counts by; never trusted from the request itself.
    req.headers[CLIENT_IP_HEADER] = req.ip ?? req.socket.remoteAddress ?? "unknown";
    next();
  });

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          "script-src": ["'self'", (_req, res) => ((res as Response).locals.cspNonce ? `'nonce-${(res as Response).locals.cspNonce}'` : "'self'"), ...(dev ? ["'unsafe-inline'"] : [])],
          // <style> elements only from our own files (an injected one could read the page with
          // CSS selectors); style="" attributes stay allowed, because charts and colour chips set
          // data-driven colours and widths inline in the server-rendered HTML. 'unsafe-inline' in
          // style-src remains only for browsers without CSP Level 3 (style-src-elem/-attr).
          "style-src": ["'self'", "'unsafe-inline'"],
          "style-src-elem": ["'self'", ...(dev ? ["'unsafe-inline'"] : [])],
          "style-src-attr": ["'unsafe-inline'"],
          "img-src": ["'self'", "data:", "blob:"],
          "connect-src": ["'self'", ...(dev ? ["ws:"] : [])],
          "font-src": ["'self'", "data:"],
          "upgrade-insecure-requests": env().APP_URL.startsWith("https:") ? [] : null,
        },
      },
      crossOriginEmbedderPolicy: false,
      strictTransportSecurity: env().APP_URL.startsWith("https:"),
    }),
  );
  app.use(compressedResponses());
  app.use(publicUrl(env().APP_URL));
  app.use(originGuard(env().APP_URL));
  app.use(privateResponses());

  // Liveness and readiness for load balancers (server/readiness.server.ts).
  const health = healthRoutes();
  app.use(health.drain);
  app.get("/healthz", health.healthz);
  app.get("/readyz", health.readyz);

  if (options.devMiddleware) {
    app.use(options.devMiddleware);
  } else {
    const clientDir = options.clientDir ?? path.resolve("build/client");
    // Hashed file names: safe to cache for a year.
    app.use("/assets", express.static(path.join(clientDir, "assets"), { immutable: true, maxAge: "1y", index: false }));
    app.use(express.static(clientDir, { maxAge: "1h", index: false }));
  }
  app.use(express.static("public", { maxAge: "1h", index: false }));

  // The embedded strip alone may be framed by any site.
  app.use((req: Request, res: Response, next: NextFunction) => {
    if (isEmbedPath(req.path)) allowFraming(res);
    next();
  });
  const build = options.build ?? loadServerBuild;
  const renderPage = createFetchHandler(build, dev ? "development" : "production");
  app.use(
    visitorPages({
      buildId: async () => (typeof build === "function" ? await build() : build).assets.version,
      render: (request) => renderPage(request, { cspNonce: "" }),
      origin: env().APP_URL,
    }),
  );

  app.all(
    "*",
    createRequestHandler({
      build,
      mode: dev ? "development" : "production",
      getLoadContext: (_req, res) => ({ cspNonce: res.locals.cspNonce as string }),
    }),
  );
  return app;
}

export interface StartOptions extends AppOptions {
  /** Refuse to start while db/migrations in this folder has migrations the database has not run. */
  migrationsDir?: string;
  /** Overrides PORT (0: any free port). */
  port?: number;
  /** Runs after the server stopped taking requests (e.g. closing Vite). */
  onStop?: () => Promise<void>;
  /** Listen for SIGTERM/SIGINT and exit after a graceful stop (default true). */
  handleSignals?: boolean;
}

export interface Running {
  server: Server;
  url: string;
  /** Stops taking requests, lets the running ones finish, stops the workers and closes the pool. */
  stop(): Promise<void>;
}

/** Thrown by start() when the server must not run; the message says what to do. */
export class StartError extends Error {
  override name = "StartError";
}

export async function start(options: StartOptions = {}): Promise<Running> {
  const config = env(); // throws a readable message when the environment is not valid
  if (options.migrationsDir) {
    const pending = await pendingMigrations(sequelize, options.migrationsDir);
    if (pending.length) {
      throw new StartError(
        `Eonscale will not start: the database schema is out of date (${pending.length} migration${pending.length === 1 ? "" : "s"} not run: ${pending.join(", ")}).\n` +
          "Run the migrations first: DATABASE_URL=… npx tsx db/cli.ts migrate",
      );
    }
  }
  // Production: the build resolved once (React Router derives its route table from a build object
  // once; given a function it calls it and derives the table again on every request).
  const build = options.build ?? (options.devMiddleware ? undefined : await loadServerBuild());
  const app = createApp({ ...options, build });
  if (config.RUN_WORKERS === "true") await startWorkers();

  const server = app.listen(options.port ?? config.PORT, config.HOST);
  // An idle keep-alive connection stays open 65 s, longer than a load balancer's usual 60 s idle
  // timeout (Node's own default is 5 s), so a balancer or client never reuses a connection the server
  // is just closing — that race answers a request with a reset (common practice for Node behind a
  // balancer). The headers of a request must arrive sooner than that.
  server.keepAliveTimeout = 65_000;
  server.headersTimeout = 66_000;
  await new Promise<void>((resolve, reject) => {
    server.once("listening", resolve);
    server.once("error", reject);
  });
  const { port } = server.address() as AddressInfo;
  const url = `http://${config.HOST}:${port}`;
  appLogger.info({ url }, "Eonscale is listening");

  let stopping: Promise<void> | undefined;
  const stop = () => {
    stopping ??= (async () => {
      // Readiness turns 503 and this server takes no new jobs; requests in flight finish.
      startDraining();
      await stopTakingJobs().catch((error) => appLogger.error({ err: error }, "pausing the workers failed"));
      const closed = new Promise<void>((resolve) => server.close(() => resolve()));
      server.closeIdleConnections();
      // Requests in flight get up to 8 s to finish; then their connections are cut.
      const cut = setTimeout(() => server.closeAllConnections(), 8_000);
      await closed;
      clearTimeout(cut);
      await options.onStop?.().catch((error) => appLogger.error({ err: error }, "stop hook failed"));
      await stopBoss().catch((error) => appLogger.error({ err: error }, "stopping the job queue failed"));
      await closeDatabase().catch(() => {});
    })();
    return stopping;
  };

  if (options.handleSignals !== false) {
    const onSignal = (signal: NodeJS.Signals) => {
      appLogger.info({ signal }, "shutting down");
      const force = setTimeout(() => process.exit(1), 15_000);
      force.unref();
      void stop().then(() => process.exit(0));
    };
    process.once("SIGTERM", onSignal);
    process.once("SIGINT", onSignal);
  }
  return { server, url, stop };
}
