import { spawnSync } from "node:child_process";
import { readdirSync } from "node:fs";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { createSequelize } from "@/lib/db/sequelize";
import { demoSites, demoTrials, demoUsers } from "@/lib/demo/scenario";
import { POSTGRES_PORT, projectRoot } from "@/scripts/lib/environment";
import { psql } from "@/scripts/lib/postgres";
import { testEnvironment } from "../support/environment";

const database = "hoebench_idempotence";

/** What the set-up says about itself (its progress goes to stderr). */
function runSetup(): string {
  const result = spawnSync(path.join(projectRoot, "node_modules/.bin/tsx"), ["scripts/run.ts", "setup", "--database", database], { cwd: projectRoot, encoding: "utf8" });
  if (result.status !== 0) throw new Error(`set-up failed: ${result.stderr}`);
  return `${result.stdout}${result.stderr}`;
}

function postmastersOnOurPort(): number {
  const listing = spawnSync("ps", ["-eo", "args"], { encoding: "utf8" }).stdout.split("\n");
  return listing.filter((line) => /\/postgres -D /.test(line) && line.includes(`-p ${POSTGRES_PORT}`)).length;
}

describe("the set-up run twice", () => {
  testEnvironment();
  psql(POSTGRES_PORT, `DROP DATABASE IF EXISTS "${database}" WITH (FORCE)`);

  it("leaves one cluster, one migrated schema and one seeded demo", async () => {
    const first = runSetup();
    const second = runSetup();
    expect(first).toContain("seeded the demo scenario");
    expect(second).toContain("PostgreSQL already running");
    expect(second).toContain("database schema is up to date");
    expect(second).toContain("demo data already present");
    expect(postmastersOnOurPort()).toBe(1);

    const sequelize = createSequelize(`postgres://postgres@127.0.0.1:${POSTGRES_PORT}/${database}`, 1);
    try {
      const migrationFiles = readdirSync(path.join(projectRoot, "migrations")).filter((name) => /^\d{14}-.+\.ts$/.test(name));
      const [[{ count: migrations }]] = (await sequelize.query("SELECT count(*)::int AS count FROM schema_migrations")) as [{ count: number }[], unknown];
      expect(migrations).toBe(migrationFiles.length);
      const counts = await sequelize.query(
        "SELECT (SELECT count(*)::int FROM users) AS users, (SELECT count(*)::int FROM sites) AS sites, (SELECT count(*)::int FROM trials) AS trials",
        { plain: true },
      );
      expect(counts).toEqual({ users: demoUsers.length, sites: demoSites.length, trials: demoTrials.length });
    } finally {
      await sequelize.close();
    }
  }, 120_000);
});

afterAll(() => {
  psql(POSTGRES_PORT, `DROP DATABASE IF EXISTS "${database}" WITH (FORCE)`);
});
