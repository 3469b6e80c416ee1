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

export class Membership extends Model<InferAttributes<Membership>, InferCreationAttributes<Membership>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User["id"]>;
  declare organisationId: ForeignKey<Organisation["id"]>;
  /** The roles held in the organisation: a set, never empty, in the order of ROLES. */
  declare roles: Role[];
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare user?: NonAttribute<User>;
  declare organisation?: NonAttribute<Organisation>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initMembership(sequelize: Sequelize) {
  Membership.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: false },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      roles: { type: DataTypes.ARRAY(DataTypes.ENUM(...ROLES)), allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "memberships" },
  );
}
