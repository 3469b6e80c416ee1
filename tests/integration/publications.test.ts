// Publications against the real database: the seeded riverside-walk publication over the public
// JSON, publishing by role, the snapshot unchanged byte for byte while the draft is edited, sign
// numbers kept and never reused, the database refusing UPDATE and DELETE, frozen slugs, e-mails.
import { createHash } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import * as composer from "../../app/routes/studio/exhibits.$slug.tsx";
import * as newExhibit from "../../app/routes/studio/exhibits.new.tsx";
import * as review from "../../app/routes/studio/exhibits.$slug.review.tsx";
import * as latest from "../../app/routes/api.exhibits.$org.$slug.ts";
import * as list from "../../app/routes/api.exhibits.$org.$slug.publications.ts";
import * as numbered from "../../app/routes/api.exhibits.$org.$slug.publications.$number.ts";
import { canonicalJson } from "../../app/lib/publication/canonical.ts";
import type { PublicationSnapshot } from "../../app/lib/publication/types.ts";
import { Exhibit, MarkerSign, Marker, OutboxMessage, Publication, type Organisation, type User } from "../../db/models/index.ts";
import { sequelize } from "../../server/db.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, routeArgs, settle } from "../helpers/db.ts";

let org: Organisation;
const who: Record<string, { user: User; cookie: string }> = {};

