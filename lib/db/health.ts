import "server-only";
import { db } from "./sequelize";

export async function databaseReachable(): Promise<boolean> {
  try {
    await db().query("SELECT 1");
    return true;
  } catch {
    return false;
  }
}
