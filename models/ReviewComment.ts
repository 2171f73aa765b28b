import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/** A reviewer's or researcher's comment on a trial or one of its assessments; replies name their parent. */
export class ReviewComment extends Model<InferAttributes<ReviewComment>, InferCreationAttributes<ReviewComment>> {
  declare id: CreationOptional<string>;
  declare trialId: string;
  declare assessmentId: string | null;
  declare parentId: string | null;
  declare authorId: string;
  declare body: string;
  declare resolvedAt: CreationOptional<Date | null>;
  declare resolvedById: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ReviewComment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false },
        assessmentId: { type: DataTypes.UUID, allowNull: true },
        parentId: { type: DataTypes.UUID, allowNull: true },
        authorId: { type: DataTypes.UUID, allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        resolvedAt: { type: DataTypes.DATE, allowNull: true },
        resolvedById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "review_comments", modelName: "ReviewComment" },
    );
  }
}
