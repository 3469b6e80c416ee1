// The dated-event library and decay systems: the seeded reference data, create/edit/delete of an
// organisation's own entries (validated field by field, audited, nothing saved on error), who may
// do what (designers read, editors and admins manage, shared entries read-only, another
// organisation's entries 404), and the search route's JSON.
import { beforeAll, describe, expect, it } from "vitest";
import * as libraryPage from "../../app/routes/studio/library.tsx";
import * as newPage from "../../app/routes/studio/library.new.tsx";
import * as entryPage from "../../app/routes/studio/library.$id.tsx";
import * as decayPage from "../../app/routes/studio/library.decay.tsx";
import * as api from "../../app/routes/api.events.ts";
import { AuditEvent, DatedEvent, DecaySystem, type Organisation } from "../../db/models/index.ts";
import { SEED_DATED_EVENTS } from "../../db/data/dated-events/dated-events.ts";
import { SEED_DECAY_SYSTEMS } from "../../db/data/dated-events/decay-systems.ts";
import type { DatedEventView } from "../../app/lib/dated-events.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle, unique } from "../helpers/db.ts";

const GOOD = {
  name: "Marrowby Weir basalt",
  summary: "A lava flow exposed below the weir on the museum's riverside trail.",
  ageValue: "61.2",
  ageUnit: "Ma",
  uncertaintyValue: "0.4",
  ageKind: "point",
  citation: "Quarrie, A. & Strand, E. (2026). The Marrowby Weir basalt. Marrowby Museum Occasional Papers 3, 1–12.",
  doi: "",
  url: "",
  datingMethod: "40Ar/39Ar groundmass",
  verification: "checked against the source",
};

type Body = { error: string; fields: Record<string, string> };

let org: Organisation;
let other: Organisation;
const cookie: Record<string, string> = {};
let otherEditor: string;

beforeAll(async () => {
  org = await createOrganisation();
  other = await createOrganisation();
  for (const role of ["admin", "designer", "reviewer", "editor"] as const) {
    const { user } = await createMember(org, role);
    cookie[role] = await cookieFor(user.id);
  }
  const { user } = await createMember(other, "editor");
  otherEditor = await cookieFor(user.id);
});

async function create(fields: Record<string, string>, who = cookie.editor) {
  return settle(() => newPage.action(routeArgs(formRequest("/studio/library/new", fields, { cookie: who }))));
}

function idFromLocation(location: string | null) {
  const m = location?.match(/^\/studio\/library\/(\d+)$/);
  if (!m) throw new Error(`not an entry location: ${location}`);
  return Number(m[1]);
}

async function createGood(patch: Record<string, string> = {}) {
  const res = await create({ ...GOOD, name: unique(GOOD.name), ...patch });
  expect(res.status).toBe(302);
  return idFromLocation(res.headers.get("Location"));
}

