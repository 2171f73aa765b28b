import { spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import type { AppConfig } from "@/lib/config";
import { objectStore } from "./object-store";
import { referencedKeysSql } from "./object-references";

const POSTGRES_BIN = "/usr/lib/postgresql/15/bin";

export interface BackupManifest {
  format: "hoebench-backup-1";
  createdAt: string;
  database: {
    file: string;
    sha256: string;
    rowCounts: Record<string, number>;
    /** Per table, an MD5 of every row as text in a fixed order, taken in the dump's snapshot; a restore must reproduce each. */
    rowDigests?: Record<string, string | null>;
  };
  bucket: string;
  objects: { key: string; file: string; sha256: string; bytes: number }[];
  /** Keys the database names but storage did not have when the backup ran. */
  missing: string[];
}

export const sha256Of = (bytes: Buffer) => createHash("sha256").update(bytes).digest("hex");

/** Object keys are ours (trials/<id>/…); anything that could climb out of the folder is refused. */
export function objectFilePath(key: string): string {
  if (key.split("/").some((part) => part === ".." || part === "") || key.startsWith("/")) throw new Error(`refusing an unsafe object key: ${key}`);
  return path.join("objects", ...key.split("/"));
}

export async function tableRowCounts(client: pg.Client): Promise<Record<string, number>> {
  const tables = await client.query<{ name: string }>("SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename");
  const counts: Record<string, number> = {};
  for (const { name } of tables.rows) {
    const result = await client.query<{ count: number }>(`SELECT count(*)::int AS count FROM "${name}"`);
    counts[name] = result.rows[0].count;
  }
  return counts;
}

/**
 * Every row of every table, as text in a fixed order, hashed: two databases with the same
 * schema and the same digests hold the same data. It reads each table once in full, which a
 * backup does anyway.
 */
export async function tableRowDigests(client: pg.Client): Promise<Record<string, string | null>> {
  const tables = await client.query<{ name: string }>("SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' ORDER BY tablename");
  const digests: Record<string, string | null> = {};
  for (const { name } of tables.rows) {
    const result = await client.query<{ digest: string | null }>(`SELECT md5(string_agg(t::text, '|' ORDER BY t::text)) AS digest FROM "${name}" t`);
    digests[name] = result.rows[0].digest;
  }
  return digests;
}

/**
 * A consistent backup: one exported snapshot serves pg_dump, the row counts and digests, and
 * the list of referenced objects, so the files match the database as it was at one instant. Stored
 * objects are never rewritten under the same key, so copying them afterwards is safe.
 */
export async function createBackup(settings: AppConfig, folder: string): Promise<BackupManifest> {
  mkdirSync(path.join(folder, "objects"), { recursive: true });
  const client = new pg.Client({ connectionString: settings.DATABASE_URL });
  await client.connect();
  const store = objectStore(settings);
  try {
    await client.query("BEGIN ISOLATION LEVEL REPEATABLE READ READ ONLY");
    const snapshot = (await client.query<{ id: string }>("SELECT pg_export_snapshot() AS id")).rows[0].id;
    const dumpFile = path.join(folder, "database.dump");
    const dump = spawnSync(path.join(POSTGRES_BIN, "pg_dump"), ["--format=custom", "--no-owner", `--snapshot=${snapshot}`, `--file=${dumpFile}`, settings.DATABASE_URL], { encoding: "utf8" });
    if (dump.status !== 0) throw new Error(`pg_dump failed: ${dump.stderr.trim()}`);
    const rowCounts = await tableRowCounts(client);
    const rowDigests = await tableRowDigests(client);
    const tables = new Set(Object.keys(rowCounts));
    const keys = (await client.query<{ key: string }>(referencedKeysSql(tables))).rows.map((row) => row.key);
    await client.query("COMMIT");

    const objects: BackupManifest["objects"] = [];
    const missing: string[] = [];
    for (const key of keys) {
      const body = await store.get(settings.S3_BUCKET, key);
      if (!body) {
        missing.push(key);
        continue;
      }
      const file = objectFilePath(key);
      mkdirSync(path.dirname(path.join(folder, file)), { recursive: true });
      writeFileSync(path.join(folder, file), body);
      objects.push({ key, file, sha256: sha256Of(body), bytes: body.byteLength });
    }
    const manifest: BackupManifest = {
      format: "hoebench-backup-1",
      createdAt: new Date().toISOString(),
      database: { file: "database.dump", sha256: sha256Of(readFileSync(dumpFile)), rowCounts, rowDigests },
      bucket: settings.S3_BUCKET,
      objects,
      missing,
    };
    writeFileSync(path.join(folder, "manifest.json"), `${JSON.stringify(manifest, null, 2)}\n`);
    return manifest;
  } finally {
    await client.end();
    store.close();
  }
}
