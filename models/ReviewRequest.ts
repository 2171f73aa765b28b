import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export const reviewStatuses = ["requested", "approved", "withdrawn"] as const;
export type ReviewStatus = (typeof reviewStatuses)[number];

/** The researcher's request for review of a trial's analyses and the reviewer's sign-off. */
export class ReviewRequest extends Model<InferAttributes<ReviewRequest>, InferCreationAttributes<ReviewRequest>> {
  declare id: CreationOptional<string>;
  declare trialId: string;
  declare status: CreationOptional<ReviewStatus>;
  declare requestedById: string;
  declare message: CreationOptional<string>;
  declare decidedById: CreationOptional<string | null>;
  declare decidedAt: CreationOptional<Date | null>;
  declare decisionNote: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ReviewRequest.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "requested" },
        requestedById: { type: DataTypes.UUID, allowNull: false },
        message: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        decidedById: { type: DataTypes.UUID, allowNull: true },
        decidedAt: { type: DataTypes.DATE, allowNull: true },
        decisionNote: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "review_requests", modelName: "ReviewRequest" },
    );
  }
}
