// The HTTP layer in front of every route: one Origin check for every state-changing request
// (pages, resource routes without a component, /api/*), the public address from APP_URL, client
// addresses through a counted number of proxies, private caching of studio and signed-in responses,
// tokens kept out of the request log, and the local inbox for this computer only.
import { once } from "node:events";
import { networkInterfaces } from "node:os";
import type { AddressInfo } from "node:net";
import { Writable } from "node:stream";
import express from "express";
import pino from "pino";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createApp } from "../../server/app.ts";
import { cacheControlFor, PRIVATE_NO_STORE } from "../../server/cache-policy.server.ts";
import { env, loadEnv } from "../../server/env.server.ts";
import { checkOrigin, originGuard, publicUrl } from "../../server/origin.server.ts";
import { inboxPage } from "../../fakes/inbox-page.ts";

const fakeBuild = async () => {
  throw new Error("no React Router build in this test: the request reached the route handler");
};

async function serve(app: express.Express, host = "127.0.0.1") {
  const server = app.listen(0, host);
  await once(server, "listening");
  return { server, base: `http://${host}:${(server.address() as AddressInfo).port}` };
}

describe("one Origin check for every state-changing request", () => {
  const lines: string[] = [];
  const memory = pino({ level: "info" }, new Writable({ write: (chunk, _enc, done) => (lines.push(String(chunk)), done()) }));
  let base = "";
  let close = () => {};
  const publicOrigin = new URL(env().APP_URL).origin;

  beforeAll(async () => {
    const s = await serve(createApp({ build: fakeBuild as never, clientDir: "/nonexistent", logger: memory }));
    base = s.base;
    close = () => s.server.close();
  });
  afterAll(() => close());

  const post = (path: string, headers: Record<string, string>, method = "POST") =>
    fetch(`${base}${path}`, { method, headers: { "Content-Type": "application/x-www-form-urlencoded", ...headers }, body: method === "DELETE" ? undefined : "x=1", redirect: "manual" });

  it("refuses another origin on routes with and without a component and on the API (403 with the reason), before any route runs", async () => {
    const cases: [string, string, Record<string, string>][] = [
      ["POST", "/logout", { Origin: "https://evil.example" }],
      ["POST", "/studio/switch-organisation", { Origin: "https://evil.example" }],
      ["POST", "/login", { Origin: "http://127.0.0.1:1" }],
      ["POST", "/studio/team", { Origin: "null" }],
      ["POST", "/api/assets", { Origin: "https://evil.example" }],
      ["DELETE", "/api/assets/1", { Origin: "https://evil.example" }],
      ["POST", "/logout", { "Sec-Fetch-Site": "cross-site" }],
      ["POST", "/logout", { "Sec-Fetch-Site": "same-site" }],
      ["POST", "/logout", { Referer: "https://evil.example/page" }],
      ["PUT", "/studio/exhibits/x", { Origin: publicOrigin.replace("http:", "https:") }],
    ];
    for (const [method, path, headers] of cases) {
      const res = await post(path, headers, method);
      const text = await res.text();
      expect([method, path, headers, res.status]).toEqual([method, path, headers, 403]);
      expect(res.headers.get("cache-control")).toBe("no-store");
      if (path.startsWith("/api/")) expect(JSON.parse(text).error).toMatch(/refused because it was sent from https:\/\/evil\.example/);
      else expect(text).toContain(`not from ${publicOrigin}`);
    }
  });

  it("lets the public origin, same-origin fetch metadata, a same-origin Referer and non-browser clients through to the route", async () => {
    const cases: Record<string, string>[] = [{ Origin: publicOrigin }, { "Sec-Fetch-Site": "same-origin" }, { Referer: `${publicOrigin}/login` }, {}];
    for (const headers of cases) {
      const res = await post("/logout", headers);
      // The fake build answers 500: the request got past the check to the route handler.
      expect([headers, res.status]).toEqual([headers, 500]);
    }
    // Reading never needs an Origin.
    expect((await fetch(`${base}/healthz`, { headers: { Origin: "https://evil.example" } })).status).toBe(200);
  });

  it("the check is pure: headers in, verdict out", () => {
    expect(checkOrigin({ origin: "https://eonscale.example" }, "https://eonscale.example")).toEqual({ ok: true });
    expect(checkOrigin({ origin: "https://eonscale.example.evil.example" }, "https://eonscale.example").ok).toBe(false);
    expect(checkOrigin({ referer: "not a url" }, "https://eonscale.example")).toEqual({ ok: false, reason: "its Referer is not an address" });
  });

  it("reset and invitation tokens never reach the request log (path, .data requests, Referer)", async () => {
    const token = "S3cr3t-T0ken_abcdefghijklmnopqrstuvwxyz012345";
    await fetch(`${base}/reset-password/${token}`);
    await fetch(`${base}/invite/${token}.data?_routes=routes%2Finvite`, { headers: { Referer: `${publicOrigin}/invite/${token}` } });
    await post(`/reset-password/${token}`, { Origin: publicOrigin, Referer: `${publicOrigin}/reset-password/${token}` });
    await new Promise((r) => setTimeout(r, 50));
    const logged = lines.filter((l) => /reset-password|invite/.test(l));
    expect(logged.length).toBeGreaterThanOrEqual(3);
    expect(logged.join("\n")).not.toContain(token);
    expect(logged.join("\n")).toContain("/invite/[token].data");
    expect(logged.join("\n")).toContain("/reset-password/[token]");
  });
});

