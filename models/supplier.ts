import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class Supplier extends Model<InferAttributes<Supplier>, InferCreationAttributes<Supplier>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare contactName: string | null;
  declare contactEmail: string | null;
  declare leadTimeDays: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof Supplier {
    return Supplier.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false, unique: true },
        contactName: { type: DataTypes.STRING(120), allowNull: true },
        contactEmail: { type: DataTypes.STRING(254), allowNull: true },
        leadTimeDays: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "supplier", underscored: true },
    );
  }
}
