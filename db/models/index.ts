// All models and their associations. Import models from here; the process that owns the
// Sequelize instance (server/db.server.ts, the migration CLI, the test setup) calls initModels once.
import type { Sequelize } from "sequelize";
import { Asset, initAsset } from "./asset.ts";
import { AuditEvent, initAuditEvent } from "./audit-event.ts";
import { ChartEdition, initChartEdition } from "./chart-edition.ts";
import { DatedEvent, initDatedEvent } from "./dated-event.ts";
import { DecaySystem, initDecaySystem } from "./decay-system.ts";
import { Exhibit, initExhibit } from "./exhibit.ts";
import { ExhibitMedium, initExhibitMedium } from "./exhibit-medium.ts";
import { ExhibitComment, initExhibitComment } from "./exhibit-comment.ts";
import { ExhibitReview, initExhibitReview } from "./exhibit-review.ts";
import { ExhibitRevision, initExhibitRevision } from "./exhibit-revision.ts";
import { MarkerSign, initMarkerSign } from "./marker-sign.ts";
import { Publication, initPublication } from "./publication.ts";
import { ImageUse, initImageUse } from "./image-use.ts";
import { Inset, initInset } from "./inset.ts";
import { Marker, initMarker } from "./marker.ts";
import { Interval, initInterval } from "./interval.ts";
import { Invitation, initInvitation } from "./invitation.ts";
import { Membership, initMembership } from "./membership.ts";
import { Organisation, initOrganisation } from "./organisation.ts";
import { OutboxMessage, initOutboxMessage } from "./outbox-message.ts";
import { PasswordReset, initPasswordReset } from "./password-reset.ts";
import { Session, initSession } from "./session.ts";
import { User, initUser } from "./user.ts";
import { WarningAcknowledgement, initWarningAcknowledgement } from "./warning-acknowledgement.ts";

let boundTo: Sequelize | undefined;

/**
 * Binds every model to this instance and sets the associations. Calling it again with the same
 * instance does nothing; with another instance it rebinds (Model.init clears the associations).
 */
export function initModels(sequelize: Sequelize): Sequelize {
  if (boundTo === sequelize) return sequelize;
  initAsset(sequelize);
  initAuditEvent(sequelize);
  initChartEdition(sequelize);
  initDatedEvent(sequelize);
  initDecaySystem(sequelize);
  initExhibit(sequelize);
  initExhibitMedium(sequelize);
  initExhibitComment(sequelize);
  initExhibitReview(sequelize);
  initExhibitRevision(sequelize);
  initMarkerSign(sequelize);
  initPublication(sequelize);
  initImageUse(sequelize);
  initInset(sequelize);
  initMarker(sequelize);
  initInterval(sequelize);
  initInvitation(sequelize);
  initMembership(sequelize);
  initOrganisation(sequelize);
  initOutboxMessage(sequelize);
  initPasswordReset(sequelize);
  initSession(sequelize);
  initUser(sequelize);
  initWarningAcknowledgement(sequelize);

  User.hasMany(Membership, { foreignKey: "userId", as: "memberships" });
  Membership.belongsTo(User, { foreignKey: "userId", as: "user" });
  Organisation.hasMany(Membership, { foreignKey: "organisationId", as: "memberships" });
  Membership.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  Invitation.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  Invitation.belongsTo(User, { foreignKey: "invitedById", as: "invitedBy" });
  PasswordReset.belongsTo(User, { foreignKey: "userId", as: "user" });
  Session.belongsTo(User, { foreignKey: "userId", as: "user" });
  AuditEvent.belongsTo(User, { foreignKey: "actorId", as: "actor" });
  AuditEvent.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  ChartEdition.hasMany(Interval, { foreignKey: "editionId", as: "intervals" });
  Interval.belongsTo(ChartEdition, { foreignKey: "editionId", as: "edition" });
  Interval.belongsTo(Interval, { foreignKey: "parentId", as: "parent" });
  ChartEdition.belongsTo(User, { foreignKey: "createdById", as: "createdBy" });
  ChartEdition.belongsTo(User, { foreignKey: "madeCurrentById", as: "madeCurrentBy" });
  ChartEdition.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  DatedEvent.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  DatedEvent.belongsTo(User, { foreignKey: "createdById", as: "createdBy" });
  DatedEvent.belongsTo(User, { foreignKey: "updatedById", as: "updatedBy" });
  Exhibit.belongsTo(Organisation, { foreignKey: "organisationId", as: "organisation" });
  Exhibit.belongsTo(ChartEdition, { foreignKey: "editionId", as: "edition" });
  Exhibit.belongsTo(User, { foreignKey: "updatedById", as: "updatedBy" });
  Exhibit.hasOne(ExhibitMedium, { foreignKey: "exhibitId", as: "medium" });
  Exhibit.hasMany(Marker, { foreignKey: "exhibitId", as: "markers" });
  Exhibit.hasMany(Inset, { foreignKey: "exhibitId", as: "insets" });
  Marker.belongsTo(Interval, { foreignKey: "intervalId", as: "interval" });
  Exhibit.belongsTo(User, { foreignKey: "approvedById", as: "approvedBy" });
  ExhibitRevision.belongsTo(User, { foreignKey: "authorId", as: "author" });
  ExhibitReview.belongsTo(User, { foreignKey: "reviewerId", as: "reviewer" });
  ExhibitComment.belongsTo(User, { foreignKey: "authorId", as: "author" });
  ExhibitComment.belongsTo(User, { foreignKey: "resolvedById", as: "resolvedBy" });
  ImageUse.belongsTo(Asset, { foreignKey: "assetId", as: "asset" });
  WarningAcknowledgement.belongsTo(User, { foreignKey: "acknowledgedById", as: "acknowledgedBy" });
  boundTo = sequelize;
  return sequelize;
}

export { Asset, AuditEvent, ChartEdition, DatedEvent, DecaySystem, Exhibit, ExhibitMedium, ImageUse, Inset, Marker, Interval, Invitation, Membership, Organisation, OutboxMessage, PasswordReset, Session, User };
export { ExhibitComment, ExhibitReview, ExhibitRevision, MarkerSign, Publication };
export { WarningAcknowledgement };
