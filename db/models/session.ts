import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
} from "sequelize";
import type { Sequelize } from "sequelize";
import type { User } from "./user.ts";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

/** A server-side session; the cookie carries only the (signed) id. */
export class Session extends Model<InferAttributes<Session>, InferCreationAttributes<Session>> {
  declare id: string;
  declare userId: ForeignKey<User["id"]> | null;
  declare data: Record<string, unknown>;
  declare expiresAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initSession(sequelize: Sequelize) {
  Session.init(
    {
      id: { type: DataTypes.STRING(TEXT_LIMITS.sessions.id), primaryKey: true },
      userId: { type: DataTypes.INTEGER, allowNull: true },
      data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      expiresAt: { type: DataTypes.DATE, allowNull: false },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "sessions" },
  );
}
