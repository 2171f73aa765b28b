import type { MigrationParams } from "./types";

/*
 * A plot's values in one version (a few hundred quadrats and species: a few kilobytes) stay in
 * their row instead of being moved out to TOAST as soon as the row passes 2 kB. Writing a
 * 100,000-value upload then touches 500 heap rows instead of also a thousand TOAST chunks and
 * their index (measured: about a tenth off the whole upload), and reading a set needs no
 * detoasting. A set past about 8 kB (thousands of values for one plot) still moves out.
 */

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.query("ALTER TABLE observation_values SET (toast_tuple_target = 8160)");
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.query("ALTER TABLE observation_values RESET (toast_tuple_target)");
}
