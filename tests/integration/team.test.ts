// Role sets on the team page, the last-admin rule under real concurrent requests, and the migration
// that turned single roles into sets (today's data kept; down and up again).
import { describe, expect, it } from "vitest";
import * as team from "../../app/routes/studio/team.tsx";
import { AuditEvent, Membership } from "../../db/models/index.ts";
import { createSequelize } from "../../db/sequelize.ts";
import { migrator } from "../../db/migrator.ts";
import { dropDatabase, ensureDatabase } from "../../fakes/services.ts";
import { cookieFor, createMember, createOrganisation, formRequest, routeArgs, settle } from "../helpers/db.ts";

function post(cookie: string, fields: Record<string, string | string[] | undefined>) {
  const body = new URLSearchParams();
  for (const [k, v] of Object.entries(fields)) for (const one of [v ?? []].flat()) body.append(k, one);
  const request = formRequest("/studio/team", {}, { cookie });
  return settle(() => team.action(routeArgs(new Request(request.url, { method: "POST", headers: request.headers, body: body.toString() }))));
}

describe("role sets on the team page", () => {
  it("an admin gives a member several roles with checkboxes; the set is stored in order and audited", async () => {
    const org = await createOrganisation();
    const admin = await cookieFor((await createMember(org, "admin")).user.id);
    const { membership } = await createMember(org, "designer");
    const res = await post(admin, { intent: "set-roles", membershipId: String(membership.id), roles: ["reviewer", "designer"] });
    expect(res.status).toBe(302);
    await membership.reload();
    expect(membership.roles).toEqual(["designer", "reviewer"]);
    const event = await AuditEvent.findOne({ where: { organisationId: org.id, action: "membership.roles", objectId: String(membership.id) } });
    expect(event?.details).toEqual({ from: ["designer"], to: ["designer", "reviewer"] });
  });

  it("no role ticked, or an unknown role, is refused with a field message and changes nothing", async () => {
    const org = await createOrganisation();
    const admin = await cookieFor((await createMember(org, "admin")).user.id);
    const { membership } = await createMember(org, "editor");
    const none = await post(admin, { intent: "set-roles", membershipId: String(membership.id) });
    expect(none.status).toBe(400);
    expect((none.body as { fields: Record<string, string> }).fields.roles).toBe("Roles: choose at least one role.");
    const odd = await post(admin, { intent: "set-roles", membershipId: String(membership.id), roles: ["editor", "owner"] });
    expect(odd.status).toBe(400);
    expect((odd.body as { fields: Record<string, string> }).fields["roles.1"]).toMatch(/^Roles: choose from admin, designer, reviewer, editor/);
    await membership.reload();
    expect(membership.roles).toEqual(["editor"]);
  });

  it("the last admin cannot drop the admin role or be removed; a second admin makes it possible", async () => {
    const org = await createOrganisation();
    const { user, membership } = await createMember(org, ["admin", "designer"]);
    const admin = await cookieFor(user.id);
    const demote = await post(admin, { intent: "set-roles", membershipId: String(membership.id), roles: ["designer"] });
    expect(demote.status).toBe(400);
    expect((demote.body as { fields: Record<string, string> }).fields.roles).toMatch(/at least one admin/);
    const remove = await post(admin, { intent: "remove", membershipId: String(membership.id) });
    expect(remove.status).toBe(400);
    await membership.reload();
    expect(membership.roles).toEqual(["admin", "designer"]);
    await createMember(org, "admin");
    expect((await post(admin, { intent: "set-roles", membershipId: String(membership.id), roles: ["designer"] })).status).toBe(302);
  });

  it("invitations carry a set of roles", async () => {
    const org = await createOrganisation();
    const admin = await cookieFor((await createMember(org, "admin")).user.id);
    const res = await post(admin, { intent: "invite", email: "curator-to-be@example.org", roles: ["reviewer", "designer"] });
    expect(res.status).toBe(302);
    const loaded = await settle(() => team.loader(routeArgs(formRequest("/studio/team", {}, { cookie: admin }))));
    expect((loaded.body as { invitations: { email: string; roles: string[] }[] }).invitations).toEqual([
      expect.objectContaining({ email: "curator-to-be@example.org", roles: ["designer", "reviewer"] }),
    ]);
  });
});