const api = (path: string, headers: Record<string, string> = {}) => new Request(new URL(path, "http://test.local"), { headers });
async function getLatest(o: string, slug: string, headers: Record<string, string> = {}) {
  return (await latest.loader(routeArgs(api(`/api/exhibits/${o}/${slug}`, headers), { org: o, slug }))) as Response;
}
const exhibitRow = async (slug: string) => (await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!;
const post = async (slug: string, fields: Record<string, string>, cookie = who.designer.cookie) =>
  settle(() => composer.action(routeArgs(formRequest(`/studio/exhibits/${slug}`, { revision: String(fields.revision ?? 0), ...fields }, { cookie }), { slug })));
const rev = async (slug: string) => String((await exhibitRow(slug)).revision);
const approve = async (slug: string) => {
  expect((await post(slug, { intent: "submit-for-review", revision: await rev(slug) })).status).toBe(302);
  const res = await settle(() => review.action(routeArgs(formRequest(`/studio/exhibits/${slug}/review`, { intent: "approve", revision: "0" }, { cookie: who.reviewer.cookie }), { slug })));
  expect(res.status).toBe(400); // revision 0 is not a revision
  const current = String((await exhibitRow(slug)).revision);
  const ok = await settle(() => review.action(routeArgs(formRequest(`/studio/exhibits/${slug}/review`, { intent: "approve", revision: current }, { cookie: who.reviewer.cookie }), { slug })));
  expect(ok.status).toBe(302);
};

beforeAll(async () => {
  org = await createOrganisation();
  for (const [name, roles] of Object.entries({ admin: "admin", designer: "designer", reviewer: "reviewer", editor: "editor" } as const)) {
    const { user } = await createMember(org, roles);
    who[name] = { user, cookie: await cookieFor(user.id) };
  }
});

describe("the seeded publication (demo)", () => {
  it("GET /api/exhibits/marrowby/riverside-walk serves publication 1: canonical JSON whose snapshot hashes to the ETag, public cache, no cookie", async () => {
    const res = await getLatest("marrowby", "riverside-walk");
    expect(res.status).toBe(200);
    expect(res.headers.get("Content-Type")).toBe("application/json; charset=utf-8");
    expect(res.headers.get("Cache-Control")).toMatch(/^public, max-age=300/);
    expect(res.headers.get("Set-Cookie")).toBeNull();
    const text = await res.text();
    const body = JSON.parse(text) as { publication: Record<string, unknown>; snapshot: PublicationSnapshot };
    expect(Object.keys(body.publication).sort()).toEqual(["approvedBy", "edition", "hash", "number", "publishedAt"]);
    expect(body.publication).toMatchObject({ number: 1, approvedBy: "Rhona Basalt", edition: { slug: "ics-2024-12", label: "ICS 2024/12" } });
    expect(text).toBe(canonicalJson(body));
    const hash = createHash("sha256").update(canonicalJson(body.snapshot)).digest("hex");
    expect(body.publication.hash).toBe(hash);
    expect(res.headers.get("ETag")).toBe(`"${hash}"`);
    const s = body.snapshot;
    expect(s.schemaVersion).toBe(1);
    expect(s.medium.kind).toBe("route");
    expect(s.markers.map((m) => m.signNumber)).toEqual(s.markers.map((_, i) => i + 1));
    const mill = s.markers.find((m) => m.label === "Marrowby mill built")!;
    expect(mill.text.html).toBe("<p>The mill by the footbridge is about <strong>200 years</strong> old: a fifth of a millimetre on this walk.</p>");
    expect(mill.position!.lat.toString().split(".")[1].length).toBeLessThanOrEqual(7);
    expect(mill.walking!.text).toMatch(/min walk/);
    expect(s.edition.languages).toContain("de");
    expect(s.edition.intervals.find((i) => i.name === "Cambrian")!.names.fr).toBe("Cambrien");
    expect(s.sources.walkingSpeed).toBe("FHWA-RD-98-107: 1.2 m/s pedestrian design walking speed");
    expect(s.cautions[0]).toMatch(/^Planning figures, not a survey/);
  });

  it("304 on a matching If-None-Match, before the body is read; 404 JSON for a draft, an unknown exhibit or organisation", async () => {
    const first = await getLatest("marrowby", "riverside-walk");
    const etag = first.headers.get("ETag")!;
    const again = await getLatest("marrowby", "riverside-walk", { "If-None-Match": etag });
    expect(again.status).toBe(304);
    expect(await again.text()).toBe("");
    for (const [o, slug] of [["marrowby", "school-rope"], ["marrowby", "corridor-wall"], ["marrowby", "no-such"], ["nobody", "riverside-walk"]]) {
      const res = await getLatest(o, slug);
      expect(res.status).toBe(404);
      expect(((await res.json()) as { error: { message: string } }).error.message).toMatch(/No published exhibit at this address/);
    }
    expect((await Exhibit.findOne({ where: { slug: "school-rope" } }))!.status).toBe("in_review");
  });
});

describe("publishing", () => {
  it("only from approved, by a designer or an admin; the snapshot stays byte for byte while the draft is edited; signs kept and never reused", async () => {
    const slug = "pub-flow";
    const form = new FormData();
    for (const [k, v] of Object.entries({ slug, title: "Publication rope", editionSlug: "ics-2024-12", mediumKind: "length", spanOlderValue: "541", spanOlderUnit: "Ma", spanYoungerValue: "0", spanYoungerUnit: "Ma", mediumType: "rope", unitsPreference: "metric", lengthValue: "54.1", lengthUnit: "m" })) form.set(k, v);
    expect((await settle(() => newExhibit.action(routeArgs(new Request("http://test.local/studio/exhibits/new", { method: "POST", body: form, headers: { Cookie: who.designer.cookie } }))))).status).toBe(302);
    expect((await post(slug, { intent: "add-boundaries", rank: "period", revision: await rev(slug) })).status).toBe(302);
    // Not approved yet.
    const early = await post(slug, { intent: "publish", revision: await rev(slug) });
    expect(early.status).toBe(409);
    expect((early.body as { error: string }).error).toMatch(/it can be published only when it is approved/);
    await approve(slug);
    for (const r of ["reviewer", "editor"]) expect((await post(slug, { intent: "publish", revision: await rev(slug) }, who[r].cookie)).status).toBe(403);
    expect((await post(slug, { intent: "publish", revision: String(Number(await rev(slug)) + 1) })).status).toBe(409);
    expect((await post(slug, { intent: "publish", revision: await rev(slug) }, who.admin.cookie)).status).toBe(302);
    const e = await exhibitRow(slug);
    expect(e.status).toBe("published");
    const one = await getLatest(org.slug, slug);
    const bytes1 = await one.text();
    const p1 = JSON.parse(bytes1) as { publication: { number: number; hash: string }; snapshot: PublicationSnapshot };
    expect(p1.publication.number).toBe(1);
    expect(await OutboxMessage.count({ where: { to: who.reviewer.user.email, subject: "Published: Publication rope" } })).toBe(1);

    // Edit the draft: back to draft, the public JSON does not move a byte.
    const markers = await Marker.findAll({ where: { exhibitId: e.id }, order: [["id", "ASC"]] });
    const gone = markers[markers.length - 1];
    expect((await post(slug, { intent: "remove-marker", markerId: String(gone.id), revision: await rev(slug) })).status).toBe(302);
    expect((await post(slug, { intent: "add-boundaries", rank: "era", revision: await rev(slug) })).status).toBe(302);
    expect((await exhibitRow(slug)).status).toBe("draft");
    expect(await (await getLatest(org.slug, slug)).text()).toBe(bytes1);

    // Second publication: the same markers keep their numbers, the removed one's number is retired, new ones come after.
    await approve(slug);
    expect((await post(slug, { intent: "publish", revision: await rev(slug) })).status).toBe(302);
    const p2 = JSON.parse(await (await getLatest(org.slug, slug)).text()) as { publication: { number: number }; snapshot: PublicationSnapshot };
    expect(p2.publication.number).toBe(2);
    const before = new Map(p1.snapshot.markers.map((m) => [m.id, m.signNumber]));
    for (const m of p2.snapshot.markers) if (before.has(m.id)) expect(m.signNumber).toBe(before.get(m.id));
    const maxBefore = Math.max(...before.values());
    const fresh = p2.snapshot.markers.filter((m) => !before.has(m.id));
    expect(fresh.length).toBeGreaterThan(0);
    expect(Math.min(...fresh.map((m) => m.signNumber))).toBe(maxBefore + 1);
    const retired = p2.snapshot.retiredSigns.find((r) => r.number === before.get(String(gone.id)))!;
    expect(retired).toMatchObject({ label: gone.label, retiredAtPublication: 2 });
    expect(p2.snapshot.markers.some((m) => m.signNumber === retired.number)).toBe(false);

    // Publication 1 is still served as it was; the list names both.
    const old = (await numbered.loader(routeArgs(api(`/api/exhibits/${org.slug}/${slug}/publications/1`), { org: org.slug, slug, number: "1" }))) as Response;
    expect(await old.text()).toBe(bytes1);
    expect(old.headers.get("Cache-Control")).toMatch(/immutable/);
    const all = (await list.loader(routeArgs(api(`/api/exhibits/${org.slug}/${slug}/publications`), { org: org.slug, slug }))) as Response;
    expect(((await all.json()) as { publications: { number: number }[] }).publications.map((p) => p.number)).toEqual([2, 1]);

    // The database refuses to change or delete a publication, or a sign number.
    const pub = (await Publication.findOne({ where: { exhibitId: e.id, number: 1 } }))!;
    await expect(sequelize.query(`UPDATE publications SET sha256 = 'x' WHERE id = $1`, { bind: [pub.id] })).rejects.toThrow(/publications are immutable: UPDATE refused/);
    await expect(sequelize.query(`DELETE FROM publications WHERE id = $1`, { bind: [pub.id] })).rejects.toThrow(/publications are immutable: DELETE refused/);
    await expect(MarkerSign.destroy({ where: { exhibitId: e.id } })).rejects.toThrow(/sign numbers are never changed, removed or reused/);
    expect((await Publication.findByPk(pub.id))!.sha256).toBe(p1.publication.hash);

    // Slugs are frozen once published: a rename keeps a redirect from the old address.
    await sequelize.query(`UPDATE exhibits SET slug = 'pub-flow-renamed' WHERE id = $1`, { bind: [e.id] });
    const moved = await getLatest(org.slug, slug);
    expect(moved.status).toBe(301);
    expect(moved.headers.get("Location")).toBe(`/api/exhibits/${org.slug}/pub-flow-renamed`);
    await sequelize.query(`UPDATE organisations SET slug = $1 WHERE id = $2`, { bind: [`${org.slug}-new`, org.id] });
    const orgMoved = await getLatest(org.slug, "pub-flow-renamed");
    expect(orgMoved.headers.get("Location")).toBe(`/api/exhibits/${org.slug}-new/pub-flow-renamed`);
    await sequelize.query(`UPDATE organisations SET slug = $1 WHERE id = $2`, { bind: [org.slug, org.id] });
  });

  it("another organisation cannot publish or see the draft (404)", async () => {
    const other = await cookieFor((await createMember(await createOrganisation(), ["designer", "admin"])).user.id);
    const res = await post("riverside-walk", { intent: "publish", revision: "1" }, other);
    expect(res.status).toBe(404);
  });
});


