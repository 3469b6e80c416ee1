import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

export class Organisation extends Model<InferAttributes<Organisation>, InferCreationAttributes<Organisation>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare slug: string;
  /** The chart edition the organisation works against (null: it follows the latest shared edition). */
  declare currentEditionId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initOrganisation(sequelize: Sequelize) {
  Organisation.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(TEXT_LIMITS.organisations.name), allowNull: false },
      slug: { type: DataTypes.STRING(TEXT_LIMITS.organisations.slug), allowNull: false, unique: true },
      currentEditionId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "organisations" },
  );
}
