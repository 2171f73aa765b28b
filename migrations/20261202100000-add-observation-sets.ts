import type { MigrationParams } from "./types";

/*
 * A version supersedes earlier values plot by plot instead of closing every old row.
 *
 * Closing 100,000 replaced rows one by one (replaced_in_version_id) and checking two foreign
 * keys per inserted row cost seconds per upload. Now each version owns one observation set
 * per plot it covers (an upload: every plot of the trial; a per-plot entry: that plot), and a
 * new version closes the earlier sets of those plots: a few hundred small rows instead of
 * 100,000 updates. A value is current when its set is; the view current_observations says so
 * once for every reader.
 *
 * The sets carry the foreign keys to plots, assessments and versions. Observations keep
 * their integrity through them: an insert statement is refused unless every row belongs to a
 * set of its version (and it counts the set's rows), and deleting a set (with its plot,
 * assessment or version) deletes its values; both run once per statement, not per row.
 * One value per plot, quadrat and species in a version is checked before the insert
 * (lib/observations/commit-version.ts), where it costs a fraction of a unique index.
 *
 * The sets are opened by a trigger on dataset_versions, so every writer of a version (the
 * app, the demo seed, tests that insert versions directly) gets them without knowing.
 */

const up_sql = `
ALTER TABLE dataset_versions ADD COLUMN scope_plot_ids uuid[];
COMMENT ON COLUMN dataset_versions.scope_plot_ids IS 'Plots whose earlier values this version replaces; NULL: the whole assessment.';

CREATE TABLE observation_sets (
  version_id uuid NOT NULL REFERENCES dataset_versions(id) ON DELETE CASCADE,
  plot_id uuid NOT NULL REFERENCES plots(id) ON DELETE CASCADE,
  assessment_id uuid NOT NULL REFERENCES assessments(id) ON DELETE CASCADE,
  replaced_in_version_id uuid REFERENCES dataset_versions(id) ON DELETE CASCADE,
  row_count integer NOT NULL DEFAULT 0,
  PRIMARY KEY (version_id, plot_id)
);
CREATE UNIQUE INDEX observation_sets_current ON observation_sets (assessment_id, plot_id) WHERE replaced_in_version_id IS NULL;
CREATE INDEX observation_sets_replaced_in_version_id ON observation_sets (replaced_in_version_id);
CREATE INDEX observation_sets_plot_id ON observation_sets (plot_id);

-- Each plot's versions in order: a set is replaced by the next version that touched the plot.
INSERT INTO observation_sets (version_id, plot_id, assessment_id, replaced_in_version_id, row_count)
SELECT touched.version_id, touched.plot_id, touched.assessment_id,
       lead(touched.version_id) OVER (PARTITION BY touched.assessment_id, touched.plot_id ORDER BY v.number),
       (SELECT count(*) FROM observations o WHERE o.added_in_version_id = touched.version_id AND o.plot_id = touched.plot_id)
  FROM (SELECT assessment_id, plot_id, added_in_version_id AS version_id FROM observations
         UNION
        SELECT assessment_id, plot_id, replaced_in_version_id FROM observations WHERE replaced_in_version_id IS NOT NULL) touched
  JOIN dataset_versions v ON v.id = touched.version_id;

ALTER TABLE observations DROP CONSTRAINT observations_assessment_id_fkey;
ALTER TABLE observations DROP CONSTRAINT observations_plot_id_fkey;
DROP INDEX observations_current_unique;
DROP INDEX observations_added_in_version_id;
DROP INDEX observations_replaced_in_version_id;
ALTER TABLE observations DROP COLUMN replaced_in_version_id;
-- One index serves every read: an assessment's values, a version's values, a set's values.
ALTER TABLE observations DROP CONSTRAINT observations_pkey;
ALTER TABLE observations ADD CONSTRAINT observations_pkey PRIMARY KEY (assessment_id, added_in_version_id, id);
-- Ids identify rows; nothing orders by them across sessions, and fetching them one by one is a third of a bulk insert's cost.
ALTER SEQUENCE observations_id_seq CACHE 1000;

CREATE VIEW current_observations AS
SELECT o.id, o.assessment_id, o.plot_id, o.quadrat, o.species, o.value, o.added_in_version_id
  FROM observation_sets s
  JOIN observations o ON o.assessment_id = s.assessment_id AND o.added_in_version_id = s.version_id AND o.plot_id = s.plot_id
 WHERE s.replaced_in_version_id IS NULL;

CREATE FUNCTION open_observation_sets() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE observation_sets SET replaced_in_version_id = NEW.id
   WHERE assessment_id = NEW.assessment_id AND replaced_in_version_id IS NULL
     AND (NEW.scope_plot_ids IS NULL OR plot_id = ANY (NEW.scope_plot_ids));
  INSERT INTO observation_sets (version_id, plot_id, assessment_id)
  SELECT NEW.id, p.id, NEW.assessment_id FROM plots p
   WHERE p.trial_id = NEW.trial_id AND (NEW.scope_plot_ids IS NULL OR p.id = ANY (NEW.scope_plot_ids));
  RETURN NULL;
END $$;
CREATE TRIGGER dataset_versions_open_sets AFTER INSERT ON dataset_versions
  FOR EACH ROW EXECUTE FUNCTION open_observation_sets();

CREATE FUNCTION count_observations_into_sets() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  groups integer;
  counted integer;
BEGIN
  WITH per_set AS (
    SELECT assessment_id, added_in_version_id, plot_id, count(*)::integer AS n FROM new_observations GROUP BY 1, 2, 3
  ), counted_sets AS (
    UPDATE observation_sets s SET row_count = s.row_count + per_set.n FROM per_set
     WHERE s.version_id = per_set.added_in_version_id AND s.plot_id = per_set.plot_id AND s.assessment_id = per_set.assessment_id
    RETURNING 1
  )
  SELECT (SELECT count(*) FROM per_set), (SELECT count(*) FROM counted_sets) INTO groups, counted;
  IF groups <> counted THEN
    RAISE EXCEPTION 'observations must belong to an observation set of their version (plot and assessment)' USING ERRCODE = 'foreign_key_violation';
  END IF;
  RETURN NULL;
END $$;
CREATE TRIGGER observations_counted_into_sets AFTER INSERT ON observations
  REFERENCING NEW TABLE AS new_observations FOR EACH STATEMENT EXECUTE FUNCTION count_observations_into_sets();

CREATE FUNCTION delete_observations_of_sets() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM observations o USING old_sets s
   WHERE o.assessment_id = s.assessment_id AND o.added_in_version_id = s.version_id AND o.plot_id = s.plot_id;
  RETURN NULL;
END $$;
CREATE TRIGGER observation_sets_delete_values AFTER DELETE ON observation_sets
  REFERENCING OLD TABLE AS old_sets FOR EACH STATEMENT EXECUTE FUNCTION delete_observations_of_sets();
`;

