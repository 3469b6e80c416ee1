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
import type { User } from "./user.ts";

export const EDITION_STATUSES = ["draft", "current", "retired"] as const satisfies readonly EditionStatus[];

/**
 * A versioned geologic timescale (an edition of the International Chronostratigraphic Chart, or an
 * editor's draft of one). Editions are shared by every organisation. At most one is current
 * (partial unique index chart_editions_one_current).
 */
export class ChartEdition extends Model<InferAttributes<ChartEdition>, InferCreationAttributes<ChartEdition>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare label: string;
  declare status: EditionStatus;
  /** Full citation of the chart edition and of the file the intervals were read from. */
  declare source: string;
  declare licence: string;
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
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initChartEdition(sequelize: Sequelize) {
  ChartEdition.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      slug: { type: DataTypes.STRING(60), allowNull: false, unique: true },
      label: { type: DataTypes.STRING(100), allowNull: false },
      status: { type: DataTypes.ENUM(...EDITION_STATUSES), allowNull: false, defaultValue: "draft" },
      source: { type: DataTypes.TEXT, allowNull: false },
      licence: { type: DataTypes.TEXT, allowNull: false },
      sourceFile: { type: DataTypes.STRING(300), allowNull: true },
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
