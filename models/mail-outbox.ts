import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

export const OUTBOX_STATUSES = ["pending", "sending", "sent", "dead"] as const;
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];

/** One mail waiting for, or done with, delivery. Written in the same transaction as the change it reports. */
export class MailOutbox extends Model<InferAttributes<MailOutbox>, InferCreationAttributes<MailOutbox>> {
  declare id: CreationOptional<number>;
  declare dedupeKey: string | null;
  declare toAddresses: string;
  declare subject: string;
  declare textBody: string;
  declare status: CreationOptional<OutboxStatus>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: Date;
  declare claimToken: string | null;
  declare claimedUntil: Date | null;
  declare lastError: string | null;
  declare sentAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): typeof MailOutbox {
    return MailOutbox.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        dedupeKey: { type: DataTypes.STRING(191), allowNull: true, unique: true },
        toAddresses: { type: DataTypes.TEXT, allowNull: false },
        subject: { type: DataTypes.STRING(255), allowNull: false },
        textBody: { type: DataTypes.TEXT("medium"), allowNull: false },
        status: { type: DataTypes.ENUM(...OUTBOX_STATUSES), allowNull: false, defaultValue: "pending" },
        attempts: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE(3), allowNull: false },
        claimToken: { type: DataTypes.STRING(64), allowNull: true },
        claimedUntil: { type: DataTypes.DATE(3), allowNull: true },
        lastError: { type: DataTypes.TEXT, allowNull: true },
        sentAt: { type: DataTypes.DATE(3), allowNull: true },
        createdAt: DataTypes.DATE(3),
        updatedAt: DataTypes.DATE(3),
      },
      {
        sequelize,
        tableName: "mail_outbox",
        underscored: true,
        indexes: [{ fields: ["status", "next_attempt_at"] }],
      },
    );
  }
}
