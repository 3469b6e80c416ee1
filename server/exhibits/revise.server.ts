// Every change to an exhibit runs in one transaction that (1) claims the next revision — refused
// when the form was based on an older one, so no one's change is lost —, (2) makes the change,
// (3) re-runs the scale engine on the result (a change that leaves markers outside the span or an
// invalid route rolls back), and (4) writes the audit event.
import type { Transaction } from "sequelize";
import { data } from "react-router";
import { Exhibit, User } from "../../db/models/index.ts";
import type { Subject } from "../../app/lib/permissions.ts";
import { sequelize } from "../db.server.ts";
import { audit } from "../audit.server.ts";
import { BodyTooLargeError, megabytes, readLimitedFormData } from "../http.server.ts";
import { recordEdit } from "../review/revisions.server.ts";
import { computeBundle, EXHIBIT_NOT_FOUND, ExhibitError, requireBundle, type ExhibitBundle } from "./load.server.ts";

/** Another person saved first: nothing of this change was written. */
export class RevisionConflictError extends ExhibitError {
  constructor(public currentRevision: number, by: string | null, at: Date) {
    super(
      `Not saved: ${by ?? "someone"} saved a newer version of this exhibit (revision ${currentRevision}) at ${at.toISOString().slice(11, 16)} UTC, after you opened it. Their change is kept; reload the page to see it, then make your change again.`,
      "_form",
      409,
    );
    this.name = "RevisionConflictError";
  }
}

export interface Actor {
  organisationId: number;
  user: User;
  /** The permission subject (the review transitions ask it: four-eyes, publish). */
  subject?: Subject;
}

/**
 * Runs `change` as the next revision of the exhibit. `revision` is the one the designer's form
 * was based on; if someone saved since, nothing happens and RevisionConflictError says who.
 */
export async function reviseExhibit<T>(
  actor: Actor,
  slug: string,
  revision: number,
  action: string,
  change: (bundle: ExhibitBundle, transaction: Transaction) => Promise<T>,
  details: (result: T) => Record<string, unknown> = () => ({}),
): Promise<{ result: T; revision: number }> {
  return sequelize.transaction(async (transaction) => {
    const [rows] = (await sequelize.query(
      `UPDATE exhibits SET revision = revision + 1, updated_by_id = $1, updated_at = now()
       WHERE organisation_id = $2 AND slug = $3 AND revision = $4 RETURNING id, revision`,
      { bind: [actor.user.id, actor.organisationId, slug, revision], transaction },
    )) as [{ id: number; revision: number }[], unknown];
    if (rows.length === 0) {
      const current = await Exhibit.findOne({ where: { organisationId: actor.organisationId, slug }, include: [{ model: User, as: "updatedBy" }], transaction });
      if (!current) throw data({ message: EXHIBIT_NOT_FOUND }, { status: 404 });
      throw new RevisionConflictError(current.revision, current.updatedBy?.name ?? null, current.updatedAt);
    }
    const before = await requireBundle(actor.organisationId, slug, transaction);
    const result = await change(before, transaction);
    // The whole exhibit must still compute: markers inside the span, a valid medium.
    const after = await requireBundle(actor.organisationId, slug, transaction);
    const computed = computeBundle(after);
    if (!computed.ok) throw new ExhibitError(`Not saved: ${computed.message}`);
    // Keep the revision's content; an edit of an exhibit in review, approved or published returns it to draft.
    const status = await recordEdit(after, actor.user.id, action, transaction);
    await audit(
      { organisationId: actor.organisationId, actorId: actor.user.id, action: `exhibit.${action}`, objectType: "exhibit", objectId: before.exhibit.id, details: { slug, revision: rows[0].revision, ...(status.after !== status.before ? { status: status.after, statusBefore: status.before } : {}), ...details(result) } },
      transaction,
    );
    return { result, revision: rows[0].revision };
  });
}

/** Exhibit forms, including a route file upload (GPS tracks of 10⁵ points are a few MB). */
export const MAX_EXHIBIT_FORM_BYTES = 8 * 1024 * 1024;

/** readLimitedFormData with the exhibit forms' limit; a too-large body → a message for the route-file field. */
export async function readExhibitForm(request: Request): Promise<{ ok: true; form: FormData } | { ok: false; message: string }> {
  try {
    return { ok: true, form: await readLimitedFormData(request, MAX_EXHIBIT_FORM_BYTES) };
  } catch (error) {
    if (error instanceof BodyTooLargeError) return { ok: false, message: `The upload is larger than ${megabytes(MAX_EXHIBIT_FORM_BYTES)}. Simplify the route (fewer points) or split it.` };
    throw error;
  }
}
