import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { Exhibit } from "./exhibit.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** A review comment on an exhibit or one of its markers; replies point to their parent. Kept across revisions; the designer resolves it. */
export class ExhibitComment extends Model<InferAttributes<ExhibitComment>, InferCreationAttributes<ExhibitComment>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare markerId: number | null;
  /** The marker's label when the comment was written (the marker may be removed later). */
  declare markerLabel: string | null;
  declare parentId: number | null;
  declare authorId: ForeignKey<User["id"]> | null;
  declare body: string;
  /** The exhibit's revision when the comment was written. */
  declare revision: number;
  declare resolvedAt: CreationOptional<Date | null>;
  declare resolvedById: ForeignKey<User["id"]> | null;
  declare createdAt: CreationOptional<Date>;
  declare author?: NonAttribute<User | null>;
  declare resolvedBy?: NonAttribute<User | null>;
}

export function initExhibitComment(sequelize: Sequelize) {
  ExhibitComment.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      markerId: { type: DataTypes.INTEGER, allowNull: true },
      markerLabel: { type: DataTypes.STRING(TEXT_LIMITS.exhibit_comments.markerLabel), allowNull: true },
      parentId: { type: DataTypes.INTEGER, allowNull: true },
      authorId: { type: DataTypes.INTEGER, allowNull: true },
      body: { type: DataTypes.TEXT, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      resolvedAt: { type: DataTypes.DATE, allowNull: true },
      resolvedById: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "exhibit_comments", updatedAt: false },
  );
}
