/**
 * `npm run --silent bench:api` — the results endpoint of a cached demo assessment under load.
 * Starts what it needs on its own port and database (PostgreSQL cluster, a freshly seeded
 * `hoebench_bench` database, a production build in .next-test-bench, `next start` on 3190),
 * signs in as the demo researcher, times a few uncached analyses, then runs autocannon with
 * 20 connections for 20 s and stops everything it started. Contract: benchmarks.md; the last
 * stdout line is {"requestsPerSecond", "p50Ms", "p95Ms", "p99Ms", "errors", "non2xx"}.
 */
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";
import { QueryTypes } from "sequelize";
import { createSequelize } from "@/lib/db/sequelize";
import { DEMO_PASSWORD } from "@/lib/demo/scenario";
import { prepareDatabase } from "./lib/database";
import { appEnvironment, POSTGRES_PORT, projectRoot } from "./lib/environment";
import { ensureCluster, psql, recreateDatabase } from "./lib/postgres";
import { buildApp } from "./lib/stack";
import { groupCpuSeconds } from "./lib/process-cpu";

// autocannon ships no types; only the parts used here.
interface AutocannonResult {
  requests: { average: number };
  latency: Record<string, number>;
  errors: number;
  non2xx: number;
}
interface AutocannonInstance {
  on(event: "response", listener: (client: unknown, statusCode: number, bytes: number, responseTime: number) => void): void;
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require("autocannon") as (options: Record<string, unknown>, done: (error: Error | null, result: AutocannonResult) => void) => AutocannonInstance;

/** Percentile of response times in ms (nearest rank); autocannon's own summary has no p95. */
function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return Number.NaN;
  return Math.round(sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] * 100) / 100;
}

const PORT = 3190;
const DATABASE = "hoebench_bench";
const DIST = ".next-test-bench";
const base = `http://127.0.0.1:${PORT}`;
const log = (message: string) => process.stderr.write(`[bench:api] ${message}\n`);

async function waitForServer(timeoutMs = 90_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  while (Date.now() < until) {
    try {
      if ((await fetch(`${base}/api/auth/csrf`)).ok) return;
    } catch {
      // not up yet
    }
    await new Promise((resolve) => setTimeout(resolve, 300));
  }
  throw new Error("the app did not start");
}

async function signIn(email: string): Promise<string> {
  const jar = new Map<string, string>();
  const remember = (response: Response) => {
    for (const header of response.headers.getSetCookie()) {
      const [pair] = header.split(";");
      jar.set(pair.slice(0, pair.indexOf("=")), pair.slice(pair.indexOf("=") + 1));
    }
  };
  const cookie = () => [...jar].map(([name, value]) => `${name}=${value}`).join("; ");
  const csrf = await fetch(`${base}/api/auth/csrf`);
  remember(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const callback = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: cookie() },
    body: new URLSearchParams({ csrfToken, email, password: DEMO_PASSWORD, json: "true" }).toString(),
  });
  remember(callback);
  if (![...jar.keys()].some((name) => name.endsWith("next-auth.session-token"))) throw new Error(`could not sign in as ${email}`);
  return cookie();
}

