import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
} from "sequelize";
import type { Sequelize } from "sequelize";
import type { Organisation } from "./organisation.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** Who did what to which object, when. Append-only. */
export class AuditEvent extends Model<InferAttributes<AuditEvent>, InferCreationAttributes<AuditEvent>> {
  declare id: CreationOptional<number>;
  declare organisationId: ForeignKey<Organisation["id"]> | null;
  declare actorId: ForeignKey<User["id"]> | null;
  declare action: string;
  declare objectType: string;
  declare objectId: string | null;
  declare details: Record<string, unknown>;
  declare createdAt: CreationOptional<Date>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initAuditEvent(sequelize: Sequelize) {
  AuditEvent.init(
    {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: true },
      actorId: { type: DataTypes.INTEGER, allowNull: true },
      action: { type: DataTypes.STRING(TEXT_LIMITS.audit_events.action), allowNull: false },
      objectType: { type: DataTypes.STRING(TEXT_LIMITS.audit_events.objectType), allowNull: false },
      objectId: { type: DataTypes.STRING(TEXT_LIMITS.audit_events.objectId), allowNull: true },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "audit_events", updatedAt: false },
  );
}
