import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";
import { PACK_KINDS, type PackKind } from "@/lib/domain/catalogue";

export class GreasePack extends Model<InferAttributes<GreasePack>, InferCreationAttributes<GreasePack>> {
  declare id: CreationOptional<number>;
  declare greaseId: number;
  declare kind: PackKind;
  declare netMassGrams: number;
  declare label: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof GreasePack {
    return GreasePack.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        greaseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM(...PACK_KINDS), allowNull: false },
        netMassGrams: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        label: { type: DataTypes.STRING(80), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "grease_pack", underscored: true, updatedAt: false, indexes: [{ fields: ["grease_id"] }] },
    );
  }
}
