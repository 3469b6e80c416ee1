import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute } from "sequelize";
import type { Sequelize } from "sequelize";
import type { Asset } from "./asset.ts";
import type { Exhibit } from "./exhibit.ts";
import type { Marker } from "./marker.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** An image used on a marker (or, with no marker, as the exhibit's cover), with this use's alt text and credit. */
export class ImageUse extends Model<InferAttributes<ImageUse>, InferCreationAttributes<ImageUse>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare markerId: ForeignKey<Marker["id"]> | null;
  declare assetId: ForeignKey<Asset["id"]>;
  declare alt: string;
  declare credit: string;
  declare asset?: NonAttribute<Asset>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initImageUse(sequelize: Sequelize) {
  ImageUse.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      markerId: { type: DataTypes.INTEGER, allowNull: true },
      assetId: { type: DataTypes.INTEGER, allowNull: false },
      alt: { type: DataTypes.STRING(TEXT_LIMITS.image_uses.alt), allowNull: false, defaultValue: "" },
      credit: { type: DataTypes.STRING(TEXT_LIMITS.image_uses.credit), allowNull: false, defaultValue: "" },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "image_uses", underscored: true },
  );
}