describe("seeded reference data", () => {
  it("holds at least 25 shared events, each with a full citation, and reads ages back exactly", async () => {
    const shared = await DatedEvent.findAll({ where: { organisationId: null } });
    expect(shared.length).toBe(SEED_DATED_EVENTS.length);
    expect(shared.length).toBeGreaterThanOrEqual(25);
    for (const e of shared) {
      expect(e.citation.length, e.slug).toBeGreaterThan(40);
      expect(e.citation, e.slug).toMatch(/\(\d{4}\)/);
      expect(["checked against the source", "seen quoted by a secondary source", "from memory"]).toContain(e.verification);
    }
    const bySlug = new Map(shared.map((e) => [e.slug, e]));
    // NUMERIC keeps the decimals as written.
    expect(bySlug.get("oldest-solar-system-solids")).toMatchObject({ ageMa: "4567.30", uncertaintyMa: "0.16" });
    expect(bySlug.get("jack-hills-zircon")).toMatchObject({ ageMa: "4404", uncertaintyMa: "8" });
    expect(bySlug.get("end-permian-extinction")).toMatchObject({ ageMa: "251.941", uncertaintyMa: "0.037" });
    expect(bySlug.get("end-triassic-extinction")).toMatchObject({ ageMa: "201.564", uncertaintyMa: "0.015" });
    expect(bySlug.get("end-cretaceous-extinction")).toMatchObject({ ageMa: "66.043", uncertaintyMa: "0.011" });
    expect(bySlug.get("holocene-begins")).toMatchObject({ ageMa: "0.0117", uncertaintyMa: "0.000099" });
    // Richter et al. 2017 (Nature 546: 293–296): 315 ± 34 ka, a weighted average of TL ages on heated flint.
    expect(bySlug.get("earliest-homo-sapiens-jebel-irhoud")).toMatchObject({ ageMa: "0.315", uncertaintyMa: "0.034", datingMethod: "Thermoluminescence of heated flint (weighted average)" });
    expect(bySlug.get("isua-stromatolites-contested")!.name).toMatch(/contested/);
  });

  it("holds the decay systems with their sources; λ·t½ = ln 2", async () => {
    const rows = await DecaySystem.findAll();
    expect(rows.length).toBe(SEED_DECAY_SYSTEMS.length);
    const u238 = rows.find((r) => r.slug === "u238-pb206")!;
    expect(u238).toMatchObject({ parent: "U-238", daughter: "Pb-206", halfLifeYears: "4468300000", decayConstantStated: true });
    expect(Number(u238.decayConstantPerYear)).toBe(1.55125e-10);
    expect(u238.citation).toMatch(/Jaffey/);
    const k = rows.find((r) => r.slug === "k40-ar40")!;
    expect(Number(k.branchConstantPerYear)).toBe(5.81e-11);
    for (const r of rows) expect(Math.abs((Number(r.halfLifeYears) * Number(r.decayConstantPerYear)) / Math.LN2 - 1)).toBeLessThan(5e-4);
  });

  it("re-seeding updates in place and keeps ids", async () => {
    const before = await DatedEvent.findOne({ where: { organisationId: null, slug: "acasta-gneiss" } });
    const { up } = await import("../../db/seeders/reference/2026.12.01T02.00.00.dated-events.ts");
    const { sequelize } = await import("../../server/db.server.ts");
    await up({ sequelize, queryInterface: sequelize.getQueryInterface() });
    const after = await DatedEvent.findOne({ where: { organisationId: null, slug: "acasta-gneiss" } });
    expect(after!.id).toBe(before!.id);
    expect(await DatedEvent.count({ where: { organisationId: null } })).toBe(SEED_DATED_EVENTS.length);
  });
});

