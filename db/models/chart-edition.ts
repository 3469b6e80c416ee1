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
import type { Correction, EditionStatus } from "../../app/lib/timescale/types.ts";
import type { Interval } from "./interval.ts";
import type { Organisation } from "./organisation.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

export const EDITION_STATUSES = ["draft", "current", "retired"] as const satisfies readonly EditionStatus[];

/**
 * A versioned geologic timescale (an edition of the International Chronostratigraphic Chart, or an
 * edition of an organisation's own). A shared edition (organisationId null) is managed by chart
 * stewards and seen by everyone once released; an organisation's own edition only by its members.
 * At most one edition per owner is current (index chart_editions_one_current_per_owner): for shared
 * editions that is the latest one. Each organisation's working edition is organisations.current_edition_id.
 */
export class ChartEdition extends Model<InferAttributes<ChartEdition>, InferCreationAttributes<ChartEdition>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare label: string;
  declare status: EditionStatus;
  /** Full citation of the chart edition and of the file the intervals were read from. */
  declare source: string;
  declare licence: string;
  /** The organisation that owns the edition; null for a shared edition (managed by chart stewards). */
  declare organisationId: ForeignKey<Organisation["id"]> | null;
  /** Repository path or uploaded file name the intervals came from. */
  declare sourceFile: string | null;
  /** Corrections made to the source data (what, from → to, why, on what authority). */
  declare corrections: CreationOptional<Correction[]>;
  declare createdById: ForeignKey<User["id"]> | null;
  declare madeCurrentById: ForeignKey<User["id"]> | null;
  declare madeCurrentAt: Date | null;
  declare retiredAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare intervals?: NonAttribute<Interval[]>;
  declare createdBy?: NonAttribute<User | null>;
  declare madeCurrentBy?: NonAttribute<User | null>;
  declare organisation?: NonAttribute<Organisation | null>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initChartEdition(sequelize: Sequelize) {
  ChartEdition.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      slug: { type: DataTypes.STRING(TEXT_LIMITS.chart_editions.slug), allowNull: false, unique: true },
      label: { type: DataTypes.STRING(TEXT_LIMITS.chart_editions.label), allowNull: false },
      status: { type: DataTypes.ENUM(...EDITION_STATUSES), allowNull: false, defaultValue: "draft" },
      source: { type: DataTypes.TEXT, allowNull: false },
      licence: { type: DataTypes.TEXT, allowNull: false },
      organisationId: { type: DataTypes.INTEGER, allowNull: true },
      sourceFile: { type: DataTypes.STRING(TEXT_LIMITS.chart_editions.sourceFile), allowNull: true },
      corrections: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
      createdById: { type: DataTypes.INTEGER, allowNull: true },
      madeCurrentById: { type: DataTypes.INTEGER, allowNull: true },
      madeCurrentAt: { type: DataTypes.DATE, allowNull: true },
      retiredAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "chart_editions" },
  );
}
