// The public JSON API over the seeded database: GET /api/timescales and /api/timescales/:slug.
//
// Every expected boundary below was typed from the printed ICS chart of the edition named beside
// it, as in tests/unit/timescale/seeded.test.ts (values reused from there). None could be checked
// against the chart PDF while writing, so each is marked "from memory"; "weak" where the
// recollection may lean on the data file itself. Here they travel the whole way: seed file →
// Postgres NUMERIC → API JSON.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { RANKS, type Rank } from "../../app/lib/timescale/index.ts";
import { loader as listLoader } from "../../app/routes/api.timescales.ts";
import { loader as editionLoader } from "../../app/routes/api.timescales.$slug.ts";
import { ChartEdition } from "../../db/models/index.ts";
import { createDraftEdition, discardDraft, editionIntervals, setOrganisationCurrent } from "../../server/editions.server.ts";
import { createMember, createOrganisation, routeArgs, unique } from "../helpers/db.ts";
import { newSteward, SEEDED_CURRENT, SEEDED_RETIRED, TEST_META } from "../helpers/editions.ts";

import { SEEDS, type Seed } from "../fixtures/ics-chart-check-values.ts";

type ApiInterval = {
  name: string;
  rank: Rank;
  parent: string | null;
  baseMa: number;
  baseUncertaintyMa: number | null;
  topMa: number;
  color: string;
  gssp: boolean | null;
  approximate: boolean;
};
type ApiEdition = { edition: Record<string, unknown>; intervals: ApiInterval[] };

async function getEdition(slug: string, headers: Record<string, string> = {}) {
  const request = new Request(`http://test.local/api/timescales/${slug}`, { headers });
  return (await editionLoader(routeArgs(request, { slug }))) as Response;
}

async function getList(headers: Record<string, string> = {}) {
  return (await listLoader(routeArgs(new Request("http://test.local/api/timescales", { headers })))) as Response;
}

const bodies: Partial<Record<Seed["edition"], ApiEdition>> = {};
beforeAll(async () => {
  for (const slug of [SEEDED_CURRENT, SEEDED_RETIRED] as const) bodies[slug] = (await (await getEdition(slug)).json()) as ApiEdition;
});

describe("seeded boundaries through the API vs the printed chart", () => {
  it("covers at least 30 boundaries, every rank, both editions, each marked from memory", () => {
    expect(SEEDS.length).toBeGreaterThanOrEqual(30);
    for (const e of [SEEDED_CURRENT, SEEDED_RETIRED]) {
      expect(new Set(SEEDS.filter((s) => s.edition === e).map((s) => s.rank))).toEqual(new Set(RANKS));
    }
    for (const s of SEEDS) expect(s.basis).toMatch(/from memory/);
  });

  it.each(SEEDS.map((s) => [`${s.edition} ${s.name} base ${s.baseMa}${s.pm ? ` ± ${s.pm}` : ""} (${s.source}, ${s.basis})`, s] as const))("%s", (_label, s) => {
    const iv = bodies[s.edition]!.intervals.find((i) => i.name === s.name);
    expect(iv, `${s.name} in ${s.edition}`).toBeDefined();
    expect(iv!.rank).toBe(s.rank);
    expect(iv!.baseMa).toBe(s.baseMa);
    if (s.pm !== undefined) expect(iv!.baseUncertaintyMa).toBe(s.pm);
    if (s.approx !== undefined) expect(iv!.approximate).toBe(s.approx);
  });
});

