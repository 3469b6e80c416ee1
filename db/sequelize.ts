// Makes a Sequelize instance for a Postgres URL. db/ never reads the environment: whoever runs
// the code (the server from its validated env, the migration CLI, tests) passes the URL in.
import { Sequelize } from "sequelize";

export interface SequelizeOptions {
  /** Most connections the pool opens (default 10). */
  poolMax?: number;
}

export function createSequelize(url: string, options: SequelizeOptions = {}) {
  return new Sequelize(url, {
    dialect: "postgres",
    logging: false,
    pool: { max: options.poolMax ?? 10, min: 0, idle: 10_000, acquire: 20_000 },
    define: { underscored: true },
  });
}
