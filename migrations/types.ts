import type { QueryInterface } from "sequelize";

/** What umzug hands every migration. */
export interface MigrationParams {
  context: QueryInterface;
}