describe("the public address and the client's address behind proxies", () => {
  it("behind a TLS proxy (APP_URL https, TRUST_PROXY=0) the request URL is the public one and same-origin posts pass", async () => {
    const app = express();
    app.set("trust proxy", loadEnv({ ...process.env, TRUST_PROXY: "0" }).TRUST_PROXY);
    app.use(publicUrl("https://eonscale.example"));
    app.use(originGuard("https://eonscale.example"));
    app.all("*", (req, res) => {
      res.json({ url: `${req.protocol}://${req.get("host")}${req.originalUrl}`, hostname: req.hostname });
    });
    const { server, base } = await serve(app);
    try {
      const res = await fetch(`${base}/login?x=1`, { method: "POST", headers: { Origin: "https://eonscale.example", Host: "internal:8080", "X-Forwarded-Host": "evil.example" } });
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual({ url: "https://eonscale.example/login?x=1", hostname: "eonscale.example" });
      expect((await fetch(`${base}/login`, { method: "POST", headers: { Origin: "http://eonscale.example" } })).status).toBe(403);
    } finally {
      server.close();
    }
  });

  it("TRUST_PROXY counts hops: a made-up X-Forwarded-For never changes the client address the limits count by", async () => {
    expect(loadEnv({ ...process.env, TRUST_PROXY: "1" }).TRUST_PROXY).toBe(1);
    expect(loadEnv({ ...process.env, TRUST_PROXY: "true" }).TRUST_PROXY).toBe(1);
    expect(loadEnv({ ...process.env, TRUST_PROXY: "false" }).TRUST_PROXY).toBe(0);
    expect(loadEnv({ ...process.env, TRUST_PROXY: undefined }).TRUST_PROXY).toBe(0);
    expect(() => loadEnv({ ...process.env, TRUST_PROXY: "yes" })).toThrow(/TRUST_PROXY must be the number of trusted proxy hops/);
    for (const [hops, expected] of [[1, "198.51.100.7"], [0, "127.0.0.1"]] as const) {
      const app = express();
      app.set("trust proxy", hops);
      app.get("/", (req, res) => {
        res.send(req.ip?.replace(/^::ffff:/, ""));
      });
      const { server, base } = await serve(app);
      try {
        // The load balancer appends the address it saw (198.51.100.7); what the client wrote before it is ignored.
        const seen = await Promise.all(
          ["203.0.113.1", "203.0.113.2, 10.0.0.1", "garbage"].map(async (made) => (await fetch(base, { headers: { "X-Forwarded-For": `${made}, 198.51.100.7` } })).text()),
        );
        expect([hops, seen]).toEqual([hops, [expected, expected, expected]]);
      } finally {
        server.close();
      }
    }
  });
});

describe("caching: a shared cache never keeps a studio page or a signed-in response", () => {
  it("decides from the path, the session cookie and what the route set", () => {
    const none = { studio: false, signedIn: false, setsCookie: false };
    expect(cacheControlFor({ ...none, studio: true, routeValue: "" })).toBe(PRIVATE_NO_STORE);
    expect(cacheControlFor({ ...none, studio: true, routeValue: "public, max-age=60" })).toBe(PRIVATE_NO_STORE);
    expect(cacheControlFor({ ...none, signedIn: true, routeValue: "" })).toBe(PRIVATE_NO_STORE);
    expect(cacheControlFor({ ...none, signedIn: true, routeValue: "no-cache" })).toBe(PRIVATE_NO_STORE);
    expect(cacheControlFor({ ...none, signedIn: true, routeValue: "public, max-age=31536000, immutable" })).toBe("public, max-age=31536000, immutable");
    expect(cacheControlFor({ ...none, signedIn: true, routeValue: "private, max-age=60" })).toBe("private, max-age=60");
    expect(cacheControlFor({ ...none, setsCookie: true, routeValue: "public, max-age=60" })).toBe(PRIVATE_NO_STORE);
    expect(cacheControlFor({ ...none, routeValue: "public, max-age=300" })).toBe("public, max-age=300");
    expect(cacheControlFor({ ...none, routeValue: "" })).toBe("");
  });

  it("is applied to what the app answers (studio paths and .data, signed-in requests)", async () => {
    const { server, base } = await serve(createApp({ build: fakeBuild as never, clientDir: "/nonexistent", logger: pino({ level: "silent" }) }));
    try {
      for (const path of ["/studio", "/studio.data", "/studio/team.data", "/studio/exhibits/x"]) {
        expect([path, (await fetch(`${base}${path}`)).headers.get("cache-control")]).toEqual([path, PRIVATE_NO_STORE]);
      }
      expect((await fetch(`${base}/editions`, { headers: { Cookie: "en_session=abc" } })).headers.get("cache-control")).toBe(PRIVATE_NO_STORE);
      expect((await fetch(`${base}/editions`)).headers.get("cache-control")).toBeNull();
    } finally {
      server.close();
    }
  });
});

describe("/dev/mail, the local inbox", () => {
  it("answers loopback clients and is 404 for any other address", async () => {
    const app = express();
    app.use("/dev/mail", inboxPage());
    const { server } = await serve(app, "0.0.0.0");
    const port = (server.address() as AddressInfo).port;
    try {
      const local = await fetch(`http://127.0.0.1:${port}/dev/mail`);
      expect(local.status).toBe(200);
      expect(await local.text()).toMatch(/only to browsers on this computer/);
      // A forwarded header claiming loopback changes nothing.
      const lan = Object.values(networkInterfaces()).flat().find((i) => i && i.family === "IPv4" && !i.internal);
      if (lan) {
        const remote = await fetch(`http://${lan.address}:${port}/dev/mail`, { headers: { "X-Forwarded-For": "127.0.0.1" } });
        expect(remote.status).toBe(404);
        expect(await remote.text()).not.toMatch(/reset-password|invite/);
      } else {
        console.info("no non-loopback interface on this machine: the remote half of the /dev/mail check was skipped");
      }
    } finally {
      server.close();
    }
  });
});
