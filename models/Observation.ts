import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

/**
 * A raw value as recorded in the field: one quadrat (and species, where recorded) of one
 * plot. Rows are never updated: a later version covering the plot supersedes its set
 * (observation_sets) and adds new rows, so raw values are never overwritten. Current values
 * are read through the view current_observations. In the database the primary key is
 * (assessment_id, added_in_version_id, id), the one index every read uses; id alone is
 * unique too, which is all Sequelize needs to know.
 */
export class Observation extends Model<InferAttributes<Observation>, InferCreationAttributes<Observation>> {
  declare id: CreationOptional<number>;
  declare assessmentId: string;
  declare plotId: string;
  declare quadrat: number;
  declare species: CreationOptional<string>;
  declare value: number;
  declare addedInVersionId: string;

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
      },
      { sequelize, tableName: "observations", modelName: "Observation", timestamps: false },
    );
  }
}
