// Review against the real database: every transition by every role and another organisation, stale
// revisions (409, nothing changed), the four-eyes rule, each automatic check failing and passing on
// purpose, edits returning an exhibit to draft, comments, and the outbox e-mails.
import { beforeAll, describe, expect, it } from "vitest";
import * as composer from "../../app/routes/studio/exhibits.$slug.tsx";
import * as newExhibit from "../../app/routes/studio/exhibits.new.tsx";
import * as review from "../../app/routes/studio/exhibits.$slug.review.tsx";
import * as revisions from "../../app/routes/studio/exhibits.$slug.revisions.tsx";
import * as compare from "../../app/routes/studio/exhibits.$slug.revisions.compare.tsx";
import { AuditEvent, Exhibit, ExhibitComment, ExhibitRevision, Inset, Marker, OutboxMessage, type Organisation, type User } from "../../db/models/index.ts";
import { sequelize } from "../../server/db.server.ts";
import { cookieFor, createMember, createOrganisation, formRequest, getRequest, routeArgs, settle } from "../helpers/db.ts";

type Refusal = { error?: string; fields?: Record<string, string> };

let org: Organisation;
const who: Record<string, { user: User; cookie: string }> = {};
let outsider: string;

const rope = { title: "Review rope", editionSlug: "ics-2024-12", mediumKind: "length", spanOlderValue: "541", spanOlderUnit: "Ma", spanYoungerValue: "0", spanYoungerUnit: "Ma", mediumType: "rope", unitsPreference: "metric", lengthValue: "54.1", lengthUnit: "m" };

async function create(slug: string, cookie = who.designer.cookie) {
  const form = new FormData();
  for (const [k, v] of Object.entries({ ...rope, slug })) form.set(k, v);
  const res = await settle(() => newExhibit.action(routeArgs(new Request("http://test.local/studio/exhibits/new", { method: "POST", body: form, headers: { Cookie: cookie } }))));
  expect(res.status).toBe(302);
  return slug;
}
const exhibitRow = async (slug: string) => (await Exhibit.findOne({ where: { organisationId: org.id, slug } }))!;
const post = (slug: string, fields: Record<string, string>, cookie: string) => settle(() => composer.action(routeArgs(formRequest(`/studio/exhibits/${slug}`, fields, { cookie }), { slug })));
const decide = (slug: string, fields: Record<string, string>, cookie: string) => settle(() => review.action(routeArgs(formRequest(`/studio/exhibits/${slug}/review`, fields, { cookie }), { slug })));
const reviewPage = async (slug: string, cookie: string) => (await settle(() => review.loader(routeArgs(getRequest(`/studio/exhibits/${slug}/review`, { cookie }), { slug })))) as { status: number; body: Awaited<ReturnType<typeof review.loader>> };
async function addBoundaries(slug: string, rank = "period") {
  const res = await post(slug, { intent: "add-boundaries", rank, revision: String((await exhibitRow(slug)).revision) }, who.designer.cookie);
  expect(res.status).toBe(302);
}
const submit = async (slug: string, cookie = who.designer.cookie) => post(slug, { intent: "submit-for-review", revision: String((await exhibitRow(slug)).revision) }, cookie);
const mailsTo = async (email: string, subject: RegExp) => (await OutboxMessage.findAll({ where: { to: email } })).filter((m) => subject.test(m.subject));

beforeAll(async () => {
  org = await createOrganisation();
  for (const [name, roles] of Object.entries({ admin: "admin", designer: "designer", reviewer: "reviewer", editor: "editor", curator: ["designer", "reviewer"] } as const)) {
    const { user } = await createMember(org, roles as never);
    who[name] = { user, cookie: await cookieFor(user.id) };
  }
  outsider = await cookieFor((await createMember(await createOrganisation(), ["designer", "reviewer", "admin"])).user.id);
});

