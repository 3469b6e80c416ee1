// umzug runners: one for schema migrations (table migration_meta), one each for the reference-data
// and demo seeders (table seeder_meta, names prefixed by their folder). The caller passes the
// Sequelize instance; migrations and seeders get it in their context.
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { QueryInterface, Sequelize } from "sequelize";
import { SequelizeStorage, Umzug } from "umzug";

const here = path.dirname(fileURLToPath(import.meta.url));

export interface MigrationContext {
  sequelize: Sequelize;
  queryInterface: QueryInterface;
}

function runner(folder: string, modelName: string, db: Sequelize, quiet: boolean, dir = path.join(here, folder)) {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: ["*.ts", { cwd: dir, ignore: ["*.d.ts", "*.test.ts"] }],
      resolve: ({ name, path: file, context }) => ({
        name: folder === "migrations" ? name : `${folder}/${name}`,
        up: async () => (await import(/* @vite-ignore */ file!)).up(context),
        down: async () => (await import(/* @vite-ignore */ file!)).down?.(context),
      }),
    },
    context: { sequelize: db, queryInterface: db.getQueryInterface() },
    storage: new SequelizeStorage({ sequelize: db, modelName, tableName: modelName }),
    logger: quiet ? undefined : console,
  });
}

export function migrator(db: Sequelize, quiet = false) {
  return runner("migrations", "migration_meta", db, quiet);
}

export function seeder(kind: "reference" | "demo", db: Sequelize, quiet = false) {
  return runner(path.join("seeders", kind), "seeder_meta", db, quiet);
}

export async function migrateAndSeed(opts: { demo: boolean; db: Sequelize; quiet?: boolean }) {
  const { db } = opts;
  await migrator(db, opts.quiet).up();
  await seeder("reference", db, opts.quiet).up();
  if (opts.demo) await seeder("demo", db, opts.quiet).up();
}

export type Migration = (ctx: MigrationContext) => Promise<void>;

/**
 * Names of the migrations the database has not run yet (empty when up to date). `dir` is the
 * migrations folder (a bundled server passes it: its own location is not db/).
 */
export async function pendingMigrations(db: Sequelize, dir = path.join(here, "migrations")): Promise<string[]> {
  return (await runner("migrations", "migration_meta", db, true, dir).pending()).map((m) => m.name);
}
