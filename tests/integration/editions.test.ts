// Chart editions against real Postgres: exact storage of the chart's figures, the reference seeder,
// the two-step import (round trip, problems save nothing, the confirm step re-validates), making an
// edition the latest (stewards) or current for an organisation (its editors and admins), ownership
// across two organisations, the role guard and draft visibility.
import { QueryTypes } from "sequelize";
import { beforeAll, describe, expect, it } from "vitest";
import * as compareRoute from "../../app/routes/editions.compare.tsx";
import * as editionPage from "../../app/routes/editions.$slug.tsx";
import * as editionCsv from "../../app/routes/editions.$slug.csv.tsx";
import * as editionJson from "../../app/routes/editions.$slug.json.tsx";
import * as editionsIndex from "../../app/routes/editions.index.tsx";
import * as importRoute from "../../app/routes/studio/editions.import.tsx";
import * as manageRoute from "../../app/routes/studio/editions.tsx";
import { exportCsv } from "../../app/lib/timescale/index.ts";
import { AuditEvent, ChartEdition, Interval } from "../../db/models/index.ts";
import { sequelize } from "../../server/db.server.ts";
import * as seedModule from "../../db/seeders/reference/2026.12.01T01.00.00.ics-editions.ts";
import { MAX_UPLOAD_BYTES, editionIntervals, makeLatest } from "../../server/editions.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle, unique } from "../helpers/db.ts";
import { SEEDED_CURRENT, SEEDED_RETIRED, TEST_META, fixture, multipartRequest, newSteward, restoreSeededLatest } from "../helpers/editions.ts";
import type { Organisation, User } from "../../db/models/index.ts";

type ImportData = {
  step: "upload" | "preview";
  error: string | null;
  fields: Record<string, string>;
  preview: null | {
    problems: { line?: number; interval: string; field: string; message: string; rule: string }[];
    intervals: unknown[];
    confirm: { content: string; token: string } | null;
    metaErrors: Record<string, string>;
    comparedWith: { slug: string; moved: number } | null;
  };
};

let org: Organisation;
let editor: User;
const cookies: Record<string, string> = {};

beforeAll(async () => {
  org = await createOrganisation();
  for (const role of ["admin", "designer", "reviewer", "editor"] as const) {
    const { user } = await createMember(org, role);
    cookies[role] = await cookieFor(user.id);
    if (role === "editor") editor = user;
  }
});

async function exportText(slug: string, format: "csv" | "json", cookie?: string) {
  const mod = format === "csv" ? editionCsv : editionJson;
  const res = (await mod.loader(routeArgs(getRequest(`/editions/${slug}/intervals.${format}`, { cookie }), { slug }))) as Response;
  return { status: res.status, text: await res.text(), headers: res.headers };
}

async function preview(cookie: string, file: { name: string; content: string | Uint8Array }, meta: Record<string, string>, format = "auto") {
  const req = multipartRequest("/studio/editions/import", { intent: "preview", format, ...meta }, { file }, { cookie });
  return settle(() => importRoute.action(routeArgs(req)));
}

async function confirm(cookie: string, fields: Record<string, string>) {
  const req = multipartRequest("/studio/editions/import", { intent: "confirm", ...fields }, {}, { cookie });
  return settle(() => importRoute.action(routeArgs(req)));
}

/** Upload, check the preview has no problems, confirm; returns the confirm response. */
async function importFile(content: string, name: string, slug: string) {
  const meta = { slug, ...TEST_META };
  const p = await preview(cookies.editor, { name, content }, meta);
  const body = p.body as ImportData;
  expect(body.preview?.problems).toEqual([]);
  expect(p.status).toBe(200);
  return confirm(cookies.editor, { ...meta, format: name.endsWith(".json") ? "json" : "csv", fileName: name, content: body.preview!.confirm!.content, token: body.preview!.confirm!.token });
}

const editionCount = async () => ChartEdition.count();