describe("submitting for review", () => {
  it("only designers submit; a draft with passing checks goes to review and every other reviewer gets an e-mail with the review link", async () => {
    const slug = await create("submit-roles");
    await addBoundaries(slug);
    for (const r of ["admin", "reviewer", "editor"]) expect((await submit(slug, who[r].cookie)).status).toBe(403);
    expect((await submit(slug, outsider)).status).toBe(404);
    expect((await exhibitRow(slug)).status).toBe("draft");
    const res = await submit(slug);
    expect(res.status).toBe(302);
    expect((await exhibitRow(slug)).status).toBe("in_review");
    const [mail] = await mailsTo(who.reviewer.user.email, /Review requested: Review rope/);
    expect(mail.text).toContain(`/studio/exhibits/${slug}/review`);
    expect(await mailsTo(who.curator.user.email, /Review requested/)).toHaveLength(1);
    expect(await mailsTo(who.designer.user.email, /Review requested/)).toHaveLength(0);
    expect(await AuditEvent.count({ where: { action: "exhibit.submit-for-review", objectId: String((await exhibitRow(slug)).id) } })).toBe(1);
    // Submitting again: it is already in review.
    const again = await submit(slug);
    expect(again.status).toBe(409);
    expect((again.body as Refusal).error).toMatch(/in review; it can be submitted for review only when it is draft or changes requested/);
  });

  it("a stale revision gets 409 and changes nothing", async () => {
    const slug = await create("submit-stale");
    const before = await exhibitRow(slug);
    const res = await post(slug, { intent: "submit-for-review", revision: String(before.revision - 1 || 99) }, who.designer.cookie);
    expect(res.status).toBe(409);
    expect((res.body as Refusal).error).toMatch(/saved a newer version/);
    expect((await exhibitRow(slug)).status).toBe("draft");
  });
});

