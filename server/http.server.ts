// Request bodies with a size limit: Content-Length is checked first, then the stream is counted,
// so a client that lies about (or omits) the length still cannot make the server buffer more.
import { ConnectionError } from "sequelize";
import { logger } from "./logger.server.ts";

export class BodyTooLargeError extends Error {
  constructor(public limit: number) {
    super(`The request body is larger than ${limit} bytes.`);
    this.name = "BodyTooLargeError";
  }
}

export async function readBodyBytes(request: Request, limit: number): Promise<Uint8Array<ArrayBuffer>> {
  const declared = request.headers.get("content-length");
  if (declared !== null && Number(declared) > limit) throw new BodyTooLargeError(limit);
  if (!request.body) return new Uint8Array(new ArrayBuffer(0));
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => {});
      throw new BodyTooLargeError(limit);
    }
    chunks.push(value);
  }
  const body = new Uint8Array(total);
  let offset = 0;
  for (const c of chunks) {
    body.set(c, offset);
    offset += c.byteLength;
  }
  return body;
}

/** The request's form data (urlencoded or multipart), refusing bodies over `limit` bytes. */
export async function readLimitedFormData(request: Request, limit: number): Promise<FormData> {
  const body = await readBodyBytes(request, limit);
  const headers = new Headers();
  const type = request.headers.get("content-type");
  if (type) headers.set("content-type", type);
  return new Request(request.url, { method: "POST", headers, body }).formData();
}

export function megabytes(bytes: number): string {
  return `${(bytes / (1024 * 1024)).toFixed(1).replace(/\.0$/, "")} MB`;
}


export const JSON_CONTENT_TYPE = "application/json; charset=utf-8";

/** A JSON response (not cached unless `headers` says otherwise): the one way the server answers JSON. */
export function jsonResponse(status: number, body: unknown, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), { status, headers: { "Content-Type": JSON_CONTENT_TYPE, "Cache-Control": "no-store", ...headers } });
}

/** The error body every JSON endpoint uses: { error: { message, issues? } }. */
export function jsonError(status: number, message: string, headers: Record<string, string> = {}, issues?: { path: string; message: string }[]): Response {
  return jsonResponse(status, { error: issues ? { message, issues } : { message } }, headers);
}

function isRouterAnswer(error: unknown): boolean {
  return error instanceof Response || (typeof error === "object" && error !== null && (error as { type?: unknown }).type === "DataWithResponseInit");
}

/** Errors of a database that cannot be reached (stopped, refused, pool closed or exhausted). */
export function isDatabaseUnavailable(error: unknown): boolean {
  if (error instanceof ConnectionError) return true;
  const message = error instanceof Error ? error.message : "";
  return /connection manager was closed|ECONNREFUSED|Connection terminated|the database system is (starting up|shutting down)/i.test(message);
}

/**
 * An API loader or action whose unexpected errors are still JSON: 503 with Retry-After when the
 * database cannot be reached, 500 otherwise. Responses the handler throws on purpose pass through.
 */
export function jsonOnError<A>(handler: (args: A) => Response | Promise<Response>): (args: A) => Promise<Response> {
  return async (args: A) => {
    try {
      return await handler(args);
    } catch (error) {
      if (isRouterAnswer(error)) throw error;
      if (isDatabaseUnavailable(error)) return jsonError(503, "The database cannot be reached at the moment; try again in a minute.", { "Retry-After": "30" });
      logger.error({ err: error }, "API request failed");
      return jsonError(500, "Something went wrong on the server; the error has been logged.");
    }
  };
}
