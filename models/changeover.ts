import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A planned move of a lube point from one grease to another. */
export class Changeover extends Model<InferAttributes<Changeover>, InferCreationAttributes<Changeover>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare pointId: number;
  declare fromGreaseId: number | null;
  declare toGreaseId: number;
  declare method: string;
  declare shortenedIntervalHours: string | number | null;
  declare servicesPlanned: CreationOptional<number>;
  declare servicesDone: CreationOptional<number>;
  declare state: CreationOptional<string>;
  declare notes: string | null;
  declare plannedBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare completedAt: Date | null;

  static initModel(sequelize: Sequelize): typeof Changeover {
    return Changeover.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        pointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        fromGreaseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        toGreaseId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        method: { type: DataTypes.STRING(12), allowNull: false },
        shortenedIntervalHours: { type: DataTypes.DECIMAL(9, 1), allowNull: true },
        servicesPlanned: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 3 },
        servicesDone: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        state: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "planned" },
        notes: { type: DataTypes.STRING(500), allowNull: true },
        plannedBy: { type: DataTypes.STRING(36), allowNull: true },
        createdAt: DataTypes.DATE(3),
        completedAt: { type: DataTypes.DATE(3), allowNull: true },
      },
      { sequelize, tableName: "changeover", underscored: true, updatedAt: false },
    );
  }
}
