import type { Sequelize } from "sequelize";
import { createSequelize } from "@/lib/db/sequelize";
import { testEnvironment } from "./environment";

let shared: Sequelize | undefined;

/** The real test database (never a mock), reached only on loopback. */
export function testDatabase(): Sequelize {
  if (!shared) shared = createSequelize(testEnvironment().databaseUrl, 4);
  return shared;
}
