import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import type { Exhibit } from "./exhibit.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** A sub-span of an exhibit shown at a magnified scale, with its own scale statement. */
export class Inset extends Model<InferAttributes<Inset>, InferCreationAttributes<Inset>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare olderMa: string | number;
  declare youngerMa: string | number;
  declare magnification: number;
  declare label: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initInset(sequelize: Sequelize) {
  Inset.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      olderMa: { type: DataTypes.DECIMAL, allowNull: false },
      youngerMa: { type: DataTypes.DECIMAL, allowNull: false },
      magnification: { type: DataTypes.DOUBLE, allowNull: false },
      label: { type: DataTypes.STRING(TEXT_LIMITS.insets.label), allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "insets" },
  );
}