async function main(): Promise<void> {
  let server: ChildProcess | undefined;
  const stop = () => {
    if (server?.pid && server.exitCode === null) {
      try {
        process.kill(-server.pid, "SIGTERM");
      } catch {
        // already gone
      }
    }
  };
  process.on("SIGINT", () => {
    stop();
    process.exit(130);
  });
  try {
    ensureCluster({ projectRoot, port: POSTGRES_PORT });
    recreateDatabase(POSTGRES_PORT, DATABASE);
    const env: Record<string, string> = { ...appEnvironment("start", DATABASE), APP_BASE_URL: base, NEXTAUTH_URL: base, NEXT_DIST_DIR: DIST };
    await prepareDatabase(env.DATABASE_URL, { seed: true });
    buildApp(env);
    log(`starting next start on ${base}`);
    // Served as `npm start` serves it: several workers on one port (scripts/serve-cluster.ts).
    server = spawn(path.join(projectRoot, "node_modules/.bin/tsx"), [path.join(projectRoot, "scripts/serve-cluster.ts"), "-p", String(PORT), "-H", "127.0.0.1"], {
      cwd: projectRoot,
      env: { ...process.env, ...env, NODE_ENV: "production" },
      stdio: ["ignore", 2, 2],
      detached: true,
    });
    await waitForServer();
    const cookie = await signIn("researcher@hoebench.test");

    const sequelize = createSequelize(env.DATABASE_URL, 1);
    const assessments = await sequelize.query<{ trialId: string; id: string; name: string }>(
      `SELECT a.trial_id AS "trialId", a.id, a.name FROM assessments a JOIN trials t ON t.id = a.trial_id
        WHERE t.status = 'active' AND EXISTS (SELECT 1 FROM dataset_versions v WHERE v.assessment_id = a.id) ORDER BY t.title, a.position`,
      { type: QueryTypes.SELECT },
    );
    await sequelize.close();
    const target = assessments.find((assessment) => assessment.name.startsWith("Weed density, 28")) ?? assessments[0];
    const url = `${base}/api/analysis/${target.trialId}/${target.id}?transform=none&method=lsd&alpha=0.05&control=WC`;

    // Uncached: the first request of each assessment and option set computes the analysis.
    const uncached: number[] = [];
    for (const [index, assessment] of assessments.entries()) {
      const started = performance.now();
      const response = await fetch(`${base}/api/analysis/${assessment.trialId}/${assessment.id}?transform=${index % 2 ? "sqrt" : "log1p"}&method=tukey`, { headers: { cookie } });
      await response.arrayBuffer();
      uncached.push(performance.now() - started);
      if (response.headers.get("x-analysis-cache") !== "miss") log(`expected a cache miss for ${assessment.name}`);
    }
    uncached.sort((a, b) => a - b);
    log(`uncached analyses: ${uncached.length}, median ${uncached[Math.floor(uncached.length / 2)].toFixed(1)} ms, max ${uncached[uncached.length - 1].toFixed(1)} ms`);

    const warm = await fetch(url, { headers: { cookie } });
    if (!warm.ok) throw new Error(`the results endpoint answered ${warm.status}`);
    await warm.arrayBuffer();
    log(`load: ${url} — 20 connections, 20 s`);
    const times: number[] = [];
    const cpuBefore = groupCpuSeconds(server.pid!);
    const result = await new Promise<AutocannonResult>((resolve, reject) => {
      const instance = autocannon({ url, connections: 20, duration: 20, headers: { cookie } }, (error, outcome) => (error ? reject(error) : resolve(outcome)));
      instance.on("response", (_client, _status, _bytes, responseTime) => times.push(responseTime));
    });
    log(`server CPU: ${(((groupCpuSeconds(server.pid!) - cpuBefore) * 1000) / times.length).toFixed(2)} ms per request over ${times.length} requests`);
    stop();
    times.sort((a, b) => a - b);
    process.stdout.write(
      `${JSON.stringify({
        requestsPerSecond: Math.round(result.requests.average * 10) / 10,
        p50Ms: percentile(times, 50),
        p95Ms: percentile(times, 95),
        p99Ms: percentile(times, 99),
        errors: result.errors,
        non2xx: result.non2xx,
      })}\n`,
    );
  } finally {
    stop();
    try {
      psql(POSTGRES_PORT, `DROP DATABASE IF EXISTS ${DATABASE} WITH (FORCE)`);
    } catch {
      // left for the next run, which recreates it
    }
  }
}

main().then(
  () => process.exit(0),
  (error: Error) => {
    process.stderr.write(`[bench:api] ${error.message}\n`);
    process.exit(1);
  },
);
