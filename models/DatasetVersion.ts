import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export const versionSources = ["upload", "manual"] as const;
export type VersionSource = (typeof versionSources)[number];

/**
 * Each committed change to an assessment's data is a numbered version (1, 2, 3, …). Its
 * insert opens one observation set per plot it covers and closes those plots' earlier sets
 * (a database trigger), so the values a version brought in and the ones it replaced are
 * found through it, and any earlier state and every change can be shown.
 */
export class DatasetVersion extends Model<InferAttributes<DatasetVersion>, InferCreationAttributes<DatasetVersion>> {
  declare id: CreationOptional<string>;
  declare assessmentId: string;
  declare trialId: string;
  declare number: number;
  declare source: VersionSource;
  declare uploadId: string | null;
  declare createdById: string;
  /** Required once the trial is locked; shown to the reviewer. */
  declare reason: string | null;
  declare rowsAdded: number;
  declare rowsReplaced: number;
  /** The plots whose earlier values this version replaces; null: the whole assessment (an upload). */
  declare scopePlotIds: CreationOptional<string[] | null>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    DatasetVersion.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        assessmentId: { type: DataTypes.UUID, allowNull: false },
        trialId: { type: DataTypes.UUID, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        source: { type: DataTypes.STRING(10), allowNull: false },
        uploadId: { type: DataTypes.UUID, allowNull: true },
        createdById: { type: DataTypes.UUID, allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: true },
        rowsAdded: { type: DataTypes.INTEGER, allowNull: false },
        rowsReplaced: { type: DataTypes.INTEGER, allowNull: false },
        scopePlotIds: { type: DataTypes.ARRAY(DataTypes.UUID), allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "dataset_versions", modelName: "DatasetVersion", updatedAt: false },
    );
  }
}
