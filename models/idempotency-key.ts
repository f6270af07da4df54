import {
  DataTypes,
  Model,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** The stored first answer to a request that carried an Idempotency-Key. */
export class IdempotencyKey extends Model<InferAttributes<IdempotencyKey>, InferCreationAttributes<IdempotencyKey>> {
  declare userId: string;
  declare idemKey: string;
  declare requestHash: string;
  declare statusCode: number;
  declare responseJson: string;
  declare createdAt: Date;

  static initModel(sequelize: Sequelize): typeof IdempotencyKey {
    return IdempotencyKey.init(
      {
        userId: { type: DataTypes.STRING(36), primaryKey: true },
        idemKey: { type: DataTypes.STRING(255), primaryKey: true },
        requestHash: { type: DataTypes.CHAR(64), allowNull: false },
        statusCode: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        responseJson: { type: DataTypes.TEXT("medium"), allowNull: false },
        createdAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "idempotency_key", underscored: true, timestamps: false },
    );
  }
}
