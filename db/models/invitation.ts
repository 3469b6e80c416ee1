import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
} from "sequelize";
import type { Sequelize } from "sequelize";
import { ROLES, type Role } from "../../app/lib/roles.ts";
import type { Organisation } from "./organisation.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** An admin's invitation of an e-mail address to an organisation with a role. Only the token's hash is kept. */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<number>;
  declare organisationId: ForeignKey<Organisation["id"]>;
  declare invitedById: ForeignKey<User["id"]> | null;
  declare email: string;
  declare roles: Role[];
  declare tokenHash: string;
  declare expiresAt: Date;
  declare acceptedAt: Date | null;
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare organisation?: NonAttribute<Organisation>;
  declare invitedBy?: NonAttribute<User>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initInvitation(sequelize: Sequelize) {
  Invitation.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      invitedById: { type: DataTypes.INTEGER, allowNull: true },
      email: { type: DataTypes.STRING(TEXT_LIMITS.invitations.email), allowNull: false },
      roles: { type: DataTypes.ARRAY(DataTypes.ENUM(...ROLES)), allowNull: false },
      tokenHash: { type: DataTypes.STRING(TEXT_LIMITS.invitations.tokenHash), allowNull: false, unique: true },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      acceptedAt: { type: DataTypes.DATE, allowNull: true },
      revokedAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "invitations" },
  );
}
