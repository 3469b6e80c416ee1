// Structured JSON logging (pino). One logger per process.
import pino from "pino";

export const logger = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === "test" ? "warn" : "info"),
  base: { service: "eonscale" },
  redact: { paths: ["req.headers.cookie", "req.headers.authorization", "res.headers[\"set-cookie\"]"], remove: true },
});
