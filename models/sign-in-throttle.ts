import {
  DataTypes,
  Model,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** Failed sign-in counters per account and per client address, kept in the database so every instance agrees. */
export class SignInThrottle extends Model<InferAttributes<SignInThrottle>, InferCreationAttributes<SignInThrottle>> {
  declare throttleKey: string;
  declare failures: number;
  declare windowStartedAt: Date;
  declare lockedUntil: Date | null;
  declare updatedAt: Date;

  static initModel(sequelize: Sequelize): typeof SignInThrottle {
    return SignInThrottle.init(
      {
        throttleKey: { type: DataTypes.STRING(191), primaryKey: true },
        failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        windowStartedAt: { type: DataTypes.DATE(3), allowNull: false },
        lockedUntil: { type: DataTypes.DATE(3), allowNull: true },
        updatedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "sign_in_throttle", underscored: true, createdAt: false },
    );
  }
}