describe("GET /api/timescales", () => {
  it("lists the published editions, current first, with slug, label, status and source", async () => {
    const res = await getList();
    expect(res.status).toBe(200);
    expect(res.headers.get("Content-Type")).toMatch(/^application\/json/);
    const body = (await res.json()) as { editions: Record<string, unknown>[] };
    const seeded = body.editions.filter((e) => e.slug === SEEDED_CURRENT || e.slug === SEEDED_RETIRED);
    expect(seeded.map((e) => [e.slug, e.label, e.status])).toEqual([
      [SEEDED_CURRENT, "ICS 2024/12", "current"],
      [SEEDED_RETIRED, "ICS 2023/09", "retired"],
    ]);
    expect(body.editions[0].status).toBe("current");
    expect(seeded.map((e) => e.latest)).toEqual([true, false]);
    for (const e of body.editions) {
      expect(Object.keys(e).sort()).toEqual(["label", "latest", "licence", "slug", "source", "status"]);
      expect(e.status).not.toBe("draft");
    }
    expect(String(seeded[0].source)).toContain("Episodes 48: 105–115");
  });
});

describe("GET /api/timescales/:slug", () => {
  it("gives the edition and its intervals in the documented shape", () => {
    const body = bodies[SEEDED_CURRENT]!;
    expect(body.edition).toMatchObject({ slug: SEEDED_CURRENT, label: "ICS 2024/12", status: "current" });
    expect(Array.isArray(body.edition.corrections)).toBe(true);
    expect((body.edition.corrections as unknown[]).length).toBeGreaterThan(0);
    expect(body.intervals).toHaveLength(177);
    for (const iv of body.intervals) {
      expect(Object.keys(iv).sort()).toEqual(["approximate", "baseMa", "baseUncertaintyMa", "boundaryKind", "color", "gssp", "name", "parent", "rank", "topMa"]);
      expect(RANKS).toContain(iv.rank);
      expect(iv.color).toMatch(/^#[0-9A-F]{6}$/i);
      expect(typeof iv.baseMa).toBe("number");
    }
    expect(new Set(body.intervals.map((i) => i.rank))).toEqual(new Set(["eon", "era", "period", "subperiod", "epoch", "age"]));
    // The example in the API's own description.
    expect(body.intervals.find((i) => i.name === "Cambrian")).toEqual({
      name: "Cambrian",
      rank: "period",
      parent: "Paleozoic",
      baseMa: 538.8,
      baseUncertaintyMa: 0.6,
      topMa: 486.85,
      color: "#7FA056",
      gssp: true,
      boundaryKind: "GSSP",
      approximate: false,
    });
  });

  it("gives null where the chart prints no ±, and English names", () => {
    const body = bodies[SEEDED_CURRENT]!;
    const by = (n: string) => body.intervals.find((i) => i.name === n)!;
    expect(by("Hadean").baseUncertaintyMa).toBeNull();
    expect(by("Holocene").baseUncertaintyMa).toBeNull();
    expect(by("Holocene").topMa).toBe(0);
    expect(by("Late Pleistocene").parent).toBe("Pleistocene"); // English name from the corrections
    expect(body.intervals.find((i) => i.name === "Kreide")).toBeUndefined();
    // 2023/09's file states no ratification at all; the flags are carried over from 2024/12 where
    // the boundary is the same (listed among the edition's corrections): Tonian GSSA, Valanginian
    // not yet ratified (2024/12 file's version note).
    const retired = (n: string) => bodies[SEEDED_RETIRED]!.intervals.find((i) => i.name === n) as unknown as { gssp: boolean | null; boundaryKind: string | null };
    expect(retired("Tonian")).toMatchObject({ gssp: true, boundaryKind: "GSSA" });
    expect(retired("Valanginian")).toMatchObject({ gssp: false, boundaryKind: null });
  });

  it("keeps chart order: Hadean first, Meghalayan last, parents before children", () => {
    const names = bodies[SEEDED_CURRENT]!.intervals.map((i) => i.name);
    expect(names[0]).toBe("Hadean");
    expect(names[names.length - 1]).toBe("Meghalayan");
    const seen = new Set<string>();
    for (const iv of bodies[SEEDED_CURRENT]!.intervals) {
      if (iv.parent) expect(seen.has(iv.parent)).toBe(true);
      seen.add(iv.name);
    }
  });

  it("answers 404 with an error message for an unknown slug", async () => {
    const res = await getEdition("ics-1999-01");
    expect(res.status).toBe(404);
    expect(res.headers.get("Content-Type")).toMatch(/^application\/json/);
    const body = (await res.json()) as { error: { message: string } };
    expect(body.error.message).toMatch(/ics-1999-01/);
  });
});

describe("drafts and organisations' own editions are not public", () => {
  let draft: string;
  let own: string;
  let ownerActor: { id: number; subject: { roles: ["editor"]; steward: false; organisationId: number } };
  beforeAll(async () => {
    const org = await createOrganisation();
    const { user } = await createMember(org, "editor");
    ownerActor = { id: user.id, subject: { roles: ["editor"], steward: false, organisationId: org.id } };
    const seeded = await ChartEdition.findOne({ where: { slug: SEEDED_CURRENT } });
    const intervals = await editionIntervals(seeded!.id);
    draft = unique("draft-api");
    own = unique("own-api");
    const base = { intervals, corrections: [], sourceFile: null, actor: { id: user.id }, format: "csv" as const };
    await createDraftEdition({ ...base, meta: { slug: draft, ...TEST_META }, ownerId: null });
    await createDraftEdition({ ...base, meta: { slug: own, ...TEST_META }, ownerId: org.id });
    // The organisation uses its own edition: it is released for the organisation, still not public.
    await setOrganisationCurrent(own, ownerActor, org.id);
  });
  afterAll(async () => {
    const { actor } = await newSteward();
    await discardDraft(draft, actor);
  });

  it("404 for a shared draft and for an organisation's own edition, and the list leaves both out", async () => {
    expect((await ChartEdition.findOne({ where: { slug: own } }))!.status).toBe("current");
    expect((await getEdition(draft)).status).toBe(404);
    expect((await getEdition(own)).status).toBe(404);
    const list = (await (await getList()).json()) as { editions: { slug: string }[]; latest: string };
    expect(list.editions.map((e) => e.slug)).not.toContain(draft);
    expect(list.editions.map((e) => e.slug)).not.toContain(own);
    expect(list.latest).toBe(SEEDED_CURRENT);
  });
});

describe("caching: ETag and If-None-Match", () => {
  it("sends a strong ETag and Cache-Control, and 304 with no body when it matches", async () => {
    const first = await getEdition(SEEDED_CURRENT);
    const etag = first.headers.get("ETag")!;
    expect(etag).toMatch(/^"[A-Za-z0-9_-]+"$/);
    expect(first.headers.get("Cache-Control")).toMatch(/public, max-age=\d+/);
    const again = await getEdition(SEEDED_CURRENT);
    expect(again.headers.get("ETag")).toBe(etag);

    const cached = await getEdition(SEEDED_CURRENT, { "If-None-Match": etag });
    expect(cached.status).toBe(304);
    expect(await cached.text()).toBe("");
    expect(cached.headers.get("ETag")).toBe(etag);
    // Weak form and a list of tags also match (weak comparison for GET).
    expect((await getEdition(SEEDED_CURRENT, { "If-None-Match": `"other", W/${etag}` })).status).toBe(304);
    expect((await getEdition(SEEDED_CURRENT, { "If-None-Match": "*" })).status).toBe(304);
  });

  it("a different edition or a stale tag gets the full body", async () => {
    const a = (await getEdition(SEEDED_CURRENT)).headers.get("ETag")!;
    const b = await getEdition(SEEDED_RETIRED, { "If-None-Match": a });
    expect(b.status).toBe(200);
    expect(b.headers.get("ETag")).not.toBe(a);
    expect((await getEdition(SEEDED_CURRENT, { "If-None-Match": '"stale"' })).status).toBe(200);
  });

  it("the list has an ETag and answers 304 too", async () => {
    const etag = (await getList()).headers.get("ETag")!;
    expect(etag).toBeTruthy();
    expect((await getList({ "If-None-Match": etag })).status).toBe(304);
  });
});
