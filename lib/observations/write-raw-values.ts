import type { Sequelize, Transaction } from "sequelize";

export interface RawValueRow {
  plotId: string;
  quadrat: number;
  species?: string;
  value: number;
}

/** A PostgreSQL array literal, every element quoted (a replacement list would not be an array). */
const arrayLiteral = (items: readonly (string | number)[]) => `{${items.map((item) => `"${String(item).replace(/["\\]/g, (mark) => `\\${mark}`)}"`).join(",")}}`;

/**
 * Writes raw values straight into a version's observation sets in one statement, for writers
 * outside the app's upload path: the demo seed, and tests (browser specs cannot load the
 * server-only commitVersion). The version must exist; its sets were opened by its trigger.
 */
export async function writeRawValues(sequelize: Sequelize, versionId: string, rows: readonly RawValueRow[], transaction?: Transaction): Promise<void> {
  await sequelize.query(
    `WITH v AS (
       SELECT * FROM unnest(:plotIds::uuid[], :quadrats::int[], :species::text[], :values::float8[]) WITH ORDINALITY AS v(plot_id, quadrat, species, value, position)
     ), names AS (
       SELECT plot_id, array_agg(species ORDER BY first) AS list
         FROM (SELECT plot_id, species, min(position) AS first FROM v GROUP BY plot_id, species) met GROUP BY plot_id
     )
     INSERT INTO observation_values (version_id, plot_id, quadrats, species_names, species_numbers, "values")
     SELECT :versionId, v.plot_id, array_agg(v.quadrat ORDER BY v.position), names.list,
            array_agg(array_position(names.list, v.species) ORDER BY v.position), array_agg(v.value ORDER BY v.position)
       FROM v JOIN names ON names.plot_id = v.plot_id
      GROUP BY v.plot_id, names.list`,
    {
      replacements: {
        versionId,
        plotIds: arrayLiteral(rows.map((row) => row.plotId)),
        quadrats: arrayLiteral(rows.map((row) => row.quadrat)),
        species: arrayLiteral(rows.map((row) => row.species ?? "")),
        values: arrayLiteral(rows.map((row) => row.value)),
      },
      transaction,
    },
  );
}
