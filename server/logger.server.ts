// Structured JSON logging (pino). One logger per process.
import pino from "pino";

export const logger = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === "test" ? "warn" : "info"),
  base: { service: "eonscale" },
  redact: { paths: ["req.headers.cookie", "req.headers.authorization", "res.headers[\"set-cookie\"]"], remove: true },
});

/** Paths whose last segment is a secret (single-use links from e-mails): never written to a log. */
const TOKEN_PATHS = /\/(reset-password|invite)\/[^/?#.]+/g;

/** The URL with reset and invitation tokens replaced by "[token]". */
export function redactTokens(url: string | undefined): string | undefined {
  return url?.replace(TOKEN_PATHS, "/$1/[token]");
}

/** pino-http's request serializer: the standard fields, with tokens taken out of the URL and the Referer. */
export function requestForLog(req: { url?: string; headers?: Record<string, unknown> } & Record<string, unknown>) {
  const headers = req.headers && typeof req.headers.referer === "string" ? { ...req.headers, referer: redactTokens(req.headers.referer) } : req.headers;
  return { ...req, url: redactTokens(req.url), headers };
}
