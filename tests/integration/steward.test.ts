// `npm run steward -- add|remove|list`: the site-wide chart steward role is granted only from the
// command line, audited without an organisation, and refused for unknown or malformed addresses.
import { describe, expect, it } from "vitest";
import { AuditEvent } from "../../db/models/index.ts";
import { sequelize } from "../../server/db.server.ts";
import { isSteward } from "../../server/auth.server.ts";
import { stewardCommand } from "../../server/steward.ts";
import { createUser } from "../helpers/db.ts";

async function stewardRows(userId: number) {
  const [rows] = await sequelize.query(`SELECT user_id FROM chart_stewards WHERE user_id = $1`, { bind: [userId] });
  return rows.length;
}

describe("npm run steward", () => {
  it("adds, lists and removes a steward, auditing each change once", async () => {
    const user = await createUser();
    const added = await stewardCommand(["add", user.email.toUpperCase()]);
    expect(added).toEqual({ code: 0, out: `${user.email} is now a chart steward.` });
    expect(await stewardRows(user.id)).toBe(1);
    expect(await isSteward(user.id)).toBe(true);

    const again = await stewardCommand(["add", user.email]);
    expect(again.out).toBe(`${user.email} was already a chart steward.`);

    const list = await stewardCommand(["list"]);
    expect(list.code).toBe(0);
    expect(list.out.split("\n").some((line) => line.startsWith(`${user.email}\t`))).toBe(true);

    const removed = await stewardCommand(["remove", user.email]);
    expect(removed.out).toBe(`${user.email} is no longer a chart steward.`);
    expect(await stewardRows(user.id)).toBe(0);
    expect(await isSteward(user.id)).toBe(false);

    const events = await AuditEvent.findAll({ where: { objectType: "user", objectId: String(user.id) }, order: [["id", "ASC"]] });
    expect(events.map((e) => [e.action, e.organisationId])).toEqual([
      ["steward.add", null],
      ["steward.remove", null],
    ]);
  });

  it("refuses a malformed address, an unknown account and an unknown command, changing nothing", async () => {
    const [before] = await sequelize.query(`SELECT count(*)::int AS n FROM chart_stewards`);
    expect(await stewardCommand(["add", "not-an-address"])).toMatchObject({ code: 2, out: expect.stringMatching(/^EMAIL: /) });
    expect(await stewardCommand(["add", "nobody-here@example.org"])).toMatchObject({ code: 1, out: expect.stringMatching(/No account has the address nobody-here@example.org/) });
    expect(await stewardCommand(["promote", "x@example.org"])).toMatchObject({ code: 2, out: expect.stringMatching(/^usage: /) });
    const [after] = await sequelize.query(`SELECT count(*)::int AS n FROM chart_stewards`);
    expect(after).toEqual(before);
  });
});
