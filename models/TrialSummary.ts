import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/**
 * A trial's plain-language summary: the researcher's edits while drafting, and once published
 * the text growers read with a snapshot of the numbers it was generated from.
 */
export class TrialSummary extends Model<InferAttributes<TrialSummary>, InferCreationAttributes<TrialSummary>> {
  declare id: CreationOptional<string>;
  declare trialId: string;
  declare editedText: string | null;
  declare publishedText: string | null;
  /** While drafting, the generated text the edit was made against (to spot results that changed since); once published, the text generated then. */
  declare generatedText: string | null;
  declare numbers: unknown;
  declare publishedAt: Date | null;
  declare publishedById: string | null;
  declare updatedById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    TrialSummary.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false, unique: true },
        editedText: { type: DataTypes.TEXT, allowNull: true },
        publishedText: { type: DataTypes.TEXT, allowNull: true },
        generatedText: { type: DataTypes.TEXT, allowNull: true },
        numbers: { type: DataTypes.JSONB, allowNull: true },
        publishedAt: { type: DataTypes.DATE, allowNull: true },
        publishedById: { type: DataTypes.UUID, allowNull: true },
        updatedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "trial_summaries", modelName: "TrialSummary" },
    );
  }
}
