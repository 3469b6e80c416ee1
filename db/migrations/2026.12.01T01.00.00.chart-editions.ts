// Chart editions and their intervals. Ages are NUMERIC without precision or scale, so the stored
// value is exactly the decimal the chart prints (251.902, 0.0117, 4567) and reads back unchanged.
// Only one edition can be current (partial unique index). A parent is always in the same edition
// (composite foreign key).
import { DataTypes } from "sequelize";
import type { Migration } from "../migrator.ts";

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

export const up: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.createTable("chart_editions", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      slug: { type: DataTypes.STRING(60), allowNull: false, unique: true },
      label: { type: DataTypes.STRING(100), allowNull: false },
      status: { type: DataTypes.ENUM("draft", "current", "retired"), allowNull: false, defaultValue: "draft" },
      source: { type: DataTypes.TEXT, allowNull: false },
      licence: { type: DataTypes.TEXT, allowNull: false },
      source_file: { type: DataTypes.STRING(300), allowNull: true },
      corrections: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      created_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      made_current_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      made_current_at: { type: DataTypes.DATE, allowNull: true },
      retired_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });
    await sequelize.query(
      `CREATE UNIQUE INDEX chart_editions_one_current ON chart_editions (status) WHERE status = 'current'`,
      { transaction },
    );
    await sequelize.query(
      `ALTER TABLE chart_editions ADD CONSTRAINT chart_editions_slug_format CHECK (slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$')`,
      { transaction },
    );

    await q.createTable("intervals", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      edition_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "chart_editions", key: "id" }, onDelete: "CASCADE" },
      name: { type: DataTypes.STRING(120), allowNull: false },
      rank: { type: DataTypes.ENUM("eon", "era", "period", "subperiod", "epoch", "age"), allowNull: false },
      parent_id: { type: DataTypes.INTEGER, allowNull: true },
      base_ma: { type: DataTypes.DECIMAL, allowNull: false },
      base_uncertainty_ma: { type: DataTypes.DECIMAL, allowNull: true },
      top_ma: { type: DataTypes.DECIMAL, allowNull: false },
      color: { type: DataTypes.STRING(7), allowNull: false },
      gssp: { type: DataTypes.BOOLEAN, allowNull: true },
      approximate: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      names: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      chart_order: { type: DataTypes.INTEGER, allowNull: false },
      ...timestamps,
    }, { transaction });
    for (const sql of [
      `ALTER TABLE intervals ADD CONSTRAINT intervals_edition_name UNIQUE (edition_id, name)`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_edition_order UNIQUE (edition_id, chart_order) DEFERRABLE INITIALLY IMMEDIATE`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_edition_id_id UNIQUE (edition_id, id)`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_parent_same_edition FOREIGN KEY (edition_id, parent_id) REFERENCES intervals (edition_id, id) ON DELETE CASCADE`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_base_older CHECK (base_ma > top_ma)`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_top_not_negative CHECK (top_ma >= 0)`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_uncertainty_not_negative CHECK (base_uncertainty_ma IS NULL OR base_uncertainty_ma >= 0)`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_color_hex CHECK (color ~ '^#[0-9A-Fa-f]{6}$')`,
      `ALTER TABLE intervals ADD CONSTRAINT intervals_order_positive CHECK (chart_order >= 1)`,
      `CREATE INDEX intervals_parent ON intervals (parent_id)`,
    ]) {
      await sequelize.query(sql, { transaction });
    }
  });
};

export const down: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.dropTable("intervals", { transaction });
    await q.dropTable("chart_editions", { transaction });
    for (const type of ["enum_intervals_rank", "enum_chart_editions_status"]) {
      await sequelize.query(`DROP TYPE IF EXISTS "${type}"`, { transaction });
    }
  });
};
