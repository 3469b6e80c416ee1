import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import { VERIFICATIONS, type Verification } from "../../app/lib/dated-events.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/**
 * A radioactive parent → daughter pair with its half-life ± and decay constant, for the "how we
 * know" panels. Shared reference data (seeded, read-only). Numbers are NUMERIC, read back as
 * decimal strings; use server/dated-events.server.ts `toDecaySystemView()` for numbers.
 */
export class DecaySystem extends Model<InferAttributes<DecaySystem>, InferCreationAttributes<DecaySystem>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  /** "U-238" */
  declare parent: string;
  declare daughter: string;
  declare decayMode: string;
  declare halfLifeYears: string;
  declare halfLifeUncertaintyYears: string | null;
  /** Total λ per year; stated by the source when decayConstantStated, else ln 2 / t½. */
  declare decayConstantPerYear: string;
  declare decayConstantStated: boolean;
  /** Partial λ of the branch that gives this daughter (⁴⁰K → ⁴⁰Ar: λₑ); null if all decays do. */
  declare branchConstantPerYear: string | null;
  declare citation: string;
  declare doi: string | null;
  declare verification: Verification;
  declare notes: CreationOptional<string>;
  declare position: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initDecaySystem(sequelize: Sequelize) {
  DecaySystem.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      slug: { type: DataTypes.STRING(TEXT_LIMITS.decay_systems.slug), allowNull: false, unique: true },
      parent: { type: DataTypes.STRING(TEXT_LIMITS.decay_systems.parent), allowNull: false },
      daughter: { type: DataTypes.STRING(TEXT_LIMITS.decay_systems.daughter), allowNull: false },
      decayMode: { type: DataTypes.STRING(TEXT_LIMITS.decay_systems.decayMode), allowNull: false },
      halfLifeYears: { type: DataTypes.DECIMAL, allowNull: false },
      halfLifeUncertaintyYears: { type: DataTypes.DECIMAL, allowNull: true },
      decayConstantPerYear: { type: DataTypes.DECIMAL, allowNull: false },
      decayConstantStated: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
      branchConstantPerYear: { type: DataTypes.DECIMAL, allowNull: true },
      citation: { type: DataTypes.TEXT, allowNull: false },
      doi: { type: DataTypes.STRING(TEXT_LIMITS.decay_systems.doi), allowNull: true },
      verification: { type: DataTypes.STRING(TEXT_LIMITS.decay_systems.verification), allowNull: false, validate: { isIn: [VERIFICATIONS as unknown as string[]] } },
      notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
      position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "decay_systems" },
  );
}
