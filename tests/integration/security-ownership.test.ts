// Attacks on ownership (issue 16 §1): organisations' admins and editors, and a member of two
// organisations acting from the other one, against another organisation's chart editions and the
// shared ones; and two admins removing each other at the same moment. Refusals change nothing and
// audit nothing anywhere; what is allowed is audited in its own organisation only.
import { Op } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import * as manageRoute from "../../app/routes/studio/editions.tsx";
import * as team from "../../app/routes/studio/team.tsx";
import { AuditEvent, ChartEdition, Membership, Organisation } from "../../db/models/index.ts";
import { editionIntervals } from "../../server/editions.server.ts";
import { createDraftEdition } from "../../server/editions/import.server.ts";
import { setOrganisationCurrent } from "../../server/editions/status.server.ts";
import { cookieFor, createMember, createOrganisation, createUser, formRequest, routeArgs, settle, unique } from "../helpers/db.ts";
import { SEEDED_CURRENT, SEEDED_RETIRED, TEST_META } from "../helpers/editions.ts";

type Snapshot = { editions: unknown[]; orgs: unknown[]; audits: number };

async function snapshot(orgIds: number[]): Promise<Snapshot> {
  return {
    editions: (await ChartEdition.findAll({ order: [["id", "ASC"]], attributes: ["id", "slug", "status", "organisationId"] })).map((e) => e.toJSON()),
    orgs: (await Organisation.findAll({ where: { id: orgIds }, order: [["id", "ASC"]], attributes: ["id", "currentEditionId"] })).map((o) => o.toJSON()),
    audits: await AuditEvent.count(),
  };
}

const manage = (cookie: string, fields: Record<string, string>) => settle(() => manageRoute.action(routeArgs(formRequest("/studio/editions", fields, { cookie }))));

describe("chart editions: another organisation's and the shared ones", () => {
  let orgA: Organisation;
  let orgB: Organisation;
  let ownDraft: string;
  let ownCurrent: string;
  const cookies: Record<string, string> = {};
  let dual: { id: number };

  beforeAll(async () => {
    orgA = await createOrganisation();
    orgB = await createOrganisation();
    const { user: editorA } = await createMember(orgA, "editor");
    const actorA = { id: editorA.id, subject: { roles: ["editor" as const], steward: false, userId: editorA.id, organisationId: orgA.id } };
    const seeded = (await ChartEdition.findOne({ where: { slug: SEEDED_CURRENT } }))!;
    const intervals = await editionIntervals(seeded.id);
    ownDraft = unique("a-draft");
    ownCurrent = unique("a-current");
    for (const slug of [ownDraft, ownCurrent]) {
      await createDraftEdition({ meta: { slug, ...TEST_META }, intervals, corrections: [], sourceFile: null, actor: editorA, ownerId: orgA.id, format: "seed" });
    }
    await setOrganisationCurrent(ownCurrent, actorA, orgA.id);
    cookies.adminB = await cookieFor((await createMember(orgB, "admin")).user.id);
    cookies.adminEditorB = await cookieFor((await createMember(orgB, ["admin", "editor"])).user.id);
    // Editor in A and admin + editor in B, working in B right now.
    const both = await createUser();
    await Membership.create({ userId: both.id, organisationId: orgA.id, roles: ["editor"] });
    await Membership.create({ userId: both.id, organisationId: orgB.id, roles: ["admin", "editor"] });
    cookies.dualInB = await cookieFor(both.id, orgB.id);
    dual = both;
  });

  it("every change, retirement or discard of A's editions or a shared one from B is 403 or 404; nothing changes, nothing is audited", async () => {
    const before = await snapshot([orgA.id, orgB.id]);
    const tried: string[] = [];
    for (const who of ["adminB", "adminEditorB", "dualInB"]) {
      for (const slug of [ownDraft, ownCurrent, SEEDED_CURRENT, SEEDED_RETIRED]) {
        for (const intent of ["set-current", "make-latest", "retire", "discard"]) {
          // Choosing a shared released edition as B's own current one is B's right, not an attack.
          if (intent === "set-current" && slug.startsWith("ics-")) continue;
          const res = await manage(cookies[who], { intent, slug, redirectTo: "/\t/evil.example" });
          tried.push(`${who} ${intent} ${slug.startsWith("ics-") ? slug : slug.replace(/-[0-9a-f]+$/, "")} → ${res.status}`);
          expect([who, intent, slug, [403, 404].includes(res.status)]).toEqual([who, intent, slug, true]);
        }
      }
    }
    console.info(`edition attacks: ${tried.length} tried, all refused (${tried.filter((t) => t.endsWith("403")).length} × 403, ${tried.filter((t) => t.endsWith("404")).length} × 404)`);
    expect(await snapshot([orgA.id, orgB.id])).toEqual(before);
  });

  it("what B may do is audited in B only, and changes nothing of A's", async () => {
    const before = await snapshot([orgA.id]);
    const maxId = (await AuditEvent.max<number, AuditEvent>("id")) ?? 0;
    const res = await manage(cookies.dualInB, { intent: "set-current", slug: SEEDED_RETIRED, redirectTo: "/\t/evil.example" });
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe("/studio/editions");
    const written = await AuditEvent.findAll({ where: { id: { [Op.gt]: maxId } } });
    expect(written.map((a) => ({ action: a.action, organisationId: a.organisationId, actorId: a.actorId }))).toEqual([
      { action: "edition.set-current", organisationId: orgB.id, actorId: dual.id },
    ]);
    const after = await snapshot([orgA.id]);
    expect({ ...after, audits: after.audits - 1 }).toEqual(before);
  });
});

