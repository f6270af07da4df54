import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A one-time link to set a password. Only the SHA-256 of the link's token is stored. */
export class UserInvitation extends Model<InferAttributes<UserInvitation>, InferCreationAttributes<UserInvitation>> {
  declare tokenHash: string;
  declare userId: string;
  declare invitedBy: string | null;
  declare expiresAt: Date;
  declare usedAt: Date | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof UserInvitation {
    return UserInvitation.init(
      {
        tokenHash: { type: DataTypes.CHAR(64), primaryKey: true },
        userId: { type: DataTypes.STRING(36), allowNull: false },
        invitedBy: { type: DataTypes.STRING(36), allowNull: true },
        expiresAt: { type: DataTypes.DATE(3), allowNull: false },
        usedAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
      },
      { sequelize, tableName: "user_invitation", underscored: true, updatedAt: false, indexes: [{ fields: ["user_id"] }] },
    );
  }
}
