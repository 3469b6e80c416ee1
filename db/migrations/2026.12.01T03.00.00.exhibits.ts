// Exhibits and what they are made of: the medium (a straight length or a route), markers and insets.
import { DataTypes } from "sequelize";
import type { Migration } from "../migrator.ts";

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};
const MEDIUM_TYPES = ["trail", "wall", "rope", "banner", "other"];
const AGE_UNITS = ["a", "ka", "Ma", "Ga"];
const LENGTH_UNITS = ["mm", "cm", "m", "km", "in", "ft", "yd", "mi"];

export const up: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.createTable("exhibits", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
      title: { type: DataTypes.STRING(200), allowNull: false },
      slug: { type: DataTypes.STRING(100), allowNull: false },
      edition_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "chart_editions", key: "id" }, onDelete: "RESTRICT" },
      span_older_value: { type: DataTypes.DECIMAL, allowNull: false },
      span_older_unit: { type: DataTypes.ENUM(...AGE_UNITS), allowNull: false },
      span_younger_value: { type: DataTypes.DECIMAL, allowNull: false },
      span_younger_unit: { type: DataTypes.ENUM(...AGE_UNITS), allowNull: false },
      units_preference: { type: DataTypes.ENUM("metric", "us"), allowNull: false, defaultValue: "metric" },
      legibility: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      status: { type: DataTypes.ENUM("draft"), allowNull: false, defaultValue: "draft" },
      revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      created_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      updated_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      ...timestamps,
    }, { transaction });
    await q.addIndex("exhibits", ["organisation_id", "slug"], { unique: true, transaction });
    await q.createTable("exhibit_media", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: { type: DataTypes.INTEGER, allowNull: false, unique: true, references: { model: "exhibits", key: "id" }, onDelete: "CASCADE" },
      kind: { type: DataTypes.ENUM("length", "route"), allowNull: false },
      medium_type: { type: DataTypes.ENUM(...MEDIUM_TYPES), allowNull: false },
      length_value: { type: DataTypes.DECIMAL, allowNull: true },
      length_unit: { type: DataTypes.ENUM(...LENGTH_UNITS), allowNull: true },
      panel_width_value: { type: DataTypes.DECIMAL, allowNull: true },
      panel_width_unit: { type: DataTypes.ENUM(...LENGTH_UNITS), allowNull: true },
      geometry: { type: DataTypes.JSONB, allowNull: true },
      route_length_m: { type: DataTypes.DOUBLE, allowNull: true },
      route_vertex_count: { type: DataTypes.INTEGER, allowNull: true },
      source_name: { type: DataTypes.STRING(300), allowNull: true },
      ...timestamps,
    }, { transaction });
    await q.createTable("markers", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "exhibits", key: "id" }, onDelete: "CASCADE" },
      kind: { type: DataTypes.ENUM("boundary", "event", "custom"), allowNull: false },
      interval_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "intervals", key: "id" }, onDelete: "RESTRICT" },
      dated_event_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "dated_events", key: "id" }, onDelete: "RESTRICT" },
      age_ma: { type: DataTypes.DECIMAL, allowNull: true },
      uncertainty_ma: { type: DataTypes.DECIMAL, allowNull: true },
      source: { type: DataTypes.TEXT, allowNull: true },
      label: { type: DataTypes.STRING(200), allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      decay_system_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "decay_systems", key: "id" }, onDelete: "SET NULL" },
      ...timestamps,
    }, { transaction });
    await q.addIndex("markers", ["exhibit_id"], { transaction });
    await sequelize.query(
      `ALTER TABLE markers ADD CONSTRAINT markers_kind_reference CHECK (
         (kind = 'boundary' AND interval_id IS NOT NULL AND dated_event_id IS NULL AND age_ma IS NULL) OR
         (kind = 'event' AND dated_event_id IS NOT NULL AND interval_id IS NULL AND age_ma IS NULL) OR
         (kind = 'custom' AND age_ma IS NOT NULL AND source IS NOT NULL AND length(trim(source)) > 0 AND interval_id IS NULL AND dated_event_id IS NULL))`,
      { transaction },
    );
    await q.createTable("insets", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "exhibits", key: "id" }, onDelete: "CASCADE" },
      older_ma: { type: DataTypes.DECIMAL, allowNull: false },
      younger_ma: { type: DataTypes.DECIMAL, allowNull: false },
      magnification: { type: DataTypes.DOUBLE, allowNull: false },
      label: { type: DataTypes.STRING(200), allowNull: false },
      ...timestamps,
    }, { transaction });
    await sequelize.query(`ALTER TABLE insets ADD CONSTRAINT insets_span CHECK (older_ma > younger_ma AND younger_ma >= 0 AND magnification > 1)`, { transaction });
  });
};

export const down: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    for (const table of ["insets", "markers", "exhibit_media", "exhibits"]) await q.dropTable(table, { transaction });
    for (const type of [
      "enum_exhibits_span_older_unit", "enum_exhibits_span_younger_unit", "enum_exhibits_units_preference", "enum_exhibits_status",
      "enum_exhibit_media_kind", "enum_exhibit_media_medium_type", "enum_exhibit_media_length_unit", "enum_exhibit_media_panel_width_unit",
      "enum_markers_kind",
    ]) {
      await sequelize.query(`DROP TYPE IF EXISTS "${type}"`, { transaction });
    }
  });
};
