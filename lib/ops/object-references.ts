/**
 * Every column that names an object in storage. A backup copies exactly these objects;
 * a feature that stores files adds its column here.
 */
export const objectReferenceColumns = [
  { table: "uploads", column: "object_key" },
  { table: "photos", column: "object_key" },
  { table: "photos", column: "thumbnail_key" },
] as const;

export function referencedKeysSql(existingTables: Set<string>): string {
  const parts = objectReferenceColumns
    .filter((reference) => existingTables.has(reference.table))
    .map((reference) => `SELECT ${reference.column} AS key FROM ${reference.table} WHERE ${reference.column} IS NOT NULL`);
  return parts.length ? `${parts.join(" UNION ")} ORDER BY key` : "SELECT NULL::text AS key WHERE false";
}
