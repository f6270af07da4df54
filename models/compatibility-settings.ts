import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** Per site: which compatibility charts are enabled, the dilution thresholds and the mixture-test allowances. */
export class CompatibilitySettingsRow extends Model<
  InferAttributes<CompatibilitySettingsRow>,
  InferCreationAttributes<CompatibilitySettingsRow>
> {
  declare siteId: number;
  /** Comma-separated chart ids. */
  declare enabledCharts: string;
  declare viscosityRatioLimit: string | number;
  declare nlgiStepLimit: string | number;
  declare droppingPointAllowanceC: string | number;
  declare workedPenetrationAllowance: string | number;
  declare storageChangeAllowance: string | number;
  declare version: CreationOptional<number>;
  declare updatedBy: string | null;
  declare updatedAt: Date;

  static initModel(sequelize: Sequelize): typeof CompatibilitySettingsRow {
    return CompatibilitySettingsRow.init(
      {
        siteId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        enabledCharts: { type: DataTypes.STRING(500), allowNull: false },
        viscosityRatioLimit: { type: DataTypes.DECIMAL(6, 2), allowNull: false },
        nlgiStepLimit: { type: DataTypes.DECIMAL(4, 1), allowNull: false },
        droppingPointAllowanceC: { type: DataTypes.DECIMAL(6, 1), allowNull: false, field: "dropping_point_allowance_c" },
        workedPenetrationAllowance: { type: DataTypes.DECIMAL(6, 1), allowNull: false },
        storageChangeAllowance: { type: DataTypes.DECIMAL(6, 1), allowNull: false },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        updatedBy: { type: DataTypes.STRING(36), allowNull: true },
        updatedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "compatibility_settings", underscored: true, createdAt: false },
    );
  }
}
