import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from "sequelize";
import {
  BASE_OIL_TYPES,
  FOOD_GRADES,
  NLGI_GRADES,
  THICKENERS,
  type BaseOilType,
  type FoodGrade,
  type NlgiGrade,
  type Thickener,
} from "@/lib/domain/catalogue";
import type { GreasePack } from "./grease-pack";
import type { Supplier } from "./supplier";

export class Grease extends Model<InferAttributes<Grease>, InferCreationAttributes<Grease>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare name: string;
  declare supplierId: number;
  declare thickener: Thickener;
  declare baseOilType: BaseOilType;
  /** Base-oil kinematic viscosity at 40 °C, mm²/s (DECIMAL comes back as a string). */
  declare viscosity40: string | number;
  declare viscosity100: string | number | null;
  declare nlgiGrade: NlgiGrade;
  /** Worked penetration (ASTM D217, 60 strokes), 0.1 mm, as stated by the data sheet. */
  declare workedPenetration: number | null;
  declare isoVg: number | null;
  declare droppingPointC: number | null;
  declare minTemperatureC: number | null;
  declare maxTemperatureC: number | null;
  declare foodGrade: CreationOptional<FoodGrade>;
  /** Comma-separated solid additives. */
  declare solidAdditives: CreationOptional<string>;
  declare shelfLifeMonths: number | null;
  declare notes: string | null;
  declare version: CreationOptional<number>;
  declare createdBy: string | null;
  declare updatedBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  declare supplier?: NonAttribute<Supplier>;
  declare packs?: NonAttribute<GreasePack[]>;

  static initModel(sequelize: Sequelize): typeof Grease {
    return Grease.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.STRING(32), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        supplierId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        thickener: { type: DataTypes.ENUM(...THICKENERS), allowNull: false },
        baseOilType: { type: DataTypes.ENUM(...BASE_OIL_TYPES), allowNull: false },
        viscosity40: { type: DataTypes.DECIMAL(9, 2), allowNull: false, field: "viscosity_40" },
        viscosity100: { type: DataTypes.DECIMAL(9, 2), allowNull: true, field: "viscosity_100" },
        nlgiGrade: { type: DataTypes.ENUM(...NLGI_GRADES), allowNull: false },
        workedPenetration: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        isoVg: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        droppingPointC: { type: DataTypes.SMALLINT, allowNull: true, field: "dropping_point_c" },
        minTemperatureC: { type: DataTypes.SMALLINT, allowNull: true, field: "min_temperature_c" },
        maxTemperatureC: { type: DataTypes.SMALLINT, allowNull: true, field: "max_temperature_c" },
        foodGrade: { type: DataTypes.ENUM(...FOOD_GRADES), allowNull: false, defaultValue: "none" },
        solidAdditives: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        shelfLifeMonths: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: true },
        version: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 1 },
        createdBy: { type: DataTypes.STRING(36), allowNull: true },
        updatedBy: { type: DataTypes.STRING(36), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "grease", underscored: true, indexes: [{ fields: ["thickener"] }, { fields: ["supplier_id"] }] },
    );
  }
}
