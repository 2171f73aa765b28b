/** `npm run seed`: seeds the invented demo scenario into an empty DATABASE_URL. */
import { config } from "@/lib/config";
import { createSequelize } from "@/lib/db/sequelize";
import { seedDemo } from "@/lib/demo/seed";

async function main(): Promise<void> {
  const sequelize = createSequelize(config().DATABASE_URL, 1);
  try {
    process.stdout.write(`${await seedDemo(sequelize)}\n`);
  } finally {
    await sequelize.close();
  }
}

main().catch((error: Error) => {
  process.stderr.write(`seeding failed: ${error.message}\n`);
  process.exit(1);
});
