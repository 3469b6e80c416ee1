// The guard on every studio route: signed out → /login?redirectTo=…, wrong role → 403,
// another organisation's data → 404. Route modules are discovered, so new studio routes are covered.
import { describe, expect, it, beforeAll } from "vitest";
import { createMember, createOrganisation, cookieFor, formRequest, getRequest, routeArgs, settle } from "../helpers/db.ts";
import type { Organisation } from "../../db/models/index.ts";
import type { RouteConfigEntry } from "@react-router/dev/routes";
import routes from "../../app/routes.ts";

type RouteModule = { loader?: (args: never) => unknown; action?: (args: never) => unknown };
const modules = import.meta.glob<RouteModule>("../../app/routes/studio/**/*.{tsx,ts}", { eager: true });

// Which roles may use each studio route (anything not listed is open to every member).
const ROLE_ONLY: Record<string, { loader?: string[]; action?: string[] }> = {
  "team.tsx": { loader: ["admin"], action: ["admin"] },
  "editions.tsx": { loader: ["editor", "admin"], action: ["editor", "admin"] },
  "editions.import.tsx": { loader: ["editor", "admin"], action: ["editor", "admin"] },
  "exhibits.new.tsx": { loader: ["designer"], action: ["designer"] },
  "exhibits.$slug.tsx": { action: ["designer"] },
  "library.tsx": { action: ["editor", "admin"] },
  "library.new.tsx": { loader: ["editor", "admin"], action: ["editor", "admin"] },
  "library.$id.tsx": { action: ["editor", "admin"] },
};

// URL of each studio route module, read from the route table (":param" segments filled in).
const PATHS = new Map<string, string>();
(function walk(entries: RouteConfigEntry[], prefix: string) {
  for (const e of entries) {
    const path = e.index ? prefix : e.path ? `${prefix}/${e.path}` : prefix;
    PATHS.set(e.file.replace(/^routes\/studio\//, ""), path.replace(/:(\w+)/g, "x").replace(/\/+/g, "/") || "/");
    if (e.children) walk(e.children, path);
  }
})(routes, "");

function pathFor(file: string) {
  const name = file.replace(/^.*app\/routes\/studio\//, "");
  const path = PATHS.get(name);
  if (!path) throw new Error(`${name} is not in app/routes.ts`);
  return path;
}

describe("studio guard", () => {
  let orgA: Organisation;
  let orgB: Organisation;
  const cookies: Record<string, string> = {};

  beforeAll(async () => {
    orgA = await createOrganisation();
    orgB = await createOrganisation();
    for (const role of ["admin", "designer", "reviewer", "editor"] as const) {
      const { user } = await createMember(orgA, role);
      cookies[role] = await cookieFor(user.id);
    }
  });

  const entries = Object.entries(modules);
  it("finds the studio route modules", () => {
    expect(entries.map(([f]) => f.replace(/^.*studio\//, "")).sort()).toEqual(expect.arrayContaining(["account.tsx", "home.tsx", "layout.tsx", "team.tsx"]));
  });

  for (const [file, mod] of entries) {
    const name = file.replace(/^.*app\/routes\/studio\//, "");
    const path = pathFor(file);
    for (const kind of ["loader", "action"] as const) {
      const fn = mod[kind];
      if (!fn) continue;
      it(`${name} ${kind}: signed out → redirect to sign-in with redirectTo`, async () => {
        const request = kind === "loader" ? getRequest(path) : formRequest(path, {});
        const res = await settle(() => fn(routeArgs(request)));
        expect(res.status).toBe(302);
        expect(res.headers.get("Location")).toBe(`/login?redirectTo=${encodeURIComponent(path)}`);
      });
      const allowed = ROLE_ONLY[name]?.[kind];
      if (allowed) {
        for (const role of ["admin", "designer", "reviewer", "editor"].filter((r) => !allowed.includes(r))) {
          it(`${name} ${kind}: ${role} → 403`, async () => {
            const request = kind === "loader" ? getRequest(path, { cookie: cookies[role] }) : formRequest(path, {}, { cookie: cookies[role] });
            const res = await settle(() => fn(routeArgs(request)));
            expect(res.status).toBe(403);
            expect(String((res.body as { message: string }).message)).toMatch(new RegExp(`This page is for ${allowed.join(" or ")} members`));
          });
        }
      }
    }
  }

  it("a user with no organisation gets a 403 that says what to do", async () => {
    const { createUser } = await import("../helpers/db.ts");
    const loner = await createUser();
    const cookie = await cookieFor(loner.id);
    const res = await settle(() => modules["../../app/routes/studio/home.tsx"].loader!(routeArgs(getRequest("/studio", { cookie }))));
    expect(res.status).toBe(403);
    expect((res.body as { message: string }).message).toMatch(/invitation/);
  });

  it("another organisation's membership cannot be changed or removed (404) and stays as it was", async () => {
    const team = modules["../../app/routes/studio/team.tsx"];
    const { membership } = await createMember(orgB, "designer");
    for (const fields of <Record<string, string>[]>[
      { intent: "change-role", membershipId: String(membership.id), role: "admin" },
      { intent: "remove", membershipId: String(membership.id) },
    ]) {
      const res = await settle(() => team.action!(routeArgs(formRequest("/studio/team", fields, { cookie: cookies.admin }))));
      expect(res.status).toBe(404);
    }
    await membership.reload();
    expect(membership.role).toBe("designer");
  });

  it("switching to an organisation the user does not belong to is a 404; to their own works", async () => {
    const sw = modules["../../app/routes/studio/switch-organisation.tsx"];
    const bad = await settle(() => sw.action!(routeArgs(formRequest("/studio/switch-organisation", { organisationId: String(orgB.id) }, { cookie: cookies.designer }))));
    expect(bad.status).toBe(404);
    const ok = await settle(() => sw.action!(routeArgs(formRequest("/studio/switch-organisation", { organisationId: String(orgA.id) }, { cookie: cookies.designer }))));
    expect(ok.status).toBe(302);
    expect(ok.headers.get("Location")).toBe("/studio");
  });

  it("members of two organisations see the one chosen in their session", async () => {
    const { user } = await createMember(orgA, "designer");
    const { Membership } = await import("../../db/models/index.ts");
    await Membership.create({ userId: user.id, organisationId: orgB.id, role: "reviewer" });
    const home = modules["../../app/routes/studio/home.tsx"];
    const inB = await settle(() => home.loader!(routeArgs(getRequest("/studio", { cookie: undefined }))));
    expect(inB.status).toBe(302);
    const cookie = await cookieFor(user.id, orgB.id);
    const res = await settle(() => home.loader!(routeArgs(getRequest("/studio", { cookie }))));
    expect((res.body as { organisation: string; role: string })).toMatchObject({ organisation: orgB.name, role: "reviewer" });
  });
});
