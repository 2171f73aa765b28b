import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class Plot extends Model<InferAttributes<Plot>, InferCreationAttributes<Plot>> {
  declare id: CreationOptional<string>;
  declare trialId: string;
  /** Field convention: block × 100 + position (101, 102, …, 201, …). */
  declare number: number;
  declare block: number;
  /** Position of the plot within its block, 1-based, in field order. */
  declare position: number;
  /** Cell in the field grid: row 1 is the first block's band, column 1 the west end. */
  declare row: number;
  declare column: number;
  /** Order a person walking the field meets the plots (serpentine or not). */
  declare walkOrder: number;
  declare treatmentId: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Plot.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        trialId: { type: DataTypes.UUID, allowNull: false },
        number: { type: DataTypes.INTEGER, allowNull: false },
        block: { type: DataTypes.INTEGER, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        row: { type: DataTypes.INTEGER, allowNull: false },
        column: { type: DataTypes.INTEGER, allowNull: false },
        walkOrder: { type: DataTypes.INTEGER, allowNull: false },
        treatmentId: { type: DataTypes.UUID, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "plots", modelName: "Plot" },
    );
  }
}
