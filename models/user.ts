import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import { ROLES, type Role } from "@/lib/domain/permissions";

export const USER_STATUSES = ["invited", "active", "disabled"] as const;
export type UserStatus = (typeof USER_STATUSES)[number];
export const UNIT_SYSTEMS = ["metric", "imperial"] as const;
export type UnitSystem = (typeof UNIT_SYSTEMS)[number];

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: string;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare status: CreationOptional<UserStatus>;
  declare passwordHash: string | null;
  declare unitSystem: CreationOptional<UnitSystem>;
  declare disabledAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof User {
    return User.init(
      {
        id: { type: DataTypes.STRING(36), primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        role: { type: DataTypes.ENUM(...ROLES), allowNull: false },
        status: { type: DataTypes.ENUM("invited", "active", "disabled"), allowNull: false, defaultValue: "active" },
        passwordHash: { type: DataTypes.STRING(255), allowNull: true },
        unitSystem: { type: DataTypes.ENUM("metric", "imperial"), allowNull: false, defaultValue: "metric" },
        disabledAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "app_user", underscored: true },
    );
  }
}
