/**
 * `npm start`, `npm run dev` and `npm test`: bring up PostgreSQL, the schema, the demo,
 * the local S3 and mail fakes, and the app, on loopback; then serve, or run every test.
 * Running it again reuses what is there; Ctrl-C stops what this run started.
 */
import { existsSync, mkdirSync, rmSync } from "node:fs";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { ensureDebianPackages } from "./lib/apt";
import { ensureCluster, ensureDatabase } from "./lib/postgres";
import { prepareDatabase } from "./lib/database";
import { appEnvironment, databaseFor, portsFor, POSTGRES_PORT, projectRoot, stateRoot, testStateName } from "./lib/environment";
import { say } from "./lib/log";
import { shutdown, stopChildren, stopListeners } from "./lib/processes";
import { bringUp, buildApp, nextBin, serveApp, startFakes } from "./lib/stack";
import { summarizeReports } from "./lib/test-report";
import { demoUsers, DEMO_PASSWORD } from "@/lib/demo/scenario";

function printWelcome(port: number): void {
  const width = Math.max(...demoUsers.map((user) => user.email.length));
  say("");
  say(`Hoebench is running at http://127.0.0.1:${port}`);
  say(`Demo sign-ins (password for all: ${DEMO_PASSWORD}):`);
  for (const user of demoUsers) say(`  ${user.email.padEnd(width)}  ${user.role}`);
  say("Press Ctrl-C to stop.");
}

async function serve(mode: "start" | "dev"): Promise<void> {
  // From the first step: Ctrl-C while the database or the fakes come up stops what has started.
  process.on("SIGINT", () => shutdown(0));
  process.on("SIGTERM", () => shutdown(0));
  const env = await bringUp(mode);
  await startFakes(mode, env);
  if (mode === "start") buildApp(env);
  await serveApp(mode, env);
  printWelcome(portsFor(mode).app);
  await new Promise(() => {});
}

async function test(args: string[]): Promise<void> {
  const filters = args.filter((arg) => !arg.startsWith("--"));
  // Names ending in .spec.ts pick browser tests; any other name picks unit and integration suites.
  const browserFilters = filters.filter((filter) => filter.endsWith(".spec.ts"));
  const unitFilters = filters.filter((filter) => !filter.endsWith(".spec.ts"));
  const runUnits = filters.length === 0 || unitFilters.length > 0;
  const runBrowser = filters.length === 0 || browserFilters.length > 0 || args.includes("--e2e");
  // --server: serve the app for HTTP-level suites without running the browser tests.
  const withServer = runBrowser || args.includes("--server");
  if (runBrowser) ensureDebianPackages("/usr/bin/chromium", ["chromium"]);
  process.on("SIGINT", () => shutdown(130));
  process.on("SIGTERM", () => shutdown(143));
  const env = await bringUp("test");
  await startFakes("test", env);
  if (withServer) {
    buildApp(env);
    await serveApp("test", env);
  }
  const reports = path.join(stateRoot, testStateName("reports"));
  rmSync(reports, { recursive: true, force: true });
  mkdirSync(reports, { recursive: true });
  const childEnv = { ...process.env, ...env, HOEBENCH_TEST: "1", NODE_ENV: "test" } as NodeJS.ProcessEnv;

  if (runUnits) {
    say("running unit and integration tests (vitest)");
    spawnSync(process.execPath, [path.join(projectRoot, "node_modules/vitest/vitest.mjs"), "run", "--reporter=default", "--reporter=json", `--outputFile.json=${path.join(reports, "vitest.json")}`, ...unitFilters], {
      cwd: projectRoot, env: childEnv, stdio: "inherit",
    });
  }
  if (runBrowser) {
    say("running browser tests (playwright, Debian chromium)");
    spawnSync(process.execPath, [path.join(projectRoot, "node_modules/@playwright/test/cli.js"), "test", "--reporter=list,json", ...browserFilters], {
      cwd: projectRoot, env: { ...childEnv, PLAYWRIGHT_JSON_OUTPUT_NAME: path.join(reports, "playwright.json") }, stdio: "inherit",
    });
  }
  stopChildren();
  // Fault tests restart the fakes outside this process's children; stop those too.
  const ports = portsFor("test");
  await stopListeners([ports.s3, ports.smtp, ports.mailHttp]);
  const summary = summarizeReports(reports, { expectUnits: runUnits, expectBrowser: runBrowser });
  shutdown(summary.failed > 0 || summary.passed === 0 ? 1 : 0, summary.line);
}

async function setupOnly(args: string[]): Promise<void> {
  const databaseIndex = args.indexOf("--database");
  const database = databaseIndex >= 0 ? args[databaseIndex + 1] : databaseFor("start");
  ensureCluster({ projectRoot, port: POSTGRES_PORT });
  ensureDatabase(POSTGRES_PORT, database);
  await prepareDatabase(appEnvironment("start", database).DATABASE_URL, { seed: true });
}

async function main(): Promise<void> {
  const [mode = "start", ...rest] = process.argv.slice(2);
  if (!existsSync(nextBin)) throw new Error("npm packages are missing; run through `npm start`");
  if (mode === "start" || mode === "dev") return serve(mode);
  if (mode === "test") return test(rest);
  if (mode === "setup") return setupOnly(rest);
  throw new Error(`unknown mode ${mode}; use start, dev, test or setup`);
}

main().catch((error: Error) => {
  process.stderr.write(`[hoebench] ${error.message}\n`);
  shutdown(1);
});
