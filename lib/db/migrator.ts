import path from "node:path";
import { Umzug, SequelizeStorage } from "umzug";
import type { Sequelize } from "sequelize";
import type { MigrationParams } from "@/migrations/types";

type MigrationModule = {
  up: (params: MigrationParams) => Promise<void>;
  down: (params: MigrationParams) => Promise<void>;
};

/** Migrations are files named YYYYMMDDHHMMSS-verb-noun.ts; umzug records each one run. */
export function createMigrator(sequelize: Sequelize, projectRoot = process.cwd()) {
  return new Umzug<MigrationParams["context"]>({
    migrations: {
      glob: ["migrations/[0-9]*-*.ts", { cwd: projectRoot }],
      resolve: ({ name, path: filePath, context }) => ({
        name,
        up: async () => ((await import(path.resolve(filePath!))) as MigrationModule).up({ context }),
        down: async () => ((await import(path.resolve(filePath!))) as MigrationModule).down({ context }),
      }),
    },
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: "schema_migrations" }),
    logger: undefined,
  });
}

export async function migrateUp(sequelize: Sequelize, projectRoot?: string): Promise<string[]> {
  const applied = await createMigrator(sequelize, projectRoot).up();
  return applied.map((migration) => migration.name);
}
