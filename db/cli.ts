// npm run db:migrate | db:rollback | db:seed [-- --demo]
import { migrator, seeder } from "./migrator.ts";
import { sequelize } from "./sequelize.ts";

const [command] = process.argv.slice(2);
const demo = process.argv.includes("--demo");

try {
  if (command === "migrate") await migrator().up();
  else if (command === "rollback") await migrator().down();
  else if (command === "seed") {
    await seeder("reference").up();
    if (demo) await seeder("demo").up();
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
