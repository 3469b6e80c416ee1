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
import { BOUNDARY_KINDS, RANKS, type BoundaryKind, type Rank } from "../../app/lib/timescale/types.ts";
import type { ChartEdition } from "./chart-edition.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/**
 * One interval (eon … age) of a chart edition. Ages are NUMERIC without a scale, so Postgres keeps
 * exactly the decimal the chart gives (251.902, 0.0117); pg hands them back as strings, which
 * `Number()` turns into the same double the import read. Use server/editions.server.ts `toInterval()`.
 */
export class Interval extends Model<InferAttributes<Interval>, InferCreationAttributes<Interval>> {
  declare id: CreationOptional<number>;
  declare editionId: ForeignKey<ChartEdition["id"]>;
  declare name: string;
  declare rank: Rank;
  declare parentId: ForeignKey<Interval["id"]> | null;
  /** NUMERIC, as a decimal string when read. */
  declare baseMa: string | number;
  declare baseUncertaintyMa: string | number | null;
  declare topMa: string | number;
  declare color: string;
  /** true / false; null = the source does not say. */
  declare gssp: boolean | null;
  /** "GSSP" / "GSSA" where the base is ratified and the source says which; null otherwise. */
  declare boundaryKind: CreationOptional<BoundaryKind | null>;
  declare approximate: boolean;
  declare names: CreationOptional<Record<string, string>>;
  declare chartOrder: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare edition?: NonAttribute<ChartEdition>;
  declare parent?: NonAttribute<Interval | null>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initInterval(sequelize: Sequelize) {
  Interval.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      editionId: { type: DataTypes.INTEGER, allowNull: false },
      name: { type: DataTypes.STRING(TEXT_LIMITS.intervals.name), allowNull: false },
      rank: { type: DataTypes.ENUM(...RANKS), allowNull: false },
      parentId: { type: DataTypes.INTEGER, allowNull: true },
      baseMa: { type: DataTypes.DECIMAL, allowNull: false },
      baseUncertaintyMa: { type: DataTypes.DECIMAL, allowNull: true },
      topMa: { type: DataTypes.DECIMAL, allowNull: false },
      color: { type: DataTypes.STRING(TEXT_LIMITS.intervals.color), allowNull: false },
      gssp: { type: DataTypes.BOOLEAN, allowNull: true },
      boundaryKind: { type: DataTypes.STRING(TEXT_LIMITS.intervals.boundaryKind), allowNull: true, defaultValue: null, validate: { isIn: [[...BOUNDARY_KINDS]] } },
      approximate: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      names: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      chartOrder: { type: DataTypes.INTEGER, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "intervals" },
  );
}
