/**
 * The pieces of a running Hoebench on loopback, shared by the start and test commands and
 * the benchmarks: PostgreSQL with a migrated, seeded database, the S3 and mail fakes, the app.
 */
import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import { spawnSync, type ChildProcess } from "node:child_process";
import { ensureCluster, ensureDatabase, recreateDatabase } from "./postgres";
import { prepareDatabase } from "./database";
import { appEnvironment, databaseFor, portsFor, POSTGRES_PORT, projectRoot, stateRoot, testStateName, type Mode } from "./environment";
import { say } from "./log";
import { httpOk, onShutdown, portOpen, startChild, stopListeners, waitFor } from "./processes";

export const nextBin = path.join(projectRoot, "node_modules/next/dist/bin/next");
const tsxBin = path.join(projectRoot, "node_modules/.bin/tsx");

export async function startFakes(mode: Mode, env: Record<string, string>): Promise<void> {
  const ports = portsFor(mode);
  // A test run starts from empty storage and mail: fakes left by an earlier run are replaced.
  if (mode === "test") await stopListeners([ports.s3, ports.smtp, ports.mailHttp]);
  if (await portOpen(ports.smtp)) {
    say(`local S3 and mail fakes already running on ${ports.s3}/${ports.smtp}`);
    return;
  }
  const fakeState = path.join(stateRoot, mode === "test" ? testStateName("fakes-test") : "fakes");
  if (mode === "test") rmSync(fakeState, { recursive: true, force: true });
  mkdirSync(fakeState, { recursive: true });
  startChild("local S3 and mail fakes", tsxBin, [path.join(projectRoot, "scripts/fakes.ts")], {
    ...env,
    FAKE_S3_PORT: String(ports.s3),
    FAKE_SMTP_PORT: String(ports.smtp),
    FAKE_MAIL_HTTP_PORT: String(ports.mailHttp),
    FAKE_STATE_DIR: fakeState,
    FAKE_S3_BUCKETS: env.S3_BUCKET,
  }, projectRoot, mode !== "test");
  await waitFor("the local mail catcher", () => httpOk(`http://127.0.0.1:${ports.mailHttp}/health`), 30_000);
}

/**
 * What a build is made from: the commit, uncommitted changes, untracked files, the Node
 * version and the settings a build reads. Null outside a git checkout: then every start builds.
 */
function sourceStamp(env: Record<string, string>): string | null {
  const git = (args: string[]) => spawnSync("git", args, { cwd: projectRoot, encoding: "utf8", maxBuffer: 1 << 28 });
  const head = git(["rev-parse", "HEAD"]);
  if (head.status !== 0) return null;
  const hash = createHash("sha256").update(head.stdout).update(git(["diff", "HEAD"]).stdout).update(process.version);
  for (const [name, value] of Object.entries(env).sort()) if (name.startsWith("NEXT_")) hash.update(`${name}=${value}\n`);
  for (const file of git(["ls-files", "--others", "--exclude-standard", "-z"]).stdout.split("\0").filter(Boolean)) {
    const full = path.join(projectRoot, file);
    if (existsSync(full)) hash.update(file).update(readFileSync(full));
  }
  return hash.digest("hex");
}

/** Builds the app for production, or reuses the last build when nothing it is made from has changed. */
export function buildApp(env: Record<string, string>): void {
  const dist = path.join(projectRoot, env.NEXT_DIST_DIR ?? ".next");
  const stampFile = path.join(dist, "hoebench-source-stamp");
  const stamp = sourceStamp(env);
  if (stamp && existsSync(path.join(dist, "BUILD_ID")) && existsSync(stampFile) && readFileSync(stampFile, "utf8") === stamp) {
    say("reusing the last build (nothing it is made from has changed)");
    return;
  }
  say("building the app (next build)");
  // Build output goes to stderr, so a benchmark's last stdout line stays its JSON.
  const result = spawnSync(process.execPath, [nextBin, "build"], { cwd: projectRoot, env: { ...process.env, ...env }, stdio: ["ignore", 2, 2] });
  if (result.status !== 0) throw new Error("next build failed");
  if (stamp) writeFileSync(stampFile, stamp);
}

/**
 * Serves the app: `next dev` for dev; otherwise the production build through
 * scripts/serve-cluster.ts, one worker per core. Test runs use one worker unless told
 * otherwise, so a suite that checks a per-process cache sees the same process each time.
 */
export async function serveApp(mode: "start" | "dev" | "test", env: Record<string, string>, options: { workers?: number } = {}): Promise<ChildProcess> {
  const port = portsFor(mode).app;
  if (await portOpen(port)) throw new Error(`port ${port} is taken; is Hoebench already running? Stop it first.`);
  const listen = ["-p", String(port), "-H", "127.0.0.1"];
  let child: ChildProcess;
  if (mode === "dev") {
    child = startChild("the app", process.execPath, ["--require", path.join(projectRoot, "scripts/client-address.cjs"), nextBin, "dev", ...listen], { ...env, NODE_ENV: "development" }, projectRoot);
  } else {
    const workers = options.workers ?? (mode === "test" ? 1 : undefined);
    const workerEnv: Record<string, string> = workers ? { HOEBENCH_APP_WORKERS: String(workers) } : {};
    child = startChild("the app", tsxBin, [path.join(projectRoot, "scripts/serve-cluster.ts"), ...listen], { ...env, ...workerEnv, NODE_ENV: "production" }, projectRoot);
  }
  await waitFor("the app", () => httpOk(`http://127.0.0.1:${port}/api/health`), mode === "dev" ? 180_000 : 60_000);
  return child;
}

export async function bringUp(mode: Mode, database = databaseFor(mode)): Promise<Record<string, string>> {
  const cluster = ensureCluster({ projectRoot, port: POSTGRES_PORT, fastUnsafe: mode === "test" });
  if (cluster.startedHere) onShutdown(cluster.stop);
  const env = appEnvironment(mode, database);
  if (mode === "test") recreateDatabase(POSTGRES_PORT, database);
  else if (ensureDatabase(POSTGRES_PORT, database)) say(`created database ${database}`);
  await prepareDatabase(env.DATABASE_URL, { seed: true });
  return env;
}

