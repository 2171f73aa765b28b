import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

import type { CheckType, MethodCategory } from "@/lib/trials/vocabulary";

export { checkTypes, methodCategories, type CheckType, type MethodCategory } from "@/lib/trials/vocabulary";

export class Treatment extends Model<InferAttributes<Treatment>, InferCreationAttributes<Treatment>> {
  declare id: CreationOptional<string>;
  declare trialId: string;
  /** Order in the treatment list (1-based); the randomization draws from this order. */
  declare position: number;
  declare code: string;
  declare name: string;
  declare category: MethodCategory;
  /** Which check this is, so percent control and weed index know their baselines. */
  declare checkType: CheckType | null;
  declare description: CreationOptional<string>;
  declare timing: CreationOptional<string>;
  declare rateOrSettings: CreationOptional<string>;
  declare passes: CreationOptional<number>;
  declare labourHoursPerHa: number | null;
  declare materialCostPerHa: number | null;
  declare equipmentCost: number | null;
  declare equipmentLifeYears: number | null;
  declare equipmentHaPerYear: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Treatment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        code: { type: DataTypes.STRING(8), allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        category: { type: DataTypes.STRING(16), allowNull: false },
        checkType: { type: DataTypes.STRING(10), allowNull: true },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        timing: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        rateOrSettings: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        passes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        labourHoursPerHa: { type: DataTypes.DOUBLE, allowNull: true },
        materialCostPerHa: { type: DataTypes.DOUBLE, allowNull: true },
        equipmentCost: { type: DataTypes.DOUBLE, allowNull: true },
        equipmentLifeYears: { type: DataTypes.DOUBLE, allowNull: true },
        equipmentHaPerYear: { type: DataTypes.DOUBLE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "treatments", modelName: "Treatment" },
    );
  }
}
