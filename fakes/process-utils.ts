// Small helpers shared by the background service processes (fakes/s3.ts, fakes/smtp.ts).
import { readFileSync, rmSync, writeFileSync } from "node:fs";

export function writePidFile(file: string): void {
  writeFileSync(file, `${process.pid}\n`);
}

function removeOwnPidFile(file: string): void {
  try {
    if (readFileSync(file, "utf8").trim() === String(process.pid)) rmSync(file, { force: true });
  } catch {
    // already gone
  }
}

/**
 * On SIGTERM/SIGINT: run `close` (bounded by `graceMs`), remove our pid file and exit 0.
 * The bound keeps `npm run services:stop` and SMTP restarts in tests fast even when a client
 * is still connected.
 */
export function onShutdown(pidFile: string, close: () => Promise<void>, graceMs = 1500): void {
  let stopping = false;
  const stop = (signal: NodeJS.Signals) => {
    if (stopping) return;
    stopping = true;
    console.log(`[${new Date().toISOString()}] ${signal}: shutting down`);
    const force = setTimeout(() => {
      removeOwnPidFile(pidFile);
      process.exit(0);
    }, graceMs);
    force.unref();
    close()
      .catch((error) => console.error("error while closing:", error))
      .finally(() => {
        removeOwnPidFile(pidFile);
        process.exit(0);
      });
  };
  process.on("SIGTERM", stop);
  process.on("SIGINT", stop);
  process.on("exit", () => removeOwnPidFile(pidFile));
}
