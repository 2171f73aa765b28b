/**
 * `npm run --silent bench:ingest`: a 100,000-row quadrat file into a 500-plot trial through
 * the same path an upload takes (register, presigned PUT to the S3 fake, read back and check
 * every row, commit as a version), against PostgreSQL's own COPY of the same rows.
 * Prints one JSON object on the last line (contract: benchmarks.md).
 */

import { spawnSync } from "node:child_process";
import { APP_HEAP_FLAGS } from "./lib/app-heap";

// The upload path runs in this process: it gets the heap the app's workers have.
if (!APP_HEAP_FLAGS.every((flag) => process.execArgv.includes(flag))) {
  const run = spawnSync(process.execPath, [...process.execArgv, ...APP_HEAP_FLAGS, ...process.argv.slice(1)], { stdio: "inherit" });
  process.exit(run.status ?? 1);
}

process.env.HOEBENCH_TEST_SLOT = process.env.HOEBENCH_TEST_SLOT ?? "8";
/**
 * Timed runs of each side, after three untimed runs each: a serving app has checked files
 * before (its code compiled, its file-checking thread started) and PostgreSQL runs warm.
 */
const RUNS = 5;
const WARM_UP = 3;
const BLOCKS = 20;
const TREATMENTS = 25;
const QUADRATS = 50;
const SPECIES = ["pigweed", "purslane", "lambsquarters", "crabgrass"];

const median = (values: number[]) => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)];
const log = (message: string) => process.stderr.write(`[bench:ingest] ${message}\n`);

function makeCsv(): string {
  const lines = ["plot,quadrat,species,value"];
  let state = 12345;
  for (let block = 1; block <= BLOCKS; block += 1) {
    for (let position = 1; position <= TREATMENTS; position += 1) {
      for (let quadrat = 1; quadrat <= QUADRATS; quadrat += 1) {
        for (const species of SPECIES) {
          state = (state * 1103515245 + 12345) % 2147483648;
          lines.push(`${block * 100 + position},${quadrat},${species},${state % 40}`);
        }
      }
    }
  }
  return `${lines.join("\n")}\n`;
}

