import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export const GREASE_DOCUMENT_KINDS = ["sds", "tds"] as const;
export type GreaseDocumentKind = (typeof GREASE_DOCUMENT_KINDS)[number];

/** The current safety data sheet (sds) or technical data sheet (tds) of a grease. */
export class GreaseDocument extends Model<InferAttributes<GreaseDocument>, InferCreationAttributes<GreaseDocument>> {
  declare greaseId: number;
  declare kind: GreaseDocumentKind;
  declare documentId: number;

  static initModel(sequelize: Sequelize): typeof GreaseDocument {
    return GreaseDocument.init(
      {
        greaseId: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        kind: { type: DataTypes.ENUM(...GREASE_DOCUMENT_KINDS), primaryKey: true },
        documentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
      },
      { sequelize, tableName: "grease_document", underscored: true, timestamps: false },
    );
  }
}
