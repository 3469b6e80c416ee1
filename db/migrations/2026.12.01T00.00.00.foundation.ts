// Organisations, users, memberships, invitations, password resets, sessions, audit events,
// the e-mail outbox and the shared sign-in rate-limit counters.
import { DataTypes } from "sequelize";
import type { Migration } from "../migrator.ts";

const ROLES = ["admin", "designer", "reviewer", "editor"];
const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};

export const up: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.createTable("organisations", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      slug: { type: DataTypes.STRING(100), allowNull: false, unique: true },
      ...timestamps,
    }, { transaction });
    await q.createTable("users", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(200), allowNull: false },
      password_hash: { type: DataTypes.STRING(100), allowNull: false },
      last_sign_in_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });
    await q.createTable("memberships", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
      organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
      role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
      ...timestamps,
    }, { transaction });
    await q.addIndex("memberships", ["user_id", "organisation_id"], { unique: true, transaction });
    await q.createTable("invitations", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisation_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "organisations", key: "id" }, onDelete: "CASCADE" },
      invited_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      email: { type: DataTypes.STRING(254), allowNull: false },
      role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
      token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      accepted_at: { type: DataTypes.DATE, allowNull: true },
      revoked_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });
    await q.addIndex("invitations", ["organisation_id", "email"], { transaction });
    await q.createTable("password_resets", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
      token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      used_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });
    await q.createTable("sessions", {
      id: { type: DataTypes.STRING(64), primaryKey: true },
      user_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "CASCADE" },
      data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      expires_at: { type: DataTypes.DATE, allowNull: false },
      ...timestamps,
    }, { transaction });
    await q.addIndex("sessions", ["user_id"], { transaction });
    await q.addIndex("sessions", ["expires_at"], { transaction });
    await q.createTable("audit_events", {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      organisation_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "organisations", key: "id" }, onDelete: "SET NULL" },
      actor_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      action: { type: DataTypes.STRING(100), allowNull: false },
      object_type: { type: DataTypes.STRING(60), allowNull: false },
      object_id: { type: DataTypes.STRING(100), allowNull: true },
      details: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      created_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction });
    await q.addIndex("audit_events", ["organisation_id", "created_at"], { transaction });
    await q.createTable("outbox_messages", {
      id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
      to: { type: DataTypes.STRING(254), allowNull: false },
      subject: { type: DataTypes.STRING(300), allowNull: false },
      text: { type: DataTypes.TEXT, allowNull: false },
      html: { type: DataTypes.TEXT, allowNull: true },
      status: { type: DataTypes.ENUM("pending", "sent", "failed"), allowNull: false, defaultValue: "pending" },
      attempts: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      last_error: { type: DataTypes.TEXT, allowNull: true },
      sent_at: { type: DataTypes.DATE, allowNull: true },
      ...timestamps,
    }, { transaction });
    await q.addIndex("outbox_messages", ["status", "created_at"], { transaction });
    // The table rate-limiter-flexible's RateLimiterPostgres uses (its own layout).
    await sequelize.query(
      `CREATE TABLE IF NOT EXISTS "rate_limits" (key varchar(255) PRIMARY KEY, points integer NOT NULL DEFAULT 0, expire bigint)`,
      { transaction },
    );
  });
};

export const down: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    for (const table of ["rate_limits", "outbox_messages", "audit_events", "sessions", "password_resets", "invitations", "memberships", "users", "organisations"]) {
      await q.dropTable(table, { transaction });
    }
    for (const type of ["enum_memberships_role", "enum_invitations_role", "enum_outbox_messages_status"]) {
      await sequelize.query(`DROP TYPE IF EXISTS "${type}"`, { transaction });
    }
  });
};
