import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A machine (motor, pump, fan …) with one or more lube points. */
export class Asset extends Model<InferAttributes<Asset>, InferCreationAttributes<Asset>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare areaId: number;
  declare tag: string;
  declare name: string;
  declare kind: CreationOptional<string>;
  declare frameSize: string | null;
  declare notes: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Asset {
    return Asset.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        areaId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tag: { type: DataTypes.STRING(32), allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        kind: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "other" },
        frameSize: { type: DataTypes.STRING(32), allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "asset", underscored: true },
    );
  }
}
