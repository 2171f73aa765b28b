import type { MigrationParams } from "./types";

/*
 * A counter on each trial that moves whenever anything an analysis reads changes: a new or
 * removed data version, treatments, assessments, plots. Cached results are keyed by it, so a
 * cache hit needs only the trial row the permission check loads anyway. Kept by triggers so no
 * write path can forget it. Statement-level triggers with transition tables bump a trial once
 * per statement, not once per row (a layout writes hundreds of plots in one statement);
 * PostgreSQL allows a transition table only on single-event triggers, hence one per event.
 */
const watched = ["dataset_versions", "treatments", "assessments", "plots"];
const events = [
  { event: "INSERT", table: "NEW" },
  { event: "UPDATE", table: "NEW" },
  { event: "DELETE", table: "OLD" },
];

const triggerName = (table: string, event: string) => `${table}_bump_trial_data_revision_on_${event.toLowerCase()}`;

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
    await run(`ALTER TABLE trials ADD COLUMN data_revision integer NOT NULL DEFAULT 0`);
    await run(`
      CREATE FUNCTION bump_trial_data_revision() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        UPDATE trials SET data_revision = data_revision + 1 WHERE id IN (SELECT DISTINCT trial_id FROM changed_rows);
        RETURN NULL;
      END $$`);
    for (const table of watched) {
      for (const { event, table: transition } of events) {
        await run(
          `CREATE TRIGGER ${triggerName(table, event)} AFTER ${event} ON ${table}
             REFERENCING ${transition} TABLE AS changed_rows FOR EACH STATEMENT EXECUTE FUNCTION bump_trial_data_revision()`,
        );
      }
    }
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    const run = (sql: string) => queryInterface.sequelize.query(sql, { transaction });
    for (const table of watched) {
      for (const { event } of events) await run(`DROP TRIGGER IF EXISTS ${triggerName(table, event)} ON ${table}`);
    }
    await run(`DROP FUNCTION IF EXISTS bump_trial_data_revision()`);
    await run(`ALTER TABLE trials DROP COLUMN data_revision`);
  });
}
