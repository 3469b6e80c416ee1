// Issue 16 §3 and §4 against the real database: the limits module equals the columns, bad input
// never gives a 500 (control characters, out-of-range integers, long addresses, huge
// magnifications, non-Latin names), constraint races answer like the serial case, /api errors are
// JSON with the database unreachable, and CSV exports carry no live formula.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QueryTypes } from "sequelize";
import * as composer from "../../app/routes/studio/exhibits.$slug.tsx";
import * as newExhibit from "../../app/routes/studio/exhibits.new.tsx";
import * as libraryNew from "../../app/routes/studio/library.new.tsx";
import * as team from "../../app/routes/studio/team.tsx";
import * as schedule from "../../app/routes/studio/exhibits.$slug.schedule-csv.ts";
import * as apiExhibit from "../../app/routes/api.exhibits.$org.$slug.ts";
import * as apiTimescales from "../../app/routes/api.timescales.ts";
import { INT4, INTEGER_INPUTS, TEXT_LIMITS } from "../../app/lib/limits.ts";
import { readCsv } from "../../app/lib/timescale/csv.ts";
import { DatedEvent, Exhibit, Inset, Invitation, Marker } from "../../db/models/index.ts";
import { sequelize } from "../../server/db.server.ts";
import type { Organisation } from "../../db/models/index.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle } from "../helpers/db.ts";

const snake = (s: string) => s.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
const wall = { title: "Limits wall", editionSlug: "ics-2024-12", mediumKind: "length", spanOlderValue: "538.8", spanOlderUnit: "Ma", spanYoungerValue: "0", spanYoungerUnit: "Ma", mediumType: "wall", unitsPreference: "metric", lengthValue: "10.776", lengthUnit: "m" };

function multipart(url: string, fields: Record<string, string>, cookie: string) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.set(k, v);
  return new Request(new URL(url, "http://test.local"), { method: "POST", body: form, headers: { Cookie: cookie, "x-eonscale-client-ip": "203.0.113.21" } });
}
const create = (fields: Record<string, string>, cookie: string) => settle(() => newExhibit.action(routeArgs(multipart("/studio/exhibits/new", fields, cookie))));
const post = (slug: string, fields: Record<string, string>, cookie: string) => settle(() => composer.action(routeArgs(formRequest(`/studio/exhibits/${slug}`, fields, { cookie }), { slug })));
const fieldsOf = (res: { body: unknown }) => (res.body as { fields?: Record<string, string> }).fields ?? {};

let org: Organisation;
let designer: string;
let editor: string;
let admin: string;

beforeAll(async () => {
  org = await createOrganisation();
  designer = await cookieFor((await createMember(org, "designer")).user.id);
  editor = await cookieFor((await createMember(org, "editor")).user.id);
  admin = await cookieFor((await createMember(org, "admin")).user.id);
});

describe("app/lib/limits.ts equals the database's column types", () => {
  it("every varchar column has its length in TEXT_LIMITS, and every entry is a column of that length", async () => {
    const rows = await sequelize.query<{ table_name: string; column_name: string; character_maximum_length: number }>(
      `SELECT table_name, column_name, character_maximum_length FROM information_schema.columns
       WHERE table_schema = 'public' AND data_type = 'character varying' AND table_name NOT IN ('migration_meta', 'seeder_meta', 'rate_limits')`,
      { type: QueryTypes.SELECT },
    );
    const inDb = Object.fromEntries(rows.map((r) => [`${r.table_name}.${r.column_name}`, r.character_maximum_length]));
    const inLimits = Object.fromEntries(Object.entries(TEXT_LIMITS).flatMap(([t, cols]) => Object.entries(cols).map(([c, n]) => [`${t}.${snake(c)}`, n])));
    expect(inLimits).toEqual(inDb);
    console.log(`limits: ${Object.keys(inDb).length} varchar columns match app/lib/limits.ts`);
  });

  it("every integer a client's input reaches is an int4 column (range INT4)", async () => {
    const rows = await sequelize.query<{ table_name: string; column_name: string; data_type: string; numeric_precision: number }>(
      `SELECT table_name, column_name, data_type, numeric_precision FROM information_schema.columns WHERE table_schema = 'public'`,
      { type: QueryTypes.SELECT },
    );
    for (const [table, columns] of Object.entries(INTEGER_INPUTS)) {
      for (const c of columns) {
        const row = rows.find((r) => r.table_name === table && r.column_name === snake(c));
        expect(row, `${table}.${c}`).toMatchObject({ data_type: "integer", numeric_precision: 32 });
      }
    }
    expect(INT4.max).toBe(2 ** 31 - 1);
    expect(INT4.min).toBe(-(2 ** 31));
  });
});

