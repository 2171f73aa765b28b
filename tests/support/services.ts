import { spawn, spawnSync } from "node:child_process";
import path from "node:path";
import { databaseFor, portsFor, POSTGRES_PORT, projectRoot, stateRoot, testStateName } from "@/scripts/lib/environment";
import { psql } from "@/scripts/lib/postgres";

/**
 * Cuts the test database off as a stopped server would: every connection dropped, none accepted.
 * Each termination waits for its backend to exit, so the goodbye has reached every client, the
 * test's own idle pool included, before the test reads again; otherwise a slow host lets a pooled
 * connection take one more query and fail it.
 */
export function takeDatabaseDown(): void {
  const database = databaseFor("test");
  psql(POSTGRES_PORT, `ALTER DATABASE "${database}" WITH ALLOW_CONNECTIONS false`);
  psql(POSTGRES_PORT, `SELECT pg_terminate_backend(pid, 5000) FROM pg_stat_activity WHERE datname = '${database}' AND pid <> pg_backend_pid()`);
}

/**
 * Lets connections in again. It first lets the event loop turn twice: the dropped connections'
 * goodbyes sit unread in this process's sockets, and a query sent before they are read (an HTTP
 * answer can be handled first in the same turn) would fail on a connection already gone.
 */
export async function bringDatabaseBack(): Promise<void> {
  for (let turn = 0; turn < 2; turn += 1) await new Promise((resolve) => setImmediate(resolve));
  psql(POSTGRES_PORT, `ALTER DATABASE "${databaseFor("test")}" WITH ALLOW_CONNECTIONS true`);
}

function listenerPid(port: number): number | null {
  const output = spawnSync("ss", ["-ltnpH", `sport = :${port}`], { encoding: "utf8" }).stdout;
  const match = /pid=(\d+)/.exec(output);
  return match ? Number(match[1]) : null;
}

/** Stops this test run's S3 and mail fakes (one process), as an outage would. */
export async function stopFakes(): Promise<void> {
  const pid = listenerPid(portsFor("test").s3);
  if (!pid) throw new Error("the S3 fake is not running");
  process.kill(pid, "SIGTERM");
  for (let attempt = 0; attempt < 50 && listenerPid(portsFor("test").s3); attempt += 1) await new Promise((resolve) => setTimeout(resolve, 100));
}

/** Starts them again on the same ports and storage folder, as the test command had them. */
export async function startFakesAgain(): Promise<void> {
  const ports = portsFor("test");
  const child = spawn(path.join(projectRoot, "node_modules/.bin/tsx"), [path.join(projectRoot, "scripts/fakes.ts")], {
    cwd: projectRoot,
    detached: true,
    stdio: "ignore",
    env: {
      ...process.env,
      FAKE_S3_PORT: String(ports.s3),
      FAKE_SMTP_PORT: String(ports.smtp),
      FAKE_MAIL_HTTP_PORT: String(ports.mailHttp),
      FAKE_STATE_DIR: path.join(stateRoot, testStateName("fakes-test")),
      FAKE_S3_BUCKETS: process.env.S3_BUCKET ?? "hoebench-test",
    },
  });
  child.unref();
  for (let attempt = 0; attempt < 100 && !listenerPid(ports.s3); attempt += 1) await new Promise((resolve) => setTimeout(resolve, 100));
  if (!listenerPid(ports.s3)) throw new Error("the fakes did not come back");
}

/**
 * Holds a table from a connection of its own, so the next transaction that writes to it waits
 * there, in the middle of its work: the moment to pull the database away from under it.
 */
export async function holdTable(table: string): Promise<{ waiter: (queryStart: string) => Promise<number>; release: () => Promise<void> }> {
  const { Client } = await import("pg");
  const holder = new Client({ connectionString: process.env.DATABASE_URL });
  holder.on("error", () => {});
  await holder.connect();
  await holder.query("BEGIN");
  await holder.query(`LOCK TABLE ${table} IN EXCLUSIVE MODE`);
  return {
    /** The backend waiting on the held table with a statement that starts so. */
    async waiter(queryStart: string): Promise<number> {
      for (let attempt = 0; attempt < 400; attempt += 1) {
        const pid = psql(POSTGRES_PORT, `SELECT pid FROM pg_stat_activity WHERE wait_event_type = 'Lock' AND query LIKE '${queryStart.replace(/'/g, "''")}%' LIMIT 1`, databaseFor("test"));
        if (pid) return Number(pid);
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
      throw new Error(`nothing came to wait on ${table}`);
    },
    async release(): Promise<void> {
      await holder.end().catch(() => {});
    },
  };
}

/** As takeDatabaseDown, but the given backend goes first, before anything could release what it waits for. */
export function takeDatabaseDownUnder(pid: number): void {
  const database = databaseFor("test");
  psql(POSTGRES_PORT, `ALTER DATABASE "${database}" WITH ALLOW_CONNECTIONS false`);
  psql(POSTGRES_PORT, `SELECT pg_terminate_backend(${Number(pid)}, 5000)`);
  psql(POSTGRES_PORT, `SELECT pg_terminate_backend(pid, 5000) FROM pg_stat_activity WHERE datname = '${database}' AND pid <> pg_backend_pid()`);
}
