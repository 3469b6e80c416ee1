// npm run bench:reset — how long the forgot-password form takes to answer for an address with an
// account and one without (issue 16 §5: the answer must not tell them apart). Both do the same work
// now (the client's limit and one queued job); this prints the medians and their ratio, measured
// in the same run, alternating the two so drift hits both. Loopback only; its own database.
import { databaseUrl, dropDatabase, ensureDatabase, startServices } from "../../fakes/services.ts";

const DATABASE = "eonscale_bench_reset";
const ROUNDS = Number(process.env.ROUNDS ?? 60);
// CONTROL=1 puts a second address without an account in the "known" slot: the spread of its ratio
// around 1 is this machine's noise, to compare the real ratio with.
const CONTROL = process.env.CONTROL === "1";

process.env.AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED = "true";
const services = await startServices({ quiet: true });
for (const [key, value] of Object.entries(services.env)) process.env[key] ??= value;
process.env.DATABASE_URL = databaseUrl(DATABASE);
process.env.LOG_LEVEL = "warn";
process.env.RUN_WORKERS = "false";

await dropDatabase(DATABASE);
await ensureDatabase(DATABASE);
const { migrateAndSeed } = await import("../../db/migrator.ts");
const { sequelize, closeDatabase } = await import("../../server/db.server.ts");
await migrateAndSeed({ demo: false, db: sequelize, quiet: true });
const { User } = await import("../../db/models/index.ts");
const { hashPassword } = await import("../../server/auth.server.ts");
const forgot = await import("../../app/routes/forgot-password.tsx");
const { stopBoss } = await import("../../server/queue.server.ts");

const known = await User.create({ email: "known@example.org", name: "Known", passwordHash: await hashPassword("a-long-password"), lastSignInAt: null });

async function once(email: string, i: number): Promise<number> {
  const request = new Request("http://bench.local/forgot-password", {
    method: "POST",
    headers: { "Content-Type": "application/x-www-form-urlencoded", "x-eonscale-client-ip": `bench-${i}-${email}` },
    body: new URLSearchParams({ email }).toString(),
  });
  const t0 = performance.now();
  await forgot.action({ request, params: {}, context: {} } as never);
  return performance.now() - t0;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const times = { known: [] as number[], unknown: [] as number[] };
for (let i = 0; i < 5; i++) await once(known.email, -i); // warm-up
for (let i = 0; i < ROUNDS; i++) {
  const order = i % 2 ? (["known", "unknown"] as const) : (["unknown", "known"] as const);
  for (const which of order) times[which].push(await once(which === "known" ? (CONTROL ? "nobody-control@example.org" : known.email) : `nobody-${i}@example.org`, i));
}
const result = { control: CONTROL, rounds: ROUNDS, knownMedianMs: +median(times.known).toFixed(2), unknownMedianMs: +median(times.unknown).toFixed(2), ratio: +(median(times.known) / median(times.unknown)).toFixed(3) };
console.log(`forgot-password answer, ${ROUNDS} rounds each: known address median ${result.knownMedianMs} ms, unknown ${result.unknownMedianMs} ms, ratio ${result.ratio}`);
console.log(JSON.stringify(result));
await stopBoss();
await closeDatabase();
await dropDatabase(DATABASE);
process.exit(0);
