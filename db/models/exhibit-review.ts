import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { CheckReport } from "../../app/lib/review/types.ts";
import type { Exhibit } from "./exhibit.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** A reviewer's decision on one revision, with the automatic check results it was made against. */
export class ExhibitReview extends Model<InferAttributes<ExhibitReview>, InferCreationAttributes<ExhibitReview>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare revision: number;
  declare reviewerId: ForeignKey<User["id"]> | null;
  declare decision: "approved" | "changes_requested";
  declare comment: CreationOptional<string>;
  declare checks: CheckReport;
  declare createdAt: CreationOptional<Date>;
  declare reviewer?: NonAttribute<User | null>;
}

export function initExhibitReview(sequelize: Sequelize) {
  ExhibitReview.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      reviewerId: { type: DataTypes.INTEGER, allowNull: true },
      decision: { type: DataTypes.STRING(TEXT_LIMITS.exhibit_reviews.decision), allowNull: false },
      comment: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      checks: { type: DataTypes.JSONB, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "exhibit_reviews", updatedAt: false },
  );
}
