// Who may do what: the one permissions table of Eonscale. Pure (no React, no server): the server
// guards (`requirePermission` in server/auth.server.ts) and the pages (which buttons to show) both ask
// `can(subject, action, resource?)`.
//
// A subject is a signed-in person as seen in their active organisation: the set of roles their
// membership there holds, and whether they are a site-wide chart steward (granted from the command
// line, never by an organisation). A resource, when given, lets a rule look at the thing acted on:
// the four-eyes rule (nobody approves an exhibit they edited) and chart-edition ownership (shared
// editions belong to the stewards, an organisation's own editions to that organisation).
import { ROLES, rolesInWords, type Role } from "./roles.ts";

export interface Subject {
  /** Roles held in the active organisation (empty when the person belongs to none). */
  roles: readonly Role[];
  /** A site-wide chart steward: manages the shared (ICS) editions. */
  steward: boolean;
  /** The person, for resource rules (four-eyes). */
  userId?: number;
  /** The active organisation, for ownership rules. */
  organisationId?: number | null;
}

export interface Resource {
  /** Everyone who edited the exhibit since its last publication (every revision's author). */
  editorIds?: readonly number[];
  /** The organisation that owns a chart edition; null for a shared edition. */
  editionOwnerId?: number | null;
}

interface Rule {
  /** Any one of these roles in the active organisation allows it. */
  roles: readonly Role[];
  /** Chart stewards may do it (whatever their organisation roles). */
  steward?: boolean;
  /** What it is, in words, for refusals: "This needs …". */
  what: string;
}

/**
 * The table. Decisions written down:
 * - designers compose (edit, acknowledge warnings, images) and submit for review;
 * - reviewers approve or request changes (never on an exhibit they edited: four-eyes);
 * - publishing an approved revision is the designer's release step, or the admin's (the issue's
 *   lifecycle: a reviewer already checked the figures; publishing only makes the approved revision
 *   public, so it needs no third role);
 * - editors look after the dated-event library, import the organisation's own chart editions and
 *   choose which edition is current for the organisation; admins may do the same, as they run the
 *   organisation;
 * - admins manage members and their roles;
 * - chart stewards (site-wide) manage the shared editions; no organisation role can;
 * - every member may export.
 */
export const PERMISSIONS = {
  "exhibit.edit": { roles: ["designer"], what: "editing exhibits" },
  "exhibit.submit": { roles: ["designer"], what: "submitting exhibits for review" },
  "exhibit.approve": { roles: ["reviewer"], what: "approving exhibits" },
  "exhibit.request-changes": { roles: ["reviewer"], what: "requesting changes to exhibits" },
  "exhibit.publish": { roles: ["designer", "admin"], what: "publishing approved exhibits" },
  "warning.acknowledge": { roles: ["designer"], what: "acknowledging check warnings" },
  "image.upload": { roles: ["designer"], what: "uploading and attaching images" },
  "exhibit.export": { roles: ROLES, what: "exporting exhibits" },
  "dated-events.manage": { roles: ["editor", "admin"], what: "managing the dated-event library" },
  "edition.import": { roles: ["editor", "admin"], what: "importing and managing the organisation's own chart editions" },
  "edition.set-current": { roles: ["editor", "admin"], what: "choosing the organisation's current chart edition" },
  "edition.manage-shared": { roles: [], steward: true, what: "managing the shared chart editions" },
  "members.manage": { roles: ["admin"], what: "managing members and their roles" },
} as const satisfies Record<string, Rule>;

export type Action = keyof typeof PERMISSIONS;
export const ACTIONS = Object.keys(PERMISSIONS) as Action[];

export type Decision = { ok: true } | { ok: false; reason: string };

/** The roles that allow an action (empty for steward-only actions). */
export function rolesFor(action: Action): readonly Role[] {
  return PERMISSIONS[action].roles;
}

/** Who may do it, in words: "editor or admin members", "chart stewards". */
export function whoMay(action: Action): string {
  const rule: Rule = PERMISSIONS[action];
  const parts: string[] = [];
  if (rule.roles.length === ROLES.length) parts.push("every member");
  else if (rule.roles.length) parts.push(`${rule.roles.join(" or ")} members`);
  if (rule.steward) parts.push("chart stewards");
  return parts.join(" or ");
}

/** The decision with its reason (for a 403 message). */
export function decide(subject: Subject, action: Action, resource?: Resource): Decision {
  const rule: Rule = PERMISSIONS[action];
  const byRole = rule.roles.some((r) => subject.roles.includes(r));
  const bySteward = Boolean(rule.steward && subject.steward);
  if (!byRole && !bySteward) {
    const held = subject.roles.length ? `You hold ${rolesInWords(subject.roles, { lower: true })}.` : "You hold no role in an organisation.";
    return { ok: false, reason: `This needs ${whoMay(action)} (${rule.what}). ${held}` };
  }
  if (resource?.editorIds && action === "exhibit.approve" && subject.userId !== undefined && resource.editorIds.includes(subject.userId)) {
    return {
      ok: false,
      reason: "Four-eyes rule: you edited this exhibit since its last publication, so a reviewer who did not edit it must approve it.",
    };
  }
  if (resource && "editionOwnerId" in resource) {
    const owner = resource.editionOwnerId ?? null;
    if (owner === null && !subject.steward) {
      return { ok: false, reason: "Shared chart editions are managed only by chart stewards; an organisation cannot change them." };
    }
    if (owner !== null && (action === "edition.manage-shared" || owner !== (subject.organisationId ?? null))) {
      return { ok: false, reason: "This chart edition belongs to another organisation." };
    }
  }
  return { ok: true };
}

/** May the subject do this (to this resource)? */
export function can(subject: Subject, action: Action, resource?: Resource): boolean {
  return decide(subject, action, resource).ok;
}

/** Every action the subject may do: handy for a page's loader to tell its component which buttons to show. */
export function allowedActions(subject: Subject): Action[] {
  return ACTIONS.filter((a) => can(subject, a));
}
