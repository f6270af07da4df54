import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** An uploaded file kept outside public/ under a generated name; the original name is only shown. */
export class StoredDocument extends Model<InferAttributes<StoredDocument>, InferCreationAttributes<StoredDocument>> {
  declare id: CreationOptional<number>;
  declare storedName: string;
  declare originalName: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare sha256: string;
  declare uploadedBy: string | null;
  declare uploadedAt: Date;

  static initModel(sequelize: Sequelize): typeof StoredDocument {
    return StoredDocument.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        storedName: { type: DataTypes.CHAR(36), allowNull: false, unique: true },
        originalName: { type: DataTypes.STRING(200), allowNull: false },
        contentType: { type: DataTypes.STRING(100), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        sha256: { type: DataTypes.CHAR(64), allowNull: false },
        uploadedBy: { type: DataTypes.STRING(36), allowNull: true },
        uploadedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      { sequelize, tableName: "stored_document", underscored: true, timestamps: false },
    );
  }
}
