import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class Photo extends Model<InferAttributes<Photo>, InferCreationAttributes<Photo>> {
  declare id: CreationOptional<string>;
  declare trialId: string;
  declare plotId: string;
  declare assessmentId: string | null;
  declare objectKey: string;
  declare thumbnailKey: string;
  declare contentType: string;
  declare sizeBytes: number;
  declare caption: CreationOptional<string>;
  declare status: CreationOptional<"pending" | "stored">;
  declare uploadedById: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Photo.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false },
        plotId: { type: DataTypes.UUID, allowNull: false },
        assessmentId: { type: DataTypes.UUID, allowNull: true },
        objectKey: { type: DataTypes.STRING(300), allowNull: false },
        thumbnailKey: { type: DataTypes.STRING(300), allowNull: false },
        contentType: { type: DataTypes.STRING(40), allowNull: false },
        sizeBytes: { type: DataTypes.INTEGER, allowNull: false },
        caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: "" },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: "pending" },
        uploadedById: { type: DataTypes.UUID, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "photos", modelName: "Photo" },
    );
  }
}
