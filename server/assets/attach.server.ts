// Attaching images to markers and as an exhibit's cover: composer commands, each one revision of
// the exhibit (reviseExhibit: revision-checked, audited, in one transaction). An image replaced or
// removed is handed to the cleanup job, which runs only after the change commits and keeps
// whatever a publication or a kept revision still uses.
import type { Transaction } from "sequelize";
import { Asset, ImageUse } from "../../db/models/index.ts";
import { ExhibitError } from "../exhibits/load.server.ts";
import { reviseExhibit, type Actor } from "../exhibits/revise.server.ts";
import { queueCleanup } from "./jobs.server.ts";

export interface ImageWords {
  assetId: number;
  alt: string;
  credit: string;
}

async function usableAsset(actor: Actor, assetId: number, transaction: Transaction) {
  const asset = await Asset.findOne({ where: { id: assetId, organisationId: actor.organisationId }, transaction });
  if (!asset) throw new ExhibitError("That image is not among your organisation's uploads. Upload it again.", "assetId");
  if (asset.status === "failed") throw new ExhibitError(`That image could not be prepared: ${asset.error ?? "processing failed"}. Upload another file or try again.`, "assetId");
  return asset;
}

/** Sets (or replaces, or rewords) the image of a marker; markerId null = the exhibit's cover. */
export function setImage(actor: Actor, slug: string, revision: number, markerId: number | null, words: ImageWords) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    markerId === null ? "images.set-cover" : "images.set-marker",
    async (b, transaction) => {
      if (markerId !== null && !b.markerRows.some((m) => m.id === markerId)) throw new ExhibitError("That marker is not on this exhibit.", "markerId");
      const asset = await usableAsset(actor, words.assetId, transaction);
      const existing = await ImageUse.findOne({ where: { exhibitId: b.exhibit.id, markerId }, transaction });
      const previous = existing?.assetId ?? null;
      if (existing) await existing.update({ assetId: asset.id, alt: words.alt, credit: words.credit }, { transaction });
      else await ImageUse.create({ exhibitId: b.exhibit.id, markerId, assetId: asset.id, alt: words.alt, credit: words.credit }, { transaction });
      // The latest words become the suggestion for the next use of the same image.
      await asset.update({ alt: words.alt, credit: words.credit }, { transaction });
      if (previous !== null && previous !== asset.id) await queueCleanup([previous], transaction);
      return { assetId: asset.id, replaced: previous !== null && previous !== asset.id ? previous : null, altMissing: words.alt === "" };
    },
    (r) => ({ markerId, assetId: r.assetId, replaced: r.replaced, altMissing: r.altMissing }),
  );
}

/** Removes the image of a marker (or the cover); its files go once nothing else uses them. */
export function removeImage(actor: Actor, slug: string, revision: number, markerId: number | null) {
  return reviseExhibit(
    actor,
    slug,
    revision,
    markerId === null ? "images.remove-cover" : "images.remove-marker",
    async (b, transaction) => {
      const use = await ImageUse.findOne({ where: { exhibitId: b.exhibit.id, markerId }, transaction });
      if (!use) throw new ExhibitError(markerId === null ? "This exhibit has no cover image." : "That marker has no image.", "markerId");
      await use.destroy({ transaction });
      await queueCleanup([use.assetId], transaction);
      return use.assetId;
    },
    (assetId) => ({ markerId, assetId }),
  );
}

/** For a marker about to be removed: its image's cleanup, queued in the same transaction (the use goes by cascade). */
export async function cleanupAfterMarkerRemoval(markerId: number, transaction: Transaction) {
  const use = await ImageUse.findOne({ where: { markerId }, transaction });
  if (use) await queueCleanup([use.assetId], transaction);
}
