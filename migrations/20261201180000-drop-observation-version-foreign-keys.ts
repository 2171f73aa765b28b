import type { MigrationParams } from "./types";

/**
 * The two version columns of observations are written only by commitVersion, in the same
 * transaction as the version row, and versions are removed only with their assessment (which
 * removes its observations too). Their per-row foreign-key checks doubled the cost of a
 * 100,000-row commit, so they go; plot and assessment keep theirs.
 */
export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.removeConstraint("observations", "observations_added_in_version_id_fkey", { transaction });
    await queryInterface.removeConstraint("observations", "observations_replaced_in_version_id_fkey", { transaction });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.addConstraint("observations", {
      type: "foreign key", fields: ["added_in_version_id"], name: "observations_added_in_version_id_fkey",
      references: { table: "dataset_versions", field: "id" }, onDelete: "CASCADE", onUpdate: "NO ACTION", transaction,
    });
    await queryInterface.addConstraint("observations", {
      type: "foreign key", fields: ["replaced_in_version_id"], name: "observations_replaced_in_version_id_fkey",
      references: { table: "dataset_versions", field: "id" }, onDelete: "CASCADE", onUpdate: "NO ACTION", transaction,
    });
  });
}
