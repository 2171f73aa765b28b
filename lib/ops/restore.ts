import { spawnSync } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import type { AppConfig } from "@/lib/config";
import { objectStore } from "./object-store";
import { objectFilePath, sha256Of, tableRowCounts, tableRowDigests, type BackupManifest } from "./backup";

const POSTGRES_BIN = "/usr/lib/postgresql/15/bin";

function readManifest(folder: string): BackupManifest {
  const manifest = JSON.parse(readFileSync(path.join(folder, "manifest.json"), "utf8")) as BackupManifest;
  if (manifest.format !== "hoebench-backup-1") throw new Error("this folder does not hold a Hoebench backup (manifest format unknown)");
  return manifest;
}

/**
 * Restores a backup into an empty database and an empty bucket, after checking every file
 * against the manifest's checksums; refuses a target that already holds data.
 */
export async function restoreBackup(settings: AppConfig, folder: string): Promise<{ tables: number; objects: number }> {
  const manifest = readManifest(folder);
  const dump = readFileSync(path.join(folder, manifest.database.file));
  if (sha256Of(dump) !== manifest.database.sha256) throw new Error("the database dump does not match its checksum; the backup is damaged");
  const files = manifest.objects.map((object) => {
    const body = readFileSync(path.join(folder, objectFilePath(object.key)));
    if (sha256Of(body) !== object.sha256) throw new Error(`stored file ${object.key} does not match its checksum; the backup is damaged`);
    return { key: object.key, body };
  });

  const client = new pg.Client({ connectionString: settings.DATABASE_URL });
  await client.connect();
  const store = objectStore(settings);
  try {
    const existing = await client.query("SELECT 1 FROM pg_tables WHERE schemaname = 'public' LIMIT 1");
    if (existing.rowCount) throw new Error("the target database is not empty; restore only into an empty database");
    await store.ensureEmptyBucket(settings.S3_BUCKET);
    const restore = spawnSync(path.join(POSTGRES_BIN, "pg_restore"), ["--no-owner", "--exit-on-error", `--dbname=${settings.DATABASE_URL}`, path.join(folder, manifest.database.file)], { encoding: "utf8" });
    if (restore.status !== 0) throw new Error(`pg_restore failed: ${restore.stderr.trim()}`);
    for (const file of files) await store.put(settings.S3_BUCKET, file.key, file.body);
    const counts = await tableRowCounts(client);
    for (const [table, count] of Object.entries(manifest.database.rowCounts)) {
      if (counts[table] !== count) throw new Error(`table ${table} has ${counts[table]} rows after restore, the backup had ${count}`);
    }
    if (manifest.database.rowDigests) {
      const digests = await tableRowDigests(client);
      for (const [table, digest] of Object.entries(manifest.database.rowDigests)) {
        if (digests[table] !== digest) throw new Error(`table ${table} does not hold the same rows after restore as in the backup`);
      }
    }
    return { tables: Object.keys(counts).length, objects: files.length };
  } finally {
    await client.end();
    store.close();
  }
}
