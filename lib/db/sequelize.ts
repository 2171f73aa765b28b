import { Sequelize } from "sequelize";
import pg from "pg";
import { config } from "@/lib/config";
import { initModels } from "@/models";

// DATE and NUMERIC come back as strings by default; trial data want numbers and plain dates.
pg.types.setTypeParser(1700, (value: string) => Number(value));
pg.types.setTypeParser(1082, (value: string) => value);

const globalForDb = globalThis as unknown as { hoebenchSequelize?: Sequelize };

/**
 * Model classes are process-wide, so only one connection may own them; a further one (a
 * second pool in a test, say) passes bindModels: false and works through transactions.
 */
export function createSequelize(databaseUrl: string, poolMax = 10, options: { bindModels?: boolean } = {}): Sequelize {
  const sequelize = new Sequelize(databaseUrl, {
    dialect: "postgres",
    dialectModule: pg,
    logging: false,
    pool: { max: poolMax, min: 0, idle: 10_000, acquire: 20_000 },
    define: { underscored: true },
  });
  if (options.bindModels !== false) initModels(sequelize);
  return sequelize;
}

/** One pool per process; dev reloads reuse it instead of leaking connections. */
export function db(): Sequelize {
  if (!globalForDb.hoebenchSequelize) {
    const { DATABASE_URL, DATABASE_POOL_MAX } = config();
    globalForDb.hoebenchSequelize = createSequelize(DATABASE_URL, DATABASE_POOL_MAX);
  }
  initModels(globalForDb.hoebenchSequelize);
  return globalForDb.hoebenchSequelize;
}