describe("the library page", () => {
  it("lists shared entries and the organisation's own, oldest first, for every role", async () => {
    const id = await createGood();
    for (const role of ["designer", "reviewer", "editor", "admin"]) {
      const res = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library", { cookie: cookie[role] }))));
      expect(res.status).toBe(200);
      const body = res.body as { events: DatedEventView[]; canManage: boolean; totals: { shared: number; ours: number } };
      expect(body.canManage).toBe(role === "editor" || role === "admin");
      expect(body.totals.shared).toBe(SEED_DATED_EVENTS.length);
      expect(body.events.some((e) => e.id === id && e.scope === "organisation")).toBe(true);
      const ages = body.events.map((e) => Number(e.ageMa));
      expect(ages).toEqual([...ages].sort((a, b) => b - a));
    }
  });

  it("editors, reviewers and admins see how far the figures were checked, and the interval-name check on the current edition; designers do not", async () => {
    // An own entry whose text names an interval its age does not fall in (Late Devonian: 382.31–358.86 Ma on ICS 2024/12).
    const bad = await createGood({ name: unique("Late Devonian fish bed"), ageValue: "300", uncertaintyValue: "", datingMethod: "" });
    type Checking = { counts: Record<"checked" | "quoted" | "memory", number>; editionLabel: string | null; warnings: { eventId: number; interval: string; message: string }[] } | null;
    for (const role of ["editor", "reviewer", "admin"]) {
      const res = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library", { cookie: cookie[role] }))));
      const { checking, totals } = res.body as { checking: Checking; totals: { shared: number; ours: number } };
      expect(checking!.counts.checked + checking!.counts.quoted + checking!.counts.memory).toBe(totals.shared + totals.ours);
      expect(checking!.counts.checked).toBe(SEED_DATED_EVENTS.filter((e) => e.verification === "checked against the source").length + totals.ours);
      expect(checking!.editionLabel).toBe("ICS 2024/12");
      // Only the bad own entry warns: the shared library has none after its corrections.
      expect(checking!.warnings.map((w) => [w.eventId, w.interval])).toEqual([[bad, "Late Devonian"]]);
      expect(checking!.warnings[0].message).toContain("runs from 382.31 ± 1.36 to 358.86 Ma");
    }
    const designer = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library", { cookie: cookie.designer }))));
    expect((designer.body as { checking: Checking }).checking).toBeNull();
    // The filter shows only the entries in one state.
    const memory = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library?checked=memory", { cookie: cookie.reviewer }))));
    const events = (memory.body as { events: DatedEventView[] }).events;
    expect(events.length).toBe(SEED_DATED_EVENTS.filter((e) => e.verification === "from memory").length);
    expect(events.every((e) => e.verification === "from memory")).toBe(true);
    await DatedEvent.destroy({ where: { id: bad } });
  });

  it("an entry page tells checkers, in a sentence, what the figures were checked against", async () => {
    const irhoud = await DatedEvent.findOne({ where: { organisationId: null, slug: "earliest-homo-sapiens-jebel-irhoud" } });
    const asReviewer = await settle(() => entryPage.loader(routeArgs(getRequest(`/studio/library/${irhoud!.id}`, { cookie: cookie.reviewer }), { id: String(irhoud!.id) })));
    expect((asReviewer.body as { checked: string }).checked).toMatch(/^The figures were checked against the published source: Richter et al\. 2017 abstract/);
    const asDesigner = await settle(() => entryPage.loader(routeArgs(getRequest(`/studio/library/${irhoud!.id}`, { cookie: cookie.designer }), { id: String(irhoud!.id) })));
    expect((asDesigner.body as { checked: string | null }).checked).toBeNull();
  });

  it("filters by shared / ours and searches name and summary", async () => {
    const name = unique("Quarry sandstone");
    await createGood({ name, summary: "Cross-bedded dune sandstone in the old Marrowby quarry." });
    const ours = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library?scope=ours", { cookie: cookie.designer }))));
    const oursEvents = (ours.body as { events: DatedEventView[] }).events;
    expect(oursEvents.length).toBeGreaterThan(0);
    expect(oursEvents.every((e) => e.scope === "organisation")).toBe(true);
    const shared = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library?scope=shared&q=zircon", { cookie: cookie.designer }))));
    const sharedEvents = (shared.body as { events: DatedEventView[] }).events;
    expect(sharedEvents.map((e) => e.slug)).toEqual(expect.arrayContaining(["jack-hills-zircon"]));
    expect(sharedEvents.every((e) => e.scope === "shared")).toBe(true);
    const bySummary = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library?q=dune%20quarry", { cookie: cookie.designer }))));
    expect((bySummary.body as { events: DatedEventView[] }).events.map((e) => e.name)).toEqual([name]);
    // Another organisation never sees it.
    const elsewhere = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library?q=dune%20quarry", { cookie: otherEditor }))));
    expect((elsewhere.body as { events: DatedEventView[] }).events).toEqual([]);
  });

  it("signed out → sign-in with redirectTo", async () => {
    const res = await settle(() => libraryPage.loader(routeArgs(getRequest("/studio/library"))));
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe(`/login?redirectTo=${encodeURIComponent("/studio/library")}`);
  });

  it("the decay-systems table is open to every member", async () => {
    const res = await settle(() => decayPage.loader(routeArgs(getRequest("/studio/library/decay", { cookie: cookie.reviewer }))));
    expect(res.status).toBe(200);
    const systems = (res.body as { systems: { slug: string; halfLifeYears: string }[] }).systems;
    expect(systems.map((s) => s.slug)).toEqual(SEED_DECAY_SYSTEMS.map((s) => s.slug));
    expect(systems.find((s) => s.slug === "c14-n14")!.halfLifeYears).toBe("5700"); // evaluated nuclear data; 5730 is the Cambridge convention
  });
});

