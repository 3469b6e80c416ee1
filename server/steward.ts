// npm run steward -- add EMAIL | remove EMAIL | list
// Chart stewards are a site-wide role: they manage the shared (ICS) chart editions. No organisation
// can grant it; it is given here, by whoever runs the server, and each change is audited (without an
// organisation, so it shows in the shared edition log's table of audit events).
import { z } from "zod";
import { User } from "../db/models/index.ts";
import { audit } from "./audit.server.ts";
import { closeDatabase, sequelize } from "./db.server.ts";

const USAGE = "usage: npm run steward -- add EMAIL | remove EMAIL | list";
const Email = z.email({ error: "EMAIL: give the account's e-mail address, like name@example.org." }).transform((e) => e.trim().toLowerCase());

export async function stewardCommand(args: string[]): Promise<{ code: number; out: string }> {
  const [command, rawEmail] = args;
  if (command === "list") {
    const [rows] = (await sequelize.query(
      `SELECT u.email, u.name, s.created_at FROM chart_stewards s JOIN users u ON u.id = s.user_id ORDER BY u.email`,
    )) as [{ email: string; name: string; created_at: Date }[], unknown];
    return { code: 0, out: rows.length ? rows.map((r) => `${r.email}\t${r.name}\tsince ${new Date(r.created_at).toISOString().slice(0, 10)}`).join("\n") : "No chart stewards yet." };
  }
  if (command !== "add" && command !== "remove") return { code: 2, out: USAGE };
  const parsed = Email.safeParse(rawEmail ?? "");
  if (!parsed.success) return { code: 2, out: `${parsed.error.issues[0].message}\n${USAGE}` };
  const user = await User.findOne({ where: { email: parsed.data } });
  if (!user) return { code: 1, out: `No account has the address ${parsed.data}. The person must have an account first (an invitation to any organisation, or the demo data).` };
  return sequelize.transaction(async (transaction) => {
    const [rows] = (await sequelize.query(
      command === "add"
        ? `INSERT INTO chart_stewards (user_id) VALUES ($1) ON CONFLICT DO NOTHING RETURNING user_id`
        : `DELETE FROM chart_stewards WHERE user_id = $1 RETURNING user_id`,
      { bind: [user.id], transaction },
    )) as [unknown[], unknown];
    const changed = rows.length > 0;
    if (changed) await audit({ organisationId: null, actorId: null, action: `steward.${command}`, objectType: "user", objectId: user.id, details: { email: user.email, by: "command line" } }, transaction);
    const verb = command === "add" ? (changed ? "is now a chart steward" : "was already a chart steward") : changed ? "is no longer a chart steward" : "was not a chart steward";
    return { code: 0, out: `${user.email} ${verb}.` };
  });
}

if (import.meta.url === `file://${process.argv[1]}`) {
  try {
    const { code, out } = await stewardCommand(process.argv.slice(2));
    (code === 0 ? console.log : console.error)(out);
    process.exitCode = code;
  } catch (error) {
    console.error(error instanceof Error ? error.message : error);
    process.exitCode = 1;
  } finally {
    await closeDatabase();
  }
}
