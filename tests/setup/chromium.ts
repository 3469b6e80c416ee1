// Debian's Chromium for browser tests. Playwright cannot download its own browsers on this
// machine, so playwright-core drives the system package at /usr/bin/chromium.
import { spawn } from "node:child_process";
import { access, constants } from "node:fs/promises";
import { chromium, type Browser, type LaunchOptions } from "playwright-core";

export const CHROMIUM_PATH = "/usr/bin/chromium";
export const CHROMIUM_INSTALL_COMMAND =
  "sudo apt-get update && sudo DEBIAN_FRONTEND=noninteractive apt-get install -y chromium";

export const chromiumArgs = [
  "--headless",
  "--no-sandbox",
  "--disable-gpu",
  "--disable-background-networking",
  "--disable-quic",
  "--no-first-run",
  "--disable-component-update",
  "--disable-sync",
];

async function isExecutable(file: string): Promise<boolean> {
  try {
    await access(file, constants.X_OK);
    return true;
  } catch {
    return false;
  }
}

function run(command: string, args: string[]): Promise<void> {
  return new Promise((resolve, reject) => {
    console.log(`[chromium] $ ${command} ${args.join(" ")}`);
    const child = spawn(command, args, {
      stdio: ["ignore", "inherit", "inherit"],
      env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" },
    });
    child.on("error", reject);
    child.on("exit", (code, signal) =>
      code === 0
        ? resolve()
        : reject(new Error(`${command} ${args.join(" ")} failed (${signal ?? `exit ${code}`})`)),
    );
  });
}

let pending: Promise<string> | undefined;

/**
 * Returns the path of Debian's Chromium, installing the package first when it is missing and
 * this process runs as root. Without root it throws with the command to run.
 */
export function ensureChromium(): Promise<string> {
  pending ??= (async () => {
    if (await isExecutable(CHROMIUM_PATH)) return CHROMIUM_PATH;
    const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
    if (!isRoot) {
      throw new Error(
        `Chromium is not installed (${CHROMIUM_PATH} is missing). Install it with:\n  ${CHROMIUM_INSTALL_COMMAND}`,
      );
    }
    console.log("[chromium] /usr/bin/chromium is missing; installing Debian's chromium package…");
    await run("apt-get", ["update"]);
    await run("apt-get", ["install", "-y", "chromium"]);
    if (!(await isExecutable(CHROMIUM_PATH))) {
      throw new Error(`apt-get installed chromium but ${CHROMIUM_PATH} is still missing`);
    }
    console.log(`[chromium] installed ${CHROMIUM_PATH}`);
    return CHROMIUM_PATH;
  })();
  // A failed attempt may be retried later (e.g. after the user installed the package by hand).
  pending.catch(() => {
    pending = undefined;
  });
  return pending;
}

/** Launches headless Chromium through playwright-core. Extra args are appended. */
export async function launchBrowser(options: LaunchOptions = {}): Promise<Browser> {
  const executablePath = await ensureChromium();
  return chromium.launch({
    ...options,
    executablePath,
    args: [...chromiumArgs, ...(options.args ?? [])],
  });
}
