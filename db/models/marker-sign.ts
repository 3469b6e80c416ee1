import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { Exhibit } from "./exhibit.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/**
 * A sign number of an exhibit, given to a marker at its first publication and kept for ever (it is
 * printed on the sign and in its QR code). When the marker goes, the number is retired, never
 * reused: it points to the sign that absorbed the marker, or says the sign was removed. A trigger
 * refuses deleting a sign or changing its number or marker.
 */
export class MarkerSign extends Model<InferAttributes<MarkerSign>, InferCreationAttributes<MarkerSign>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare number: number;
  declare markerId: number;
  declare label: string;
  declare firstPublication: number;
  declare retiredAtPublication: number | null;
  declare absorbedByNumber: number | null;
  declare createdAt: CreationOptional<Date>;
}

export function initMarkerSign(sequelize: Sequelize) {
  MarkerSign.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      markerId: { type: DataTypes.INTEGER, allowNull: false },
      label: { type: DataTypes.STRING(TEXT_LIMITS.marker_signs.label), allowNull: false },
      firstPublication: { type: DataTypes.INTEGER, allowNull: false },
      retiredAtPublication: { type: DataTypes.INTEGER, allowNull: true },
      absorbedByNumber: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "marker_signs", updatedAt: false },
  );
}
