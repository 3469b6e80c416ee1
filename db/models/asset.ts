import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import type { AcceptedFormat, AssetStatus, ServedFormat } from "../../app/lib/images.ts";
import type { Organisation } from "./organisation.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** One file made from the original: a web size (WebP/JPEG/AVIF) or the print master. */
export interface AssetFile {
  /** The name served under /media/:assetId/ ("960.webp", "print.jpg"). */
  file: string;
  /** The S3 key (content-hashed). */
  key: string;
  format: ServedFormat;
  width: number;
  height: number;
  bytes: number;
  /** SHA-256 of the bytes (hex, first 16): the ETag and part of the key. */
  hash: string;
  /** A web size (listed in `sizes`) or the full-resolution print master. */
  role: "web" | "print";
}

/** An uploaded image: the private original on S3 and what the processing job made from it. */
export class Asset extends Model<InferAttributes<Asset>, InferCreationAttributes<Asset>> {
  declare id: CreationOptional<number>;
  declare organisationId: ForeignKey<Organisation["id"]>;
  declare uploadedById: ForeignKey<User["id"]> | null;
  declare originalKey: string;
  declare originalName: CreationOptional<string>;
  declare format: AcceptedFormat;
  declare bytes: number | string;
  declare width: number;
  declare height: number;
  declare status: CreationOptional<AssetStatus>;
  declare error: CreationOptional<string | null>;
  declare files: CreationOptional<AssetFile[]>;
  declare avifStatus: CreationOptional<"pending" | "ready" | "failed">;
  declare alt: CreationOptional<string>;
  declare credit: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

export function initAsset(sequelize: Sequelize) {
  Asset.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      uploadedById: { type: DataTypes.INTEGER, allowNull: true },
      originalKey: { type: DataTypes.STRING(TEXT_LIMITS.assets.originalKey), allowNull: false },
      originalName: { type: DataTypes.STRING(TEXT_LIMITS.assets.originalName), allowNull: false, defaultValue: "" },
      format: { type: DataTypes.ENUM("jpeg", "png", "webp", "avif", "tiff"), allowNull: false },
      bytes: { type: DataTypes.BIGINT, allowNull: false },
      width: { type: DataTypes.INTEGER, allowNull: false },
      height: { type: DataTypes.INTEGER, allowNull: false },
      status: { type: DataTypes.ENUM("processing", "ready", "failed"), allowNull: false, defaultValue: "processing" },
      error: { type: DataTypes.TEXT, allowNull: true },
      files: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      avifStatus: { type: DataTypes.ENUM("pending", "ready", "failed"), allowNull: false, defaultValue: "pending" },
      alt: { type: DataTypes.STRING(TEXT_LIMITS.assets.alt), allowNull: false, defaultValue: "" },
      credit: { type: DataTypes.STRING(TEXT_LIMITS.assets.credit), allowNull: false, defaultValue: "" },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "assets", underscored: true },
  );
}
