import {
  DataTypes,
  Model,
  type CreationOptional,
  type InferAttributes,
  type InferCreationAttributes,
  type Sequelize,
} from "sequelize";

/** Evidence about one pair of products (a lab mixture test, a supplier's statement). The pair is stored low id first. */
export class GreasePairEvidence extends Model<InferAttributes<GreasePairEvidence>, InferCreationAttributes<GreasePairEvidence>> {
  declare id: CreationOptional<number>;
  declare greaseLowId: number;
  declare greaseHighId: number;
  declare kind: "lab_mixture_test" | "supplier_statement";
  declare verdict: "compatible" | "borderline" | "incompatible";
  declare title: string;
  declare summary: string | null;
  /** JSON of the lab results when kind is lab_mixture_test. */
  declare testData: string | null;
  declare documentId: number | null;
  declare recordedBy: string | null;
  declare recordedAt: Date;

  static initModel(sequelize: Sequelize): typeof GreasePairEvidence {
    return GreasePairEvidence.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        greaseLowId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        greaseHighId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        kind: { type: DataTypes.ENUM("lab_mixture_test", "supplier_statement"), allowNull: false },
        verdict: { type: DataTypes.ENUM("compatible", "borderline", "incompatible"), allowNull: false },
        title: { type: DataTypes.STRING(200), allowNull: false },
        summary: { type: DataTypes.TEXT, allowNull: true },
        testData: { type: DataTypes.TEXT("medium"), allowNull: true },
        documentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        recordedBy: { type: DataTypes.STRING(36), allowNull: true },
        recordedAt: { type: DataTypes.DATE(3), allowNull: false },
      },
      {
        sequelize,
        tableName: "grease_pair_evidence",
        underscored: true,
        timestamps: false,
        indexes: [{ fields: ["grease_low_id", "grease_high_id"] }],
      },
    );
  }
}
