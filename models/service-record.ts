import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** One grease job at a lube point. */
export class ServiceRecord extends Model<InferAttributes<ServiceRecord>, InferCreationAttributes<ServiceRecord>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare pointId: number;
  declare greaseId: number;
  declare grams: string | number;
  declare strokes: number | null;
  declare gunId: number | null;
  declare plannedGrams: string | number | null;
  declare quantityFlag: string | null;
  declare backPressure: CreationOptional<boolean>;
  declare purgeSeen: CreationOptional<boolean>;
  declare noise: CreationOptional<boolean>;
  declare housingTemperatureC: string | number | null;
  declare notes: string | null;
  declare changeoverId: number | null;
  declare performedBy: string;
  declare performedAt: Date;

  static initModel(sequelize: Sequelize): typeof ServiceRecord {
    return ServiceRecord.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        pointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        greaseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        grams: { type: DataTypes.DECIMAL(8, 2), allowNull: false },
        strokes: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        gunId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        plannedGrams: { type: DataTypes.DECIMAL(8, 2), allowNull: true },
        quantityFlag: { type: DataTypes.STRING(8), allowNull: true },
        backPressure: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        purgeSeen: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        noise: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        housingTemperatureC: { type: DataTypes.DECIMAL(5, 1), allowNull: true, field: "housing_temperature_c" },
        notes: { type: DataTypes.STRING(1000), allowNull: true },
        changeoverId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        performedBy: { type: DataTypes.STRING(36), allowNull: false },
        performedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "service_record", underscored: true, timestamps: false },
    );
  }
}
