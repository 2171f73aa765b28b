import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export const uploadStatuses = ["pending", "checked", "committed", "refused"] as const;
export type UploadStatus = (typeof uploadStatuses)[number];

/** One raw file as it was received; kept (with its checksum) whatever became of it. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: CreationOptional<string>;
  declare trialId: string;
  declare assessmentId: string;
  declare objectKey: string;
  declare originalName: string;
  declare declaredSizeBytes: number;
  declare sizeBytes: number | null;
  declare sha256: string | null;
  declare status: CreationOptional<UploadStatus>;
  /** Problems found by the last check, as shown to the uploader. */
  declare problems: CreationOptional<unknown[]>;
  declare rowCount: number | null;
  declare uploadedById: string;
  declare versionId: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Upload.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false },
        assessmentId: { type: DataTypes.UUID, allowNull: false },
        objectKey: { type: DataTypes.STRING(300), allowNull: false },
        originalName: { type: DataTypes.STRING(200), allowNull: false },
        declaredSizeBytes: { type: DataTypes.BIGINT, allowNull: false },
        sizeBytes: { type: DataTypes.BIGINT, allowNull: true },
        sha256: { type: DataTypes.STRING(64), allowNull: true },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "pending" },
        problems: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        rowCount: { type: DataTypes.INTEGER, allowNull: true },
        uploadedById: { type: DataTypes.UUID, allowNull: false },
        versionId: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "uploads", modelName: "Upload" },
    );
  }
}
