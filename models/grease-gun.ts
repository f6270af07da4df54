import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A grease gun with its calibrated output per stroke. */
export class GreaseGun extends Model<InferAttributes<GreaseGun>, InferCreationAttributes<GreaseGun>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare label: string;
  declare gramsPerStroke: string | number;
  declare calibratedOn: string;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof GreaseGun {
    return GreaseGun.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        label: { type: DataTypes.STRING(60), allowNull: false },
        gramsPerStroke: { type: DataTypes.DECIMAL(6, 3), allowNull: false },
        calibratedOn: { type: DataTypes.DATEONLY, allowNull: false },
        notes: { type: DataTypes.STRING(200), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "grease_gun", underscored: true, updatedAt: false },
    );
  }
}
