import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A mix that was refused, found, or an exception during a changeover. */
export class MixingIncident extends Model<InferAttributes<MixingIncident>, InferCreationAttributes<MixingIncident>> {
  declare id: CreationOptional<number>;
  declare siteId: number;
  declare pointId: number | null;
  declare kind: string;
  declare greaseInPointId: number | null;
  declare greaseOfferedId: number | null;
  declare verdict: string;
  declare reasonsJson: string;
  declare state: CreationOptional<string>;
  declare rootCause: string | null;
  declare correctiveAction: string | null;
  declare openedBy: string | null;
  declare openedAt: Date;
  declare closedBy: string | null;
  declare closedAt: Date | null;

  static initModel(sequelize: Sequelize): typeof MixingIncident {
    return MixingIncident.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        pointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        kind: { type: DataTypes.STRING(32), allowNull: false },
        greaseInPointId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        greaseOfferedId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        verdict: { type: DataTypes.STRING(16), allowNull: false },
        reasonsJson: { type: DataTypes.TEXT("medium"), allowNull: false },
        state: { type: DataTypes.STRING(16), allowNull: false, defaultValue: "open" },
        rootCause: { type: DataTypes.TEXT, allowNull: true },
        correctiveAction: { type: DataTypes.TEXT, allowNull: true },
        openedBy: { type: DataTypes.STRING(36), allowNull: true },
        openedAt: { type: DataTypes.DATE(3), allowNull: false },
        closedBy: { type: DataTypes.STRING(36), allowNull: true },
        closedAt: { type: DataTypes.DATE(3), allowNull: true },
      },
      { sequelize, tableName: "mixing_incident", underscored: true, timestamps: false },
    );
  }
}
