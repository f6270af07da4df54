import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A lube point: one bearing or grease nipple on an asset, with its tag, needs and plan. */
export class LubePoint extends Model<InferAttributes<LubePoint>, InferCreationAttributes<LubePoint>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare assetId: number;
  declare tagCode: string;
  declare name: string;
  declare bearingType: string;
  declare bearingDesignation: string | null;
  declare boreMm: string | number;
  declare outsideDiameterMm: string | number;
  declare widthMm: string | number;
  declare speedRpm: string | number;
  declare operatingTemperatureC: string | number | null;
  declare runningHoursPerDay: CreationOptional<string | number>;
  declare verticalShaft: CreationOptional<boolean>;
  declare contamination: CreationOptional<string>;
  declare moisture: CreationOptional<string>;
  declare vibration: CreationOptional<string>;
  declare foodGradeRequired: CreationOptional<boolean>;
  declare replenishment: CreationOptional<string>;
  declare sealedForLife: CreationOptional<boolean>;
  declare assignedGreaseId: number | null;
  declare currentGreaseId: number | null;
  declare intervalHoursOverride: string | number | null;
  declare quantityGramsOverride: string | number | null;
  declare overrideReason: string | null;
  declare makerIntervalHours: string | number | null;
  declare makerQuantityGrams: string | number | null;
  declare makerNote: string | null;
  declare intervalHours: string | number | null;
  declare quantityGrams: string | number | null;
  declare lastServicedAt: Date | null;
  declare nextDueAt: Date | null;
  declare routeOrder: CreationOptional<number>;
  declare version: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof LubePoint {
    return LubePoint.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        assetId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        tagCode: { type: DataTypes.CHAR(8), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        bearingType: { type: DataTypes.STRING(24), allowNull: false },
        bearingDesignation: { type: DataTypes.STRING(40), allowNull: true },
        boreMm: { type: DataTypes.DECIMAL(7, 2), allowNull: false },
        outsideDiameterMm: { type: DataTypes.DECIMAL(7, 2), allowNull: false },
        widthMm: { type: DataTypes.DECIMAL(7, 2), allowNull: false },
        speedRpm: { type: DataTypes.DECIMAL(8, 1), allowNull: false },
        operatingTemperatureC: { type: DataTypes.DECIMAL(5, 1), allowNull: true, field: "operating_temperature_c" },
        runningHoursPerDay: { type: DataTypes.DECIMAL(4, 1), allowNull: false, defaultValue: 24 },
        verticalShaft: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        contamination: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "low" },
        moisture: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "low" },
        vibration: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "low" },
        foodGradeRequired: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        replenishment: { type: DataTypes.STRING(8), allowNull: false, defaultValue: "side" },
        sealedForLife: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        assignedGreaseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        currentGreaseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        intervalHoursOverride: { type: DataTypes.DECIMAL(9, 1), allowNull: true },
        quantityGramsOverride: { type: DataTypes.DECIMAL(8, 2), allowNull: true },
        overrideReason: { type: DataTypes.STRING(300), allowNull: true },
        makerIntervalHours: { type: DataTypes.DECIMAL(9, 1), allowNull: true },
        makerQuantityGrams: { type: DataTypes.DECIMAL(8, 2), allowNull: true },
        makerNote: { type: DataTypes.STRING(300), allowNull: true },
        intervalHours: { type: DataTypes.DECIMAL(9, 1), allowNull: true },
        quantityGrams: { type: DataTypes.DECIMAL(8, 2), allowNull: true },
        lastServicedAt: { type: DataTypes.DATE(3), allowNull: true },
        nextDueAt: { type: DataTypes.DATE(3), allowNull: true },
        routeOrder: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "lube_point", underscored: true },
    );
  }
}
