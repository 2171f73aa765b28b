import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { dayKey, runDueDailyJobs, type DailyJob } from "@/lib/jobs/daily";
import { previewDocument } from "@/lib/mail/caught-preview";
import { testDatabase } from "../support/database";

const name = `test-job-${Math.random().toString(36).slice(2, 8)}`;

beforeAll(() => {
  testDatabase();
});

afterAll(async () => {
  await testDatabase().query(`DELETE FROM job_runs WHERE name LIKE 'test-job-%'`);
});

describe("daily jobs", () => {
  it("run once a day even when several servers check at the same moment, and not before their hour", async () => {
    let runs = 0;
    const job: DailyJob = { name, hourUtc: 6, run: async () => void (runs += 1) };
    const early = new Date("2031-03-04T05:59:00Z");
    expect(await runDueDailyJobs([job], early)).toEqual([]);
    const due = new Date("2031-03-04T06:01:00Z");
    await Promise.all([runDueDailyJobs([job], due), runDueDailyJobs([job], due), runDueDailyJobs([job], due)]);
    expect(runs).toBe(1);
    await runDueDailyJobs([job], new Date("2031-03-04T18:00:00Z"));
    expect(runs).toBe(1);
    await runDueDailyJobs([job], new Date("2031-03-05T06:00:00Z"));
    expect(runs).toBe(2);
    expect(dayKey(due)).toBe("2031-03-04");
  });

  it("gives a failed run's day back, so the next check tries again", async () => {
    let attempts = 0;
    const flaky: DailyJob = {
      name: `${name}-flaky`,
      hourUtc: 0,
      run: async () => {
        attempts += 1;
        if (attempts === 1) throw new Error("database went away");
      },
    };
    const now = new Date("2031-03-04T10:00:00Z");
    const quiet = console.error;
    console.error = () => {};
    try {
      expect(await runDueDailyJobs([flaky], now)).toEqual([]);
    } finally {
      console.error = quiet;
    }
    expect(await runDueDailyJobs([flaky], now)).toEqual([flaky.name]);
    expect(attempts).toBe(2);
  });
});

describe("caught mail preview", () => {
  it("opens links in a new tab and forbids scripts inside the sandboxed frame", () => {
    const page = previewDocument('<html><head><title>x</title></head><body><a href="http://127.0.0.1/a">a</a></body></html>');
    expect(page).toMatch(/<head><base target="_blank"><meta http-equiv="Content-Security-Policy" content="default-src 'none';/);
    expect(previewDocument("<p>bare</p>")).toContain('<base target="_blank">');
  });
});
