import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.createTable("sites", {
    id: { type: DataTypes.UUID, primaryKey: true },
    name: { type: DataTypes.STRING(160), allowNull: false },
    location: { type: DataTypes.STRING(200), allowNull: false },
    region: { type: DataTypes.STRING(120), allowNull: false },
    soil: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
    latitude: { type: DataTypes.DOUBLE, allowNull: true },
    longitude: { type: DataTypes.DOUBLE, allowNull: true },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: "users", key: "id" }, onDelete: "SET NULL" },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.dropTable("sites");
}