describe("storage: the chart's figures come back exactly", () => {
  it("keeps the decimals as written (NUMERIC) and null where no ± is printed", async () => {
    const rows = await sequelize.query<{ name: string; base: string; pm: string | null; top: string }>(
      `SELECT i.name, i.base_ma::text AS base, i.base_uncertainty_ma::text AS pm, i.top_ma::text AS top
       FROM intervals i JOIN chart_editions e ON e.id = i.edition_id
       WHERE e.slug = :slug AND i.name IN ('Triassic', 'Holocene', 'Meghalayan', 'Hadean', 'Ordovician')
       ORDER BY i.name`,
      { replacements: { slug: SEEDED_CURRENT }, type: QueryTypes.SELECT },
    );
    expect(rows).toEqual([
      { name: "Hadean", base: "4567", pm: null, top: "4031" },
      { name: "Holocene", base: "0.0117", pm: null, top: "0" },
      { name: "Meghalayan", base: "0.0042", pm: null, top: "0" },
      { name: "Ordovician", base: "486.85", pm: "1.5", top: "443.1" },
      { name: "Triassic", base: "251.902", pm: "0.024", top: "201.4" },
    ]);
  });

  it("reads every seeded edition back equal to its seed file", async () => {
    for (const slug of [SEEDED_CURRENT, SEEDED_RETIRED] as const) {
      const edition = await ChartEdition.findOne({ where: { slug } });
      expect(await editionIntervals(edition!.id)).toEqual(seedModule.readSeededEdition(slug).intervals);
      expect(edition!.corrections).toEqual(seedModule.readSeededEdition(slug).edition.corrections);
    }
  });

  it("allows one latest shared edition only (partial unique index per owner)", async () => {
    expect(await ChartEdition.count({ where: { status: "current", organisationId: null } })).toBe(1);
    await expect(sequelize.query(`UPDATE chart_editions SET status = 'current' WHERE slug = :slug`, { replacements: { slug: SEEDED_RETIRED } })).rejects.toMatchObject({
      parent: { constraint: "chart_editions_one_current_per_owner" },
    });
  });

  it("refuses a parent from another edition and a base younger than its top", async () => {
    const [a, b] = await Promise.all([ChartEdition.findOne({ where: { slug: SEEDED_CURRENT } }), ChartEdition.findOne({ where: { slug: SEEDED_RETIRED } })]);
    const foreign = await Interval.findOne({ where: { editionId: b!.id, name: "Cenozoic" } });
    await expect(
      sequelize.query(`UPDATE intervals SET parent_id = :p WHERE edition_id = :e AND name = 'Paleogene'`, { replacements: { p: foreign!.id, e: a!.id } }),
    ).rejects.toMatchObject({ parent: { constraint: "intervals_parent_same_edition" } });
    await expect(sequelize.query(`UPDATE intervals SET top_ma = 70 WHERE edition_id = :e AND name = 'Danian'`, { replacements: { e: a!.id } })).rejects.toMatchObject({
      parent: { constraint: "intervals_base_older" },
    });
  });
});

describe("reference seeder", () => {
  it("is idempotent: a second run keeps ids, counts and values, and does not change which edition is current", async () => {
    const before = await sequelize.query<{ id: number; name: string; base: string }>(`SELECT id, name, base_ma::text AS base FROM intervals ORDER BY id`, { type: QueryTypes.SELECT });
    const editionsBefore = await ChartEdition.findAll({ order: [["id", "ASC"]], attributes: ["id", "slug", "status"] });
    await seedModule.up({ sequelize, queryInterface: sequelize.getQueryInterface() });
    const after = await sequelize.query<{ id: number; name: string; base: string }>(`SELECT id, name, base_ma::text AS base FROM intervals ORDER BY id`, { type: QueryTypes.SELECT });
    const editionsAfter = await ChartEdition.findAll({ order: [["id", "ASC"]], attributes: ["id", "slug", "status"] });
    expect(after).toEqual(before);
    expect(editionsAfter.map((e) => e.toJSON())).toEqual(editionsBefore.map((e) => e.toJSON()));
    for (const slug of [SEEDED_CURRENT, SEEDED_RETIRED]) {
      const e = await ChartEdition.findOne({ where: { slug } });
      expect(await Interval.count({ where: { editionId: e!.id } })).toBe(177);
    }
  });
});

