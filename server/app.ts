// The Express application: security headers, compression, static files, health check, logging,
// and the React Router request handler. Used by server/index.ts in production and development.
import { randomBytes } from "node:crypto";
import path from "node:path";
import { createRequestHandler } from "@react-router/express";
import compression from "compression";
import express, { type Request, type Response, type NextFunction } from "express";
import helmet from "helmet";
import { pinoHttp } from "pino-http";
import type { ServerBuild } from "react-router";
import { sequelize } from "./db.server.ts";
import { CLIENT_IP_HEADER } from "./auth.server.ts";
import { env } from "./env.server.ts";
import { logger } from "./logger.server.ts";

declare module "react-router" {
  interface AppLoadContext {
    cspNonce: string;
  }
}

export interface AppOptions {
  build: ServerBuild | (() => Promise<ServerBuild>);
  /** Vite dev middleware (development only). */
  devMiddleware?: express.RequestHandler;
  clientDir?: string;
}

export async function healthCheck(db = sequelize): Promise<boolean> {
  try {
    await db.query("SELECT 1");
    return true;
  } catch {
    return false;
  }
}

export function createApp(options: AppOptions) {
  const app = express();
  const dev = Boolean(options.devMiddleware);
  app.disable("x-powered-by");
  if (env().TRUST_PROXY === "true") app.set("trust proxy", true);

  app.use(
    pinoHttp({
      logger,
      autoLogging: { ignore: (req) => req.url === "/healthz" || req.url?.startsWith("/assets/") === true },
      customLogLevel: (_req, res, err) => (err || res.statusCode >= 500 ? "error" : res.statusCode >= 400 ? "warn" : "info"),
    }),
  );

  app.use((req: Request, res: Response, next: NextFunction) => {
    res.locals.cspNonce = randomBytes(16).toString("base64");
    // The client address the sign-in rate limit counts by; never trusted from the request itself.
    req.headers[CLIENT_IP_HEADER] = req.ip ?? req.socket.remoteAddress ?? "unknown";
    next();
  });

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: true,
        directives: {
          "script-src": ["'self'", (_req, res) => `'nonce-${(res as Response).locals.cspNonce}'`, ...(dev ? ["'unsafe-inline'"] : [])],
          "style-src": ["'self'", "'unsafe-inline'"],
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
  app.use(compression());

  app.get("/healthz", async (_req, res) => {
    const ok = await healthCheck();
    res.status(ok ? 200 : 503).set("Cache-Control", "no-store").json(ok ? { ok: true } : { ok: false, error: "database unreachable" });
  });

  if (options.devMiddleware) {
    app.use(options.devMiddleware);
  } else {
    const clientDir = options.clientDir ?? path.resolve("build/client");
    // Hashed file names: safe to cache for a year.
    app.use("/assets", express.static(path.join(clientDir, "assets"), { immutable: true, maxAge: "1y", index: false }));
    app.use(express.static(clientDir, { maxAge: "1h", index: false }));
  }
  app.use(express.static("public", { maxAge: "1h", index: false }));

  app.all(
    "*",
    createRequestHandler({
      build: options.build,
      mode: dev ? "development" : "production",
      getLoadContext: (_req, res) => ({ cspNonce: res.locals.cspNonce as string }),
    }),
  );
  return app;
}
