// Acknowledged legibility warnings: stored per exhibit under the warning's stable key, read by the
// composer (shown as acknowledged, with the reason) and by the review checks.
import type { Transaction } from "sequelize";
import type { WarningAcknowledgement as Acknowledgement } from "../../app/lib/exhibit/index.ts";
import { User, WarningAcknowledgement } from "../../db/models/index.ts";
import { computeBundle, ExhibitError } from "./load.server.ts";
import { reviseExhibit, type Actor } from "./revise.server.ts";

/** Every stored acknowledgement of the exhibit (match them to the current warnings with acknowledgementOf / withAcknowledgements). */
export async function acknowledgementsFor(exhibitId: number, transaction?: Transaction): Promise<Acknowledgement[]> {
  const rows = await WarningAcknowledgement.findAll({ where: { exhibitId }, include: [{ model: User, as: "acknowledgedBy" }], order: [["id", "ASC"]], transaction });
  return rows.map((r) => ({ warningKey: r.warningKey, reason: r.reason, by: r.acknowledgedBy?.name ?? null, at: r.updatedAt.toISOString(), revision: r.revision }));
}

/**
 * Acknowledges one of the saved exhibit's current warnings with a reason (again: replaces the
 * reason). A revision-checked, audited edit like any other (so an exhibit in review goes back to draft).
 */
export function acknowledgeWarning(actor: Actor, slug: string, revision: number, warningKey: string, reason: string) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    "warnings.acknowledge",
    async (b, transaction) => {
      const computed = computeBundle(b);
      if (!computed.ok) throw new ExhibitError(computed.message);
      const warning = computed.result.warnings.find((w) => w.key === warningKey);
      if (!warning) throw new ExhibitError("That warning is not on this exhibit any more (the markers or settings changed); reload the page to see the current warnings.", "warningKey");
      const existing = await WarningAcknowledgement.findOne({ where: { exhibitId: b.exhibit.id, warningKey }, transaction });
      if (existing) await existing.update({ reason, acknowledgedById: actor.user.id, revision: b.exhibit.revision }, { transaction });
      else await WarningAcknowledgement.create({ exhibitId: b.exhibit.id, warningKey, reason, acknowledgedById: actor.user.id, revision: b.exhibit.revision }, { transaction });
      return warning;
    },
    (w) => ({ warningKey, code: w.code, markers: w.markers.map((m) => m.number), reason }),
  );
}
