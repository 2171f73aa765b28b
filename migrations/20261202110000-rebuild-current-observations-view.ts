import type { MigrationParams } from "./types";

/*
 * Reads of current values go version first: the few versions that hold an assessment's
 * current sets, their rows through the primary key (assessment, version, id), then the plot
 * check against the sets. Joining set by set instead lets the planner, with statistics that
 * predate a fresh 100,000-row version, pick one primary-key range scan per plot: 500 scans of
 * the whole version. Deleting sets' values takes the same path.
 */

const up_sql = `
CREATE OR REPLACE VIEW current_observations AS
SELECT o.id, o.assessment_id, o.plot_id, o.quadrat, o.species, o.value, o.added_in_version_id
  FROM (SELECT DISTINCT assessment_id, version_id FROM observation_sets WHERE replaced_in_version_id IS NULL) current_version
  JOIN observations o ON o.assessment_id = current_version.assessment_id AND o.added_in_version_id = current_version.version_id
 WHERE EXISTS (SELECT 1 FROM observation_sets s
                WHERE s.assessment_id = o.assessment_id AND s.version_id = o.added_in_version_id AND s.plot_id = o.plot_id
                  AND s.replaced_in_version_id IS NULL);

CREATE OR REPLACE FUNCTION delete_observations_of_sets() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM observations o
   USING (SELECT DISTINCT assessment_id, version_id FROM old_sets) v
   WHERE o.assessment_id = v.assessment_id AND o.added_in_version_id = v.version_id
     AND EXISTS (SELECT 1 FROM old_sets s WHERE s.version_id = o.added_in_version_id AND s.plot_id = o.plot_id);
  RETURN NULL;
END $$;
`;

const down_sql = `
CREATE OR REPLACE VIEW current_observations AS
SELECT o.id, o.assessment_id, o.plot_id, o.quadrat, o.species, o.value, o.added_in_version_id
  FROM observation_sets s
  JOIN observations o ON o.assessment_id = s.assessment_id AND o.added_in_version_id = s.version_id AND o.plot_id = s.plot_id
 WHERE s.replaced_in_version_id IS NULL;

CREATE OR REPLACE FUNCTION delete_observations_of_sets() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM observations o USING old_sets s
   WHERE o.assessment_id = s.assessment_id AND o.added_in_version_id = s.version_id AND o.plot_id = s.plot_id;
  RETURN NULL;
END $$;
`;

export async function up({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.sequelize.query(up_sql, { transaction });
  });
}

export async function down({ context: queryInterface }: MigrationParams): Promise<void> {
  await queryInterface.sequelize.transaction(async (transaction) => {
    await queryInterface.sequelize.query(down_sql, { transaction });
  });
}
