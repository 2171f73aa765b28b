import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      "trials",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        title: { type: DataTypes.STRING(200), allowNull: false },
        crop: { type: DataTypes.STRING(80), allowNull: false },
        season: { type: DataTypes.STRING(20), allowNull: false },
        site_id: { type: DataTypes.UUID, allowNull: false, references: { model: "sites", key: "id" }, onDelete: "RESTRICT" },
        objective: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        design: { type: DataTypes.STRING(10), allowNull: false },
        blocks: { type: DataTypes.INTEGER, allowNull: false },
        plot_length_m: { type: DataTypes.DOUBLE, allowNull: false },
        plot_width_m: { type: DataTypes.DOUBLE, allowNull: false },
        harvest_area_m2: { type: DataTypes.DOUBLE, allowNull: false },
        quadrat_area_m2: { type: DataTypes.DOUBLE, allowNull: false },
        planting_date: { type: DataTypes.DATEONLY, allowNull: true },
        random_seed: { type: DataTypes.INTEGER, allowNull: false },
        serpentine: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        status: { type: DataTypes.STRING(12), allowNull: false, defaultValue: "draft" },
        owner_id: { type: DataTypes.UUID, allowNull: false, references: { model: "users", key: "id" }, onDelete: "RESTRICT" },
        created_at: { type: DataTypes.DATE, allowNull: false },
        updated_at: { type: DataTypes.DATE, allowNull: false },
      },
      { transaction },
    );
    await queryInterface.addConstraint("trials", {
      type: "check", fields: ["design"], name: "trials_design_known",
      where: { design: ["rcbd", "crd", "latin"] }, transaction,
    });
    await queryInterface.addConstraint("trials", {
      type: "check", fields: ["status"], name: "trials_status_known",
      where: { status: ["draft", "active", "locked", "published"] }, transaction,
    });
    await queryInterface.addIndex("trials", ["owner_id"], { transaction });
    await queryInterface.addIndex("trials", ["status", "crop", "season"], { transaction });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.dropTable("trials");
}
