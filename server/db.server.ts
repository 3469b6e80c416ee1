// The server's one Sequelize instance, made from the validated environment, with every model
// bound to it. Import `sequelize` from here (transactions, raw queries); import models from
// db/models/index.ts. In development the instance survives Vite's module reloads (globalThis),
// so a code change does not open a second connection pool.
import type { Sequelize } from "sequelize";
import { initModels } from "../db/models/index.ts";
import { createSequelize } from "../db/sequelize.ts";
import { env } from "./env.server.ts";

const keep = globalThis as unknown as { __eonscaleSequelize?: Sequelize };

function open(): Sequelize {
  const config = env();
  if (config.NODE_ENV !== "development") return createSequelize(config.DATABASE_URL, { poolMax: config.DATABASE_POOL_MAX });
  keep.__eonscaleSequelize ??= createSequelize(config.DATABASE_URL, { poolMax: config.DATABASE_POOL_MAX });
  return keep.__eonscaleSequelize;
}

export const sequelize: Sequelize = initModels(open());

/** Closes the pool (graceful shutdown, end of a test file). */
export async function closeDatabase() {
  if (keep.__eonscaleSequelize === sequelize) keep.__eonscaleSequelize = undefined;
  await sequelize.close();
}