describe("export → import round trip", () => {
  it("CSV: the export of a seeded edition imports as a draft and exports identically", async () => {
    const original = await exportText(SEEDED_CURRENT, "csv");
    expect(original.status).toBe(200);
    expect(original.headers.get("Content-Type")).toMatch(/^text\/csv/);
    expect(original.headers.get("Content-Disposition")).toContain(`${SEEDED_CURRENT}-intervals.csv`);
    const slug = unique("roundtrip-csv");
    const res = await importFile(original.text, `${SEEDED_CURRENT}-intervals.csv`, slug);
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe(`/editions/${slug}`);
    const saved = await ChartEdition.findOne({ where: { slug } });
    expect(saved!.status).toBe("draft");
    expect(saved!.createdById).toBe(editor.id);
    const again = await exportText(slug, "csv", cookies.editor);
    expect(again.text).toBe(original.text);
    const audit = await AuditEvent.findOne({ where: { action: "edition.import", objectId: String(saved!.id) } });
    expect(audit!.actorId).toBe(editor.id);
    expect(audit!.details).toMatchObject({ slug, format: "csv", intervals: 177 });
  });

  it("JSON: the same for the JSON export (retired edition, boundary kinds carried over)", async () => {
    const original = await exportText(SEEDED_RETIRED, "json");
    const slug = unique("roundtrip-json");
    const res = await importFile(original.text, `${SEEDED_RETIRED}-intervals.json`, slug);
    expect(res.status).toBe(302);
    expect((await exportText(slug, "json", cookies.editor)).text).toBe(original.text);
    expect((await exportText(slug, "csv", cookies.editor)).text).toBe((await exportText(SEEDED_RETIRED, "csv")).text);
  });

  it("Turtle: the ICS file itself is read, and its own errors are reported with lines (nothing saved)", async () => {
    const { readFileSync } = await import("node:fs");
    const ttl = readFileSync("db/data/ics/source/ics-chart-2024-12.ttl", "utf8");
    const before = await editionCount();
    const res = await preview(cookies.editor, { name: "chart.ttl", content: ttl }, { slug: unique("ttl"), ...TEST_META });
    const body = res.body as ImportData;
    expect(body.preview!.intervals).toHaveLength(177);
    // The uncorrected file breaks the Aquitanian/Ludlow boundaries (see db/data/ics/README.md).
    expect(body.preview!.problems.some((p) => p.interval === "Aquitanian" && typeof p.line === "number")).toBe(true);
    expect(body.preview!.confirm).toBeNull();
    expect(res.status).toBe(422);
    expect(await editionCount()).toBe(before);
  });

  it("exports are cacheable and revalidate with the ETag", async () => {
    const first = await exportText(SEEDED_CURRENT, "csv");
    const etag = first.headers.get("ETag")!;
    const res = (await editionCsv.loader(routeArgs(new Request(`http://test.local/editions/${SEEDED_CURRENT}/intervals.csv`, { headers: { "If-None-Match": etag } }), { slug: SEEDED_CURRENT }))) as Response;
    expect(res.status).toBe(304);
  });
});

