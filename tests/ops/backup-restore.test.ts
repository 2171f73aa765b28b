import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parseConfig } from "@/lib/config";
import { Photo } from "@/models";
import { objectStore } from "@/lib/ops/object-store";
import { POSTGRES_PORT, projectRoot } from "@/scripts/lib/environment";
import { psql } from "@/scripts/lib/postgres";
import { createTrialFixture, removeTrialFixtures } from "../factories/trials";
import { testDatabase } from "../support/database";
import { testEnvironment } from "../support/environment";

const restoreDatabase = `hoebench_restore_${process.env.HOEBENCH_TEST_SLOT ?? "0"}`;
const restoreBucket = `hoebench-restore-${process.env.HOEBENCH_TEST_SLOT ?? "0"}-${Date.now()}`;
const restoreUrl = `postgres://postgres@127.0.0.1:${POSTGRES_PORT}/${restoreDatabase}`;
const folder = mkdtempSync(path.join(os.tmpdir(), "hoebench-backup-test-"));
const settings = parseConfig(process.env);
const photoBytes = Buffer.from([0xff, 0xd8, 0xff, 0xe0, ...Array.from({ length: 200 }, (_, index) => index % 251)]);

function run(script: string, args: string[], env: Record<string, string> = {}): string {
  return execFileSync(path.join(projectRoot, "node_modules/.bin/tsx"), [script, ...args], { cwd: projectRoot, encoding: "utf8", env: { ...process.env, ...env }, stdio: ["ignore", "pipe", "pipe"] });
}

/** Every row of every table, as text, in a fixed order: two databases with equal digests hold the same data. */
async function tableDigests(url: string): Promise<Record<string, string>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const tables = (await client.query<{ name: string }>("SELECT tablename AS name FROM pg_tables WHERE schemaname = 'public' ORDER BY 1")).rows;
    const digests: Record<string, string> = {};
    for (const { name } of tables) {
      const result = await client.query<{ digest: string | null; count: number }>(
        `SELECT md5(string_agg(t::text, '|' ORDER BY t::text)) AS digest, count(*)::int AS count FROM "${name}" t`,
      );
      digests[name] = `${result.rows[0].count}:${result.rows[0].digest}`;
    }
    return digests;
  } finally {
    await client.end();
  }
}

beforeAll(async () => {
  testEnvironment();
  const fixture = await createTrialFixture();
  const key = `trials/${fixture.trial.id}/photos/backup-test`;
  const store = objectStore(settings);
  await store.put(settings.S3_BUCKET, key, photoBytes);
  await store.put(settings.S3_BUCKET, `${key}-thumbnail.jpg`, photoBytes.subarray(0, 50));
  store.close();
  await Photo.create({
    trialId: fixture.trial.id, plotId: fixture.plots[0].id, assessmentId: null, objectKey: key, thumbnailKey: `${key}-thumbnail.jpg`,
    contentType: "image/jpeg", sizeBytes: photoBytes.byteLength, status: "stored", uploadedById: fixture.owner.id,
  });
  psql(POSTGRES_PORT, `DROP DATABASE IF EXISTS "${restoreDatabase}" WITH (FORCE)`);
  psql(POSTGRES_PORT, `CREATE DATABASE "${restoreDatabase}"`);
});

describe("backup and restore", () => {
  it("round-trips every row and every referenced file", async () => {
    const backupOutput = run("scripts/backup.ts", [folder]);
    expect(backupOutput).toMatch(/^backup written to .+: \d+ tables, \d+ rows, \d+ files$/m);
    const manifest = JSON.parse(readFileSync(path.join(folder, "manifest.json"), "utf8"));
    expect(manifest.missing).toEqual([]);
    expect(manifest.objects.length).toBeGreaterThanOrEqual(2);

    const restoreOutput = run("scripts/restore.ts", [folder], { DATABASE_URL: restoreUrl, S3_BUCKET: restoreBucket });
    expect(restoreOutput).toContain(`restored`);

    // Against the database as the backup saw it (its snapshot), not as it is now: the app's own
    // background work (the mail queue) may have moved on since.
    const snapshot = Object.fromEntries(
      Object.entries(manifest.database.rowCounts as Record<string, number>).map(([table, count]) => [table, `${count}:${manifest.database.rowDigests[table]}`]),
    );
    expect(Object.keys(snapshot).length).toBeGreaterThan(20);
    expect(await tableDigests(restoreUrl)).toEqual(snapshot);
    const store = objectStore(settings);
    for (const object of manifest.objects as { key: string; sha256: string }[]) {
      const original = await store.get(settings.S3_BUCKET, object.key);
      const restored = await store.get(restoreBucket, object.key);
      expect(restored, object.key).not.toBeNull();
      expect(restored!.equals(original!), object.key).toBe(true);
    }
    store.close();
  }, 120_000);

  it("refuses to restore over data that is already there", () => {
    expect(() => run("scripts/restore.ts", [folder], { DATABASE_URL: restoreUrl, S3_BUCKET: `${restoreBucket}-2` })).toThrow(/the target database is not empty/);
  });

  it("refuses a damaged backup before touching anything", () => {
    const manifest = JSON.parse(readFileSync(path.join(folder, "manifest.json"), "utf8"));
    const file = path.join(folder, manifest.objects[0].file);
    const bytes = readFileSync(file);
    bytes[0] ^= 0xff;
    writeFileSync(file, bytes);
    psql(POSTGRES_PORT, `DROP DATABASE IF EXISTS "${restoreDatabase}" WITH (FORCE)`);
    psql(POSTGRES_PORT, `CREATE DATABASE "${restoreDatabase}"`);
    expect(() => run("scripts/restore.ts", [folder], { DATABASE_URL: restoreUrl, S3_BUCKET: `${restoreBucket}-3` })).toThrow(/does not match its checksum; the backup is damaged/);
    expect(psql(POSTGRES_PORT, "SELECT count(*) FROM pg_tables WHERE schemaname = 'public'", restoreDatabase).trim()).toBe("0");
  });
});

afterAll(async () => {
  rmSync(folder, { recursive: true, force: true });
  psql(POSTGRES_PORT, `DROP DATABASE IF EXISTS "${restoreDatabase}" WITH (FORCE)`);
  await removeTrialFixtures();
  await testDatabase().close();
});
