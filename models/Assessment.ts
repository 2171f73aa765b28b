import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

import type { AssessmentVariable, TimingReference } from "@/lib/trials/vocabulary";

export { assessmentVariables, timingReferences, type AssessmentVariable, type TimingReference } from "@/lib/trials/vocabulary";

export class Assessment extends Model<InferAttributes<Assessment>, InferCreationAttributes<Assessment>> {
  declare id: CreationOptional<string>;
  declare trialId: string;
  declare position: number;
  declare name: string;
  declare variable: AssessmentVariable;
  /** Unit of the values technicians record (plants per quadrat, g per quadrat, kg per plot, %, h per plot…). */
  declare unit: string;
  declare plannedDate: string | null;
  /** Days after planting or after treatment, as weed scientists time assessments. */
  declare timingDays: number | null;
  declare timingReference: TimingReference | null;
  declare quadratsPerPlot: number;
  /** Values outside this range are flagged at upload, not refused. */
  declare plausibleMin: number | null;
  declare plausibleMax: number | null;
  declare notes: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Assessment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        variable: { type: DataTypes.STRING(24), allowNull: false },
        unit: { type: DataTypes.STRING(40), allowNull: false },
        plannedDate: { type: DataTypes.DATEONLY, allowNull: true },
        timingDays: { type: DataTypes.INTEGER, allowNull: true },
        timingReference: { type: DataTypes.STRING(12), allowNull: true },
        quadratsPerPlot: { type: DataTypes.INTEGER, allowNull: false },
        plausibleMin: { type: DataTypes.DOUBLE, allowNull: true },
        plausibleMax: { type: DataTypes.DOUBLE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "assessments", modelName: "Assessment" },
    );
  }
}
