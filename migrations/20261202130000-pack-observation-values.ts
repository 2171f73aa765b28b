import type { MigrationParams } from "./types";

/*
 * A version's values for one plot are written once and never changed (a later version
 * supersedes the plot's set), so they are now stored together: one row per observation set
 * holding the quadrats, species and values as three arrays of equal length, in the order
 * they were recorded. A 100,000-value upload becomes 500 rows instead of 100,000, and its
 * write costs a twentieth of what it did; reading an assessment's current values is one
 * index scan over its current sets.
 *
 * Every reader keeps its row-per-value shape: the views observations (all values, current
 * and replaced) and current_observations unnest the arrays. Integrity stays in the
 * database: a row belongs to a set of its version and plot (foreign key, cascading with the
 * set), the arrays match in length and hold no nulls, quadrats are counted from 1, and a
 * plot without values has no row.
 *
 * The arrays are stored uncompressed: compressing them cost more than it saved.
 */

const up_sql = `
CREATE TABLE observation_values (
  version_id uuid NOT NULL,
  plot_id uuid NOT NULL,
  quadrats integer[] NOT NULL,
  species text[] NOT NULL,
  "values" double precision[] NOT NULL,
  PRIMARY KEY (version_id, plot_id),
  FOREIGN KEY (version_id, plot_id) REFERENCES observation_sets (version_id, plot_id) ON DELETE CASCADE,
  CONSTRAINT observation_values_aligned CHECK (
    array_ndims(quadrats) = 1 AND cardinality(quadrats) > 0 AND cardinality(quadrats) = cardinality(species) AND cardinality(quadrats) = cardinality("values")
    AND array_position(quadrats, NULL) IS NULL AND array_position(species, NULL) IS NULL AND array_position("values", NULL) IS NULL
    AND 1 <= ALL (quadrats)
  )
);
ALTER TABLE observation_values ALTER COLUMN quadrats SET STORAGE EXTERNAL, ALTER COLUMN species SET STORAGE EXTERNAL, ALTER COLUMN "values" SET STORAGE EXTERNAL;

INSERT INTO observation_values (version_id, plot_id, quadrats, species, "values")
SELECT added_in_version_id, plot_id, array_agg(quadrat ORDER BY id), array_agg(species::text ORDER BY id), array_agg(value ORDER BY id)
  FROM observations GROUP BY added_in_version_id, plot_id;

DROP TRIGGER observation_sets_delete_values ON observation_sets;
DROP FUNCTION delete_observations_of_sets();
DROP TRIGGER observations_counted_into_sets ON observations;
DROP FUNCTION count_observations_into_sets();
DROP VIEW current_observations;
DROP TABLE observations;
ALTER TABLE observation_sets DROP COLUMN row_count;

CREATE VIEW observations AS
SELECT s.assessment_id, s.plot_id, u.quadrat, u.species, u.value, s.version_id AS added_in_version_id,
       s.replaced_in_version_id, u.position
  FROM observation_sets s
  JOIN observation_values v ON v.version_id = s.version_id AND v.plot_id = s.plot_id
  CROSS JOIN LATERAL unnest(v.quadrats, v.species, v."values") WITH ORDINALITY AS u(quadrat, species, value, position);

CREATE VIEW current_observations AS
SELECT s.assessment_id, s.plot_id, u.quadrat, u.species, u.value, s.version_id AS added_in_version_id, u.position
  FROM observation_sets s
  JOIN observation_values v ON v.version_id = s.version_id AND v.plot_id = s.plot_id
  CROSS JOIN LATERAL unnest(v.quadrats, v.species, v."values") WITH ORDINALITY AS u(quadrat, species, value, position)
 WHERE s.replaced_in_version_id IS NULL;
`;

// The state after 20261202110000: a row per value, counted into its set by a statement trigger.
const down_sql = `
DROP VIEW current_observations;
DROP VIEW observations;
ALTER TABLE observation_sets ADD COLUMN row_count integer NOT NULL DEFAULT 0;
UPDATE observation_sets s SET row_count = cardinality(v.quadrats)
  FROM observation_values v WHERE v.version_id = s.version_id AND v.plot_id = s.plot_id;

CREATE TABLE observations (
  id bigserial NOT NULL,
  assessment_id uuid NOT NULL,
  plot_id uuid NOT NULL,
  quadrat integer NOT NULL,
  species varchar(80) NOT NULL DEFAULT '',
  value double precision NOT NULL,
  added_in_version_id uuid NOT NULL,
  CONSTRAINT observations_pkey PRIMARY KEY (assessment_id, added_in_version_id, id)
);
ALTER SEQUENCE observations_id_seq CACHE 1000;
INSERT INTO observations (assessment_id, plot_id, quadrat, species, value, added_in_version_id)
SELECT s.assessment_id, s.plot_id, u.quadrat, u.species, u.value, s.version_id
  FROM observation_sets s
  JOIN observation_values v ON v.version_id = s.version_id AND v.plot_id = s.plot_id
  CROSS JOIN LATERAL unnest(v.quadrats, v.species, v."values") WITH ORDINALITY AS u(quadrat, species, value, position)
 ORDER BY s.version_id, s.plot_id, u.position;
DROP TABLE observation_values;

CREATE VIEW current_observations AS
SELECT o.id, o.assessment_id, o.plot_id, o.quadrat, o.species, o.value, o.added_in_version_id
  FROM (SELECT DISTINCT assessment_id, version_id FROM observation_sets WHERE replaced_in_version_id IS NULL) current_version
  JOIN observations o ON o.assessment_id = current_version.assessment_id AND o.added_in_version_id = current_version.version_id
 WHERE EXISTS (SELECT 1 FROM observation_sets s
                WHERE s.assessment_id = o.assessment_id AND s.version_id = o.added_in_version_id AND s.plot_id = o.plot_id
                  AND s.replaced_in_version_id IS NULL);

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
  DELETE FROM observations o
   USING (SELECT DISTINCT assessment_id, version_id FROM old_sets) v
   WHERE o.assessment_id = v.assessment_id AND o.added_in_version_id = v.version_id
     AND EXISTS (SELECT 1 FROM old_sets s WHERE s.version_id = o.added_in_version_id AND s.plot_id = o.plot_id);
  RETURN NULL;
END $$;
CREATE TRIGGER observation_sets_delete_values AFTER DELETE ON observation_sets
  REFERENCING OLD TABLE AS old_sets FOR EACH STATEMENT EXECUTE FUNCTION delete_observations_of_sets();
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
