import {
  DataTypes,
  Model,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** A signed-in session. `id` is the SHA-256 (hex) of the token in the cookie; the token itself is never stored. */
export class UserSession extends Model<InferAttributes<UserSession>, InferCreationAttributes<UserSession>> {
  declare id: string;
  declare userId: string;
  declare expiresAt: Date;
  declare createdAt: Date;
  declare lastSeenAt: Date;
  declare userAgent: string | null;

  static initModel(sequelize: Sequelize): typeof UserSession {
    return UserSession.init(
      {
        id: { type: DataTypes.STRING(64), primaryKey: true },
        userId: { type: DataTypes.STRING(36), allowNull: false },
        expiresAt: { type: DataTypes.DATE(3), allowNull: false },
        createdAt: { type: DataTypes.DATE(3), allowNull: false },
        lastSeenAt: { type: DataTypes.DATE(3), allowNull: false },
        userAgent: { type: DataTypes.STRING(255), allowNull: true },
      },
      {
        sequelize,
        tableName: "user_session",
        underscored: true,
        timestamps: false,
        indexes: [{ fields: ["user_id"] }],
      },
    );
  }
}
