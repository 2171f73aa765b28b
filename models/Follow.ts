import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export const followKinds = ["crop", "method"] as const;
export type FollowKind = (typeof followKinds)[number];

/** A signed-in reader following a crop or a method category, to hear of new published trials. */
export class Follow extends Model<InferAttributes<Follow>, InferCreationAttributes<Follow>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare kind: FollowKind;
  declare value: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Follow.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        userId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(10), allowNull: false },
        value: { type: DataTypes.STRING(80), allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: "follows", modelName: "Follow", updatedAt: false },
    );
  }
}
