// Starts, stops and reports the local stand-ins for Eonscale's hosted services, all bound to
// 127.0.0.1 and keeping their state under <repo>/.data (EONSCALE_DATA_DIR):
//   pg    PostgreSQL from Debian's packages (fakes/postgres.ts)
//   s3    s3rver (fakes/s3.ts), objects in <dataDir>/s3
//   smtp  SMTP server + HTTP inbox API (fakes/smtp.ts), mail in <dataDir>/mail
// The command line is fakes/cli.ts (npm run services:start|stop|status).
import { serviceConfig, type ServiceConfig } from "./config.ts";
import { allOpen, ensureBucket, nodeServices, runningPid, startNodeService, stopNodeService } from "./node-services.ts";
import { ensurePgInstalled, pgAccepts, placePg, postmasterInfo, startPg, stopPg } from "./postgres.ts";
import { ServiceError, withLock } from "./util.ts";

export { databaseUrl, servicePorts, serviceConfig, type ServiceConfig } from "./config.ts";
export { dropDatabase, ensureDatabase } from "./postgres.ts";
export { ServiceError } from "./util.ts";

export type ServiceName = "pg" | "s3" | "smtp";
export const serviceNames: readonly ServiceName[] = ["pg", "s3", "smtp"];

export interface ServiceOptions {
  only?: ServiceName[];
  quiet?: boolean;
}

export interface ServiceStatus {
  name: ServiceName;
  running: boolean;
  pid: number | null;
  ports: number[];
  detail: string;
}

function selected(opts?: ServiceOptions): ServiceName[] {
  const only = opts?.only?.length ? opts.only : serviceNames;
  for (const name of only) {
    if (!serviceNames.includes(name)) throw new ServiceError(`Unknown service "${name}" (use pg, s3 or smtp)`);
  }
  return serviceNames.filter((name) => only.includes(name));
}

const wasStarted = (outcome: string | undefined) => outcome !== undefined && !outcome.startsWith("already running");

/**
 * Starts the selected services (all by default). Idempotent: services already running are left
 * alone. Resolves with the configuration (and which services this call started) once every
 * service accepts connections. When one fails, the ones this call started are stopped again.
 */
export async function startServices(opts: ServiceOptions = {}): Promise<ServiceConfig & { started: ServiceName[] }> {
  let config = serviceConfig();
  const names = selected(opts);
  const log = (line: string) => {
    if (!opts.quiet) console.log(line);
  };
  const results = await withLock(config.dataDir, async () => {
    if (names.includes("pg")) {
      await ensurePgInstalled(log);
      config = await placePg(config, { deciding: true });
    }
    const services = nodeServices(config);
    const outcome: Partial<Record<ServiceName, string>> = {};
    const settled = await Promise.allSettled(
      names.map(async (name) => {
        if (name === "pg") outcome.pg = await startPg(config, log);
        else {
          outcome[name] = await startNodeService(config, services[name]);
          if (name === "s3") outcome.s3 += `, ${await ensureBucket(config)}`;
        }
      }),
    );
    const failure = settled.find((s): s is PromiseRejectedResult => s.status === "rejected");
    if (failure) {
      for (const name of names.filter((n) => wasStarted(outcome[n]))) {
        await (name === "pg" ? stopPg(config) : stopNodeService(services[name])).catch(() => {});
        log(`  ${name.padEnd(5)} stopped again (another service failed to start)`);
      }
      throw failure.reason;
    }
    return outcome;
  });
  if (!opts.quiet) {
    const lines = [`Eonscale local services (127.0.0.1 only, data in ${config.dataDir}):`];
    if (results.pg) lines.push(`  pg    ${results.pg.padEnd(36)} DATABASE_URL=${config.DATABASE_URL}`);
    if (results.pg && !config.pg.dataDir.startsWith(config.dataDir)) {
      lines.push(`        cluster in ${config.pg.dataDir} (the postgres user cannot reach ${config.dataDir})`);
    }
    if (results.s3) {
      lines.push(
        `  s3    ${results.s3.padEnd(36)} S3_ENDPOINT=${config.s3.endpoint} bucket=${config.s3.bucket} key=${config.s3.accessKeyId}/${config.s3.secretAccessKey}`,
      );
    }
    if (results.smtp) lines.push(`  smtp  ${results.smtp.padEnd(36)} SMTP_URL=${config.SMTP_URL} INBOX_URL=${config.INBOX_URL}`);
    console.log(lines.join("\n"));
  }
  return { ...config, started: names.filter((n) => wasStarted(results[n])) };
}

/** Stops the selected services (all by default); a service that is not running is skipped. */
export async function stopServices(opts: ServiceOptions = {}): Promise<void> {
  const config = await placePg(serviceConfig());
  const names = selected(opts);
  const results = await withLock(config.dataDir, async () => {
    const services = nodeServices(config);
    const outcome: Partial<Record<ServiceName, string>> = {};
    await Promise.all(
      names.map(async (name) => {
        outcome[name] = name === "pg" ? await stopPg(config) : await stopNodeService(services[name]);
      }),
    );
    return outcome;
  });
  if (!opts.quiet) {
    console.log(names.map((name) => `  ${name.padEnd(5)} ${results[name]}`).join("\n"));
  }
}

/** Reports whether each selected service is running and reachable. */
export async function serviceStatus(opts: Pick<ServiceOptions, "only"> = {}): Promise<ServiceStatus[]> {
  const config = await placePg(serviceConfig());
  const services = nodeServices(config);
  return Promise.all(
    selected(opts).map(async (name): Promise<ServiceStatus> => {
      if (name === "pg") {
        const info = postmasterInfo(config);
        const accepting = info !== null && (await pgAccepts(config));
        return {
          name,
          running: accepting,
          pid: info?.pid ?? null,
          ports: [config.pg.port],
          detail: info === null ? `${config.DATABASE_URL} (not running)` : accepting ? `${config.DATABASE_URL} cluster=${config.pg.dataDir}` : `pid ${info.pid} but not accepting connections on ${config.pg.port}`,
        };
      }
      const service = services[name];
      const pid = runningPid(service);
      const open = pid !== null && (await allOpen(service.ports));
      const where = name === "s3" ? `${config.s3.endpoint} bucket=${config.s3.bucket}` : `${config.SMTP_URL} inbox=${config.INBOX_URL}`;
      return {
        name,
        running: open,
        pid,
        ports: service.ports,
        detail: pid === null ? `${where} (not running)` : open ? where : `pid ${pid} but ports ${service.ports.join(", ")} not open`,
      };
    }),
  );
}
