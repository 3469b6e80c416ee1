// All models and their associations. Import models from here so associations are always set up.
import { AuditEvent } from "./audit-event.ts";
import { ChartEdition } from "./chart-edition.ts";
import { DatedEvent } from "./dated-event.ts";
import { DecaySystem } from "./decay-system.ts";
import { Exhibit } from "./exhibit.ts";
import { ExhibitMedium } from "./exhibit-medium.ts";
import { Inset } from "./inset.ts";
import { Marker } from "./marker.ts";
import { Interval } from "./interval.ts";
import { Invitation } from "./invitation.ts";
import { Membership } from "./membership.ts";
import { Organisation } from "./organisation.ts";
import { OutboxMessage } from "./outbox-message.ts";
import { PasswordReset } from "./password-reset.ts";
import { Session } from "./session.ts";
import { User } from "./user.ts";

// Associations belong to these class objects, so they are set every time this module is
// evaluated (the server entry and the React Router server bundle each evaluate their own copy).
{
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
}

export { AuditEvent, ChartEdition, DatedEvent, DecaySystem, Exhibit, ExhibitMedium, Inset, Interval, Marker, Invitation, Membership, Organisation, OutboxMessage, PasswordReset, Session, User };
export { sequelize } from "../sequelize.ts";
