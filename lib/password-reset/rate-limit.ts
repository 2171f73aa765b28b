import "server-only";
import { createHash } from "node:crypto";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";

export interface Limit {
  bucket: string;
  max: number;
  windowMs: number;
}

/** Addresses are counted under a hash, so the table holds no list of who asked. */
export function hashedBucket(prefix: string, value: string): string {
  return `${prefix}:${createHash("sha256").update(value).digest("hex").slice(0, 32)}`;
}

/**
 * Records one attempt in every bucket and says whether any bucket is now over its limit.
 * The count lives in PostgreSQL, so all app servers share it.
 */
export async function recordAttempt(limits: Limit[], now = new Date()): Promise<{ allowed: boolean }> {
  const sequelize = db();
  let allowed = true;
  for (const limit of limits) {
    const since = new Date(now.getTime() - limit.windowMs);
    const [row] = await sequelize.query<{ count: string }>(
      `WITH pruned AS (DELETE FROM rate_limit_hits WHERE bucket = :bucket AND created_at < :since),
            added AS (INSERT INTO rate_limit_hits (bucket, created_at) VALUES (:bucket, :now) RETURNING 1)
       SELECT (SELECT count(*) FROM rate_limit_hits WHERE bucket = :bucket AND created_at >= :since) + (SELECT count(*) FROM added) AS count`,
      { type: QueryTypes.SELECT, replacements: { bucket: limit.bucket, since, now } },
    );
    if (Number(row.count) > limit.max) allowed = false;
  }
  return { allowed };
}
