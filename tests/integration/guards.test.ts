// The guard on every studio route, as a table written out by hand: route × identity → status, for
// the loader (GET) and the action (an empty form POST). Signed out → 302 to /login?redirectTo=…;
// not allowed → 403; allowed → whatever the route answers an empty request with (200, or 400 for an
// empty form, 404 for a made-up id). The table is NOT derived from app/lib/permissions.ts: it is the
// independent statement of who may do what. Route modules are discovered, so a new studio route
// without a row fails this file.
import { beforeAll, describe, expect, it } from "vitest";
import type { RouteConfigEntry } from "@react-router/dev/routes";
import routes from "../../app/routes.ts";
import type { Organisation } from "../../db/models/index.ts";
import { cookieFor, createMember, createOrganisation, createUser, formRequest, getRequest, makeSteward, routeArgs, settle } from "../helpers/db.ts";

type RouteModule = { loader?: (args: never) => unknown; action?: (args: never) => unknown };
const modules = import.meta.glob<RouteModule>("../../app/routes/studio/**/*.{tsx,ts}", { eager: true });

const IDENTITIES = ["out", "admin", "designer", "reviewer", "editor", "curator", "steward", "loner"] as const;
type Identity = (typeof IDENTITIES)[number];
// curator = designer and reviewer; steward = chart steward in no organisation; loner = in no organisation.

//                               out  admin designer reviewer editor curator steward loner
type Row = [number, number, number, number, number, number, number, number];
const EXPECTED: Record<string, { loader?: Row; action?: Row }> = {
  "layout.tsx": { loader: [302, 200, 200, 200, 200, 200, 200, 403] },
  "home.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403] },
  "account.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403], action: [302, 400, 400, 400, 400, 400, 403, 403] },
  "switch-organisation.tsx": { loader: [302, 302, 302, 302, 302, 302, 403, 403], action: [302, 400, 400, 400, 400, 400, 403, 403] },
  "team.tsx": { loader: [302, 200, 403, 403, 403, 403, 403, 403], action: [302, 400, 403, 403, 403, 403, 403, 403] },
  "editions.tsx": { loader: [302, 200, 403, 403, 200, 403, 200, 403], action: [302, 400, 403, 403, 400, 403, 400, 403] },
  "editions.import.tsx": { loader: [302, 200, 403, 403, 200, 403, 200, 403], action: [302, 400, 403, 403, 400, 403, 400, 403] },
  "library.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403] },
  "library.new.tsx": { loader: [302, 200, 403, 403, 200, 403, 403, 403], action: [302, 400, 403, 403, 400, 403, 403, 403] },
  "library.decay.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403] },
  "library.$id.tsx": { loader: [302, 404, 404, 404, 404, 404, 403, 403], action: [302, 400, 403, 403, 400, 403, 403, 403] },
  "exhibits.tsx": { loader: [302, 200, 200, 200, 200, 200, 403, 403] },
  "exhibits.new.tsx": { loader: [302, 403, 200, 403, 403, 200, 403, 403], action: [302, 403, 400, 403, 403, 400, 403, 403] },
  "exhibits.$slug.tsx": { loader: [302, 404, 404, 404, 404, 404, 403, 403], action: [302, 403, 400, 403, 403, 400, 403, 403] },
  "exhibits.$slug.schedule-csv.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.points-geojson.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.points-gpx.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.panels-pdf.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.panels-zip.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.signs-pdf.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.trailhead-pdf.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.profile-json.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.schedule-xlsx.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.kit-zip.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.exports.$jobId.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.exports.$jobId.file.ts": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.review.tsx": { loader: [302, 404, 404, 404, 404, 404, 403, 403], action: [302, 403, 400, 400, 403, 400, 403, 403] },
  "exhibits.$slug.revisions.tsx": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
  "exhibits.$slug.revisions.compare.tsx": { loader: [302, 404, 404, 404, 404, 404, 403, 403] },
};

// URL of each studio route module, read from the route table (":param" segments filled in).
const PATHS = new Map<string, string>();
(function walk(entries: RouteConfigEntry[], prefix: string) {
  for (const e of entries) {
    const path = e.index ? prefix : e.path ? `${prefix}/${e.path}` : prefix;
    PATHS.set(e.file.replace(/^routes\/studio\//, ""), path.replace(/:(\w+)/g, "999999").replace(/\/+/g, "/") || "/");
    if (e.children) walk(e.children, path);
  }
})(routes, "");

const nameOf = (file: string) => file.replace(/^.*app\/routes\/studio\//, "");

describe("studio guard: route × identity → status", () => {
  let orgA: Organisation;
  const cookies: Partial<Record<Identity, string>> = {};

  beforeAll(async () => {
    orgA = await createOrganisation();
    for (const role of ["admin", "designer", "reviewer", "editor"] as const) cookies[role] = await cookieFor((await createMember(orgA, role)).user.id);
    cookies.curator = await cookieFor((await createMember(orgA, ["designer", "reviewer"])).user.id);
    const steward = await createUser();
    await makeSteward(steward.id);
    cookies.steward = await cookieFor(steward.id);
    cookies.loner = await cookieFor((await createUser()).id);
  });

  const entries = Object.entries(modules);
  it("has a row for every studio route module, and a loader or action for every row", () => {
    expect(entries.map(([f]) => nameOf(f)).sort()).toEqual(Object.keys(EXPECTED).sort());
    for (const [file, mod] of entries) {
      const row = EXPECTED[nameOf(file)];
      expect(Boolean(mod.loader), `${nameOf(file)} loader`).toBe(Boolean(row.loader));
      expect(Boolean(mod.action), `${nameOf(file)} action`).toBe(Boolean(row.action));
    }
  });

  for (const [file, mod] of entries) {
    const name = nameOf(file);
    const path = PATHS.get(name);
    for (const kind of ["loader", "action"] as const) {
      const fn = mod[kind];
      const row = EXPECTED[name]?.[kind];
      if (!fn || !row || !path) continue;
      it(`${name} ${kind}`, async () => {
        const got: Record<string, number> = {};
        for (const who of IDENTITIES) {
          const cookie = cookies[who];
          const request = kind === "loader" ? getRequest(path, { cookie }) : formRequest(path, {}, { cookie });
          got[who] = (await settle(() => fn(routeArgs(request, { slug: "999999", id: "999999" })))).status;
        }
        expect(got).toEqual(Object.fromEntries(IDENTITIES.map((who, i) => [who, row[i]])));
      });
    }
  }

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