const down_sql = `
DROP TRIGGER observation_sets_delete_values ON observation_sets;
DROP FUNCTION delete_observations_of_sets();
DROP TRIGGER observations_counted_into_sets ON observations;
DROP FUNCTION count_observations_into_sets();
DROP TRIGGER dataset_versions_open_sets ON dataset_versions;
DROP FUNCTION open_observation_sets();
DROP VIEW current_observations;

ALTER SEQUENCE observations_id_seq CACHE 1;
ALTER TABLE observations DROP CONSTRAINT observations_pkey;
ALTER TABLE observations ADD CONSTRAINT observations_pkey PRIMARY KEY (id);
ALTER TABLE observations ADD COLUMN replaced_in_version_id uuid;
UPDATE observations o SET replaced_in_version_id = s.replaced_in_version_id
  FROM observation_sets s
 WHERE s.replaced_in_version_id IS NOT NULL
   AND o.assessment_id = s.assessment_id AND o.added_in_version_id = s.version_id AND o.plot_id = s.plot_id;
CREATE UNIQUE INDEX observations_current_unique ON observations (assessment_id, plot_id, quadrat, species) WHERE replaced_in_version_id IS NULL;
CREATE INDEX observations_added_in_version_id ON observations (added_in_version_id);
CREATE INDEX observations_replaced_in_version_id ON observations (replaced_in_version_id);
ALTER TABLE observations ADD CONSTRAINT observations_assessment_id_fkey FOREIGN KEY (assessment_id) REFERENCES assessments(id) ON DELETE CASCADE;
ALTER TABLE observations ADD CONSTRAINT observations_plot_id_fkey FOREIGN KEY (plot_id) REFERENCES plots(id) ON DELETE CASCADE;

DROP TABLE observation_sets;
ALTER TABLE dataset_versions DROP COLUMN scope_plot_ids;
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