describe("creating an entry", () => {
  it("an editor creates one: saved exactly, audited, visible only to the organisation", async () => {
    const name = unique("Weir basalt");
    const res = await create({ ...GOOD, name, ageValue: "315", ageUnit: "ka", uncertaintyValue: "34", doi: "https://doi.org/10.1038/nature22336", url: "https://example.org/weir" });
    expect(res.status).toBe(302);
    const id = idFromLocation(res.headers.get("Location"));
    const row = await DatedEvent.findByPk(id);
    expect(row).toMatchObject({ organisationId: org.id, name, ageMa: "0.315", uncertaintyMa: "0.034", doi: "10.1038/nature22336", url: "https://example.org/weir", verification: "checked against the source" });
    expect(row!.slug).toMatch(/^weir-basalt-/);
    expect(row!.createdById).not.toBeNull();
    const audit = await AuditEvent.findOne({ where: { action: "dated-event.create", objectId: String(id) } });
    expect(audit).toMatchObject({ organisationId: org.id, objectType: "dated_event" });

    const shown = await settle(() => entryPage.loader(routeArgs(getRequest(`/studio/library/${id}`, { cookie: cookie.designer }), { id: String(id) })));
    expect(shown.body).toMatchObject({ editable: false, event: { ageText: "315 ± 34 ka", scope: "organisation" } });
    const foreign = await settle(() => entryPage.loader(routeArgs(getRequest(`/studio/library/${id}`, { cookie: otherEditor }), { id: String(id) })));
    expect(foreign.status).toBe(404);
  });

  it("an admin may create too", async () => {
    const res = await create({ ...GOOD, name: unique("Admin entry") }, cookie.admin);
    expect(res.status).toBe(302);
  });

  it("validates every field with a clear message and saves nothing", async () => {
    const cases: [Record<string, string>, string, RegExp][] = [
      [{ name: "" }, "name", /^Name: /],
      [{ name: "x".repeat(161) }, "name", /^Name: use at most 160/],
      [{ summary: "" }, "summary", /^Summary: /],
      [{ summary: "y".repeat(501) }, "summary", /^Summary: keep it to 500/],
      [{ ageValue: "" }, "ageValue", /^Age: enter the age/],
      [{ ageValue: "4,404" }, "ageValue", /^Age: write a plain number/],
      [{ ageValue: "-1" }, "ageValue", /^Age: write a plain number/],
      [{ ageValue: "14.1", ageUnit: "Ga" }, "ageValue", /older than the Universe/],
      [{ ageUnit: "years" }, "ageUnit", /^Age unit: /],
      [{ uncertaintyValue: "±8" }, "uncertaintyValue", /^Uncertainty: write a plain number/],
      [{ uncertaintyValue: "62" }, "uncertaintyValue", /^Uncertainty: the ± cannot be larger than the age/],
      [{ ageKind: "roughly" }, "ageKind", /^Kind of age: /],
      [{ citation: "" }, "citation", /^Citation: give the full reference/],
      [{ citation: "A note without the year of anything" }, "citation", /^Citation: include the year/],
      [{ doi: "doi.org/nothing" }, "doi", /^DOI: /],
      [{ url: "javascript:alert(1)" }, "url", /^Link: /],
      [{ datingMethod: "z".repeat(201) }, "datingMethod", /^Dating method: use at most 200/],
      [{ verification: "trust me" }, "verification", /^Checked: /],
      [{ slug: "Has Spaces" }, "slug", /^Slug: /],
    ];
    const before = await DatedEvent.count();
    const audits = await AuditEvent.count({ where: { action: "dated-event.create" } });
    for (const [patch, field, message] of cases) {
      const res = await create({ ...GOOD, name: unique("Invalid"), ...patch });
      expect(res.status, `${field} ${JSON.stringify(patch).slice(0, 60)}`).toBe(400);
      const body = res.body as Body & { values: Record<string, string> };
      expect(body.fields[field], field).toMatch(message);
      expect(body.error).toMatch(/^Check the form: /);
      // The typed values come back so the form can show them again.
      expect(body.values.citation).toBe(patch.citation ?? GOOD.citation);
    }
    // A missing field (not just empty) is refused as well.
    const { verification: _v, ...noVerification } = GOOD;
    expect((await create({ ...noVerification, name: unique("No check") })).status).toBe(400);
    expect(await DatedEvent.count()).toBe(before);
    expect(await AuditEvent.count({ where: { action: "dated-event.create" } })).toBe(audits);
  });

  it("refuses a slug the organisation already uses, and allows the same slug in another organisation or the shared library", async () => {
    const slug = unique("weir").toLowerCase();
    await createGood({ slug });
    const again = await create({ ...GOOD, name: unique("Second weir"), slug });
    expect(again.status).toBe(400);
    expect((again.body as Body).fields.slug).toMatch(/^Slug: another entry of your organisation .* already uses/);
    const elsewhere = await create({ ...GOOD, name: unique("Their weir"), slug }, otherEditor);
    expect(elsewhere.status).toBe(302);
    const sharedSlug = await create({ ...GOOD, name: unique("Our zircon"), slug: "jack-hills-zircon" });
    expect(sharedSlug.status).toBe(302);
  });

  it("designers and reviewers cannot create (403); signed out → sign-in", async () => {
    const before = await DatedEvent.count();
    for (const role of ["designer", "reviewer"]) {
      const res = await create({ ...GOOD, name: unique("Not mine") }, cookie[role]);
      expect(res.status).toBe(403);
      expect((res.body as { message: string }).message).toMatch(/This page is for editor or admin members/);
      const page = await settle(() => newPage.loader(routeArgs(getRequest("/studio/library/new", { cookie: cookie[role] }))));
      expect(page.status).toBe(403);
    }
    const out = await settle(() => newPage.action(routeArgs(formRequest("/studio/library/new", GOOD))));
    expect(out.status).toBe(302);
    expect(out.headers.get("Location")).toBe(`/login?redirectTo=${encodeURIComponent("/studio/library/new")}`);
    expect(await DatedEvent.count()).toBe(before);
  });

  it("starts a copy from a shared entry with ?from=", async () => {
    const zircon = await DatedEvent.findOne({ where: { organisationId: null, slug: "jack-hills-zircon" } });
    const res = await settle(() => newPage.loader(routeArgs(getRequest(`/studio/library/new?from=${zircon!.id}`, { cookie: cookie.editor }))));
    expect(res.body).toMatchObject({ copiedFrom: zircon!.name, values: { ageValue: "4404", ageUnit: "Ma", uncertaintyValue: "8", slug: "" } });
  });
});

