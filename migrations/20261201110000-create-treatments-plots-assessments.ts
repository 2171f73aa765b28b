import { DataTypes } from "sequelize";
import type { MigrationParams } from "./types";

const timestamps = {
  created_at: { type: DataTypes.DATE, allowNull: false },
  updated_at: { type: DataTypes.DATE, allowNull: false },
};
const trialReference = { type: DataTypes.UUID, allowNull: false, references: { model: "trials", key: "id" }, onDelete: "CASCADE" } as const;

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.createTable(
      "treatments",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: trialReference,
        position: { type: DataTypes.INTEGER, allowNull: false },
        code: { type: DataTypes.STRING(8), allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        category: { type: DataTypes.STRING(16), allowNull: false },
        check_type: { type: DataTypes.STRING(10), allowNull: true },
        description: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        timing: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        rate_or_settings: { type: DataTypes.STRING(200), allowNull: false, defaultValue: "" },
        passes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        labour_hours_per_ha: { type: DataTypes.DOUBLE, allowNull: true },
        material_cost_per_ha: { type: DataTypes.DOUBLE, allowNull: true },
        equipment_cost: { type: DataTypes.DOUBLE, allowNull: true },
        equipment_life_years: { type: DataTypes.DOUBLE, allowNull: true },
        equipment_ha_per_year: { type: DataTypes.DOUBLE, allowNull: true },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addConstraint("treatments", { type: "unique", fields: ["trial_id", "code"], name: "treatments_code_unique_in_trial", transaction });
    await queryInterface.addConstraint("treatments", {
      type: "check", fields: ["category"], name: "treatments_category_known",
      where: { category: ["check", "hand", "mulch", "cultivation", "thermal", "robotic", "chemical", "other"] }, transaction,
    });
    await queryInterface.sequelize.query(
      "ALTER TABLE treatments ADD CONSTRAINT treatments_check_type_known CHECK (check_type IS NULL OR check_type IN ('weedy', 'weed-free'))",
      { transaction },
    );

    await queryInterface.createTable(
      "plots",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: trialReference,
        number: { type: DataTypes.INTEGER, allowNull: false },
        block: { type: DataTypes.INTEGER, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        row: { type: DataTypes.INTEGER, allowNull: false },
        column: { type: DataTypes.INTEGER, allowNull: false },
        walk_order: { type: DataTypes.INTEGER, allowNull: false },
        treatment_id: { type: DataTypes.UUID, allowNull: false, references: { model: "treatments", key: "id" }, onDelete: "RESTRICT" },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addConstraint("plots", { type: "unique", fields: ["trial_id", "number"], name: "plots_number_unique_in_trial", transaction });

    await queryInterface.createTable(
      "assessments",
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        trial_id: trialReference,
        position: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(120), allowNull: false },
        variable: { type: DataTypes.STRING(24), allowNull: false },
        unit: { type: DataTypes.STRING(40), allowNull: false },
        planned_date: { type: DataTypes.DATEONLY, allowNull: true },
        timing_days: { type: DataTypes.INTEGER, allowNull: true },
        timing_reference: { type: DataTypes.STRING(12), allowNull: true },
        quadrats_per_plot: { type: DataTypes.INTEGER, allowNull: false },
        plausible_min: { type: DataTypes.DOUBLE, allowNull: true },
        plausible_max: { type: DataTypes.DOUBLE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: "" },
        ...timestamps,
      },
      { transaction },
    );
    await queryInterface.addConstraint("assessments", {
      type: "check", fields: ["variable"], name: "assessments_variable_known",
      where: { variable: ["weed-density", "weed-biomass", "crop-yield", "crop-injury", "weed-control-rating", "labour-time", "custom"] },
      transaction,
    });
    await queryInterface.sequelize.query(
      "ALTER TABLE assessments ADD CONSTRAINT assessments_quadrats_positive CHECK (quadrats_per_plot BETWEEN 1 AND 50)",
      { transaction },
    );
    for (const table of ["treatments", "plots", "assessments"]) {
      await queryInterface.addIndex(table, ["trial_id"], { transaction });
    }
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.dropTable("plots", { transaction });
    await queryInterface.dropTable("assessments", { transaction });
    await queryInterface.dropTable("treatments", { transaction });
  });
}
