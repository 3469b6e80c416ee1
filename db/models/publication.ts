import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";
import type { PublicationMeta, PublicationSnapshot } from "../../app/lib/publication/types.ts";
import type { ChartEdition } from "./chart-edition.ts";
import type { Exhibit } from "./exhibit.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/**
 * An immutable publication of an approved revision: what visitors, signs and exports read. The
 * database refuses UPDATE, DELETE and TRUNCATE on this table (trigger publications_immutable).
 */
export class Publication extends Model<InferAttributes<Publication>, InferCreationAttributes<Publication>> {
  declare id: CreationOptional<number>;
  declare exhibitId: ForeignKey<Exhibit["id"]>;
  /** 1, 2, … per exhibit. */
  declare number: number;
  declare revision: number;
  declare editionId: ForeignKey<ChartEdition["id"]>;
  declare approvedById: ForeignKey<User["id"]> | null;
  declare publishedById: ForeignKey<User["id"]> | null;
  declare approvedAt: Date;
  declare publishedAt: Date;
  declare meta: PublicationMeta;
  declare snapshot: PublicationSnapshot;
  /** RFC 8785 canonical JSON of the snapshot (what the hash is taken over). */
  declare snapshotCanonical: string;
  /** SHA-256 of snapshotCanonical, hex. */
  declare sha256: string;
}

export function initPublication(sequelize: Sequelize) {
  Publication.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      exhibitId: { type: DataTypes.INTEGER, allowNull: false },
      number: { type: DataTypes.INTEGER, allowNull: false },
      revision: { type: DataTypes.INTEGER, allowNull: false },
      editionId: { type: DataTypes.INTEGER, allowNull: false },
      approvedById: { type: DataTypes.INTEGER, allowNull: true },
      publishedById: { type: DataTypes.INTEGER, allowNull: true },
      approvedAt: { type: DataTypes.DATE, allowNull: false },
      publishedAt: { type: DataTypes.DATE, allowNull: false },
      meta: { type: DataTypes.JSONB, allowNull: false },
      snapshot: { type: DataTypes.JSONB, allowNull: false },
      snapshotCanonical: { type: DataTypes.TEXT, allowNull: false },
      sha256: { type: DataTypes.STRING(TEXT_LIMITS.publications.sha256), allowNull: false },
    },
    { sequelize, tableName: "publications", timestamps: false },
  );
}
