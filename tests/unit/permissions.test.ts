// The permissions table, checked against expectations written out here by hand (one row per action:
// which single roles may, and whether a chart steward without roles may). Role sets, the four-eyes
// rule and chart-edition ownership are checked case by case.
import { describe, expect, it } from "vitest";
import { ACTIONS, can, decide, type Action } from "../../app/lib/permissions.ts";
import { normaliseRoles, rolesInWords } from "../../app/lib/roles.ts";

//                                      admin  designer reviewer editor  steward-only
const EXPECTED: Record<Action, [boolean, boolean, boolean, boolean, boolean]> = {
  "exhibit.edit": [false, true, false, false, false],
  "exhibit.submit": [false, true, false, false, false],
  "exhibit.approve": [false, false, true, false, false],
  "exhibit.request-changes": [false, false, true, false, false],
  "exhibit.publish": [true, true, false, false, false],
  "warning.acknowledge": [false, true, false, false, false],
  "image.upload": [false, true, false, false, false],
  "exhibit.export": [true, true, true, true, false],
  "dated-events.manage": [true, false, false, true, false],
  "edition.import": [true, false, false, true, false],
  "edition.set-current": [true, false, false, true, false],
  "edition.manage-shared": [false, false, false, false, true],
  "members.manage": [true, false, false, false, false],
};

describe("can(): one role at a time", () => {
  it("has an expectation for every action and no more", () => {
    expect(Object.keys(EXPECTED).sort()).toEqual([...ACTIONS].sort());
  });
  for (const [action, [admin, designer, reviewer, editor, steward]] of Object.entries(EXPECTED) as [Action, boolean[]][]) {
    it(action, () => {
      expect(can({ roles: ["admin"], steward: false }, action)).toBe(admin);
      expect(can({ roles: ["designer"], steward: false }, action)).toBe(designer);
      expect(can({ roles: ["reviewer"], steward: false }, action)).toBe(reviewer);
      expect(can({ roles: ["editor"], steward: false }, action)).toBe(editor);
      expect(can({ roles: [], steward: true }, action)).toBe(steward);
      expect(can({ roles: [], steward: false }, action)).toBe(false);
    });
  }
});

describe("can(): role sets", () => {
  it("any one matching role in the set is enough", () => {
    const curator = { roles: ["designer", "reviewer"] as const, steward: false };
    expect(can(curator, "exhibit.edit")).toBe(true);
    expect(can(curator, "exhibit.approve")).toBe(true);
    expect(can(curator, "members.manage")).toBe(false);
    expect(can(curator, "dated-events.manage")).toBe(false);
  });
  it("a steward who is also an editor may manage both kinds of edition", () => {
    const s = { roles: ["editor"] as const, steward: true, organisationId: 7 };
    expect(can(s, "edition.manage-shared", { editionOwnerId: null })).toBe(true);
    expect(can(s, "edition.import", { editionOwnerId: 7 })).toBe(true);
  });
});

describe("can(): four-eyes rule", () => {
  const curator = { roles: ["designer", "reviewer"] as const, steward: false, userId: 41 };
  it("refuses a reviewer who edited the exhibit since its last publication, with the rule named", () => {
    expect(can(curator, "exhibit.approve", { editorIds: [12, 41] })).toBe(false);
    const d = decide(curator, "exhibit.approve", { editorIds: [41] });
    expect(d.ok).toBe(false);
    expect(!d.ok && d.reason).toMatch(/Four-eyes rule/);
  });
  it("allows a reviewer who did not edit it", () => {
    expect(can(curator, "exhibit.approve", { editorIds: [12, 13] })).toBe(true);
    expect(can(curator, "exhibit.approve", { editorIds: [] })).toBe(true);
  });
  it("does not touch other actions: the curator may still edit their own exhibit", () => {
    expect(can(curator, "exhibit.edit", { editorIds: [41] })).toBe(true);
    expect(can(curator, "exhibit.request-changes", { editorIds: [41] })).toBe(true);
  });
});

describe("can(): chart-edition ownership", () => {
  const editorOf7 = { roles: ["editor"] as const, steward: false, organisationId: 7 };
  const adminOf7 = { roles: ["admin"] as const, steward: false, organisationId: 7 };
  const steward = { roles: [] as const, steward: true, organisationId: null };
  it("an organisation's editor or admin changes its own editions only", () => {
    expect(can(editorOf7, "edition.import", { editionOwnerId: 7 })).toBe(true);
    expect(can(adminOf7, "edition.import", { editionOwnerId: 7 })).toBe(true);
    expect(can(editorOf7, "edition.import", { editionOwnerId: 8 })).toBe(false);
    expect(can(adminOf7, "edition.import", { editionOwnerId: 8 })).toBe(false);
  });
  it("nobody but a steward changes a shared edition", () => {
    expect(can(editorOf7, "edition.import", { editionOwnerId: null })).toBe(false);
    expect(can(adminOf7, "edition.manage-shared", { editionOwnerId: null })).toBe(false);
    expect(can(steward, "edition.manage-shared", { editionOwnerId: null })).toBe(true);
    const d = decide(editorOf7, "edition.import", { editionOwnerId: null });
    expect(!d.ok && d.reason).toMatch(/only by chart stewards/);
  });
  it("a steward does not change an organisation's own editions", () => {
    expect(can(steward, "edition.manage-shared", { editionOwnerId: 7 })).toBe(false);
    expect(can(steward, "edition.import", { editionOwnerId: 7 })).toBe(false);
  });
});

describe("refusal messages name what is needed", () => {
  it("names the roles and the roles held", () => {
    const d = decide({ roles: ["designer", "reviewer"], steward: false }, "dated-events.manage");
    expect(d).toEqual({ ok: false, reason: "This needs editor or admin members (managing the dated-event library). You hold designer and reviewer." });
  });
  it("names stewards for shared editions", () => {
    const d = decide({ roles: ["editor"], steward: false }, "edition.manage-shared");
    expect(!d.ok && d.reason).toBe("This needs chart stewards (managing the shared chart editions). You hold chart editor.");
  });
});

describe("role sets in words", () => {
  it("orders and de-duplicates", () => {
    expect(normaliseRoles(["reviewer", "admin", "reviewer"])).toEqual(["admin", "reviewer"]);
    expect(rolesInWords(["reviewer", "designer"])).toBe("Designer and reviewer");
    expect(rolesInWords(["editor", "admin", "designer"], { lower: true })).toBe("admin, designer and chart editor");
  });
});