describe("an import with problems saves nothing", () => {
  it("shows every problem with its line, and no edition or interval is written", async () => {
    const before = { editions: await editionCount(), intervals: await Interval.count() };
    const slug = unique("broken");
    const res = await preview(cookies.editor, { name: "test-edition-one-error.csv", content: fixture("test-edition-one-error.csv") }, { slug, ...TEST_META });
    expect(res.status).toBe(422);
    const body = res.body as ImportData;
    expect(body.error).toMatch(/2 problems found\. Nothing has been saved/);
    // Reported at the file line, under the CSV column name.
    expect(body.preview!.problems.map((p) => [p.line, p.interval, p.field, p.rule])).toEqual([
      [131, "Berriasian", "base_ma", "tiling-base"],
      [131, "Berriasian", "base_ma", "rank-overlap"],
    ]);
    expect(body.preview!.confirm).toBeNull();
    expect(await ChartEdition.findOne({ where: { slug } })).toBeNull();
    expect({ editions: await editionCount(), intervals: await Interval.count() }).toEqual(before);
  });

  it("row problems (CSV columns) carry the file line and the column name", async () => {
    const csv = fixture("test-edition.csv").replace("Berriasian,age,Early Cretaceous,143,0.6,", "Berriasian,age,Early Cretaceous,143,-0.6,");
    const res = await preview(cookies.editor, { name: "x.csv", content: csv }, { slug: unique("row"), ...TEST_META });
    const problems = (res.body as ImportData).preview!.problems;
    expect(problems).toEqual([expect.objectContaining({ line: 131, interval: "Berriasian", field: "base_uncertainty_ma", rule: "row" })]);
  });

  it("the confirm step parses and checks again: a forged or altered file is refused and nothing is saved", async () => {
    const meta = { slug: unique("forged"), ...TEST_META };
    const good = await preview(cookies.editor, { name: "t.csv", content: fixture("test-edition.csv") }, meta);
    const { token, content } = (good.body as ImportData).preview!.confirm!;
    const before = await editionCount();

    // The broken file sent with the good file's token (content altered after the preview).
    const broken = Buffer.from(fixture("test-edition-one-error.csv")).toString("base64");
    const altered = await confirm(cookies.editor, { ...meta, format: "csv", fileName: "t.csv", content: broken, token });
    expect(altered.status).toBe(422);
    expect((altered.body as ImportData).error).toMatch(/not previewed by you/);
    expect((altered.body as ImportData).preview!.problems).toHaveLength(2);

    // A token for another user's preview does not work either.
    const forged = await confirm(cookies.admin, { ...meta, format: "csv", fileName: "t.csv", content, token });
    expect(forged.status).toBe(422);

    // A clean file whose slug was taken between preview and confirm.
    const taken = await confirm(cookies.editor, { ...meta, slug: SEEDED_CURRENT, format: "csv", fileName: "t.csv", content, token });
    expect(taken.status).toBe(422);
    expect((taken.body as ImportData).fields.slug).toMatch(/already used/);

    expect(await editionCount()).toBe(before);
    expect(await ChartEdition.findOne({ where: { slug: meta.slug } })).toBeNull();

    // The untouched preview still confirms.
    const ok = await confirm(cookies.editor, { ...meta, format: "csv", fileName: "t.csv", content, token });
    expect(ok.status).toBe(302);
  });

  it("validates the form fields with clear messages", async () => {
    const res = await preview(cookies.editor, { name: "t.csv", content: fixture("test-edition.csv") }, { slug: "Not A Slug", label: "", source: "short", licence: "" });
    expect(res.status).toBe(400);
    const fields = (res.body as ImportData).fields;
    expect(fields.slug).toMatch(/lower-case letters, digits and single hyphens/);
    expect(fields.label).toMatch(/Enter a label/);
    expect(fields.source).toMatch(/full citation/);
    expect(fields.licence).toMatch(/licence/);
    const none = await settle(() =>
      importRoute.action(routeArgs(multipartRequest("/studio/editions/import", { intent: "preview", format: "auto", slug: unique("nofile"), ...TEST_META }, { file: { name: "", content: "" } }, { cookie: cookies.editor }))),
    );
    expect((none.body as ImportData).fields.file).toMatch(/Choose a file/);
    const reserved = await preview(cookies.editor, { name: "t.csv", content: "x" }, { slug: "compare", ...TEST_META });
    expect((reserved.body as ImportData).fields.slug).toMatch(/used by the site's own pages/);
  });

  it("refuses files over 5 MB with a clear message", async () => {
    // Just over: the form's own check on the file.
    const big = new Uint8Array(MAX_UPLOAD_BYTES + 10).fill(0x61);
    const res = await preview(cookies.editor, { name: "big.csv", content: big }, { slug: unique("big"), ...TEST_META });
    expect(res.status).toBe(400);
    expect((res.body as ImportData).fields.file).toMatch(/larger than 5 MB/);
    // Far over: refused by the declared size, before the body is read.
    const byHeader = new Request("http://test.local/studio/editions/import", {
      method: "POST",
      headers: { Cookie: cookies.editor, "Content-Type": "multipart/form-data; boundary=x", "Content-Length": String(20 * 1024 * 1024) },
      body: "--x--",
    });
    const refused = await settle(() => importRoute.action(routeArgs(byHeader)));
    expect(refused.status).toBe(413);
    expect((refused.body as ImportData).fields.file).toMatch(/larger than 5 MB/);
  });

  it("refuses a file that is not UTF-8", async () => {
    const res = await preview(cookies.editor, { name: "latin1.csv", content: new Uint8Array([0x6e, 0x61, 0x6d, 0x65, 0xe9, 0xff]) }, { slug: unique("enc"), ...TEST_META });
    expect(res.status).toBe(400);
    expect((res.body as ImportData).fields.file).toMatch(/not UTF-8/);
  });
});

describe("the current edition of an organisation", () => {
  let own: string;
  beforeAll(async () => {
    own = unique("own-next");
    const res = await importFile(fixture("test-edition.csv"), "test-edition.csv", own);
    expect(res.status).toBe(302);
  });
  const post = (cookie: string, fields: Record<string, string>) => settle(() => manageRoute.action(routeArgs(formRequest("/studio/editions", fields, { cookie }))));

  it("an editor's import is the organisation's own draft, labelled as such and audited under it", async () => {
    const saved = await ChartEdition.findOne({ where: { slug: own } });
    expect(saved).toMatchObject({ status: "draft", organisationId: org.id });
    const audit = await AuditEvent.findOne({ where: { action: "edition.import", objectId: String(saved!.id) } });
    expect(audit!.organisationId).toBe(org.id);
    const page = await settle(() => editionPage.loader(routeArgs(getRequest(`/editions/${own}`, { cookie: cookies.editor }), { slug: own })));
    expect((page.body as { edition: { ownerName: string; latest: boolean } }).edition).toMatchObject({ ownerName: org.name, latest: false });
  });

  it("an own edition may not be named like an ICS edition", async () => {
    const p = await preview(cookies.editor, { name: "t.csv", content: fixture("test-edition.csv") }, { ...TEST_META, slug: unique("fake-ics"), label: "ICS 2025/06" });
    expect(p.status).toBe(422);
    expect((p.body as ImportData).fields.label).toMatch(/must not be named like an ICS edition/);
  });

  it("making its own edition current changes that organisation only: its audit, its exhibits' re-check, not the shared editions", async () => {
    const other = await createOrganisation();
    const res = await post(cookies.editor, { intent: "set-current", slug: own, redirectTo: `/editions/${own}` });
    expect(res.status).toBe(302);
    expect(res.headers.get("Location")).toBe(`/editions/${own}`);
    await org.reload();
    const edition = await ChartEdition.findOne({ where: { slug: own } });
    expect(org.currentEditionId).toBe(edition!.id);
    expect(edition!.status).toBe("current");
    // The shared editions and another organisation are untouched.
    expect((await ChartEdition.findOne({ where: { slug: SEEDED_CURRENT } }))!.status).toBe("current");
    await other.reload();
    expect(other.currentEditionId).toBeNull();
    const audit = await AuditEvent.findOne({ where: { action: "edition.set-current", objectId: String(edition!.id) } });
    expect(audit).toMatchObject({ organisationId: org.id, actorId: editor.id });
    // The public API still serves the shared latest edition, and never the own edition.
    const { loader } = await import("../../app/routes/api.timescales.$slug.ts");
    const api = (await loader(routeArgs(new Request(`http://test.local/api/timescales/${own}`), { slug: own }))) as Response;
    expect(api.status).toBe(404);
  });

  it("switching back to a shared edition retires the own one; asking twice is refused", async () => {
    const res = await post(cookies.admin, { intent: "set-current", slug: SEEDED_CURRENT });
    expect(res.status).toBe(302);
    expect((await ChartEdition.findOne({ where: { slug: own } }))!.status).toBe("retired");
    const again = await post(cookies.admin, { intent: "set-current", slug: SEEDED_CURRENT });
    expect(again.status).toBe(400);
    expect((again.body as { error: string }).error).toMatch(/already the current edition of/);
  });

  it("retires and discards own drafts (admins too), audited; unknown slugs are 404; unknown intents 400", async () => {
    const a = unique("to-retire");
    const b = unique("to-discard");
    await importFile(fixture("test-edition.csv"), "t.csv", a);
    await importFile(fixture("test-edition.csv"), "t.csv", b);
    expect((await post(cookies.admin, { intent: "retire", slug: a })).status).toBe(302);
    expect((await ChartEdition.findOne({ where: { slug: a } }))!.status).toBe("retired");
    const d = await post(cookies.admin, { intent: "discard", slug: b, redirectTo: `/editions/${b}` });
    expect(d.status).toBe(302);
    expect(d.headers.get("Location")).toBe("/studio/editions");
    expect(await ChartEdition.findOne({ where: { slug: b } })).toBeNull();
    expect(await AuditEvent.count({ where: { action: ["edition.retire", "edition.discard"], organisationId: org.id } })).toBe(2);
    expect((await post(cookies.admin, { intent: "set-current", slug: "no-such-edition" })).status).toBe(404);
    const bad = await post(cookies.admin, { intent: "explode", slug: a });
    expect(bad.status).toBe(400);
    expect((bad.body as { error: string }).error).toMatch(/Unknown action/);
  });
});

describe("ownership across two organisations", () => {
  it("editors and admins of one organisation cannot change, retire or discard a shared edition or another organisation's (403/404); nothing changes, nothing is audited", async () => {
    const orgB = await createOrganisation();
    const { user: editorB } = await createMember(orgB, "editor");
    const cookieB = await cookieFor(editorB.id);
    const ownA = unique("own-a");
    await importFile(fixture("test-edition.csv"), "t.csv", ownA);
    const { actor: steward } = await newSteward();
    const sharedDraft = unique("shared-draft");
    const up = await preview(await cookieFor(steward.id), { name: "t.csv", content: fixture("test-edition.csv") }, { ...TEST_META, slug: sharedDraft, owner: "shared" });
    const upBody = up.body as ImportData;
    expect(upBody.preview?.confirm).not.toBeNull();
    expect((await confirm(await cookieFor(steward.id), { ...TEST_META, slug: sharedDraft, owner: "shared", format: "csv", fileName: "t.csv", content: upBody.preview!.confirm!.content, token: upBody.preview!.confirm!.token })).status).toBe(302);
    expect((await ChartEdition.findOne({ where: { slug: sharedDraft } }))!.organisationId).toBeNull();

    const before = {
      editions: (await ChartEdition.findAll({ order: [["id", "ASC"]], attributes: ["id", "slug", "status", "organisationId"] })).map((e) => e.toJSON()),
      audits: await AuditEvent.count(),
      orgB: (await orgB.reload()).currentEditionId,
    };
    const cases: [string, Record<string, string>, number][] = [
      // another organisation's own edition: invisible → 404
      [cookieB, { intent: "set-current", slug: ownA }, 404],
      [cookieB, { intent: "retire", slug: ownA }, 404],
      [cookieB, { intent: "discard", slug: ownA }, 404],
      // a shared released edition: visible, but only stewards manage it → 403
      [cookieB, { intent: "retire", slug: SEEDED_RETIRED }, 403],
      [cookieB, { intent: "discard", slug: SEEDED_RETIRED }, 403],
      [cookieB, { intent: "make-latest", slug: SEEDED_RETIRED }, 403],
      [cookies.admin, { intent: "make-latest", slug: SEEDED_RETIRED }, 403],
      [cookies.editor, { intent: "retire", slug: SEEDED_CURRENT }, 403],
      // a shared draft: only stewards see it → 404
      [cookies.admin, { intent: "retire", slug: sharedDraft }, 404],
      [cookieB, { intent: "discard", slug: sharedDraft }, 404],
      [cookieB, { intent: "set-current", slug: sharedDraft }, 404],
    ];
    for (const [cookie, fields, status] of cases) {
      const res = await settle(() => manageRoute.action(routeArgs(formRequest("/studio/editions", fields, { cookie }))));
      expect([fields.intent, fields.slug === ownA ? "own-a" : fields.slug, res.status]).toEqual([fields.intent, fields.slug === ownA ? "own-a" : fields.slug, status]);
    }
    // Another organisation's edition is not even readable.
    expect((await settle(() => editionPage.loader(routeArgs(getRequest(`/editions/${ownA}`, { cookie: cookieB }), { slug: ownA })))).status).toBe(404);
    expect((await exportText(ownA, "csv", cookieB)).status).toBe(404);
    const after = {
      editions: (await ChartEdition.findAll({ order: [["id", "ASC"]], attributes: ["id", "slug", "status", "organisationId"] })).map((e) => e.toJSON()),
      audits: await AuditEvent.count(),
      orgB: (await orgB.reload()).currentEditionId,
    };
    expect(after).toEqual(before);
  });

  it("a steward makes a shared edition the latest: audited without an organisation; organisations that had not chosen stay where they were", async () => {
    const { actor: steward } = await newSteward();
    const undecided = await createOrganisation();
    const latestBefore = await ChartEdition.findOne({ where: { slug: SEEDED_CURRENT } });
    try {
      const { edition } = await makeLatest(SEEDED_RETIRED, steward);
      expect(edition.status).toBe("current");
      expect((await ChartEdition.findOne({ where: { slug: SEEDED_CURRENT } }))!.status).toBe("retired");
      expect((await undecided.reload()).currentEditionId).toBe(latestBefore!.id);
      const audit = await AuditEvent.findOne({ where: { action: "edition.make-latest", objectId: String(edition.id) }, order: [["id", "DESC"]] });
      expect(audit).toMatchObject({ organisationId: null, actorId: steward.id });
      // The shared log is visible on the studio editions page of any organisation's editor.
      const page = await settle(() => manageRoute.loader(routeArgs(getRequest("/studio/editions", { cookie: cookies.editor }))));
      expect((page.body as { log: { action: string; shared: boolean }[] }).log[0]).toMatchObject({ action: "edition.make-latest", shared: true });
      // Re-seeding does not undo the steward's choice.
      await seedModule.up({ sequelize, queryInterface: sequelize.getQueryInterface() });
      expect((await ChartEdition.findOne({ where: { status: "current", organisationId: null } }))!.slug).toBe(SEEDED_RETIRED);
      // Two stewards at once: both finish and exactly one shared edition is the latest.
      const results = await Promise.allSettled([makeLatest(SEEDED_CURRENT, steward), makeLatest(SEEDED_CURRENT, steward)]);
      expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
      expect(await ChartEdition.count({ where: { status: "current", organisationId: null } })).toBe(1);
    } finally {
      await restoreSeededLatest(steward);
    }
  });
});

describe("role guard", () => {
  for (const role of ["designer", "reviewer"] as const) {
    it(`${role}: import and manage pages and actions are 403`, async () => {
      const before = await editionCount();
      const load = await settle(() => importRoute.loader(routeArgs(getRequest("/studio/editions/import", { cookie: cookies[role] }))));
      expect(load.status).toBe(403);
      expect((load.body as { message: string }).message).toMatch(/This page is for editor or admin members/);
      const up = await preview(cookies[role], { name: "t.csv", content: fixture("test-edition.csv") }, { slug: unique("nope"), ...TEST_META });
      expect(up.status).toBe(403);
      const manage = await settle(() => manageRoute.loader(routeArgs(getRequest("/studio/editions", { cookie: cookies[role] }))));
      expect(manage.status).toBe(403);
      const make = await settle(() => manageRoute.action(routeArgs(formRequest("/studio/editions", { intent: "set-current", slug: SEEDED_RETIRED }, { cookie: cookies[role] }))));
      expect(make.status).toBe(403);
      expect(await editionCount()).toBe(before);
      expect((await ChartEdition.findOne({ where: { slug: SEEDED_RETIRED } }))!.status).toBe("retired");
    });
  }

  it("signed out: redirect to sign-in with redirectTo", async () => {
    for (const [fn, path] of [
      [() => importRoute.loader(routeArgs(getRequest("/studio/editions/import"))), "/studio/editions/import"],
      [() => importRoute.action(routeArgs(multipartRequest("/studio/editions/import", { intent: "preview" }))), "/studio/editions/import"],
      [() => manageRoute.loader(routeArgs(getRequest("/studio/editions"))), "/studio/editions"],
      [() => manageRoute.action(routeArgs(formRequest("/studio/editions", { intent: "set-current", slug: SEEDED_RETIRED }))), "/studio/editions"],
    ] as const) {
      const res = await settle(fn);
      expect(res.status).toBe(302);
      expect(res.headers.get("Location")).toBe(`/login?redirectTo=${encodeURIComponent(path)}`);
    }
  });

  it("editors and admins open both pages", async () => {
    for (const role of ["editor", "admin"] as const) {
      expect((await settle(() => importRoute.loader(routeArgs(getRequest("/studio/editions/import", { cookie: cookies[role] }))))).status).toBe(200);
      expect((await settle(() => manageRoute.loader(routeArgs(getRequest("/studio/editions", { cookie: cookies[role] }))))).status).toBe(200);
    }
  });
});

describe("reading: visitors and members see published editions; drafts only editors and admins", () => {
  let draft: string;
  beforeAll(async () => {
    draft = unique("draft-visibility");
    await importFile(fixture("test-edition.csv"), "t.csv", draft);
  });

  it("the list shows status and counts; drafts only to editors and admins", async () => {
    const visitor = (await settle(() => editionsIndex.loader(routeArgs(getRequest("/editions"))))).body as { editions: { slug: string; status: string; counts: Record<string, number>; total: number }[] };
    const seeded = visitor.editions.find((e) => e.slug === SEEDED_CURRENT)!;
    expect(seeded.status).toBe("current");
    expect(seeded.counts).toEqual({ eon: 4, era: 10, period: 22, subperiod: 2, epoch: 38, age: 101 });
    expect(seeded.total).toBe(177);
    expect(visitor.editions.map((e) => e.slug)).not.toContain(draft);
    const designer = (await settle(() => editionsIndex.loader(routeArgs(getRequest("/editions", { cookie: cookies.designer }))))).body as { editions: { slug: string }[] };
    expect(designer.editions.map((e) => e.slug)).not.toContain(draft);
    const ed = (await settle(() => editionsIndex.loader(routeArgs(getRequest("/editions", { cookie: cookies.editor }))))).body as { editions: { slug: string }[] };
    expect(ed.editions.map((e) => e.slug)).toContain(draft);
  });

  it("an edition page: visitors 200 for published, 404 for drafts (and the draft's exports)", async () => {
    const page = await settle(() => editionPage.loader(routeArgs(getRequest(`/editions/${SEEDED_CURRENT}`), { slug: SEEDED_CURRENT })));
    expect(page.status).toBe(200);
    const body = page.body as { edition: { corrections: unknown[] }; intervals: unknown[]; may: Record<string, boolean>; compareWith: { from: string } };
    expect(body.intervals).toHaveLength(177);
    expect(body.edition.corrections.length).toBeGreaterThan(0);
    expect(body.may).toEqual({ setCurrent: false, makeLatest: false, retire: false });
    expect(body.compareWith.from).toBe(SEEDED_RETIRED);
    expect((await settle(() => editionPage.loader(routeArgs(getRequest(`/editions/${draft}`), { slug: draft })))).status).toBe(404);
    expect((await settle(() => editionPage.loader(routeArgs(getRequest(`/editions/${draft}`, { cookie: cookies.reviewer }), { slug: draft })))).status).toBe(404);
    expect((await settle(() => editionPage.loader(routeArgs(getRequest(`/editions/${draft}`, { cookie: cookies.editor }), { slug: draft })))).status).toBe(200);
    expect((await exportText(draft, "csv")).status).toBe(404);
    const own = await exportText(draft, "csv", cookies.editor);
    expect(own.status).toBe(200);
    expect(own.headers.get("Cache-Control")).toMatch(/private/);
    expect((await settle(() => editionPage.loader(routeArgs(getRequest("/editions/none"), { slug: "none" })))).status).toBe(404);
  });

  it("compare: the seeded editions' moved boundaries, grouped by boundary", async () => {
    const res = await settle(() => compareRoute.loader(routeArgs(getRequest(`/editions/compare?from=${SEEDED_RETIRED}&to=${SEEDED_CURRENT}`))));
    const pair = (res.body as { pair: { moved: { names: string[]; oldBaseMa: number; newBaseMa: number; shiftMa: number }[]; movedIntervals: number; gsspStated: unknown[] } }).pair;
    // 72: the 2023/09 Sakmarian base is corrected to the printed chart's 293.52 Ma (its data file had 293.51), the same as 2024/12, so it no longer moves.
    expect(pair.movedIntervals).toBe(72);
    const cretaceous = pair.moved.find((m) => m.names[0] === "Cretaceous")!;
    expect(cretaceous).toMatchObject({ names: ["Cretaceous", "Early Cretaceous", "Berriasian"], oldBaseMa: 145, newBaseMa: 143.1, shiftMa: -1.9 });
    expect(pair.gsspStated).toHaveLength(0); // 2023/09's flags are carried over from 2024/12 (its corrections list)
    // Defaults: the current edition against the latest retired one.
    const defaults = await settle(() => compareRoute.loader(routeArgs(getRequest("/editions/compare"))));
    expect(defaults.body).toMatchObject({ toSlug: SEEDED_CURRENT });
  });

  it("compare: a draft with the current edition (editors), one boundary moved; drafts 404 for visitors", async () => {
    const res = await settle(() => compareRoute.loader(routeArgs(getRequest(`/editions/compare?from=${SEEDED_CURRENT}&to=${draft}`, { cookie: cookies.editor }))));
    const pair = (res.body as { pair: { moved: { names: string[]; oldBaseMa: number; newBaseMa: number }[] } }).pair;
    expect(pair.moved).toEqual([expect.objectContaining({ names: ["Cretaceous", "Early Cretaceous", "Berriasian"], oldBaseMa: 143.1, newBaseMa: 143 })]);
    expect((await settle(() => compareRoute.loader(routeArgs(getRequest(`/editions/compare?from=${SEEDED_CURRENT}&to=${draft}`))))).status).toBe(404);
  });

  it("the test fixture is the seeded edition with only the Cretaceous base moved", async () => {
    const seeded = seedModule.readSeededEdition(SEEDED_CURRENT).intervals.map((iv) => ({ ...iv, names: {} }));
    const expected = exportCsv(
      seeded.map((iv) =>
        ["Cretaceous", "Early Cretaceous", "Berriasian"].includes(iv.name) ? { ...iv, baseMa: 143 } : ["Jurassic", "Late Jurassic", "Tithonian"].includes(iv.name) ? { ...iv, topMa: 143 } : iv,
      ),
    );
    expect(fixture("test-edition.csv")).toBe(expected);
  });
});
