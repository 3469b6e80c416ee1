import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import type { LineStringGeometry } from "../../app/lib/exhibit/types.ts";
import { MEDIUM_TYPES, type MediumType } from "../../app/lib/scale/legibility.ts";
import { LENGTH_UNITS, type LengthUnit } from "../../app/lib/units/index.ts";
import type { Exhibit } from "./exhibit.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** What an exhibit is laid out on: a straight length (wall, rope, banner) or a route (GeoJSON in JSONB). */
export class ExhibitMedium extends Model<InferAttributes<ExhibitMedium>, InferCreationAttributes<ExhibitMedium>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare kind: "length" | "route";
  declare mediumType: MediumType;
  declare lengthValue: string | number | null;
  declare lengthUnit: LengthUnit | null;
  declare panelWidthValue: string | number | null;
  declare panelWidthUnit: LengthUnit | null;
  declare geometry: LineStringGeometry | null;
  /** Length on the WGS84 ellipsoid, computed by the scale engine when the route is saved. */
  declare routeLengthM: number | null;
  declare routeVertexCount: number | null;
  declare sourceName: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initExhibitMedium(sequelize: Sequelize) {
  ExhibitMedium.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      kind: { type: DataTypes.ENUM("length", "route"), allowNull: false },
      mediumType: { type: DataTypes.ENUM(...MEDIUM_TYPES), allowNull: false },
      lengthValue: { type: DataTypes.DECIMAL, allowNull: true },
      lengthUnit: { type: DataTypes.ENUM(...LENGTH_UNITS), allowNull: true },
      panelWidthValue: { type: DataTypes.DECIMAL, allowNull: true },
      panelWidthUnit: { type: DataTypes.ENUM(...LENGTH_UNITS), allowNull: true },
      geometry: { type: DataTypes.JSONB, allowNull: true },
      routeLengthM: { type: DataTypes.DOUBLE, allowNull: true },
      routeVertexCount: { type: DataTypes.INTEGER, allowNull: true },
      sourceName: { type: DataTypes.STRING(TEXT_LIMITS.exhibit_media.sourceName), allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "exhibit_media" },
  );
}
