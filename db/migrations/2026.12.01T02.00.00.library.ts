// The dated-event library and the decay systems. Ages, half-lives and decay constants are NUMERIC
// without precision or scale, so the stored value is exactly the decimal entered ("4567.30",
// "0.000099", "1.55125e-10") and reads back unchanged. A dated event with organisation_id NULL is a
// shared library entry (seeded reference data); otherwise it belongs to that organisation. Slugs are
// unique among the shared entries and within each organisation (two partial unique indexes).
import { DataTypes } from "sequelize";
import type { Migration } from "../migrator.ts";

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

const VERIFICATIONS = ["checked against the source", "seen quoted by a secondary source", "from memory"];

export const up: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.createTable("dated_events", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisation_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
      slug: { type: DataTypes.STRING(80), allowNull: false },
      name: { type: DataTypes.STRING(160), allowNull: false },
      summary: { type: DataTypes.TEXT, allowNull: false },
      age_ma: { type: DataTypes.DECIMAL, allowNull: false },
      uncertainty_ma: { type: DataTypes.DECIMAL, allowNull: true },
      age_kind: { type: DataTypes.ENUM("point", "approximate", "onset", "minimum"), allowNull: false, defaultValue: "point" },
      citation: { type: DataTypes.TEXT, allowNull: false },
      doi: { type: DataTypes.STRING(200), allowNull: true },
      url: { type: DataTypes.STRING(500), allowNull: true },
      dating_method: { type: DataTypes.STRING(200), allowNull: true },
      verification: { type: DataTypes.STRING(60), allowNull: false, defaultValue: "from memory" },
      created_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      updated_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      ...timestamps,
    }, { transaction });
    for (const sql of [
      `CREATE UNIQUE INDEX dated_events_shared_slug ON dated_events (slug) WHERE organisation_id IS NULL`,
      `CREATE UNIQUE INDEX dated_events_organisation_slug ON dated_events (organisation_id, slug) WHERE organisation_id IS NOT NULL`,
      `CREATE INDEX dated_events_organisation_age ON dated_events (organisation_id, age_ma DESC)`,
      `ALTER TABLE dated_events ADD CONSTRAINT dated_events_slug_format CHECK (slug ~ '^[a-z0-9]+(-[a-z0-9]+)*$')`,
      `ALTER TABLE dated_events ADD CONSTRAINT dated_events_age_not_negative CHECK (age_ma >= 0)`,
      `ALTER TABLE dated_events ADD CONSTRAINT dated_events_uncertainty_not_negative CHECK (uncertainty_ma IS NULL OR uncertainty_ma >= 0)`,
      `ALTER TABLE dated_events ADD CONSTRAINT dated_events_citation_present CHECK (length(btrim(citation)) > 0)`,
      `ALTER TABLE dated_events ADD CONSTRAINT dated_events_verification CHECK (verification IN (${VERIFICATIONS.map((v) => `'${v}'`).join(", ")}))`,
    ]) {
      await sequelize.query(sql, { transaction });
    }

    await q.createTable("decay_systems", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      slug: { type: DataTypes.STRING(40), allowNull: false, unique: true },
      parent: { type: DataTypes.STRING(20), allowNull: false },
      daughter: { type: DataTypes.STRING(20), allowNull: false },
      decay_mode: { type: DataTypes.STRING(200), allowNull: false },
      half_life_years: { type: DataTypes.DECIMAL, allowNull: false },
      half_life_uncertainty_years: { type: DataTypes.DECIMAL, allowNull: true },
      decay_constant_per_year: { type: DataTypes.DECIMAL, allowNull: false },
      decay_constant_stated: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      branch_constant_per_year: { type: DataTypes.DECIMAL, allowNull: true },
      citation: { type: DataTypes.TEXT, allowNull: false },
      doi: { type: DataTypes.STRING(200), allowNull: true },
      verification: { type: DataTypes.STRING(60), allowNull: false, defaultValue: "from memory" },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      ...timestamps,
    }, { transaction });
    for (const sql of [
      `ALTER TABLE decay_systems ADD CONSTRAINT decay_systems_half_life_positive CHECK (half_life_years > 0)`,
      `ALTER TABLE decay_systems ADD CONSTRAINT decay_systems_constant_positive CHECK (decay_constant_per_year > 0)`,
      `ALTER TABLE decay_systems ADD CONSTRAINT decay_systems_branch_within_total CHECK (branch_constant_per_year IS NULL OR (branch_constant_per_year > 0 AND branch_constant_per_year <= decay_constant_per_year))`,
      `ALTER TABLE decay_systems ADD CONSTRAINT decay_systems_citation_present CHECK (length(btrim(citation)) > 0)`,
      `ALTER TABLE decay_systems ADD CONSTRAINT decay_systems_verification CHECK (verification IN (${VERIFICATIONS.map((v) => `'${v}'`).join(", ")}))`,
    ]) {
      await sequelize.query(sql, { transaction });
    }
  });
};

export const down: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.dropTable("decay_systems", { transaction });
    await q.dropTable("dated_events", { transaction });
    await sequelize.query(`DROP TYPE IF EXISTS "enum_dated_events_age_kind"`, { transaction });
  });
};
