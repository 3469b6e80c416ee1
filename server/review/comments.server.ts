// Review comments: on the exhibit or on one marker, threaded (a reply names its parent), kept across
// revisions, resolved by a designer. Comments are not edits: they leave the exhibit's revision and
// status alone.
import { data } from "react-router";
import { ExhibitComment, Exhibit, Marker } from "../../db/models/index.ts";
import { audit } from "../audit.server.ts";
import { sequelize } from "../db.server.ts";
import { EXHIBIT_NOT_FOUND, ExhibitError } from "../exhibits/load.server.ts";
import type { ReviewActor } from "./lifecycle.server.ts";

async function exhibitOf(actor: ReviewActor, slug: string) {
  const exhibit = await Exhibit.findOne({ where: { organisationId: actor.organisationId, slug } });
  if (!exhibit) throw data({ message: EXHIBIT_NOT_FOUND }, { status: 404 });
  return exhibit;
}

export async function addComment(actor: ReviewActor, slug: string, input: { body: string; markerId: number | null; parentId: number | null }) {
  const exhibit = await exhibitOf(actor, slug);
  return sequelize.transaction(async (transaction) => {
    let markerId = input.markerId;
    let markerLabel: string | null = null;
    if (input.parentId !== null) {
      const parent = await ExhibitComment.findOne({ where: { id: input.parentId, exhibitId: exhibit.id }, transaction });
      if (!parent) throw new ExhibitError("The comment you replied to is not on this exhibit.", "parentId", 404);
      markerId = parent.markerId;
      markerLabel = parent.markerLabel;
    } else if (markerId !== null) {
      const marker = await Marker.findOne({ where: { id: markerId, exhibitId: exhibit.id }, transaction });
      if (!marker) throw new ExhibitError("That marker is not on this exhibit (it may have been removed).", "markerId", 404);
      markerLabel = marker.label;
    }
    const comment = await ExhibitComment.create({ exhibitId: exhibit.id, markerId, markerLabel, parentId: input.parentId, authorId: actor.user.id, body: input.body, revision: exhibit.revision }, { transaction });
    await audit({ organisationId: actor.organisationId, actorId: actor.user.id, action: "exhibit.comment", objectType: "exhibit", objectId: exhibit.id, details: { slug, commentId: comment.id, markerId, parentId: input.parentId } }, transaction);
    return comment;
  });
}

export async function resolveComment(actor: ReviewActor, slug: string, commentId: number) {
  const exhibit = await exhibitOf(actor, slug);
  return sequelize.transaction(async (transaction) => {
    const comment = await ExhibitComment.findOne({ where: { id: commentId, exhibitId: exhibit.id }, transaction, lock: transaction.LOCK.UPDATE });
    if (!comment) throw new ExhibitError("That comment is not on this exhibit.", "commentId", 404);
    if (comment.parentId !== null) throw new ExhibitError("Resolve the thread's first comment; replies belong to it.", "commentId");
    if (comment.resolvedAt) throw new ExhibitError("This comment is already resolved.", "commentId", 409);
    await comment.update({ resolvedAt: new Date(), resolvedById: actor.user.id }, { transaction });
    await audit({ organisationId: actor.organisationId, actorId: actor.user.id, action: "exhibit.comment-resolve", objectType: "exhibit", objectId: exhibit.id, details: { slug, commentId } }, transaction);
    return comment;
  });
}
