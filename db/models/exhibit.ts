import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
} from "sequelize";
import type { Sequelize } from "sequelize";
import type { LegibilitySettings, UnitsPreference } from "../../app/lib/exhibit/types.ts";
import { AGE_UNITS, type AgeUnit } from "../../app/lib/units/index.ts";
import type { ExhibitStatus } from "../../app/lib/review/lifecycle.ts";
import type { ChartEdition } from "./chart-edition.ts";
import type { ExhibitMedium } from "./exhibit-medium.ts";
import type { Inset } from "./inset.ts";
import type { Marker } from "./marker.ts";
import type { Organisation } from "./organisation.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** A time-as-distance exhibit of one organisation, pinned to one chart edition. */
export class Exhibit extends Model<InferAttributes<Exhibit>, InferCreationAttributes<Exhibit>> {
  declare id: CreationOptional<number>;
  declare organisationId: ForeignKey<Organisation["id"]>;
  declare title: string;
  declare slug: string;
  declare editionId: ForeignKey<ChartEdition["id"]>;
  /** NUMERIC (a decimal string when read). */
  declare spanOlderValue: string | number;
  declare spanOlderUnit: AgeUnit;
  declare spanYoungerValue: string | number;
  declare spanYoungerUnit: AgeUnit;
  declare unitsPreference: CreationOptional<UnitsPreference>;
  declare legibility: CreationOptional<LegibilitySettings>;
  /** The lifecycle (app/lib/review/lifecycle.ts): draft → in_review → approved → published; in_review → changes_requested. */
  declare status: CreationOptional<ExhibitStatus>;
  /** The revision a reviewer approved (null unless approved or published). */
  declare approvedRevision: CreationOptional<number | null>;
  declare approvedById: CreationOptional<ForeignKey<User["id"]> | null>;
  declare approvedAt: CreationOptional<Date | null>;
  declare statusChangedAt: CreationOptional<Date | null>;
  /** Optimistic locking: every saved change increments it; a save based on an older one is refused. */
  declare revision: CreationOptional<number>;
  declare createdById: ForeignKey<User["id"]> | null;
  declare updatedById: ForeignKey<User["id"]> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare edition?: NonAttribute<ChartEdition>;
  declare medium?: NonAttribute<ExhibitMedium>;
  declare markers?: NonAttribute<Marker[]>;
  declare insets?: NonAttribute<Inset[]>;
  declare updatedBy?: NonAttribute<User | null>;
  declare approvedBy?: NonAttribute<User | null>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initExhibit(sequelize: Sequelize) {
  Exhibit.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: false },
      title: { type: DataTypes.STRING(TEXT_LIMITS.exhibits.title), allowNull: false },
      slug: { type: DataTypes.STRING(TEXT_LIMITS.exhibits.slug), allowNull: false },
      editionId: { type: DataTypes.INTEGER, allowNull: false },
      spanOlderValue: { type: DataTypes.DECIMAL, allowNull: false },
      spanOlderUnit: { type: DataTypes.ENUM(...AGE_UNITS), allowNull: false },
      spanYoungerValue: { type: DataTypes.DECIMAL, allowNull: false },
      spanYoungerUnit: { type: DataTypes.ENUM(...AGE_UNITS), allowNull: false },
      unitsPreference: { type: DataTypes.ENUM("metric", "us"), allowNull: false, defaultValue: "metric" },
      legibility: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      status: { type: DataTypes.STRING(TEXT_LIMITS.exhibits.status), allowNull: false, defaultValue: "draft" },
      approvedRevision: { type: DataTypes.INTEGER, allowNull: true },
      approvedById: { type: DataTypes.INTEGER, allowNull: true },
      approvedAt: { type: DataTypes.DATE, allowNull: true },
      statusChangedAt: { type: DataTypes.DATE, allowNull: true },
      revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      createdById: { type: DataTypes.INTEGER, allowNull: true },
      updatedById: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "exhibits" },
  );
}