describe("automatic checks, failing and passing on purpose", () => {
  it("a custom age without a usable source fails and refuses submission; a real source passes", async () => {
    const slug = await create("check-source");
    const e = await exhibitRow(slug);
    const marker = await Marker.create({ exhibitId: e.id, kind: "custom", intervalId: null, datedEventId: null, ageMa: 100, uncertaintyMa: null, source: "tbd", label: "Mystery fossil", decaySystemId: null });
    const page = await reviewPage(slug, who.reviewer.cookie);
    const fail = page.body.report.results.find((r) => r.kind === "source" && r.markerId === String(marker.id))!;
    expect(fail).toMatchObject({ status: "fail", message: "Marker 1 (“Mystery fossil”): this custom age gives “tbd” as its source, which is a placeholder, not a source. Give the publication the age comes from." });
    const res = await submit(slug);
    expect(res.status).toBe(400);
    expect((res.body as Refusal).error).toMatch(/^Not submitted: 1 check fails\. Marker 1 \(“Mystery fossil”\)/);
    expect((await exhibitRow(slug)).status).toBe("draft");
    await marker.update({ source: "Marrowby test record: a made-up age for this test" });
    const ok = (await reviewPage(slug, who.reviewer.cookie)).body.report.results.find((r) => r.kind === "source" && r.markerId === String(marker.id))!;
    expect(ok.status).toBe("pass");
  });

  it("a boundary marker on another edition's interval fails; the pinned edition's interval passes and shows the same age side by side", async () => {
    const slug = await create("check-boundary");
    await addBoundaries(slug);
    const e = await exhibitRow(slug);
    const [[row]] = (await sequelize.query(
      `SELECT m.id, (SELECT i2.id FROM intervals i2 JOIN chart_editions c ON c.id = i2.edition_id WHERE c.slug = 'ics-2023-09' AND i2.name = i.name) AS other
         FROM markers m JOIN intervals i ON i.id = m.interval_id WHERE m.exhibit_id = $1 AND i.name = 'Cretaceous'`,
      { bind: [e.id] },
    )) as [{ id: number; other: number }[], unknown];
    const good = await reviewPage(slug, who.reviewer.cookie);
    const cretaceous = good.body.report.figures.find((f) => f.intervalName === "Cretaceous")!;
    expect(cretaceous).toMatchObject({ exhibitAgeMa: 143.1, editionAgeMa: 143.1, matches: true });
    await sequelize.query(`UPDATE markers SET interval_id = $1 WHERE id = $2`, { bind: [row.other, row.id] });
    const bad = await reviewPage(slug, who.reviewer.cookie);
    expect(bad.body.report.overall).toBe("fail");
    expect(bad.body.report.results[0].message).toMatch(/base of the Cretaceous .* uses the Cretaceous of another chart edition, not ICS 2024\/12/);
    expect((await submit(slug)).status).toBe(400);
  });

  it("a legibility warning is a warning until acknowledged with a reason; acknowledging an exhibit in review returns it to draft", async () => {
    const slug = await create("check-ack");
    await addBoundaries(slug);
    const before = (await reviewPage(slug, who.reviewer.cookie)).body.report.results.filter((r) => r.kind === "legibility");
    const open = before.find((r) => r.status === "warning")!;
    expect(open.message).toMatch(/Resolve it \(an inset, fewer markers\) or acknowledge it with a reason\.$/);
    expect((await submit(slug)).status).toBe(302);
    const res = await post(slug, { intent: "acknowledge-warning", warningKey: open.warningKey!, reason: "The rope is for a talk; the guide says this one aloud.", revision: String((await exhibitRow(slug)).revision) }, who.designer.cookie);
    expect(res.status).toBe(302);
    expect((await exhibitRow(slug)).status).toBe("draft");
    const after = (await reviewPage(slug, who.reviewer.cookie)).body.report.results.find((r) => r.warningKey === open.warningKey)!;
    expect(after.status).toBe("pass");
    expect(after.message).toMatch(/^Acknowledged: .* Reason given: “The rope is for a talk; the guide says this one aloud\.”\.$/);
  });

  it("an inset must state its magnification; a marker outside the span fails", async () => {
    const slug = await create("check-inset");
    const e = await exhibitRow(slug);
    await Inset.create({ exhibitId: e.id, olderMa: 0.01, youngerMa: 0, magnification: 1000, label: "the last ten thousand years" });
    await Inset.create({ exhibitId: e.id, olderMa: 66.1, youngerMa: 65.9, magnification: 50, label: "end-Cretaceous at 50×" });
    const results = (await reviewPage(slug, who.reviewer.cookie)).body.report.results.filter((r) => r.kind === "inset-magnification");
    expect(results.map((r) => [r.status, r.message])).toEqual([
      ["fail", "Inset “the last ten thousand years” does not state its magnification: add “1,000×” to its label so visitors know it is not to the main scale."],
      ["pass", "Inset “end-Cretaceous at 50×” states its magnification (50×)."],
    ]);
    await Marker.create({ exhibitId: e.id, kind: "custom", intervalId: null, datedEventId: null, ageMa: 600, uncertaintyMa: null, source: "An invented age for this test, outside the span", label: "Too old", decaySystemId: null });
    const outside = (await reviewPage(slug, who.reviewer.cookie)).body.report.results.find((r) => r.kind === "inside-span" && r.status === "fail")!;
    expect(outside.message).toBe("Marker 1 (“Too old”) is at 600 Ma, outside the exhibit's span (541 Ma to 0 a).");
  });

  it("an event whose text names an interval it does not lie in is a warning (submission still allowed); a consistent one passes", async () => {
    const slug = await create("check-names");
    const e = await exhibitRow(slug);
    const bad = await Marker.create({ exhibitId: e.id, kind: "custom", intervalId: null, datedEventId: null, ageMa: 380, uncertaintyMa: null, source: "An invented record for this test (Marrowby archive)", label: "Fish of the late Carnian", decaySystemId: null });
    const good = await Marker.create({ exhibitId: e.id, kind: "custom", intervalId: null, datedEventId: null, ageMa: 380, uncertaintyMa: null, source: "An invented record for this test (Marrowby archive)", label: "Reef of the Late Devonian", decaySystemId: null });
    const results = (await reviewPage(slug, who.reviewer.cookie)).body.report.results.filter((r) => r.kind === "interval-names");
    const byId = new Map(results.map((r) => [r.markerId, r]));
    expect(byId.get(String(bad.id))!.status).toBe("warning");
    expect(byId.get(String(bad.id))!.message).toMatch(/names the late part of .*Carnian.*but on ICS 2024\/12 the Carnian runs from/);
    expect(byId.get(String(good.id))!.status).toBe("pass");
    expect((await submit(slug)).status).toBe(302);
  });

  it("a pinned edition that is not the organisation's current one is flagged “needs re-check”", async () => {
    const other = await createOrganisation();
    const { user } = await createMember(other, "designer");
    const cookie = await cookieFor(user.id);
    await sequelize.query(`UPDATE organisations SET current_edition_id = (SELECT id FROM chart_editions WHERE slug = 'ics-2023-09') WHERE id = $1`, { bind: [other.id] });
    const form = new FormData();
    for (const [k, v] of Object.entries({ ...rope, slug: "recheck" })) form.set(k, v);
    await settle(() => newExhibit.action(routeArgs(new Request("http://test.local/studio/exhibits/new", { method: "POST", body: form, headers: { Cookie: cookie } }))));
    const page = (await settle(() => review.loader(routeArgs(getRequest("/studio/exhibits/recheck/review", { cookie }), { slug: "recheck" })))) as { body: Awaited<ReturnType<typeof review.loader>> };
    const r = page.body.report.results.find((x) => x.kind === "edition-current")!;
    expect(r.status).toBe("warning");
    expect(r.message).toMatch(/^Needs re-check: your organisation now works with ICS 2023\/09, but this exhibit is pinned to ICS 2024\/12/);
  });
});

