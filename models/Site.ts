import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from "sequelize";

export class Site extends Model<InferAttributes<Site>, InferCreationAttributes<Site>> {
  declare id: CreationOptional<string>;
  declare name: string;
  declare location: string;
  declare region: string;
  declare soil: CreationOptional<string>;
  declare notes: CreationOptional<string>;
  declare latitude: number | null;
  declare longitude: number | null;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Site.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        location: { type: DataTypes.STRING(200), allowNull: false },
        region: { type: DataTypes.STRING(120), allowNull: false },
        soil: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        latitude: { type: DataTypes.DOUBLE, allowNull: true },
        longitude: { type: DataTypes.DOUBLE, allowNull: true },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: "sites", modelName: "Site" },
    );
  }
}
