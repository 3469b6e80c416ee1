import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes } from "sequelize";
import type { Sequelize } from "sequelize";
import { TEXT_LIMITS } from "../../app/lib/limits.ts";

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  declare lastSignInAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
}

/** Binds the model to the process's Sequelize instance (called once, by initModels). */
export function initUser(sequelize: Sequelize) {
  User.init(
    {
      id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
      email: { type: DataTypes.STRING(TEXT_LIMITS.users.email), allowNull: false, unique: true },
      name: { type: DataTypes.STRING(TEXT_LIMITS.users.name), allowNull: false },
      passwordHash: { type: DataTypes.STRING(TEXT_LIMITS.users.passwordHash), allowNull: false },
      lastSignInAt: { type: DataTypes.DATE, allowNull: true },
      createdAt: DataTypes.DATE,
      updatedAt: DataTypes.DATE,
    },
    { sequelize, tableName: "users" },
  );
}
