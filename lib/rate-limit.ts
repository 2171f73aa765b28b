import "server-only";
import { createHash } from "node:crypto";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";

export interface Limit {
  bucket: string;
  max: number;
  windowMs: number;
}

/** Addresses and accounts are counted under a hash, so the table holds no list of who tried. */
export function hashedBucket(prefix: string, value: string): string {
  return `${prefix}:${createHash("sha256").update(value).digest("hex").slice(0, 32)}`;
}

/** Whether any bucket already holds its limit within its window (nothing is recorded). */
export async function overLimit(limits: Limit[], now = new Date()): Promise<boolean> {
  for (const limit of limits) {
    const [row] = await db().query<{ count: string }>(
      "SELECT count(*) AS count FROM rate_limit_hits WHERE bucket = :bucket AND created_at >= :since",
      { type: QueryTypes.SELECT, replacements: { bucket: limit.bucket, since: new Date(now.getTime() - limit.windowMs) } },
    );
    if (Number(row.count) >= limit.max) return true;
  }
  return false;
}

/** Records one hit in every bucket, dropping hits older than the window. */
export async function recordHits(limits: Limit[], now = new Date()): Promise<void> {
  for (const limit of limits) {
    await db().query(
      `WITH pruned AS (DELETE FROM rate_limit_hits WHERE bucket = :bucket AND created_at < :since)
       INSERT INTO rate_limit_hits (bucket, created_at) VALUES (:bucket, :now)`,
      { replacements: { bucket: limit.bucket, since: new Date(now.getTime() - limit.windowMs), now } },
    );
  }
}

/**
 * Records one attempt in every bucket and says whether all are still within their limits.
 * The counts live in PostgreSQL, so every app server sees the same ones.
 */
export async function recordAttempt(limits: Limit[], now = new Date()): Promise<{ allowed: boolean }> {
  const allowed = !(await overLimit(limits, now));
  await recordHits(limits, now);
  return { allowed };
}
