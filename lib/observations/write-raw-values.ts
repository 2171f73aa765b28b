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
    `INSERT INTO observation_values (version_id, plot_id, quadrats, species, "values")
     SELECT :versionId, plot_id, array_agg(quadrat ORDER BY position), array_agg(species ORDER BY position), array_agg(value ORDER BY position)
       FROM unnest(:plotIds::uuid[], :quadrats::int[], :species::text[], :values::float8[]) WITH ORDINALITY AS v(plot_id, quadrat, species, value, position)
      GROUP BY plot_id`,
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
