import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export class UserSiteAccess extends Model<InferAttributes<UserSiteAccess>, InferCreationAttributes<UserSiteAccess>> {
  declare userId: string;
  declare siteId: number;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof UserSiteAccess {
    return UserSiteAccess.init(
      {
        userId: { type: DataTypes.STRING(36), primaryKey: true },
        siteId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "user_site_access", underscored: true, updatedAt: false },
    );
  }
}
