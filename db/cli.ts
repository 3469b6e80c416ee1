// npm run db:migrate | db:rollback | db:seed [-- --demo]. Needs DATABASE_URL (the local scripts in
// package.json pass the stand-in's address; in production set it as the server does).
import { migrator, seeder } from "./migrator.ts";
import { createSequelize } from "./sequelize.ts";

const [command] = process.argv.slice(2);
const demo = process.argv.includes("--demo");
const url = process.env.DATABASE_URL;

if (!url || !/^postgres(ql)?:\/\//.test(url)) {
  console.error("DATABASE_URL must be set to a postgres:// URL (npm run db:* sets it to the local stand-in)");
  process.exit(2);
}
const sequelize = createSequelize(url);
try {
  if (command === "migrate") await migrator(sequelize).up();
  else if (command === "rollback") await migrator(sequelize).down();
  else if (command === "seed") {
    await seeder("reference", sequelize).up();
    if (demo) await seeder("demo", sequelize).up();
  } else {
    console.error("usage: tsx db/cli.ts migrate|rollback|seed [--demo]");
    process.exitCode = 2;
  }
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  process.exitCode = 1;
} finally {
  await sequelize.close();
}
