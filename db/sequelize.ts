// The one Sequelize instance of a process (kept across dev-server reloads).
import { Sequelize } from "sequelize";
import { env } from "../server/env.server.ts";

const globalForDb = globalThis as unknown as { __eonscaleSequelize?: Sequelize };

export function createSequelize(url = env().DATABASE_URL) {
  return new Sequelize(url, {
    dialect: "postgres",
    logging: false,
    pool: { max: env().DATABASE_POOL_MAX, min: 0, idle: 10_000, acquire: 20_000 },
    define: { underscored: true },
  });
}

export const sequelize: Sequelize = (globalForDb.__eonscaleSequelize ??= createSequelize());
