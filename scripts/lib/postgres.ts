import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, rmSync, chownSync } from "node:fs";
import path from "node:path";
import { ensureDebianPackages } from "./apt";
import { say } from "./log";
import { run, succeeds } from "./shell";

const POSTGRES_BIN = "/usr/lib/postgresql/15/bin";
const isRoot = process.getuid?.() === 0;

export interface ClusterOptions {
  projectRoot: string;
  port: number;
  /** Test clusters trade durability for speed; never the start command's. */
  fastUnsafe?: boolean;
}

export interface Cluster {
  dataDir: string;
  socketDir: string;
  port: number;
  startedHere: boolean;
  stop(): void;
}

function asPostgresUser(command: string, args: string[]): string {
  return isRoot ? run("runuser", ["-u", "postgres", "--", command, ...args]) : run(command, args);
}

/**
 * initdb and postgres refuse to run as root, and the postgres user cannot enter a folder
 * below a mode-700 home; then the cluster lives in /var/lib/hoebench, keyed by project path.
 */
/**
 * The cluster lives in the project's own git-ignored .hoebench/, unless the postgres user
 * cannot reach that folder (a checkout under a home directory closed to others, as /root is):
 * then in a folder of its own under /var/lib/hoebench, named after the checkout's path.
 */
function chooseClusterRoot(projectRoot: string): string {
  const local = path.join(projectRoot, ".hoebench");
  mkdirSync(local, { recursive: true });
  if (!isRoot || succeeds("runuser", ["-u", "postgres", "--", "test", "-x", local])) return local;
  const key = createHash("sha256").update(projectRoot).digest("hex").slice(0, 12);
  const outside = path.join("/var/lib/hoebench", key);
  mkdirSync(outside, { recursive: true });
  return outside;
}

function ownByPostgres(folder: string): void {
  if (!isRoot) return;
  const uid = Number(run("id", ["-u", "postgres"]).trim());
  const gid = Number(run("id", ["-g", "postgres"]).trim());
  chownSync(folder, uid, gid);
}

function isReady(port: number): boolean {
  return succeeds(path.join(POSTGRES_BIN, "pg_isready"), ["-q", "-h", "127.0.0.1", "-p", String(port)]);
}

/** A postmaster.pid left by a killed server names a process that is gone or a zombie. */
function removeStalePidFile(dataDir: string): void {
  const pidFile = path.join(dataDir, "postmaster.pid");
  if (!existsSync(pidFile)) return;
  const pid = Number(readFileSync(pidFile, "utf8").split("\n")[0]);
  const statusPath = `/proc/${pid}/status`;
  const alive =
    pid > 0 &&
    existsSync(statusPath) &&
    /postgres/.test(readFileSync(`/proc/${pid}/comm`, "utf8")) &&
    !/State:\s+Z/.test(readFileSync(statusPath, "utf8"));
  if (!alive) {
    say(`removing stale postmaster.pid (pid ${pid} is gone)`);
    rmSync(pidFile);
  }
}

export function ensureCluster(options: ClusterOptions): Cluster {
  ensureDebianPackages(path.join(POSTGRES_BIN, "postgres"), ["postgresql"]);
  const root = chooseClusterRoot(options.projectRoot);
  const dataDir = path.join(root, "pg");
  const socketDir = path.join(root, "pg-socket");
  for (const folder of [dataDir, socketDir]) {
    if (!existsSync(folder)) {
      mkdirSync(folder, { recursive: true, mode: 0o700 });
      ownByPostgres(folder);
    }
  }

  if (!existsSync(path.join(dataDir, "PG_VERSION"))) {
    say(`creating PostgreSQL cluster in ${dataDir}`);
    asPostgresUser(path.join(POSTGRES_BIN, "initdb"), [
      "-D", dataDir, "-U", "postgres", "--auth=trust", "--encoding=UTF8", "--locale=C.UTF-8",
    ]);
  }

  const stop = () => {
    if (existsSync(path.join(dataDir, "postmaster.pid"))) {
      say("stopping PostgreSQL");
      try {
        asPostgresUser(path.join(POSTGRES_BIN, "pg_ctl"), ["-D", dataDir, "-m", "fast", "-w", "stop"]);
      } catch (error) {
        say(`PostgreSQL did not stop cleanly: ${(error as Error).message}`);
      }
    }
  };

  if (isReady(options.port)) {
    say(`PostgreSQL already running on 127.0.0.1:${options.port}`);
    // A test run starts the cluster without durable writes; data kept by npm start deserve them.
    if (!options.fastUnsafe && psql(options.port, "SHOW fsync").trim() === "off") {
      say("warning: this PostgreSQL was started by a test run, without durable writes (fsync off); stop it (or let the tests finish) and start again to keep your data safe");
    }
    return { dataDir, socketDir, port: options.port, startedHere: false, stop: () => {} };
  }

  removeStalePidFile(dataDir);
  const settings = [
    "-c listen_addresses=127.0.0.1",
    `-p ${options.port}`,
    `-k ${socketDir}`,
    "-c max_connections=200",
    ...(options.fastUnsafe ? ["-c fsync=off", "-c synchronous_commit=off", "-c full_page_writes=off"] : []),
  ].join(" ");
  say(`starting PostgreSQL on 127.0.0.1:${options.port}`);
  asPostgresUser(path.join(POSTGRES_BIN, "pg_ctl"), [
    "-D", dataDir, "-l", path.join(dataDir, "server.log"), "-w", "-t", "60", "-o", settings, "start",
  ]);
  return { dataDir, socketDir, port: options.port, startedHere: true, stop };
}

export function psql(port: number, sql: string, database = "postgres"): string {
  return run(path.join(POSTGRES_BIN, "psql"), [
    "-h", "127.0.0.1", "-p", String(port), "-U", "postgres", "-d", database, "-tA", "-v", "ON_ERROR_STOP=1", "-c", sql,
  ]);
}

export function ensureDatabase(port: number, name: string): boolean {
  const exists = psql(port, `SELECT 1 FROM pg_database WHERE datname = '${name}'`).trim() === "1";
  if (!exists) psql(port, `CREATE DATABASE "${name}"`);
  return !exists;
}

export function recreateDatabase(port: number, name: string): void {
  psql(port, `DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
  psql(port, `CREATE DATABASE "${name}"`);
}
