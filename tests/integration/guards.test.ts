// The authorization matrix over the WHOLE route table (app/routes.ts): every route module (pages,
// resource routes, API, visitor pages, media) × identity → status, for the loader (GET) and the
// action (an empty form POST), written out by hand below. Identities: signed out; each role of the
// demo organisation (marrowby, which owns the published exhibit riverside-walk); a chart steward in
// no organisation; a user in no organisation; the admin of ANOTHER organisation. Parameters are
// real objects of marrowby where the route names one (riverside-walk, publication 1, ics-2024-12),
// made-up ones otherwise (999999). Signed out → 302 to /login; not allowed → 403; another
// organisation's object → 404; allowed → what the route answers an empty request with. The table is
// NOT derived from app/lib/permissions.ts. Route modules are discovered, so a new route without a
// row fails this file, which prints routes × identities × methods covered.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Organisation } from "../../db/models/index.ts";
import { routePaths } from "../helpers/route-table.ts";
import { cookieFor, createMember, createOrganisation, createUser, formRequest, getRequest, makeSteward, routeArgs, settle } from "../helpers/db.ts";

type RouteModule = { loader?: (args: never) => unknown; action?: (args: never) => unknown };
const modules = import.meta.glob<RouteModule>("../../app/routes/**/*.{tsx,ts}", { eager: true });
const studioModules = import.meta.glob<RouteModule>("../../app/routes/studio/**/*.{tsx,ts}", { eager: true });

const IDENTITIES = ["out", "admin", "designer", "reviewer", "editor", "curator", "steward", "loner", "other"] as const;
type Identity = (typeof IDENTITIES)[number];
// curator = designer and reviewer; steward = chart steward in no organisation; loner = in no
// organisation; other = admin of another organisation.

//                      out  admin designer reviewer editor curator steward loner other
type Row = [number, number, number, number, number, number, number, number, number];
const EXPECTED: Record<string, { loader?: Row; action?: Row }> = {
  "api.assets.$id.ts": { loader: [404, 404, 404, 404, 404, 404, 404, 404, 404], action: [401, 403, 404, 403, 403, 404, 403, 403, 403] },
  "api.assets.ts": { action: [401, 403, 400, 403, 403, 400, 403, 403, 403] },
  "api.events.ts": { loader: [401, 200, 200, 200, 200, 200, 403, 403, 200] },
  "api.exhibits.$org.$slug.publications.$number.$file.ts": { loader: [404, 404, 404, 404, 404, 404, 404, 404, 404] },
  "api.exhibits.$org.$slug.publications.$number.ts": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "api.exhibits.$org.$slug.publications.ts": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "api.exhibits.$org.$slug.ts": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "api.scale.ts": { loader: [405, 405, 405, 405, 405, 405, 405, 405, 405], action: [400, 400, 400, 400, 400, 400, 400, 400, 400] },
  "api.timescales.$slug.ts": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "api.timescales.ts": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "editions.$slug.csv.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "editions.$slug.json.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "editions.$slug.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "editions.compare.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "editions.index.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "editions.layout.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "forgot-password.tsx": { action: [400, 400, 400, 400, 400, 400, 400, 400, 400] },
  "glossary.tsx": {}, // no loader, no action: nothing to guard
  "home.tsx": {}, // no loader, no action: nothing to guard
  "invite.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200], action: [400, 400, 400, 400, 400, 400, 400, 400, 400] },
  "login.tsx": { loader: [200, 302, 302, 302, 302, 302, 302, 302, 302], action: [400, 400, 400, 400, 400, 400, 400, 400, 400] },
  "logout.tsx": { loader: [302, 302, 302, 302, 302, 302, 302, 302, 302], action: [302, 302, 302, 302, 302, 302, 302, 302, 302] },
  "media.$assetId.$file.ts": { loader: [404, 404, 404, 404, 404, 404, 404, 404, 404] },
  "not-found.tsx": { loader: [404, 404, 404, 404, 404, 404, 404, 404, 404] },
  "reset-password.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200], action: [400, 400, 400, 400, 400, 400, 400, 400, 400] },
  "studio/account.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 200], action: [302, 400, 400, 400, 400, 400, 403, 403, 400] },
  "studio/editions.import.tsx": { loader: [302, 200, 403, 403, 200, 403, 200, 403, 200], action: [302, 400, 403, 403, 400, 403, 400, 403, 400] },
  "studio/editions.tsx": { loader: [302, 200, 403, 403, 200, 403, 200, 403, 200], action: [302, 400, 403, 403, 400, 403, 400, 403, 400] },
  "studio/exhibits.$slug.exports.$jobId.file.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403, 404] },
  "studio/exhibits.$slug.exports.$jobId.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403, 404] },
  "studio/exhibits.$slug.kit-zip.ts": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.panels-pdf.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403, 404] },
  "studio/exhibits.$slug.panels-zip.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403, 404] },
  "studio/exhibits.$slug.points-geojson.ts": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.points-gpx.ts": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.profile-json.ts": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.review.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404], action: [302, 403, 400, 400, 403, 400, 403, 403, 403] },
  "studio/exhibits.$slug.revisions.compare.tsx": { loader: [302, 400, 400, 400, 400, 400, 403, 403, 404] },
  "studio/exhibits.$slug.revisions.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.schedule-csv.ts": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.schedule-xlsx.ts": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.signs-pdf.ts": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.signs.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404], action: [302, 403, 400, 403, 403, 400, 403, 403, 403] },
  "studio/exhibits.$slug.trailhead-pdf.ts": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404] },
  "studio/exhibits.$slug.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 404], action: [302, 403, 400, 403, 403, 400, 403, 403, 403] },
  "studio/exhibits.new.tsx": { loader: [302, 403, 200, 403, 403, 200, 403, 403, 403], action: [302, 403, 400, 403, 403, 400, 403, 403, 403] },
  "studio/exhibits.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 200] },
  "studio/home.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 200] },
  "studio/layout.tsx": { loader: [302, 200, 200, 200, 200, 200, 200, 403, 200] },
  "studio/library.$id.tsx": { loader: [302, 404, 404, 404, 404, 404, 403, 403, 404], action: [302, 400, 403, 403, 400, 403, 403, 403, 400] },
  "studio/library.decay.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 200] },
  "studio/library.new.tsx": { loader: [302, 200, 403, 403, 200, 403, 403, 403, 200], action: [302, 400, 403, 403, 400, 403, 403, 403, 400] },
  "studio/library.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403, 200] },
  "studio/switch-organisation.tsx": { loader: [302, 302, 302, 302, 302, 302, 403, 403, 302], action: [302, 400, 400, 400, 400, 400, 403, 403, 400] },
  "studio/team.tsx": { loader: [302, 200, 403, 403, 403, 403, 403, 403, 200], action: [302, 400, 403, 403, 403, 403, 403, 403, 400] },
  "visit.$org.$slug.$number.qr-png.ts": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "visit.$org.$slug.$number.qr-svg.ts": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "visit.$org.$slug.$number.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "visit.$org.$slug.embed.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
  "visit.$org.$slug.tsx": { loader: [200, 200, 200, 200, 200, 200, 200, 200, 200] },
};

