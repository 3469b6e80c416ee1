// Module resolve hook (runs on Node's loader thread): appends each resolved file URL to the log.
import { appendFileSync } from "node:fs";

const log = process.env.EONSCALE_MODULE_LOG;

export async function resolve(specifier, context, nextResolve) {
  const result = await nextResolve(specifier, context);
  if (log && result.url.startsWith("file:")) appendFileSync(log, `${result.url}\n`);
  return result;
}
