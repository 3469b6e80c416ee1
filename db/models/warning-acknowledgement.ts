import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute } from "sequelize";
import type { Sequelize } from "sequelize";
import type { Exhibit } from "./exhibit.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** A legibility warning accepted with a reason, under the warning's stable key. */
export class WarningAcknowledgement extends Model<InferAttributes<WarningAcknowledgement>, InferCreationAttributes<WarningAcknowledgement>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare warningKey: string;
  declare reason: string;
  declare acknowledgedById: ForeignKey<User["id"]> | null;
  declare revision: number;
  declare acknowledgedBy?: NonAttribute<User>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initWarningAcknowledgement(sequelize: Sequelize) {
  WarningAcknowledgement.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      warningKey: { type: DataTypes.STRING(TEXT_LIMITS.exhibit_warning_acknowledgements.warningKey), allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: false },
      acknowledgedById: { type: DataTypes.INTEGER, allowNull: true },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "exhibit_warning_acknowledgements" },
  );
}
