import { readFileSync } from "node:fs";
import path from "node:path";
import Papa from "papaparse";
import { expect } from "vitest";
import { analyzeTrial } from "@/lib/stats";
import { expectClose } from "./helpers";

export const fixtureDirectory = path.resolve(__dirname, "../fixtures/stats");

export function loadFixture(name: string): Record<string, any> {
  return JSON.parse(readFileSync(path.join(fixtureDirectory, `${name}.json`), "utf8"));
}

/** Reads a fixture CSV as text cells; lines starting with "#" are provenance comments (NIST data). */
export function loadRows(file: string): Record<string, string>[] {
  const text = readFileSync(path.join(fixtureDirectory, file), "utf8");
  return Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true, dynamicTyping: false, comments: "#" }).data;
}

export function analyzeFixture(name: string): { actual: Record<string, any>; expected: Record<string, any>; fixture: Record<string, any> } {
  const fixture = loadFixture(name);
  const actual = analyzeTrial(loadRows(fixture.data), fixture.options) as Record<string, any>;
  return { actual, expected: fixture.expected, fixture };
}

const sixDigits = 1e-6;

/** Compares every field R produced with our analysis: 6+ significant digits, Tukey/Shapiro p to 3 decimals. */
export function compareWithR(actual: Record<string, any>, expected: Record<string, any>, relative = 1e-9): void {
  const tight = Math.min(relative, sixDigits);
  expect(actual.n).toBe(expected.n);
  expectClose(actual.grandMean, expected.grandMean, tight, 0, "grandMean");
  expectClose(actual.cvPercent, expected.cvPercent, tight, 0, "cvPercent");
  expect(actual.anova.map((row: any) => row.source)).toEqual(expected.anova.map((row: any) => row.source));
  expected.anova.forEach((row: any, index: number) => {
    expect(actual.anova[index].df).toBe(row.df);
    for (const key of ["ss", "ms", "f", "p"]) {
      if (row[key] !== undefined) expectClose(actual.anova[index][key], row[key], tight, 1e-300, `${row.source}.${key}`);
    }
  });
  expected.means.forEach((line: any, index: number) => {
    const mine = actual.means[index];
    expect(mine.treatment).toBe(line.treatment);
    expect(mine.n).toBe(line.n);
    for (const key of ["mean", "lsmean", "se", "backTransformed"]) {
      if (line[key] !== undefined) expectClose(mine[key], line[key], tight, 1e-12, `${line.treatment}.${key}`);
    }
  });
  if (expected.lsd === undefined || expected.lsd === null) expect(actual.lsd).toBeNull();
  else expectClose(actual.lsd, expected.lsd, tight, 0, "lsd");
  expect(actual.comparisons.length).toBe(expected.comparisons.length);
  expected.comparisons.forEach((pair: any, index: number) => {
    const mine = actual.comparisons[index];
    expect([mine.a, mine.b]).toEqual([pair.a, pair.b]);
    const label = `${pair.a}-${pair.b}`;
    expectClose(mine.diff, pair.diff, tight, 1e-12, `${label} diff`);
    expectClose(mine.se, pair.se, tight, 0, `${label} se`);
    expectClose(mine.pLsd, pair.pLsd, tight, 1e-300, `${label} pLsd`);
    expectClose(mine.pTukey, pair.pTukey, 1e-6, 1e-9, `${label} pTukey`);
  });
  expectClose(actual.assumptions.shapiroWilk.w, expected.assumptions.shapiroWilk.w, tight, 0, "Shapiro W");
  expectClose(actual.assumptions.shapiroWilk.p, expected.assumptions.shapiroWilk.p, 1e-6, 1e-9, "Shapiro p");
  expectClose(actual.assumptions.levene.f, expected.assumptions.levene.f, tight, 0, "Levene F");
  expectClose(actual.assumptions.levene.p, expected.assumptions.levene.p, tight, 0, "Levene p");
  if (expected.friedman) {
    expectClose(actual.friedman.chi2, expected.friedman.chi2, tight, 0, "Friedman chi2");
    expect(actual.friedman.df).toBe(expected.friedman.df);
    expectClose(actual.friedman.p, expected.friedman.p, tight, 0, "Friedman p");
  }
}
