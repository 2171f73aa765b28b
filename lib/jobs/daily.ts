import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";

/** The UTC calendar day, as the key that makes a daily job run once across all servers. */
export function dayKey(date: Date): string {
  return date.toISOString().slice(0, 10);
}

/** True for the one server that gets to run `name` for `key`; every other caller gets false. */
export async function claimJobRun(name: string, key: string): Promise<boolean> {
  const rows = await db().query(
    `INSERT INTO job_runs (name, run_key, started_at) VALUES (:name, :key, now()) ON CONFLICT DO NOTHING RETURNING name`,
    { type: QueryTypes.SELECT, replacements: { name, key } },
  );
  return rows.length === 1;
}

export async function finishJobRun(name: string, key: string): Promise<void> {
  await db().query(`UPDATE job_runs SET finished_at = now() WHERE name = :name AND run_key = :key`, { replacements: { name, key } });
}

/** A failed run gives up its claim so the next check (on any server) tries again. */
export async function releaseJobRun(name: string, key: string): Promise<void> {
  await db().query(`DELETE FROM job_runs WHERE name = :name AND run_key = :key AND finished_at IS NULL`, { replacements: { name, key } });
}

export interface DailyJob {
  name: string;
  /** Hour of the UTC day from which the job is due. */
  hourUtc: number;
  run: (now: Date) => Promise<unknown>;
}

/** Runs every job that is due today and not yet claimed; failures are released and logged briefly. */
export async function runDueDailyJobs(jobs: DailyJob[], now = new Date()): Promise<string[]> {
  const ran: string[] = [];
  for (const job of jobs) {
    if (now.getUTCHours() < job.hourUtc) continue;
    const key = dayKey(now);
    if (!(await claimJobRun(job.name, key))) continue;
    try {
      await job.run(now);
      await finishJobRun(job.name, key);
      ran.push(job.name);
    } catch (error) {
      await releaseJobRun(job.name, key).catch(() => undefined);
      console.error(`daily job ${job.name} failed`, error instanceof Error ? error.message : error);
    }
  }
  return ran;
}