describe("bad input is a 400 with the field, never a 500, and changes nothing", () => {
  let revision = 1;
  beforeAll(async () => {
    expect((await create({ ...wall, slug: "limits-wall" }, designer)).status).toBe(302);
  });

  it("a NUL in a marker label", async () => {
    const before = await Marker.count();
    const res = await post("limits-wall", { intent: "add-custom", label: "Quarry\u0000opened", ageValue: "150", ageUnit: "a", source: "Parish records (test)", revision: String(revision) }, designer);
    expect(res.status).toBe(400);
    expect(fieldsOf(res).label).toMatch(/control character/);
    expect(await Marker.count()).toBe(before);
  });

  it("revision=99999999999", async () => {
    const res = await post("limits-wall", { intent: "add-custom", label: "Quarry", ageValue: "150", ageUnit: "a", source: "Parish records (test)", revision: "99999999999" }, designer);
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toMatch(/revision/);
  });

  it("an inset with magnification 1e308", async () => {
    const before = await Inset.count();
    const res = await post("limits-wall", { intent: "add-inset", olderValue: "10", olderUnit: "ka", youngerValue: "0", youngerUnit: "ka", magnification: "1e308", revision: String(revision) }, designer);
    expect(res.status).toBe(400);
    expect(fieldsOf(res).magnification).toMatch(/at most/);
    expect(await Inset.count()).toBe(before);
    revision = (await Exhibit.findOne({ where: { organisationId: org.id, slug: "limits-wall" } }))!.revision;
  });

  it("an invitation to a 290-character address", async () => {
    const before = await Invitation.count();
    const email = `${"a".repeat(280)}@example.org`;
    const res = await settle(() => team.action(routeArgs(formRequest("/studio/team", { intent: "invite", email, roles: "designer" }, { cookie: admin }))));
    expect(res.status).toBe(400);
    expect(JSON.stringify(res.body)).toMatch(/at most 254 characters/);
    expect(await Invitation.count()).toBe(before);
  });

  it("a library entry named in Japanese gets a slug (a stable id), not an empty one", async () => {
    const res = await settle(() =>
      libraryNew.action(
        routeArgs(
          formRequest("/studio/library/new", { name: "四万十帯の付加体", summary: "An accretionary complex (test entry).", ageValue: "70", ageUnit: "Ma", uncertaintyValue: "", ageKind: "point", citation: "Test citation for the limits suite, 2026.", doi: "", url: "", datingMethod: "", verification: "checked against the source" }, { cookie: editor }),
        ),
      ),
    );
    expect(res.status).toBe(302);
    const entry = await DatedEvent.findOne({ where: { organisationId: org.id, name: "四万十帯の付加体" } });
    expect(entry?.slug).toMatch(/^event-[0-9a-z]{7}$/);
  });
});

describe("constraint races answer like the serial case", () => {
  it("two designers creating the same exhibit slug at once: one 302, one 400 on slug with the serial message", async () => {
    const other = await cookieFor((await createMember(org, "designer")).user.id);
    for (let i = 0; i < 5; i++) {
      const slug = `race-${i}`;
      const [a, b] = await Promise.all([create({ ...wall, slug }, designer), create({ ...wall, slug }, other)]);
      expect([a.status, b.status].sort()).toEqual([302, 400]);
      const refused = a.status === 400 ? a : b;
      expect(fieldsOf(refused).slug).toBe(`Your organisation already has an exhibit at /${slug}. Choose another slug.`);
      expect(await Exhibit.count({ where: { organisationId: org.id, slug } })).toBe(1);
    }
    const serial = await create({ ...wall, slug: "race-0" }, designer);
    expect(fieldsOf(serial).slug).toBe("Your organisation already has an exhibit at /race-0. Choose another slug.");
  });
});

describe("CSV exports carry no live formula", () => {
  it("schedule.csv writes a formula-looking label and source as text", async () => {
    const rev = (await Exhibit.findOne({ where: { organisationId: org.id, slug: "limits-wall" } }))!.revision;
    const res = await post("limits-wall", { intent: "add-custom", label: '=HYPERLINK("http://evil.example","x")', ageValue: "150", ageUnit: "a", source: "=cmd|' /C calc'!A0", revision: String(rev) }, designer);
    expect(res.status).toBe(302);
    const csv = (await schedule.loader(routeArgs(getRequest("/studio/exhibits/limits-wall/schedule.csv", { cookie: designer }), { slug: "limits-wall" }) as never)) as Response;
    expect(csv.status).toBe(200);
    const { records } = readCsv(await csv.text());
    const row = records.find((r) => r.fields[1]?.includes("HYPERLINK"))!;
    expect(row.fields[1]).toBe(`'=HYPERLINK("http://evil.example","x")`);
    expect(row.fields[7]).toBe(`'=cmd|' /C calc'!A0`);
    for (const r of records) for (const f of r.fields) expect(f).not.toMatch(/^[=+@\t\r]/);
  });
});

describe("/api errors are JSON when the database cannot be reached", () => {
  const config = sequelize.connectionManager as unknown as { config: { port: string | number }; pool: { destroyAllNow(): Promise<void> } };
  let port: string | number;
  beforeAll(async () => {
    port = config.config.port;
    await config.pool.destroyAllNow();
    config.config.port = 1; // nothing listens there: every new connection is refused
  });
  afterAll(async () => {
    config.config.port = port;
    await config.pool.destroyAllNow();
  });

  it.each([
    ["/api/exhibits/marrowby/riverside-walk", apiExhibit.loader, { org: "marrowby", slug: "riverside-walk" }],
    ["/api/timescales", apiTimescales.loader, {}],
  ] as const)("GET %s → 503 JSON with Retry-After", async (url, loader, params) => {
    const res = (await loader(routeArgs(getRequest(url), params) as never)) as Response;
    expect(res.status).toBe(503);
    expect(res.headers.get("Content-Type")).toMatch(/^application\/json/);
    expect(res.headers.get("Retry-After")).toBe("30");
    expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/database cannot be reached/);
  });
});
