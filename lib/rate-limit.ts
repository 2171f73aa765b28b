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

/** Whether any bucket already holds its limit within its window (nothing is recorded). One query for all buckets: it sits before every sign-in. */
export async function overLimit(limits: Limit[], now = new Date()): Promise<boolean> {
  if (limits.length === 0) return false;
  const rows = await db().query<{ full: boolean }>(
    `SELECT (SELECT count(*) FROM rate_limit_hits h WHERE h.bucket = l.bucket AND h.created_at >= l.since) >= l.max AS full
       FROM unnest(ARRAY[:buckets]::text[], ARRAY[:sinces]::timestamptz[], ARRAY[:maxes]::int[]) AS l(bucket, since, max)`,
    {
      type: QueryTypes.SELECT,
      replacements: {
        buckets: limits.map((limit) => limit.bucket),
        sinces: limits.map((limit) => new Date(now.getTime() - limit.windowMs).toISOString()),
        maxes: limits.map((limit) => limit.max),
      },
    },
  );
  return rows.some((row) => row.full);
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
