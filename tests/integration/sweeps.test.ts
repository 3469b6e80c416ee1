// Housekeeping: expired sessions, rate-limit counters and old reset links are deleted; live ones stay.
import { describe, expect, it } from "vitest";
import { PasswordReset, Session } from "../../db/models/index.ts";
import { sequelize } from "../../server/db.server.ts";
import { sweepExpired } from "../../server/sweeps.server.ts";
import { newToken } from "../../server/tokens.server.ts";
import { cookieFor, createMember, createOrganisation, unique } from "../helpers/db.ts";

describe("housekeeping sweep", () => {
  it("removes what has expired and keeps what is live", async () => {
    const { user } = await createMember(await createOrganisation(), "designer");
    await cookieFor(user.id);
    await Session.create({ id: unique("old-session"), userId: user.id, data: { userId: user.id }, expiresAt: new Date(Date.now() - 1000) });
    const dead = unique("signin_address:dead");
    const live = unique("signin_address:live");
    await sequelize.query(`INSERT INTO rate_limits (key, points, expire) VALUES ($1, 3, $2), ($3, 3, $4)`, { bind: [dead, Date.now() - 1000, live, Date.now() + 600_000] });
    const old = newToken();
    await PasswordReset.create({ userId: user.id, tokenHash: old.hash, expiresAt: new Date(Date.now() - 3 * 86400_000), usedAt: null, createdAt: new Date(Date.now() - 3 * 86400_000) } as never);
    const fresh = newToken();
    await PasswordReset.create({ userId: user.id, tokenHash: fresh.hash, expiresAt: new Date(Date.now() + 3600_000), usedAt: null });

    const removed = await sweepExpired();
    expect(removed.sessions).toBeGreaterThanOrEqual(1);
    expect(await Session.count({ where: { userId: user.id } })).toBe(1);
    const [rows] = await sequelize.query(`SELECT key FROM rate_limits WHERE key IN ($1, $2)`, { bind: [dead, live] });
    expect((rows as { key: string }[]).map((r) => r.key)).toEqual([live]);
    expect(await PasswordReset.count({ where: { tokenHash: old.hash } })).toBe(0);
    expect(await PasswordReset.count({ where: { tokenHash: fresh.hash } })).toBe(1);
  });
});
