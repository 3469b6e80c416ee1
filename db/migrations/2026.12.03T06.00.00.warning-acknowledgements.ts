// Acknowledged legibility warnings: a designer accepts a warning with a written reason, stored under
// the warning's stable key (code and ids, e.g. "markers-same-age:137,140"). One row per exhibit and
// key (acknowledging again replaces the reason); the revision it was saved as, who and when. A row
// whose warning no longer exists is kept but ignored (app/lib/exhibit/acknowledgements.ts).
import { DataTypes } from "sequelize";
import type { Migration } from "../migrator.ts";

export const up: Migration = async ({ queryInterface: q, sequelize }) => {
  await sequelize.transaction(async (transaction) => {
    await q.createTable("exhibit_warning_acknowledgements", {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibit_id: { type: DataTypes.INTEGER, allowNull: false, references: { model: "exhibits", key: "id" }, onDelete: "CASCADE" },
      warning_key: { type: DataTypes.STRING(5000), allowNull: false },
      reason: { type: DataTypes.TEXT, allowNull: false },
      acknowledged_by_id: { type: DataTypes.INTEGER, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      created_at: { type: DataTypes.DATE, allowNull: false },
      updated_at: { type: DataTypes.DATE, allowNull: false },
    }, { transaction });
    await q.addIndex("exhibit_warning_acknowledgements", ["exhibit_id", "warning_key"], { unique: true, name: "exhibit_warning_acknowledgements_key", transaction });
  });
};

export const down: Migration = async ({ queryInterface: q }) => {
  await q.dropTable("exhibit_warning_acknowledgements");
};