describe("editing and deleting", () => {
  async function save(id: number, fields: Record<string, string>, who = cookie.editor) {
    return settle(() => entryPage.action(routeArgs(formRequest(`/studio/library/${id}`, { intent: "save", ...fields }, { cookie: who }), { id: String(id) })));
  }
  async function remove(id: number, who = cookie.editor) {
    return settle(() => entryPage.action(routeArgs(formRequest(`/studio/library/${id}`, { intent: "delete" }, { cookie: who }), { id: String(id) })));
  }

  it("an editor edits their organisation's entry; the audit records what changed", async () => {
    const id = await createGood();
    const row = await DatedEvent.findByPk(id);
    const page = await settle(() => entryPage.loader(routeArgs(getRequest(`/studio/library/${id}`, { cookie: cookie.editor }), { id: String(id) })));
    expect(page.body).toMatchObject({ editable: true, values: { ageValue: "61.2", ageUnit: "Ma", uncertaintyValue: "0.4" } });
    const res = await save(id, { ...GOOD, name: row!.name, slug: row!.slug, ageValue: "61.25", uncertaintyValue: "0.15", verification: "from memory" });
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe(`/studio/library/${id}`);
    await row!.reload();
    expect(row).toMatchObject({ ageMa: "61.25", uncertaintyMa: "0.15", verification: "from memory" });
    const audit = await AuditEvent.findOne({ where: { action: "dated-event.update", objectId: String(id) } });
    expect(audit!.details).toMatchObject({ changes: { ageMa: { from: "61.2", to: "61.25" }, uncertaintyMa: { from: "0.4", to: "0.15" }, verification: { from: "checked against the source", to: "from memory" } } });
  });

  it("an invalid edit is refused field by field and changes nothing", async () => {
    const id = await createGood();
    const row = await DatedEvent.findByPk(id);
    const res = await save(id, { ...GOOD, name: row!.name, citation: "", ageValue: "abc" });
    expect(res.status).toBe(400);
    expect((res.body as Body).fields).toMatchObject({ citation: expect.stringMatching(/^Citation/), ageValue: expect.stringMatching(/^Age/) });
    const fresh = await DatedEvent.findByPk(id);
    expect(fresh!.toJSON()).toEqual(row!.toJSON());
  });

  it("shared entries are read-only for editors and admins alike (403), valid form or not", async () => {
    const shared = await DatedEvent.findOne({ where: { organisationId: null, slug: "acasta-gneiss" } });
    const before = shared!.toJSON();
    for (const who of [cookie.editor, cookie.admin]) {
      const edit = await save(shared!.id, { ...GOOD, name: "Acasta, edited" }, who);
      expect(edit.status).toBe(403);
      expect((edit.body as Body).error).toMatch(/Shared library entries are read-only/);
      const invalid = await save(shared!.id, { ...GOOD, name: "" }, who);
      expect(invalid.status).toBe(403);
      const del = await remove(shared!.id, who);
      expect(del.status).toBe(403);
    }
    const page = await settle(() => entryPage.loader(routeArgs(getRequest(`/studio/library/${shared!.id}`, { cookie: cookie.editor }), { id: String(shared!.id) })));
    expect(page.body).toMatchObject({ editable: false, event: { scope: "shared", ageText: "4031 ± 3 Ma" } });
    expect((await DatedEvent.findByPk(shared!.id))!.toJSON()).toEqual(before);
  });

  it("another organisation's entry is 404 on view, edit and delete, and stays as it was", async () => {
    const res = await create({ ...GOOD, name: unique("Theirs") }, otherEditor);
    const id = idFromLocation(res.headers.get("Location"));
    const before = (await DatedEvent.findByPk(id))!.toJSON();
    expect((await save(id, GOOD)).status).toBe(404);
    expect((await remove(id)).status).toBe(404);
    expect((await remove(999999999)).status).toBe(404);
    expect((await settle(() => entryPage.loader(routeArgs(getRequest("/studio/library/nope", { cookie: cookie.editor }), { id: "nope" })))).status).toBe(404);
    expect((await DatedEvent.findByPk(id))!.toJSON()).toEqual(before);
  });

  it("designers and reviewers cannot edit or delete (403)", async () => {
    const id = await createGood();
    for (const role of ["designer", "reviewer"]) {
      expect((await save(id, GOOD, cookie[role])).status).toBe(403);
      expect((await remove(id, cookie[role])).status).toBe(403);
    }
    expect(await DatedEvent.findByPk(id)).not.toBeNull();
  });

  it("an admin deletes an entry; the audit keeps a snapshot", async () => {
    const id = await createGood();
    const res = await remove(id, cookie.admin);
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe("/studio/library");
    expect(await DatedEvent.findByPk(id)).toBeNull();
    const audit = await AuditEvent.findOne({ where: { action: "dated-event.delete", objectId: String(id) } });
    expect(audit!.details).toMatchObject({ snapshot: { ageMa: "61.2", citation: GOOD.citation } });
  });

  it("an unknown intent is a 400", async () => {
    const id = await createGood();
    const res = await settle(() => entryPage.action(routeArgs(formRequest(`/studio/library/${id}`, { intent: "publish" }, { cookie: cookie.editor }), { id: String(id) })));
    expect(res.status).toBe(400);
  });

  it("the entry page shows how-we-know figures for radiometric methods", async () => {
    const zircon = await DatedEvent.findOne({ where: { organisationId: null, slug: "jack-hills-zircon" } });
    const res = await settle(() => entryPage.loader(routeArgs(getRequest(`/studio/library/${zircon!.id}`, { cookie: cookie.designer }), { id: String(zircon!.id) })));
    const panels = (res.body as { howWeKnow: { slug: string; percentText: string }[] }).howWeKnow;
    expect(panels.map((p) => p.slug)).toEqual(["u238-pb206", "u235-pb207"]);
    // e^(−1.55125e-10 × 4404e6) = 0.50505 (bc -l).
    expect(panels[0].percentText).toBe("50.5 %");
  });
});

