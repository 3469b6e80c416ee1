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
import { AGE_KINDS, VERIFICATIONS, type AgeKind, type Verification } from "../../app/lib/dated-events.ts";
import type { Organisation } from "./organisation.ts";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/**
 * An event that is not a chart boundary ("oldest known mineral grains"), with its age, ± and the
 * published source. organisationId null = the shared library (reference data, read-only in the
 * studio); otherwise the entry belongs to, and is seen only by, that organisation. Ages are NUMERIC:
 * pg hands them back as decimal strings, exactly as entered ("4567.30").
 */
export class DatedEvent extends Model<InferAttributes<DatedEvent>, InferCreationAttributes<DatedEvent>> {
  declare id: CreationOptional<number>;
  declare organisationId: ForeignKey<Organisation["id"]> | null;
  declare slug: string;
  declare name: string;
  declare summary: string;
  /** NUMERIC, Ma, as a decimal string when read. */
  declare ageMa: string;
  declare uncertaintyMa: string | null;
  declare ageKind: CreationOptional<AgeKind>;
  declare citation: string;
  declare doi: string | null;
  declare url: string | null;
  declare datingMethod: string | null;
  declare verification: Verification;
  declare createdById: ForeignKey<User["id"]> | null;
  declare updatedById: ForeignKey<User["id"]> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare organisation?: NonAttribute<Organisation | null>;
  declare createdBy?: NonAttribute<User | null>;
  declare updatedBy?: NonAttribute<User | null>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initDatedEvent(sequelize: Sequelize) {
  DatedEvent.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      organisationId: { type: DataTypes.INTEGER, allowNull: true },
      slug: { type: DataTypes.STRING(TEXT_LIMITS.dated_events.slug), allowNull: false },
      name: { type: DataTypes.STRING(TEXT_LIMITS.dated_events.name), allowNull: false },
      summary: { type: DataTypes.TEXT, allowNull: false },
      ageMa: { type: DataTypes.DECIMAL, allowNull: false },
      uncertaintyMa: { type: DataTypes.DECIMAL, allowNull: true },
      ageKind: { type: DataTypes.ENUM(...AGE_KINDS), allowNull: false, defaultValue: "point" },
      citation: { type: DataTypes.TEXT, allowNull: false },
      doi: { type: DataTypes.STRING(TEXT_LIMITS.dated_events.doi), allowNull: true },
      url: { type: DataTypes.STRING(TEXT_LIMITS.dated_events.url), allowNull: true },
      datingMethod: { type: DataTypes.STRING(TEXT_LIMITS.dated_events.datingMethod), allowNull: true },
      verification: { type: DataTypes.STRING(TEXT_LIMITS.dated_events.verification), allowNull: false, validate: { isIn: [VERIFICATIONS as unknown as string[]] } },
      createdById: { type: DataTypes.INTEGER, allowNull: true },
      updatedById: { type: DataTypes.INTEGER, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "dated_events" },
  );
}