function postTeam(cookie: string, fields: Record<string, string | string[]>) {
  const body = new URLSearchParams();
  for (const [k, v] of Object.entries(fields)) for (const one of [v].flat()) body.append(k, one);
  const request = formRequest("/studio/team", {}, { cookie });
  return settle(() => team.action(routeArgs(new Request(request.url, { method: "POST", headers: request.headers, body: body.toString() }))));
}

describe("the last admin, two admins at once", () => {
  it("removing or demoting each other at the same moment, 20 rounds: one refused every time, one admin left, only the change made is audited, in its organisation", async () => {
    const refused: number[] = [];
    for (let round = 0; round < 20; round++) {
      const org = await createOrganisation();
      const a = await createMember(org, "admin");
      const b = await createMember(org, ["admin", "designer"]);
      const [ca, cb] = await Promise.all([cookieFor(a.user.id), cookieFor(b.user.id)]);
      const maxId = (await AuditEvent.max<number, AuditEvent>("id")) ?? 0;
      // Rounds alternate: both remove; remove against demote; both demote; demote against remove.
      const act = (target: { membership: Membership }, kind: number): Record<string, string | string[]> =>
        kind === 0 ? { intent: "remove", membershipId: String(target.membership.id) } : { intent: "set-roles", membershipId: String(target.membership.id), roles: ["designer"] };
      const [ra, rb] = await Promise.all([postTeam(ca, act(b, round % 4 < 2 ? 0 : 1)), postTeam(cb, act(a, round % 2))]);
      const statuses = [ra.status, rb.status];
      refused.push(statuses.filter((s) => s === 400 || s === 403).length);
      expect([round, statuses.filter((s) => s === 302).length]).toEqual([round, 1]);
      expect(await Membership.count({ where: { organisationId: org.id, roles: { [Op.contains]: ["admin"] } } })).toBe(1);
      const written = await AuditEvent.findAll({ where: { id: { [Op.gt]: maxId }, action: { [Op.like]: "membership.%" } } });
      // Other test files write audits in their own databases; here only this round's one change.
      expect(written.map((w) => w.organisationId)).toEqual([org.id]);
    }
    expect(refused).toEqual(Array(20).fill(1));
  });
});