describe("deciding: approve, request changes, four-eyes", () => {
  it("request changes needs a comment; then the designer edits and resubmits; a reviewer who did not edit approves", async () => {
    const slug = await create("decide-flow");
    await addBoundaries(slug);
    expect((await submit(slug)).status).toBe(302);
    const rev = String((await exhibitRow(slug)).revision);
    const noComment = await decide(slug, { intent: "request-changes", revision: rev, comment: "  " }, who.reviewer.cookie);
    expect(noComment.status).toBe(400);
    expect((noComment.body as Refusal).fields?.comment).toBe("Say what needs to change: a comment is required when asking for changes.");
    for (const r of ["admin", "editor"]) expect((await decide(slug, { intent: "request-changes", revision: rev, comment: "x" }, who[r].cookie)).status).toBe(403);
    expect((await decide(slug, { intent: "request-changes", revision: rev, comment: "x" }, who.designer.cookie)).status).toBe(403);
    expect((await decide(slug, { intent: "request-changes", revision: rev, comment: "x" }, outsider)).status).toBe(404);
    const sent = await decide(slug, { intent: "request-changes", revision: rev, comment: "Add the Ediacaran base for context." }, who.reviewer.cookie);
    expect(sent.status).toBe(302);
    expect((await exhibitRow(slug)).status).toBe("changes_requested");
    expect((await mailsTo(who.designer.user.email, /Changes requested: Review rope/))[0].text).toContain("Add the Ediacaran base for context.");
    // The designer changes it (it stays "changes requested" until resubmitted) and resubmits.
    const edit = await post(slug, { intent: "add-boundaries", intervalName: "Cambrian", revision: rev }, who.designer.cookie);
    expect([302, 400]).toContain(edit.status);
    expect((await submit(slug)).status).toBe(302);
    const rev2 = String((await exhibitRow(slug)).revision);
    // Stale decision: 409, nothing changed.
    const stale = await decide(slug, { intent: "approve", revision: String(Number(rev2) - 1) }, who.reviewer.cookie);
    expect(stale.status).toBe(409);
    expect((await exhibitRow(slug)).status).toBe("in_review");
    const ok = await decide(slug, { intent: "approve", revision: rev2, comment: "Figures match." }, who.reviewer.cookie);
    expect(ok.status).toBe(302);
    expect(await exhibitRow(slug)).toMatchObject({ status: "approved", approvedRevision: Number(rev2), approvedById: who.reviewer.user.id });
    expect(await mailsTo(who.designer.user.email, /Approved: Review rope/)).toHaveLength(1);
  });

  it("four-eyes: the curator may not approve an exhibit they edited (403 naming the rule); the reviewer may", async () => {
    const slug = await create("four-eyes", who.designer.cookie);
    await addBoundaries(slug);
    // The curator (designer + reviewer) adds an edit; the last save is the designer's.
    const r1 = String((await exhibitRow(slug)).revision);
    expect((await post(slug, { intent: "add-boundaries", rank: "era", revision: r1 }, who.curator.cookie)).status).toBe(302);
    const r2 = String((await exhibitRow(slug)).revision);
    expect((await post(slug, { intent: "add-boundaries", intervalName: "Ediacaran", revision: r2 }, who.designer.cookie)).status).toBeLessThan(500);
    expect((await submit(slug)).status).toBe(302);
    const rev = String((await exhibitRow(slug)).revision);
    const page = await reviewPage(slug, who.curator.cookie);
    expect(page.body.approveRefusal).toMatch(/^Four-eyes rule/);
    const refused = await decide(slug, { intent: "approve", revision: rev }, who.curator.cookie);
    expect(refused.status).toBe(403);
    expect((refused.body as Refusal).error).toBe("Four-eyes rule: you edited this exhibit since its last publication, so a reviewer who did not edit it must approve it.");
    expect((await exhibitRow(slug)).status).toBe("in_review");
    expect((await decide(slug, { intent: "approve", revision: rev }, who.reviewer.cookie)).status).toBe(302);
  });

  it("any edit of an approved exhibit returns it to draft and voids the approval", async () => {
    const slug = await create("edit-voids");
    await addBoundaries(slug);
    await submit(slug);
    await decide(slug, { intent: "approve", revision: String((await exhibitRow(slug)).revision) }, who.reviewer.cookie);
    expect((await exhibitRow(slug)).status).toBe("approved");
    const e = await exhibitRow(slug);
    const marker = (await Marker.findOne({ where: { exhibitId: e.id } }))!;
    expect((await post(slug, { intent: "edit-marker", markerId: String(marker.id), label: "Renamed", text: "", revision: String(e.revision) }, who.designer.cookie)).status).toBe(302);
    expect(await exhibitRow(slug)).toMatchObject({ status: "draft", approvedRevision: null });
    const audit = await AuditEvent.findOne({ where: { action: "exhibit.markers.edit", objectId: String(e.id) } });
    expect(audit!.details).toMatchObject({ status: "draft", statusBefore: "approved" });
  });
});

