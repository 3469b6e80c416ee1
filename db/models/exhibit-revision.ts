import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from "sequelize";
import type { RevisionContent } from "../../app/lib/review/types.ts";
import type { Exhibit } from "./exhibit.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** One revision of an exhibit: who made it, with which change, and a copy of the whole exhibit as it then was. */
export class ExhibitRevision extends Model<InferAttributes<ExhibitRevision>, InferCreationAttributes<ExhibitRevision>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  declare revision: number;
  declare authorId: ForeignKey<User["id"]> | null;
  /** The audited change ("markers.add-event", "settings", "create", …). */
  declare action: string;
  declare content: RevisionContent;
  declare createdAt: CreationOptional<Date>;
  declare author?: NonAttribute<User | null>;
}

export function initExhibitRevision(sequelize: Sequelize) {
  ExhibitRevision.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      authorId: { type: DataTypes.INTEGER, allowNull: true },
      action: { type: DataTypes.STRING(TEXT_LIMITS.exhibit_revisions.action), allowNull: false },
      content: { type: DataTypes.JSONB, allowNull: false },
      createdAt: DataTypes.DATE,
    },
    { sequelize, tableName: "exhibit_revisions", updatedAt: false },
  );
}