describe("GET /api/events", () => {
  async function search(query: string, who?: string) {
    const res = await api.loader(routeArgs(getRequest(`/api/events${query}`, { cookie: who })));
    return { status: res.status, type: res.headers.get("Content-Type"), cache: res.headers.get("Cache-Control"), body: await res.json() };
  }

  it("answers shared and own entries by name or summary, names starting with the query first, at most 20", async () => {
    const name = unique("Zircon of the weir");
    await createGood({ name, summary: "A detrital grain from the Marrowby gravels." });
    const res = await search("?q=zircon", cookie.designer);
    expect(res.status).toBe(200);
    expect(res.type).toMatch(/^application\/json/);
    expect(res.cache).toMatch(/no-store/);
    expect(res.body).toMatchObject({ query: "zircon", limit: 20 });
    const results = res.body.results as DatedEventView[];
    expect(res.body.count).toBe(results.length);
    expect(results[0].name).toBe(name); // starts with "Zircon"
    expect(results.map((r) => r.slug)).toEqual(expect.arrayContaining(["jack-hills-zircon"]));
    expect(Object.keys(results[0]).sort()).toEqual(
      ["id", "slug", "name", "summary", "ageMa", "uncertaintyMa", "ageKind", "ageText", "citation", "doi", "url", "datingMethod", "verification", "checkedAgainst", "scope"].sort(),
    );
    expect(results.find((r) => r.slug === "jack-hills-zircon")).toMatchObject({ ageMa: "4404", uncertaintyMa: "8", ageText: "4404 ± 8 Ma", scope: "shared", datingMethod: "U–Pb zircon (SHRIMP ion microprobe)" });

    const all = await search("", cookie.designer);
    expect(all.body.results.length).toBe(20);
    const few = await search("?q=extinction&limit=3", cookie.designer);
    expect(few.body.results.length).toBe(3);
    const none = await search("?q=unobtainium", cookie.designer);
    expect(none.body).toMatchObject({ count: 0, results: [] });
    // Escaped, not a wildcard.
    const pct = await search("?q=%25", cookie.designer);
    expect(pct.body.count).toBe(0);
  });

  it("never shows another organisation's entries", async () => {
    const name = unique("Hidden gravel");
    await create({ ...GOOD, name }, otherEditor);
    const res = await search(`?q=${encodeURIComponent(name)}`, cookie.editor);
    expect(res.body.count).toBe(0);
    const theirs = await search(`?q=${encodeURIComponent(name)}`, otherEditor);
    expect(theirs.body.count).toBe(1);
  });

  it("signed out → 401 JSON; bad parameters → 400 with the reason", async () => {
    const out = await search("?q=zircon");
    expect(out.status).toBe(401);
    expect(out.body.error.message).toMatch(/Sign in/);
    expect((await search("?limit=0", cookie.designer)).status).toBe(400);
    expect((await search("?limit=21", cookie.designer)).body.error.message).toMatch(/^limit: /);
    expect((await search(`?q=${"a".repeat(101)}`, cookie.designer)).body.error.message).toMatch(/^q: /);
  });
});
