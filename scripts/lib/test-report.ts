import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}

function vitestCounts(file: string): Counts {
  if (!existsSync(file)) return { passed: 0, failed: 1, skipped: 0 };
  const report = JSON.parse(readFileSync(file, "utf8"));
  // A suite that fails to load counts as a failure even though none of its tests ran.
  const brokenSuites = (report.testResults ?? []).filter(
    (suite: { status: string; assertionResults: unknown[] }) => suite.status === "failed" && suite.assertionResults.length === 0,
  ).length;
  return {
    passed: report.numPassedTests ?? 0,
    failed: (report.numFailedTests ?? 0) + brokenSuites,
    skipped: (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0),
  };
}

function playwrightCounts(file: string): Counts {
  if (!existsSync(file)) return { passed: 0, failed: 1, skipped: 0 };
  const { stats, errors } = JSON.parse(readFileSync(file, "utf8"));
  return {
    passed: (stats?.expected ?? 0) + (stats?.flaky ?? 0),
    failed: (stats?.unexpected ?? 0) + (errors?.length ?? 0),
    skipped: stats?.skipped ?? 0,
  };
}

/** The closing line CI reads: `N passed, N failed` (and skipped ones, if any). */
export function summarizeReports(folder: string, options: { expectUnits: boolean; expectBrowser: boolean }): Counts & { line: string } {
  const parts: Counts[] = [];
  if (options.expectUnits) parts.push(vitestCounts(path.join(folder, "vitest.json")));
  if (options.expectBrowser) parts.push(playwrightCounts(path.join(folder, "playwright.json")));
  const total = parts.reduce((sum, part) => ({ passed: sum.passed + part.passed, failed: sum.failed + part.failed, skipped: sum.skipped + part.skipped }), { passed: 0, failed: 0, skipped: 0 });
  const line = `${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ""}`;
  return { ...total, line };
}