describe("at least one admin, under concurrency", () => {
  it("two admins demoting each other at the same moment, 20 times: exactly one is refused each time", async () => {
    const refusedPerRound: number[] = [];
    let atLock = 0;
    for (let round = 0; round < 20; round++) {
      const org = await createOrganisation();
      const a = await createMember(org, "admin");
      const b = await createMember(org, "admin");
      const [ca, cb] = await Promise.all([cookieFor(a.user.id), cookieFor(b.user.id)]);
      // Round by round, alternate demotion and removal so both paths race.
      const intentB = round % 2 === 0 ? { intent: "set-roles", membershipId: String(a.membership.id), roles: ["designer"] } : { intent: "remove", membershipId: String(a.membership.id) };
      const [ra, rb] = await Promise.all([
        post(ca, { intent: "set-roles", membershipId: String(b.membership.id), roles: ["designer"] }),
        post(cb, intentB),
      ]);
      // Refused at the organisation lock (400: the other admin's change came first) or, when the
      // other change had already committed, by the guard itself (403: no longer an admin).
      refusedPerRound.push([ra, rb].filter((r) => r.status === 400 || r.status === 403).length);
      atLock += [ra, rb].filter((r) => r.status === 400).length;
      expect([ra.status, rb.status].filter((s) => s === 302)).toEqual([302]);
      const admins = await Membership.count({ where: { organisationId: org.id, roles: { [(await import("sequelize")).Op.contains]: ["admin"] } } });
      expect(admins).toBe(1);
    }
    expect(refusedPerRound).toEqual(Array(20).fill(1));
    // The requests really overlapped: most refusals came from the lock, not from the guard.
    console.info(`last-admin race: ${atLock} of 20 refusals at the organisation lock, ${20 - atLock} by the guard`);
    expect(atLock).toBeGreaterThan(0);
  });
});

describe("the role-set migration", () => {
  it("keeps each existing role as a one-element set, and down keeps one role (an admin stays admin)", async () => {
    const name = "eonscale_roles_migration_b";
    await dropDatabase(name);
    const { url } = await ensureDatabase(name);
    const db = createSequelize(url);
    try {
      const m = migrator(db, true);
      const all = (await m.pending()).map((p) => p.name);
      const mine = all.find((n) => n.includes("role-sets-and-edition-owners"))!;
      await m.up({ to: all[all.indexOf(mine) - 1] });
      await db.query(`INSERT INTO organisations (name, slug, created_at, updated_at) VALUES ('Old museum', 'old-museum', now(), now())`);
      await db.query(`INSERT INTO users (email, name, password_hash, created_at, updated_at) VALUES ('a@example.org', 'A', 'x', now(), now()), ('b@example.org', 'B', 'x', now(), now())`);
      await db.query(`INSERT INTO memberships (user_id, organisation_id, role, created_at, updated_at)
        SELECT u.id, o.id, CASE u.email WHEN 'a@example.org' THEN 'admin' ELSE 'reviewer' END::enum_memberships_role, now(), now() FROM users u, organisations o`);
      await m.up({ to: mine });
      const [after] = await db.query(`SELECT u.email, m.roles::text[] AS roles FROM memberships m JOIN users u ON u.id = m.user_id ORDER BY u.email`);
      expect(after).toEqual([{ email: "a@example.org", roles: ["admin"] }, { email: "b@example.org", roles: ["reviewer"] }]);
      await expect(db.query(`UPDATE memberships SET roles = '{}'`)).rejects.toThrow(/memberships_roles_not_empty/);
      await expect(db.query(`UPDATE memberships SET roles = '{admin,admin}'`)).rejects.toThrow(/memberships_roles_distinct/);
      await db.query(`UPDATE memberships SET roles = '{admin,editor}' WHERE user_id = (SELECT id FROM users WHERE email = 'b@example.org')`);
      await m.down({ to: mine });
      const [before] = await db.query(`SELECT u.email, m.role::text AS role FROM memberships m JOIN users u ON u.id = m.user_id ORDER BY u.email`);
      expect(before).toEqual([{ email: "a@example.org", role: "admin" }, { email: "b@example.org", role: "admin" }]);
      await m.up();
      expect(await m.pending()).toEqual([]);
    } finally {
      await db.close();
      await dropDatabase(name);
    }
  });
});
