// The exhibit lifecycle and the review page's forms: which transition may start from which status
// (every pair), what an edit does to the status, which permission a composer form needs, and the
// refusals of bad input in words.
import { describe, expect, it } from "vitest";
import { CompareQuerySchema, MAX_COMMENT_LENGTH, ReviewCommandSchema } from "../../../app/lib/review/forms.ts";
import { composerPermission, dayOf, EXHIBIT_STATUSES, isExhibitStatus, revisionActionWords, STATUS_EXPLAINED, STATUS_WORDS, statusAfterEdit, transitionRefusal, TRANSITIONS, type ExhibitStatus, type Transition } from "../../../app/lib/review/lifecycle.ts";
import { parseForm } from "../../../app/lib/validation.ts";

describe("transitions", () => {
  // The issue's lifecycle: draft → in_review → approved → published, in_review → changes_requested,
  // and a resubmission after changes were requested.
  const allowed: Record<Transition, ExhibitStatus[]> = {
    "submit-for-review": ["draft", "changes_requested"],
    approve: ["in_review"],
    "request-changes": ["in_review"],
    publish: ["approved"],
  };
  const target: Record<Transition, ExhibitStatus> = { "submit-for-review": "in_review", approve: "approved", "request-changes": "changes_requested", publish: "published" };

  for (const transition of Object.keys(allowed) as Transition[]) {
    for (const status of EXHIBIT_STATUSES) {
      const ok = allowed[transition].includes(status);
      it(`${transition} from ${status}: ${ok ? `allowed, to ${target[transition]}` : "refused in words"}`, () => {
        const refusal = transitionRefusal(transition, status);
        if (ok) {
          expect(refusal).toBeNull();
          expect(TRANSITIONS[transition].to).toBe(target[transition]);
        } else {
          expect(refusal).toMatch(new RegExp(`^This exhibit is ${STATUS_WORDS[status].toLowerCase()}; it can be ${TRANSITIONS[transition].words} only when it is `));
        }
      });
    }
  }

  it("names every allowed status in a refusal", () => {
    expect(transitionRefusal("submit-for-review", "approved")).toBe("This exhibit is approved; it can be submitted for review only when it is draft or changes requested.");
    expect(transitionRefusal("publish", "in_review")).toBe("This exhibit is in review; it can be published only when it is approved.");
  });

  it("an edit returns in review, approved and published to draft; changes requested stays until resubmitted", () => {
    expect(EXHIBIT_STATUSES.map((s) => [s, statusAfterEdit(s)])).toEqual([
      ["draft", "draft"],
      ["in_review", "draft"],
      ["changes_requested", "changes_requested"],
      ["approved", "draft"],
      ["published", "draft"],
    ]);
  });

  it("every status has its words and an explanation", () => {
    for (const s of EXHIBIT_STATUSES) {
      expect(STATUS_WORDS[s].length).toBeGreaterThan(3);
      expect(STATUS_EXPLAINED[s]).toMatch(/\.$/);
    }
    expect(isExhibitStatus("in_review")).toBe(true);
    expect(isExhibitStatus("archived")).toBe(false);
    expect(isExhibitStatus(3)).toBe(false);
  });

  it("composer forms: publishing and submitting have their own permissions, every other intent edits", () => {
    expect(composerPermission("publish")).toBe("exhibit.publish");
    expect(composerPermission("submit-for-review")).toBe("exhibit.submit");
    for (const intent of ["add-boundaries", "remove-marker", "acknowledge-warning", "approve", ""]) expect(composerPermission(intent)).toBe("exhibit.edit");
  });
});

describe("history words", () => {
  it("every revision action the server records reads as words; an unknown one as its name", () => {
    const recorded = ["create", "settings", "route.replace", "repin", "markers.add-boundaries", "markers.add-event", "markers.add-custom", "markers.edit", "markers.remove", "markers.combine", "insets.add", "insets.remove", "warnings.acknowledge", "images.set-marker", "images.remove-marker", "images.set-cover", "images.remove-cover"];
    for (const action of recorded) expect(revisionActionWords(action), action).toMatch(/^[A-Z][a-z]+ [a-z’' ]+/);
    expect(revisionActionWords("markers.add-custom")).toBe("Added a custom age");
    expect(revisionActionWords("labels.translate")).toBe("labels translate");
  });

  it("a day in words, in UTC whatever the clock's zone", () => {
    expect(dayOf("2026-12-01T23:47:00.000Z")).toBe("1 December 2026");
    expect(dayOf("2027-01-31T00:00:00Z")).toBe("31 January 2027");
  });
});

describe("review forms", () => {
  const parse = (fields: Record<string, string>) => parseForm(ReviewCommandSchema, fields);

  it("approve: a revision and an optional note", () => {
    expect(parse({ intent: "approve", revision: "5" })).toEqual({ ok: true, data: { intent: "approve", revision: 5, comment: "" } });
    const bad = parse({ intent: "approve", revision: "five" });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(Object.keys(bad.fieldErrors)).toEqual(["revision"]);
  });

  it("request-changes needs a comment, said in words", () => {
    const empty = parse({ intent: "request-changes", revision: "5", comment: "   " });
    expect(empty.ok).toBe(false);
    if (!empty.ok) expect(empty.fieldErrors.comment).toBe("Say what needs to change: a comment is required when asking for changes.");
    const long = parse({ intent: "request-changes", revision: "5", comment: "x".repeat(MAX_COMMENT_LENGTH + 1) });
    if (!long.ok) expect(long.fieldErrors.comment).toBe("The comment is too long: keep it under 4,000 characters.");
    else expect.unreachable("a comment over the limit was accepted");
    expect(parse({ intent: "request-changes", revision: "5", comment: " Check marker 3's source. " })).toEqual({ ok: true, data: { intent: "request-changes", revision: 5, comment: "Check marker 3's source." } });
  });

  it("comment: on the exhibit (no marker) or a marker, optionally a reply", () => {
    expect(parse({ intent: "comment", body: "Looks right.", markerId: "", parentId: "" })).toEqual({ ok: true, data: { intent: "comment", body: "Looks right.", markerId: null, parentId: null } });
    expect(parse({ intent: "comment", body: "Source?", markerId: "12" })).toEqual({ ok: true, data: { intent: "comment", body: "Source?", markerId: 12, parentId: null } });
    const bad = parse({ intent: "comment", body: "", markerId: "-1" });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.fieldErrors).toMatchObject({ body: "Write the comment.", markerId: "Choose a marker." });
  });

  it("an unknown intent is refused", () => {
    const bad = parse({ intent: "publish", revision: "3" });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.formError).toBe("Check the form: Unknown action.");
  });

  it("compare query: two revision numbers, or a revision and the live publication", () => {
    expect(parseForm(CompareQuerySchema, { from: "2", to: "published" })).toEqual({ ok: true, data: { from: 2, to: "published" } });
    expect(parseForm(CompareQuerySchema, { from: "2", to: "5" })).toEqual({ ok: true, data: { from: 2, to: 5 } });
    const bad = parseForm(CompareQuerySchema, { from: "0", to: "latest" });
    expect(bad.ok).toBe(false);
    if (!bad.ok) expect(bad.fieldErrors).toEqual({ from: "from must be a revision number.", to: "to must be a revision number or “published”." });
  });
});
