// App server processes for tests that need more than one (scale-out, faults, load): each is started
// the way `npm run serve` starts it — server/index.ts importing the production build
// (EONSCALE_BUILD_DIR) — with the environment the test gives it, and stopped with a signal.
import { spawn, type ChildProcess } from "node:child_process";
import { createServer, request as httpRequest, type IncomingMessage, type Server } from "node:http";
import type { AddressInfo } from "node:net";

export interface AppProcess {
  name: string;
  port: number;
  url: string;
  child: ChildProcess;
  /** stdout and stderr so far (JSON log lines), for failure messages. */
  output(): string;
  /** Sends a signal (default SIGTERM) and resolves with the exit code and how long the stop took. */
  stop(signal?: NodeJS.Signals): Promise<{ code: number | null; ms: number }>;
}

/** The environment of a production server: the test's own, without vitest's variables. */
export function serverEnv(extra: Record<string, string>): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: "production", HOST: "127.0.0.1", ...extra };
  for (const key of Object.keys(env)) if (key.startsWith("VITEST") || key === "TEST") delete env[key];
  return env;
}

export async function startAppProcess(name: string, port: number, env: Record<string, string>, opts: { timeoutMs?: number } = {}): Promise<AppProcess> {
  const child = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], { env: serverEnv({ ...env, PORT: String(port) }), stdio: ["ignore", "pipe", "pipe"] });
  let out = "";
  child.stdout!.on("data", (b: Buffer) => (out += b.toString()));
  child.stderr!.on("data", (b: Buffer) => (out += b.toString()));
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + (opts.timeoutMs ?? 90_000);
  for (;;) {
    const ok = await fetch(`${url}/healthz`).then((r) => r.ok, () => false);
    if (ok) break;
    if (child.exitCode !== null) throw new Error(`app server ${name} exited with code ${child.exitCode}:\n${out.slice(-3000)}`);
    if (Date.now() > deadline) {
      child.kill("SIGKILL");
      throw new Error(`app server ${name} did not answer on ${url} in time:\n${out.slice(-3000)}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return {
    name,
    port,
    url,
    child,
    output: () => out,
    async stop(signal = "SIGTERM") {
      const started = Date.now();
      if (child.exitCode !== null || child.signalCode !== null) return { code: child.exitCode, ms: 0 };
      const exited = new Promise<number | null>((resolve) => child.once("exit", (code) => resolve(code)));
      child.kill(signal);
      const code = await exited;
      return { code, ms: Date.now() - started };
    },
  };
}

/**
 * A minimal load balancer on loopback: every request goes to the backend named by its
 * `x-backend` header (the test chooses), with the Host header kept as the balancer's own and the
 * client address in X-Forwarded-For — what the servers see behind a real one (APP_URL = its URL).
 */
export async function startBalancer(backends: () => Record<string, number>): Promise<{ url: string; close(): Promise<void> }> {
  const server: Server = createServer((req, res) => {
    const which = String(req.headers["x-backend"] ?? "");
    const port = backends()[which];
    if (!port) {
      res.writeHead(502).end(`no backend "${which}"`);
      return;
    }
    const headers: Record<string, string | string[] | undefined> = { ...req.headers, "x-forwarded-for": req.socket.remoteAddress ?? "127.0.0.1" };
    delete headers["x-backend"];
    const upstream = httpRequest({ host: "127.0.0.1", port, method: req.method, path: req.url, headers }, (answer: IncomingMessage) => {
      res.writeHead(answer.statusCode ?? 502, answer.headers);
      answer.pipe(res);
    });
    upstream.on("error", (error) => {
      if (!res.headersSent) res.writeHead(502).end(`backend ${which} unreachable: ${error.message}`);
      else res.destroy();
    });
    req.pipe(upstream);
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise<void>((resolve) => {
        server.closeAllConnections();
        server.close(() => resolve());
      }),
  };
}

/** A TCP server that accepts connections and never says a word: an SMTP server that hangs. */
export async function startSilentServer(): Promise<{ port: number; close(): Promise<void> }> {
  const { createServer: createTcp } = await import("node:net");
  const sockets = new Set<import("node:net").Socket>();
  const server = createTcp((socket) => {
    sockets.add(socket);
    socket.on("close", () => sockets.delete(socket));
    socket.on("error", () => {});
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  return {
    port: (server.address() as AddressInfo).port,
    close: () =>
      new Promise<void>((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}

/**
 * A TCP relay in front of a service (Postgres, S3, SMTP) that a test can cut and restore: to the
 * app behind it, a cut looks exactly like the service going away (open connections reset, new ones
 * refused), and nothing else using the service is disturbed.
 */
export async function startCuttableRelay(targetPort: number): Promise<{ port: number; cut(): Promise<void>; restore(): Promise<void> }> {
  const net = await import("node:net");
  const sockets = new Set<import("node:net").Socket>();
  const track = (s: import("node:net").Socket) => {
    sockets.add(s);
    s.on("close", () => sockets.delete(s));
    s.on("error", () => s.destroy());
  };
  let server = makeServer();
  function makeServer() {
    return net.createServer((client) => {
      const upstream = net.connect(targetPort, "127.0.0.1");
      track(client);
      track(upstream);
      client.pipe(upstream);
      upstream.pipe(client);
      client.on("close", () => upstream.destroy());
      upstream.on("close", () => client.destroy());
    });
  }
  const listen = (port: number) => new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  await listen(0);
  const port = (server.address() as AddressInfo).port;
  return {
    port,
    async cut() {
      await new Promise<void>((resolve) => {
        server.close(() => resolve());
        for (const s of sockets) s.destroy();
      });
    },
    async restore() {
      server = makeServer();
      await listen(port);
    },
  };
}

/** Polls `fn` until it returns something truthy (errors count as "not yet"). */
export async function until<T>(what: string, fn: () => Promise<T | null | undefined | false>, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await fn().catch(() => null);
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 200));
  }
}

/** A fresh copy of the test template database under `name` (retried while the template is busy). */
export async function copyTemplateDatabase(name: string, template: string) {
  const { dropDatabase, ensureDatabase } = await import("../../fakes/services.ts");
  await dropDatabase(name);
  for (let attempt = 1; ; attempt++) {
    try {
      await ensureDatabase(name, { template });
      return;
    } catch (error) {
      // 55006: another process has the template open for a moment.
      if ((error as { code?: string }).code !== "55006" || attempt === 20) throw error;
      await new Promise((r) => setTimeout(r, 200 * attempt));
    }
  }
}
