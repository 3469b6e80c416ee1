// Fabrication: an exhibit's sign settings (the text's mounting height and the viewing distance the
// sign sheets size their text for; absent row = the defaults) and export jobs (large files made in
// the background: progress 0–1, the finished file's S3 key).
import { DataTypes } from "sequelize";
import type { Migration } from "../migrator.ts";

export const up: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.createTable("exhibit_sign_settings", {
      exhibit_id: { type: DataTypes.INTEGER, primaryKey: true, references: { model: "exhibits", key: "id" }, onDelete: "CASCADE" },
      mounting_height_mm: { type: DataTypes.DOUBLE, allowNull: false },
      viewing_distance_mm: { type: DataTypes.DOUBLE, allowNull: false },
      updated_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction });
    await sequelize.query(
      `ALTER TABLE exhibit_sign_settings
         ADD CONSTRAINT exhibit_sign_settings_mounting CHECK (mounting_height_mm BETWEEN 300 AND 6000),
         ADD CONSTRAINT exhibit_sign_settings_distance CHECK (viewing_distance_mm BETWEEN 200 AND 30000)`,
      { transaction },
    );
    await q.createTable("export_jobs", {
      id: { type: DataTypes.UUID, primaryKey: true },
      organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
      exhibit_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "exhibits", key: "id" }, onDelete: "CASCADE" },
      file: { type: DataTypes.STRING(40), allowNull: false },
      query: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      /** What the file is made from, as it was when asked for: { snapshot, draft, publication, fileStem }. */
      source: { type: DataTypes.JSONB, allowNull: false },
      status: { type: DataTypes.ENUM("queued", "running", "done", "failed"), allowNull: false, defaultValue: "queued" },
      progress: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
      s3_key: { type: DataTypes.STRING(300), allowNull: true },
      bytes: { type: DataTypes.BIGINT, allowNull: true },
      file_name: { type: DataTypes.STRING(300), allowNull: false },
      error: { type: DataTypes.TEXT, allowNull: true },
      created_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction });
    await q.addIndex("export_jobs", ["exhibit_id", "created_at"], { transaction });
  });
};

export const down: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.dropTable("export_jobs", { transaction });
    await sequelize.query(`DROP TYPE IF EXISTS "enum_export_jobs_status"`, { transaction });
    await q.dropTable("exhibit_sign_settings", { transaction });
  });
};
