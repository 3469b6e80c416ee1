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
import { MARKER_KINDS, type MarkerKind } from "../../app/lib/exhibit/types.ts";
import type { Exhibit } from "./exhibit.ts";
import type { Interval } from "./interval.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/**
 * A marker on an exhibit: the base of an interval of the pinned edition, a dated event from the
 * library, or a custom age with its ± and a required source (a CHECK constraint enforces which).
 */
export class Marker extends Model<InferAttributes<Marker>, InferCreationAttributes<Marker>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare kind: MarkerKind;
  declare intervalId: ForeignKey<Interval["id"]> | null;
  declare datedEventId: number | null;
  declare ageMa: string | number | null;
  declare uncertaintyMa: string | number | null;
  declare source: string | null;
  declare label: string;
  /** Short Markdown text; sanitised when shown. */
  declare text: CreationOptional<string>;
  declare decaySystemId: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare interval?: NonAttribute<Interval | null>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initMarker(sequelize: Sequelize) {
  Marker.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.ENUM(...MARKER_KINDS), allowNull: false },
      intervalId: { type: DataTypes.INTEGER, allowNull: true },
      datedEventId: { type: DataTypes.INTEGER, allowNull: true },
      ageMa: { type: DataTypes.DECIMAL, allowNull: true },
      uncertaintyMa: { type: DataTypes.DECIMAL, allowNull: true },
      source: { type: DataTypes.TEXT, allowNull: true },
      label: { type: DataTypes.STRING(TEXT_LIMITS.markers.label), allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      decaySystemId: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "markers" },
  );
}