describe("comments, history and compare", () => {
  it("comments on a marker thread, are kept across revisions and are resolved by a designer only", async () => {
    const slug = await create("comments");
    await addBoundaries(slug);
    const e = await exhibitRow(slug);
    const marker = (await Marker.findOne({ where: { exhibitId: e.id }, order: [["id", "ASC"]] }))!;
    expect((await decide(slug, { intent: "comment", body: "", markerId: String(marker.id) }, who.reviewer.cookie)).status).toBe(400);
    expect((await decide(slug, { intent: "comment", body: "Hello", markerId: "999999" }, who.reviewer.cookie)).status).toBe(404);
    expect((await decide(slug, { intent: "comment", body: "Check this base", markerId: String(marker.id) }, who.reviewer.cookie)).status).toBe(302);
    const root = (await ExhibitComment.findOne({ where: { exhibitId: e.id } }))!;
    expect(root).toMatchObject({ markerId: marker.id, markerLabel: marker.label, revision: e.revision });
    expect((await decide(slug, { intent: "comment", body: "Done", parentId: String(root.id) }, who.designer.cookie)).status).toBe(302);
    expect((await decide(slug, { intent: "resolve-comment", commentId: String(root.id) }, who.reviewer.cookie)).status).toBe(403);
    expect((await decide(slug, { intent: "resolve-comment", commentId: String(root.id) }, who.designer.cookie)).status).toBe(302);
    const page = await reviewPage(slug, who.designer.cookie);
    expect(page.body.comments).toHaveLength(1);
    expect(page.body.comments[0]).toMatchObject({ body: "Check this base", resolved: { by: "Test Person" }, replies: [{ body: "Done" }] });
    expect((await exhibitRow(slug)).revision).toBe(e.revision);
  });

  it("every revision keeps its content; compare shows added, moved and rewritten markers in the exhibit's units", async () => {
    const slug = await create("history");
    await addBoundaries(slug);
    const e = await exhibitRow(slug);
    const marker = (await Marker.findOne({ where: { exhibitId: e.id }, order: [["id", "ASC"]] }))!;
    await post(slug, { intent: "edit-marker", markerId: String(marker.id), label: "Base of the Cambrian, renamed", text: "New words", revision: String(e.revision) }, who.designer.cookie);
    const kept = await ExhibitRevision.findAll({ where: { exhibitId: e.id }, order: [["revision", "ASC"]] });
    expect(kept.map((r) => [r.revision, r.action])).toEqual([[1, "create"], [2, "markers.add-boundaries"], [3, "markers.edit"]]);
    const list = (await settle(() => revisions.loader(routeArgs(getRequest(`/studio/exhibits/${slug}/revisions`, { cookie: who.editor.cookie }), { slug })))) as { body: Awaited<ReturnType<typeof revisions.loader>> };
    expect(list.body.revisions.map((r) => r.revision)).toEqual([3, 2, 1]);
    const diff = (await settle(() => compare.loader(routeArgs(getRequest(`/studio/exhibits/${slug}/revisions/compare?from=1&to=3`, { cookie: who.editor.cookie }), { slug })))) as { body: Awaited<ReturnType<typeof compare.loader>> };
    expect(diff.body.diff.added.length).toBe(kept[1].content.markers.length);
    const d23 = (await settle(() => compare.loader(routeArgs(getRequest(`/studio/exhibits/${slug}/revisions/compare?from=2&to=3`, { cookie: who.editor.cookie }), { slug })))) as { body: Awaited<ReturnType<typeof compare.loader>> };
    expect(d23.body.diff.changed).toEqual([{ id: String(marker.id), label: "Base of the Cambrian, renamed", changes: [`label “${marker.label}” → “Base of the Cambrian, renamed”`, "text added"] }]);
    const bad = await settle(() => compare.loader(routeArgs(getRequest(`/studio/exhibits/${slug}/revisions/compare?from=x&to=3`, { cookie: who.editor.cookie }), { slug })));
    expect(bad.status).toBe(400);
  });
});


