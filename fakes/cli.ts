// npm run services:start|stop|status, and `exec` for commands that need the stand-ins' addresses:
//   npx tsx fakes/cli.ts start|stop|restart|status [pg|s3|smtp ...] [--quiet]
//   npx tsx fakes/cli.ts exec -- <command> [args…]   (runs it with DATABASE_URL, SMTP_URL, … set)
import { spawnSync } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { serviceConfig } from "./config.ts";
import { ServiceError, serviceStatus, startServices, stopServices, type ServiceName } from "./services.ts";

async function main(argv: string[]): Promise<number> {
  if (argv[0] === "exec") {
    const [command, ...args] = argv.slice(argv[1] === "--" ? 2 : 1);
    if (!command) throw new ServiceError("usage: npx tsx fakes/cli.ts exec -- <command> [args…]");
    const env = { ...serviceConfig().env, ...process.env };
    const result = spawnSync(command, args, { stdio: "inherit", env });
    return result.status ?? 1;
  }
  const quiet = argv.includes("--quiet") || argv.includes("-q");
  const [command = "status", ...rest] = argv.filter((a) => !a.startsWith("-"));
  const only = rest as ServiceName[];
  switch (command) {
    case "start":
      await startServices({ only, quiet });
      return 0;
    case "stop":
      await stopServices({ only, quiet });
      return 0;
    case "restart":
      await stopServices({ only, quiet });
      await startServices({ only, quiet });
      return 0;
    case "status": {
      const statuses = await serviceStatus({ only });
      for (const s of statuses) {
        console.log(`  ${s.name.padEnd(5)} ${(s.running ? "running" : "stopped").padEnd(8)} ${s.pid ? `pid ${s.pid}`.padEnd(11) : "".padEnd(11)} ${s.detail}`);
      }
      return statuses.every((s) => s.running) ? 0 : 1;
    }
    default:
      console.error("usage: npx tsx fakes/cli.ts start|stop|restart|status [pg|s3|smtp ...] [--quiet] | exec -- <command>");
      return 2;
  }
}

if (process.argv[1] !== undefined && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  // The AWS SDK warns on every run that future releases will need Node 22; not actionable here.
  process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED ??= "true";
  main(process.argv.slice(2)).then(
    (code) => process.exit(code),
    (error: unknown) => {
      console.error(error instanceof ServiceError ? `error: ${error.message}` : error);
      process.exit(1);
    },
  );
}
