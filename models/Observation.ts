import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/**
 * A raw value as recorded in the field: one quadrat (and species, where recorded) of one
 * plot. Rows are never updated in place: a change closes the old row (replacedInVersionId)
 * and adds a new one, so raw values are never overwritten.
 */
export class Observation extends Model<InferAttributes<Observation>, InferCreationAttributes<Observation>> {
  declare id: CreationOptional<number>;
  declare assessmentId: string;
  declare plotId: string;
  declare quadrat: number;
  declare species: CreationOptional<string>;
  declare value: number;
  declare addedInVersionId: string;
  declare replacedInVersionId: string | null;

  static initModel(sequelize: Sequelize): void {
    Observation.init(
      {
        id: { type: DataTypes.BIGINT, autoIncrement: true, primaryKey: true },
        assessmentId: { type: DataTypes.UUID, allowNull: false },
        plotId: { type: DataTypes.UUID, allowNull: false },
        quadrat: { type: DataTypes.INTEGER, allowNull: false },
        species: { type: DataTypes.STRING(80), allowNull: false, defaultValue: "" },
        value: { type: DataTypes.DOUBLE, allowNull: false },
        addedInVersionId: { type: DataTypes.UUID, allowNull: false },
        replacedInVersionId: { type: DataTypes.UUID, allowNull: true },
      },
      { sequelize, tableName: "observations", modelName: "Observation", timestamps: false },
    );
  }
}
