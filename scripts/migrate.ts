/** `npm run migrate`: applies pending migrations to DATABASE_URL (one release step in production). */
import { config } from "@/lib/config";
import { createSequelize } from "@/lib/db/sequelize";
import { migrateUp } from "@/lib/db/migrator";

async function main(): Promise<void> {
  const sequelize = createSequelize(config().DATABASE_URL, 1);
  try {
    const applied = await migrateUp(sequelize);
    process.stdout.write(applied.length ? `applied: ${applied.join(", ")}\n` : "schema is up to date\n");
  } finally {
    await sequelize.close();
  }
}

main().catch((error: Error) => {
  process.stderr.write(`migration failed: ${error.message}\n`);
  process.exit(1);
});
