// Who is looking at chart editions, and which editions they may see. Pages outside the studio
// (/editions…) are open to visitors too, so nothing here throws a redirect.
//   - shared editions (organisation_id NULL, the published ICS editions): everyone sees the
//     released ones (current = latest, retired); chart stewards also see shared drafts;
//   - an organisation's own editions: only its members, drafts only to those who may manage them.
import { Op, type WhereOptions } from "sequelize";
import { can, type Subject } from "../../app/lib/permissions.ts";
import { getSigned, type Signed } from "../auth.server.ts";

export interface Viewer {
  userId: number;
  name: string;
  organisationId: number | null;
  organisationName: string | null;
  /** A member of some organisation (so the studio is open to them). */
  member: boolean;
  subject: Subject;
}

/** What a reader may see: their organisation's own editions, shared drafts (stewards), own drafts (editors, admins). */
export interface EditionScope {
  organisationId: number | null;
  steward: boolean;
  ownDrafts: boolean;
}

/** A visitor's scope: released shared editions only (also the public API's). */
export const PUBLIC_SCOPE: EditionScope = { organisationId: null, steward: false, ownDrafts: false };

/** The signed-in reader, or null for a visitor. Never throws a redirect. */
export async function viewerOf(request: Request): Promise<Viewer | null> {
  const s = await getSigned(request);
  return s ? toViewer(s) : null;
}

/** The reader as the edition pages see them, from what the guards found. */
export function toViewer(s: Signed): Viewer {
  return {
    userId: s.user.id,
    name: s.user.name,
    organisationId: s.organisation?.id ?? null,
    organisationName: s.organisation?.name ?? null,
    member: s.membership !== null,
    subject: s.subject,
  };
}

export function scopeOf(viewer: Viewer | null): EditionScope {
  if (!viewer) return PUBLIC_SCOPE;
  return { organisationId: viewer.organisationId, steward: viewer.subject.steward, ownDrafts: can(viewer.subject, "edition.import") };
}

/** May this reader manage some editions (the "Manage" links)? */
export function managesEditions(viewer: Viewer | null): boolean {
  return Boolean(viewer && (can(viewer.subject, "edition.import") || can(viewer.subject, "edition.manage-shared")));
}

const RELEASED = ["current", "retired"];

/** The editions a scope may see, as a Sequelize where clause. */
export function visibleWhere(scope: EditionScope): WhereOptions {
  const or: WhereOptions[] = [{ organisationId: null, status: scope.steward ? [...RELEASED, "draft"] : RELEASED }];
  if (scope.organisationId !== null) {
    or.push(scope.ownDrafts ? { organisationId: scope.organisationId } : { organisationId: scope.organisationId, status: RELEASED });
  }
  return { [Op.or]: or };
}

/** The same rule for one edition already loaded. */
export function isVisible(edition: { organisationId: number | null; status: string }, scope: EditionScope): boolean {
  if (edition.organisationId === null) return edition.status !== "draft" || scope.steward;
  if (edition.organisationId !== scope.organisationId) return false;
  return edition.status !== "draft" || scope.ownDrafts;
}
