/**
 * Serves the production build from several `next start` workers that share one port through
 * node:cluster, so every core answers requests (one Node process is single-threaded and was
 * the bottleneck under load). Arguments are passed to `next start` unchanged.
 *
 * The app keeps no state a second worker could miss: sessions are signed cookies, sign-in
 * limits and job claims live in PostgreSQL, files in object storage. Caches (analysis results)
 * are per worker and keyed by data version, so a worker never serves a stale result.
 *
 * HOEBENCH_APP_WORKERS sets the number of workers (default: the cores, at most 4);
 * HOEBENCH_WORKER_NODE_FLAGS passes node flags to each worker (e.g. "--cpu-prof --cpu-prof-dir=/tmp/p").
 */
import cluster from "node:cluster";
import os from "node:os";
import path from "node:path";
import { parseConfig } from "../lib/config";
import { APP_HEAP_FLAGS } from "./lib/app-heap";

const nextBin = path.join(__dirname, "..", "node_modules/next/dist/bin/next");
const requested = Number(process.env.HOEBENCH_APP_WORKERS);
const workers = Number.isInteger(requested) && requested > 0 ? requested : Math.min(4, Math.max(1, os.availableParallelism()));
const say = (message: string) => process.stderr.write(`[hoebench] ${message}\n`);

let stopping = false;
let exitCode = 0;
const restarts: number[] = [];

// Workers are plain node running Next's own CLI, without this script's TypeScript loader.
// Each worker decides a request's client address where the connection arrives (see client-address.cjs).
const workerFlags = [
  ...APP_HEAP_FLAGS,
  "--require",
  path.join(__dirname, "client-address.cjs"),
  ...(process.env.HOEBENCH_WORKER_NODE_FLAGS ?? "").split(" ").filter(Boolean),
];
cluster.setupPrimary({ exec: nextBin, args: ["start", ...process.argv.slice(2)], execArgv: workerFlags });

cluster.on("exit", (worker, code, signal) => {
  if (stopping) {
    if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(exitCode);
    return;
  }
  // A worker that keeps dying (a broken build, a port taken) would otherwise spin forever.
  const now = Date.now();
  restarts.push(now);
  while (restarts.length && restarts[0] < now - 60_000) restarts.shift();
  if (restarts.length > 5) {
    say(`app workers keep stopping (last: ${signal ?? `exit ${code}`}); giving up`);
    stop(1);
    return;
  }
  say(`app worker ${worker.process.pid} stopped (${signal ?? `exit ${code}`}); starting another`);
  cluster.fork();
});

function stop(code = 0): void {
  if (stopping) return;
  stopping = true;
  exitCode = code;
  const alive = Object.values(cluster.workers ?? {});
  if (alive.length === 0) process.exit(exitCode);
  for (const worker of alive) worker?.process.kill("SIGTERM");
  setTimeout(() => process.exit(exitCode), 10_000).unref();
}

process.on("SIGTERM", () => stop());
process.on("SIGINT", () => stop());

// A bad setting stops here, with its name, instead of surfacing later as a failing request.
try {
  parseConfig({ ...process.env, NODE_ENV: "production" });
} catch (error) {
  say((error as Error).message);
  process.exit(1);
}

say(`serving with ${workers} app worker${workers === 1 ? "" : "s"}`);
for (let index = 0; index < workers; index += 1) cluster.fork();
