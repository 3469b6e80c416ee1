// Compressed streamed responses: React Router's way of writing a stream (wait for "drain" after a
// write the socket cannot take at once, then take the listener back) must not leave a listener on
// compression's zlib stream per wait. A real HTTP server and client; the page is 4 MB of random
// bytes (they do not compress, so nearly every 64 KB write has to wait).
import { once } from "node:events";
import { createHash, randomBytes } from "node:crypto";
import type { AddressInfo } from "node:net";
import { request } from "node:http";
import { gunzipSync } from "node:zlib";
import compression from "compression";
import express, { type RequestHandler } from "express";
import { writeReadableStreamToWritable } from "@react-router/node";
import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { compressedResponses } from "../../server/compression.server.ts";

const chunks = Array.from({ length: 64 }, () => randomBytes(64 * 1024));
const sha = (b: Buffer) => createHash("sha256").update(b).digest("hex");
const whole = sha(Buffer.concat(chunks));

/** GET the page through `middleware` with this Accept-Encoding: the body as sent (decompressed) and its Content-Encoding. */
async function fetchPage(middleware: RequestHandler[], encoding: string): Promise<{ body: Buffer; contentEncoding: string | undefined; waits: number }> {
  const app = express();
  let waits = 0;
  app.use(middleware);
  app.get("/page", async (_req, res) => {
    res.type("text/html");
    const once = res.once;
    res.once = function (this: typeof res, event: string | symbol, listener: (...args: unknown[]) => void) {
      if (event === "drain") waits++;
      return once.call(this, event, listener);
    } as typeof res.once;
    let i = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(c) {
        if (i < chunks.length) c.enqueue(chunks[i++]);
        else c.close();
      },
    });
    await writeReadableStreamToWritable(stream, res);
  });
  const server = app.listen(0, "127.0.0.1");
  await once(server, "listening");
  try {
    const { port } = server.address() as AddressInfo;
    const res = await new Promise<import("node:http").IncomingMessage>((resolve, reject) => request({ port, host: "127.0.0.1", path: "/page", headers: { "accept-encoding": encoding } }, resolve).on("error", reject).end());
    const parts: Buffer[] = [];
    for await (const p of res) parts.push(p as Buffer);
    const raw = Buffer.concat(parts);
    const contentEncoding = res.headers["content-encoding"];
    return { body: contentEncoding === "gzip" ? gunzipSync(raw) : raw, contentEncoding, waits };
  } finally {
    server.close();
  }
}

describe("compressed streamed responses", () => {
  const warnings: Error[] = [];
  const onWarning = (w: Error) => warnings.push(w);
  beforeEach(() => {
    warnings.length = 0;
    process.on("warning", onWarning);
  });
  afterEach(() => {
    process.off("warning", onWarning);
  });
  const leaks = () => warnings.filter((w) => w.name === "MaxListenersExceededWarning" && /drain listeners/.test(w.message));

  it("compression() alone leaves a drain listener per wait on its zlib stream (the fault repaired here)", async () => {
    const { body, contentEncoding, waits } = await fetchPage([compression()], "gzip");
    expect(contentEncoding).toBe("gzip");
    expect(sha(body)).toBe(whole);
    expect(waits).toBeGreaterThan(10);
    await new Promise((r) => setImmediate(r)); // warnings are emitted on the next tick
    expect(leaks().map((w) => w.message)).toEqual([expect.stringMatching(/11 drain listeners added to \[Gzip\]/)]);
  });

  it("with the server's middleware: the same page, every byte, and no listener left behind", async () => {
    const { body, contentEncoding, waits } = await fetchPage(compressedResponses(), "gzip");
    expect(contentEncoding).toBe("gzip");
    expect(sha(body)).toBe(whole);
    expect(waits).toBeGreaterThan(10);
    await new Promise((r) => setImmediate(r));
    expect(leaks()).toEqual([]);
  });

  it("uncompressed (a client that asks for no encoding): the waits are on the response itself, and the page arrives whole", async () => {
    const { body, contentEncoding } = await fetchPage(compressedResponses(), "identity");
    expect(contentEncoding).toBeUndefined();
    expect(sha(body)).toBe(whole);
    await new Promise((r) => setImmediate(r));
    expect(leaks()).toEqual([]);
  });
});
