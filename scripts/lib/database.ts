import { createSequelize } from "@/lib/db/sequelize";
import { migrateUp } from "@/lib/db/migrator";
import { seedDemo } from "@/lib/demo/seed";
import { say } from "./log";
import { projectRoot } from "./environment";

/** Migrates a database and seeds the demo when it is empty; safe to run any number of times. */
export async function prepareDatabase(databaseUrl: string, options: { seed: boolean }): Promise<void> {
  const sequelize = createSequelize(databaseUrl, 2);
  try {
    const applied = await migrateUp(sequelize, projectRoot);
    say(applied.length ? `applied migrations: ${applied.join(", ")}` : "database schema is up to date");
    if (options.seed) {
      const outcome = await seedDemo(sequelize);
      say(outcome === "seeded" ? "seeded the demo scenario" : "demo data already present; left as it is");
    }
  } finally {
    await sequelize.close();
  }
}
