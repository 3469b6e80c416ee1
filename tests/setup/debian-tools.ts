// Debian command-line tools some tests check files with (xmllint from libxml2-utils, pdftoppm from
// poppler-utils, …): found on PATH, or installed with apt-get when missing and this process runs as
// root (as the test setup does for Chromium); without root, the error names the command to run.
import { spawn } from "node:child_process";
import { access, constants } from "node:fs/promises";
import path from "node:path";

async function onPath(command: string): Promise<string | null> {
  for (const dir of (process.env.PATH ?? "/usr/bin:/bin").split(path.delimiter)) {
    const file = path.join(dir, command);
    try {
      await access(file, constants.X_OK);
      return file;
    } catch {
      // not in this folder
    }
  }
  return null;
}

/** Runs a command; resolves with its exit code, standard output and standard error. */
export function runCommand(command: string, args: string[], options: { input?: string } = {}): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { stdio: [options.input === undefined ? "ignore" : "pipe", "pipe", "pipe"], env: { ...process.env, DEBIAN_FRONTEND: "noninteractive" } });
    let stdout = "";
    let stderr = "";
    child.stdout?.on("data", (d: Buffer) => (stdout += d.toString()));
    child.stderr?.on("data", (d: Buffer) => (stderr += d.toString()));
    child.on("error", reject);
    child.on("close", (code) => resolve({ code: code ?? 1, stdout, stderr }));
    if (child.stdin) {
      child.stdin.on("error", () => {}); // the command may exit before reading its input
      child.stdin.end(options.input);
    }
  });
}

const pending = new Map<string, Promise<string>>();

/** The path of `command`, installing Debian package `pkg` first when it is missing. */
export function ensureDebianCommand(command: string, pkg: string): Promise<string> {
  let p = pending.get(command);
  if (!p) {
    p = (async () => {
      const found = await onPath(command);
      if (found) return found;
      const isRoot = typeof process.getuid === "function" && process.getuid() === 0;
      if (!isRoot) throw new Error(`${command} is not installed. Install it with:\n  sudo apt-get update && sudo apt-get install -y ${pkg}`);
      console.log(`[tests] ${command} is missing; installing Debian's ${pkg}…`);
      for (const args of [["update"], ["install", "-y", pkg]]) {
        const r = await runCommand("apt-get", args);
        if (r.code !== 0) throw new Error(`apt-get ${args.join(" ")} failed (exit ${r.code}): ${r.stderr.slice(-500)}`);
      }
      const installed = await onPath(command);
      if (!installed) throw new Error(`apt-get installed ${pkg} but ${command} is still not on PATH`);
      return installed;
    })();
    pending.set(command, p);
    p.catch(() => pending.delete(command));
  }
  return p;
}
