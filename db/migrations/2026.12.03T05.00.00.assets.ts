// Images on S3: one row per uploaded original (assets) and one per use of an image on a marker or
// as an exhibit's cover (image_uses; the alt text and credit belong to the use). An asset row is
// written only after S3 accepted the original; its id is taken from the sequence first, so the
// object key (assets/<id>/…) names it and the sweep can tell orphans from live objects.
import { DataTypes } from "sequelize";
import type { Migration } from "../migrator.ts";

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

export const up: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.createTable("assets", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
      uploaded_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      original_key: { type: DataTypes.STRING(300), allowNull: false, unique: true },
      original_name: { type: DataTypes.STRING(255), allowNull: false, defaultValue: "" },
      format: { type: DataTypes.ENUM("jpeg", "png", "webp", "avif", "tiff"), allowNull: false },
      bytes: { type: DataTypes.BIGINT, allowNull: false },
      width: { type: DataTypes.INTEGER, allowNull: false },
      height: { type: DataTypes.INTEGER, allowNull: false },
      status: { type: DataTypes.ENUM("processing", "ready", "failed"), allowNull: false, defaultValue: "processing" },
      error: { type: DataTypes.TEXT, allowNull: true },
      files: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      avif_status: { type: DataTypes.ENUM("pending", "ready", "failed"), allowNull: false, defaultValue: "pending" },
      alt: { type: DataTypes.STRING(250), allowNull: false, defaultValue: "" },
      credit: { type: DataTypes.STRING(300), allowNull: false, defaultValue: "" },
      ...timestamps,
    }, { transaction });
    await q.addIndex("assets", ["organisation_id"], { transaction });
    await q.createTable("image_uses", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "exhibits", key: "id" }, onDelete: "CASCADE" },
      marker_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "markers", key: "id" }, onDelete: "CASCADE" },
      asset_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "assets", key: "id" }, onDelete: "RESTRICT" },
      alt: { type: DataTypes.STRING(250), allowNull: false, defaultValue: "" },
      credit: { type: DataTypes.STRING(300), allowNull: false, defaultValue: "" },
      ...timestamps,
    }, { transaction });
    // One image per marker; one cover (marker_id NULL) per exhibit.
    await sequelize.query(`CREATE UNIQUE INDEX image_uses_marker ON image_uses (marker_id) WHERE marker_id IS NOT NULL`, { transaction });
    await sequelize.query(`CREATE UNIQUE INDEX image_uses_cover ON image_uses (exhibit_id) WHERE marker_id IS NULL`, { transaction });
    await q.addIndex("image_uses", ["asset_id"], { transaction });
  });
};

export const down: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.dropTable("image_uses", { transaction });
    await q.dropTable("assets", { transaction });
    for (const type of ["enum_assets_format", "enum_assets_status", "enum_assets_avif_status"]) {
      await sequelize.query(`DROP TYPE IF EXISTS "${type}"`, { transaction });
    }
  });
};