async function main(): Promise<void> {
  const { bringUp, startFakes } = await import("./lib/stack");
  const { stopChildren, shutdown } = await import("./lib/processes");
  const { POSTGRES_PORT, databaseFor } = await import("./lib/environment");
  const { psql } = await import("./lib/postgres");
  const env = await bringUp("test");
  Object.assign(process.env, env);
  await startFakes("test", env);

  const { db } = await import("@/lib/db/sequelize");
  const { Assessment, Plot, Site, Treatment, Trial, User } = await import("@/models");
  const { startUpload, checkUpload, commitUpload } = await import("@/lib/uploads/service");
  db();
  const researcher = (await User.findOne({ where: { email: "researcher@hoebench.test" } }))!;
  const site = await Site.create({ name: "Bench site", location: "Bench", region: "Bench", latitude: null, longitude: null, createdById: researcher.id });
  const trial = await Trial.create({
    title: "Ingest benchmark", crop: "Lettuce", season: "2026", siteId: site.id, design: "rcbd", blocks: BLOCKS,
    plotLengthM: 6, plotWidthM: 1.5, harvestAreaM2: 4.5, quadratAreaM2: 0.25, plantingDate: null, randomSeed: 1, status: "active", ownerId: researcher.id,
  });
  const treatments = await Treatment.bulkCreate(
    Array.from({ length: TREATMENTS }, (_, index) => ({
      trialId: trial.id, position: index + 1, code: `T${index + 1}`, name: `Method ${index + 1}`, category: "hand" as const, checkType: null,
      labourHoursPerHa: null, materialCostPerHa: null, equipmentCost: null, equipmentLifeYears: null, equipmentHaPerYear: null,
    })),
  );
  await Plot.bulkCreate(
    Array.from({ length: BLOCKS * TREATMENTS }, (_, index) => {
      const block = Math.floor(index / TREATMENTS) + 1;
      const position = (index % TREATMENTS) + 1;
      return { trialId: trial.id, number: block * 100 + position, block, position, row: block, column: position, walkOrder: index + 1, treatmentId: treatments[position - 1].id };
    }),
  );
  const assessment = await Assessment.create({
    trialId: trial.id, position: 1, name: "Weed density by species", variable: "weed-density", unit: "plants per quadrat",
    plannedDate: null, timingDays: null, timingReference: null, quadratsPerPlot: QUADRATS, plausibleMin: 0, plausibleMax: 500,
  });

  const csv = makeCsv();
  const rows = csv.split("\n").length - 2;
  const bytes = Buffer.from(csv);
  const user = { id: researcher.id, email: researcher.email, name: researcher.name, role: researcher.role };
  log(`file: ${rows} rows, ${(bytes.byteLength / 1024 / 1024).toFixed(1)} MB; ${WARM_UP} untimed and ${RUNS} timed runs of each side, median`);

  // PostgreSQL's own COPY of the same bytes, sent the way psql's \copy sends a file, over a
  // connection opened beforehand: the time is COPY's alone, not a client's start-up.
  const database = databaseFor("test");
  psql(POSTGRES_PORT, "CREATE TABLE IF NOT EXISTS bench_copy_scratch (plot int, quadrat int, species text, value float8)", database);
  const { Client } = await import("pg");
  const { from: copyFrom } = await import("pg-copy-streams");
  const { Readable } = await import("node:stream");
  const { pipeline } = await import("node:stream/promises");
  const client = new Client({ connectionString: `postgres://postgres@127.0.0.1:${POSTGRES_PORT}/${database}` });
  await client.connect();

  async function timePath(run: number): Promise<number> {
    const started = performance.now();
    const upload = await startUpload(user, trial, { trialId: trial.id, assessmentId: assessment.id, fileName: "bench.csv", sizeBytes: bytes.byteLength });
    const put = await fetch(upload.putUrl, { method: "PUT", headers: { "content-type": upload.contentType }, body: bytes });
    if (!put.ok) throw new Error(`PUT failed: ${put.status}`);
    const sent = performance.now();
    const checked = await checkUpload(upload.uploadId);
    const checkedAt = performance.now();
    if (checked.errors > 0 || checked.rowCount !== rows) throw new Error(`check failed: ${JSON.stringify(checked.problems.slice(0, 3))}`);
    const version = await commitUpload(user, upload.uploadId);
    const seconds = (performance.now() - started) / 1000;
    const phases = `register+PUT ${((sent - started) / 1000).toFixed(2)} s, check ${((checkedAt - sent) / 1000).toFixed(2)} s, commit ${((performance.now() - checkedAt) / 1000).toFixed(2)} s`;
    log(`${run < 0 ? "warm-up" : `run ${run + 1}`}: version ${version.number}, ${version.rowsAdded} rows added, ${version.rowsReplaced} replaced, ${seconds.toFixed(3)} s (${phases})`);
    return seconds;
  }

  async function timeCopy(): Promise<number> {
    await client.query("TRUNCATE bench_copy_scratch");
    const started = performance.now();
    await pipeline(Readable.from([bytes]), client.query(copyFrom("COPY bench_copy_scratch FROM STDIN (FORMAT csv, HEADER true)")));
    return (performance.now() - started) / 1000;
  }

  // The two sides take turns, run by run, so a host that speeds up or slows down meanwhile
  // (this one is shared) weighs on both alike.
  const pathSeconds: number[] = [];
  const copySeconds: number[] = [];
  for (let run = -WARM_UP; run < RUNS; run += 1) {
    const path = await timePath(run);
    const copy = await timeCopy();
    if (run >= 0) {
      pathSeconds.push(path);
      copySeconds.push(copy);
    }
  }
  const [{ copied }] = (await client.query("SELECT count(*)::int AS copied FROM bench_copy_scratch")).rows as { copied: number }[];
  await client.end();
  if (copied !== rows) throw new Error(`COPY loaded ${copied} rows, not ${rows}`);
  log(`COPY runs: ${copySeconds.map((value) => value.toFixed(3)).join(", ")} s`);

  await db().close();
  stopChildren();
  const seconds = median(pathSeconds);
  const copy = median(copySeconds);
  // Last, after whatever clean-up prints.
  shutdown(0, JSON.stringify({ rows, seconds: Number(seconds.toFixed(3)), rowsPerSecond: Math.round(rows / seconds), copySeconds: Number(copy.toFixed(3)), ratio: Number((seconds / copy).toFixed(2)) }));
}

main().catch((error: Error) => {
  process.stderr.write(`[bench:ingest] ${error.stack ?? error.message}\n`);
  process.exit(1);
});
