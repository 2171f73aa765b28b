import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

import type { TrialDesign, TrialStatus } from "@/lib/trials/vocabulary";

export { trialDesigns, trialStatuses, type TrialDesign, type TrialStatus } from "@/lib/trials/vocabulary";

export class Trial extends Model<InferAttributes<Trial>, InferCreationAttributes<Trial>> {
  declare id: CreationOptional<string>;
  declare title: string;
  declare crop: string;
  declare season: string;
  declare siteId: string;
  declare objective: CreationOptional<string>;
  declare design: TrialDesign;
  declare blocks: number;
  declare plotLengthM: number;
  declare plotWidthM: number;
  declare harvestAreaM2: number;
  declare quadratAreaM2: number;
  declare plantingDate: string | null;
  declare randomSeed: CreationOptional<number>;
  declare serpentine: CreationOptional<boolean>;
  declare status: CreationOptional<TrialStatus>;
  declare ownerId: string;
  /** Moves (by trigger) whenever data an analysis reads change; keys cached results. */
  declare dataRevision: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Trial.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        title: { type: DataTypes.STRING(200), allowNull: false },
        crop: { type: DataTypes.STRING(80), allowNull: false },
        season: { type: DataTypes.STRING(20), allowNull: false },
        siteId: { type: DataTypes.UUID, allowNull: false },
        objective: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        design: { type: DataTypes.STRING(10), allowNull: false },
        blocks: { type: DataTypes.INTEGER, allowNull: false },
        plotLengthM: { type: DataTypes.DOUBLE, allowNull: false },
        plotWidthM: { type: DataTypes.DOUBLE, allowNull: false },
        harvestAreaM2: { type: DataTypes.DOUBLE, allowNull: false },
        quadratAreaM2: { type: DataTypes.DOUBLE, allowNull: false },
        plantingDate: { type: DataTypes.DATEONLY, allowNull: true },
        randomSeed: { type: DataTypes.INTEGER, allowNull: false },
        serpentine: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "draft" },
        ownerId: { type: DataTypes.UUID, allowNull: false },
        dataRevision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "trials", modelName: "Trial" },
    );
  }
}