const PATHS = routePaths();

function paramsFor(name: string): Record<string, string> {
  const edition = /^(editions\.|api\.timescales)/.test(name);
  return { org: "marrowby", slug: edition ? "ics-2024-12" : "riverside-walk", number: "1", file: "schedule.csv", id: "999999", jobId: "999999", assetId: "999999", token: "made-up-token-999999" };
}
const fill = (path: string, params: Record<string, string>) => path.replace(/:(\w+)/g, (_, k: string) => params[k] ?? "999999").replace(/\*$/, "no-such-page");

const nameOf = (file: string) => file.replace(/^.*app\/routes\//, "");

describe("authorization matrix: route × identity × method → status", () => {
  let orgA: Organisation;
  const cookies: Partial<Record<Identity, string>> = {};
  let covered = 0;

  beforeAll(async () => {
    orgA = (await Organisation.findOne({ where: { slug: "marrowby" } }))!;
    for (const role of ["admin", "designer", "reviewer", "editor"] as const) sessions[role] = [(await createMember(orgA, role)).user.id, orgA.id];
    sessions.curator = [(await createMember(orgA, ["designer", "reviewer"])).user.id, orgA.id];
    const steward = await createUser();
    await makeSteward(steward.id);
    sessions.steward = [steward.id];
    sessions.loner = [(await createUser()).id];
    const orgB = await createOrganisation();
    sessions.other = [(await createMember(orgB, "admin")).user.id, orgB.id];
    for (const [who, [userId, orgId]] of Object.entries(sessions)) cookies[who as Identity] = await cookieFor(userId, orgId);
  });
  // Signing out ends the session: /logout gets a fresh one for each identity.
  const sessions: Partial<Record<Identity, [number, number?]>> = {};
  const cookieOf = async (who: Identity, name: string) => (name === "logout.tsx" && sessions[who] ? cookieFor(...sessions[who]) : cookies[who]);
  afterAll(() => {
    console.log(`authorization matrix: ${Object.keys(EXPECTED).length} route modules, ${covered} route × method cases × ${IDENTITIES.length} identities = ${covered * IDENTITIES.length} checks`);
  });

  const entries = Object.entries(modules).filter(([f]) => PATHS.has(nameOf(f)));
  it("has a row for every route module of app/routes.ts, and a loader or action for every row", () => {
    expect(entries.map(([f]) => nameOf(f)).sort()).toEqual([...PATHS.keys()].sort());
    expect(Object.keys(EXPECTED).sort()).toEqual([...PATHS.keys()].sort());
    for (const [file, mod] of entries) {
      const row = EXPECTED[nameOf(file)];
      expect(Boolean(mod.loader), `${nameOf(file)} loader`).toBe(Boolean(row?.loader));
      expect(Boolean(mod.action), `${nameOf(file)} action`).toBe(Boolean(row?.action));
    }
  });

  for (const [file, mod] of entries) {
    const name = nameOf(file);
    const params = paramsFor(name);
    const path = fill(PATHS.get(name)!, params);
    for (const kind of ["loader", "action"] as const) {
      const fn = mod[kind];
      const row = EXPECTED[name]?.[kind];
      if (!fn) continue;
      it(`${name} ${kind}`, async () => {
        const got: Record<string, number> = {};
        for (const who of IDENTITIES) {
          const cookie = await cookieOf(who, name);
          const request = kind === "loader" ? getRequest(path, { cookie }) : formRequest(path, {}, { cookie, ip: `198.51.100.${IDENTITIES.indexOf(who) + 1}` });
          const res = await settle(() => fn(routeArgs(request, params)));
          got[who] = res.status;
        }
        covered++;
        expect(got, `observed: "${name}": ${kind}: [${IDENTITIES.map((w) => got[w]).join(", ")}]`).toEqual(row ? Object.fromEntries(IDENTITIES.map((who, i) => [who, row[i]])) : {});
      });
    }
  }
});

describe("studio guard: messages", () => {
  let orgA: Organisation;
  const cookies: Partial<Record<"curator" | "loner", string>> = {};
  beforeAll(async () => {
    orgA = await createOrganisation();
    cookies.curator = await cookieFor((await createMember(orgA, ["designer", "reviewer"])).user.id);
    cookies.loner = await cookieFor((await createUser()).id);
  });
  const modules = studioModules;

  it("signed out → the sign-in page with the way back", async () => {
    const res = await settle(() => modules["../../app/routes/studio/team.tsx"].loader!(routeArgs(getRequest("/studio/team"))));
    expect(res.headers.get("Location")).toBe(`/login?redirectTo=${encodeURIComponent("/studio/team")}`);
  });

  it("a refusal names what is needed and the roles held", async () => {
    const res = await settle(() => modules["../../app/routes/studio/team.tsx"].loader!(routeArgs(getRequest("/studio/team", { cookie: cookies.curator }))));
    expect((res.body as { message: string }).message).toBe(`This page is for admin members of ${orgA.name}. Your roles there: designer and reviewer.`);
  });

  it("a user with no organisation gets a 403 that says what to do", async () => {
    const res = await settle(() => modules["../../app/routes/studio/home.tsx"].loader!(routeArgs(getRequest("/studio", { cookie: cookies.loner }))));
    expect((res.body as { message: string }).message).toMatch(/invitation/);
  });
});

describe("studio guard: other organisations", () => {
  it("another organisation's membership cannot be changed or removed (404) and stays as it was", async () => {
    const orgA = await createOrganisation();
    const orgB = await createOrganisation();
    const admin = await cookieFor((await createMember(orgA, "admin")).user.id);
    const team = modules["../../app/routes/studio/team.tsx"];
    const { membership } = await createMember(orgB, "designer");
    for (const fields of <Record<string, string>[]>[
      { intent: "set-roles", membershipId: String(membership.id), roles: "admin" },
      { intent: "remove", membershipId: String(membership.id) },
    ]) {
      const res = await settle(() => team.action!(routeArgs(formRequest("/studio/team", fields, { cookie: admin }))));
      expect(res.status).toBe(404);
    }
    await membership.reload();
    expect(membership.roles).toEqual(["designer"]);
  });

  it("switching to an organisation the user does not belong to is a 404; to their own works", async () => {
    const orgA = await createOrganisation();
    const orgB = await createOrganisation();
    const designer = await cookieFor((await createMember(orgA, "designer")).user.id);
    const sw = modules["../../app/routes/studio/switch-organisation.tsx"];
    const bad = await settle(() => sw.action!(routeArgs(formRequest("/studio/switch-organisation", { organisationId: String(orgB.id) }, { cookie: designer }))));
    expect(bad.status).toBe(404);
    const ok = await settle(() => sw.action!(routeArgs(formRequest("/studio/switch-organisation", { organisationId: String(orgA.id) }, { cookie: designer }))));
    expect(ok.status).toBe(302);
    expect(ok.headers.get("Location")).toBe("/studio");
  });

  it("members of two organisations act with the roles of the one chosen in their session", async () => {
    const orgA = await createOrganisation();
    const orgB = await createOrganisation();
    const { user } = await createMember(orgA, "designer");
    const { Membership } = await import("../../db/models/index.ts");
    await Membership.create({ userId: user.id, organisationId: orgB.id, roles: ["reviewer", "admin"] });
    const team = modules["../../app/routes/studio/team.tsx"];
    const inA = await settle(() => team.loader!(routeArgs(getRequest("/studio/team", { cookie: undefined }))));
    expect(inA.status).toBe(302);
    const inOrgA = await cookieFor(user.id, orgA.id);
    const inOrgB = await cookieFor(user.id, orgB.id);
    const asA = await settle(() => team.loader!(routeArgs(getRequest("/studio/team", { cookie: inOrgA }))));
    expect(asA.status).toBe(403);
    const asB = await settle(() => team.loader!(routeArgs(getRequest("/studio/team", { cookie: inOrgB }))));
    expect(asB.status).toBe(200);
    expect((asB.body as { organisation: string }).organisation).toBe(orgB.name);
  });
});
