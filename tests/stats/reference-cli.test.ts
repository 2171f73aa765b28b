// The three shared reference analyses (R 4.2.2 output, see
// tests/fixtures/stats/reference/README.md: lm, anova, emmeans, pairs(adjust = "none" | "tukey"),
// shapiro.test, car::leveneTest(center = median), friedman.test, t.test), run through the CLI.
import { execFileSync } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { expectClose } from "./helpers";

const root = path.resolve(__dirname, "../..");
const fixtures = path.join(root, "tests/fixtures/stats/reference");
const tsx = path.join(root, "node_modules/.bin/tsx");

function runCli(args: string[]): Record<string, any> {
  const output = execFileSync(tsx, [path.join(root, "scripts/analyze.ts"), ...args], { cwd: root, encoding: "utf8" });
  return JSON.parse(output);
}

const sixDigits = 1e-6;
// Tukey and Shapiro-Wilk p-values: to 3 decimals (contract analysis-cli.md).
const threeDecimals = 5e-4;

for (const name of ["hardness_rcbd", "insect_sprays_crd"]) {
  describe(`reference ${name} (R 4.2.2)`, () => {
    const expected = JSON.parse(readFileSync(path.join(fixtures, `${name}.expected.json`), "utf8"));
    const actual = runCli([path.join(fixtures, `${name}.csv`), ...expected.args]);

    it("has the same design, n, grand mean and CV%", () => {
      expect(actual.design).toBe(expected.design);
      expect(actual.response).toBe(expected.response);
      expect(actual.transform).toBe(expected.transform);
      expect(actual.n).toBe(expected.n);
      expectClose(actual.grandMean, expected.grandMean, sixDigits, 0, "grandMean");
      expectClose(actual.cvPercent, expected.cvPercent, sixDigits, 0, "cvPercent");
    });

    it("has the same ANOVA table", () => {
      expect(actual.anova.map((row: any) => row.source)).toEqual(expected.anova.map((row: any) => row.source));
      expected.anova.forEach((row: any, index: number) => {
        const mine = actual.anova[index];
        expect(mine.df).toBe(row.df);
        for (const key of ["ss", "ms", "f", "p"]) {
          if (row[key] !== undefined) expectClose(mine[key], row[key], sixDigits, 0, `${row.source}.${key}`);
        }
      });
    });

    it("has the same means, lsmeans and standard errors", () => {
      expect(actual.means.map((line: any) => line.treatment)).toEqual(expected.means.map((line: any) => line.treatment));
      expected.means.forEach((line: any, index: number) => {
        const mine = actual.means[index];
        expect(mine.n).toBe(line.n);
        for (const key of ["mean", "lsmean", "se"]) expectClose(mine[key], line[key], sixDigits, 0, `${line.treatment}.${key}`);
      });
      expectClose(actual.lsd, expected.lsd, sixDigits, 0, "lsd");
    });

    it("has the same pairwise comparisons", () => {
      expect(actual.comparisons.length).toBe(expected.comparisons.length);
      expected.comparisons.forEach((pair: any, index: number) => {
        const mine = actual.comparisons[index];
        expect([mine.a, mine.b]).toEqual([pair.a, pair.b]);
        const label = `${pair.a}-${pair.b}`;
        expectClose(mine.diff, pair.diff, sixDigits, 1e-12, `${label} diff`);
        expectClose(mine.se, pair.se, sixDigits, 0, `${label} se`);
        expectClose(mine.pLsd, pair.pLsd, sixDigits, 0, `${label} pLsd`);
        expectClose(mine.pTukey, pair.pTukey, 0, threeDecimals, `${label} pTukey`);
        // Beyond the contract: our port of R's ptukey agrees far better than 3 decimals.
        expectClose(mine.pTukey, pair.pTukey, 1e-6, 1e-12, `${label} pTukey (6 digits)`);
      });
    });

    it("has the same assumption checks", () => {
      const { shapiroWilk, levene } = expected.assumptions;
      expectClose(actual.assumptions.shapiroWilk.w, shapiroWilk.w, sixDigits, 0, "W");
      expectClose(actual.assumptions.shapiroWilk.p, shapiroWilk.p, 0, threeDecimals, "Shapiro p");
      expectClose(actual.assumptions.levene.f, levene.f, sixDigits, 0, "Levene F");
      expectClose(actual.assumptions.levene.p, levene.p, sixDigits, 0, "Levene p");
      if (expected.friedman) {
        expectClose(actual.friedman.chi2, expected.friedman.chi2, sixDigits, 0, "Friedman chi2");
        expect(actual.friedman.df).toBe(expected.friedman.df);
        expectClose(actual.friedman.p, expected.friedman.p, sixDigits, 0, "Friedman p");
      } else {
        expect(actual.friedman).toBeUndefined();
      }
    });
  });
}

describe("reference sleep_paired (R 4.2.2 t.test(paired = TRUE))", () => {
  const expected = JSON.parse(readFileSync(path.join(fixtures, "sleep_paired.expected.json"), "utf8"));
  const actual = runCli([path.join(fixtures, "sleep_paired.csv"), ...expected.args]);
  it("has the same t-test", () => {
    expect(actual.design).toBe("paired");
    expect([actual.tTest.a, actual.tTest.b]).toEqual([expected.tTest.a, expected.tTest.b]);
    for (const key of ["t", "df", "p", "meanDiff"]) expectClose(actual.tTest[key], expected.tTest[key], sixDigits, 0, key);
    expectClose(actual.tTest.ci[0], expected.tTest.ci[0], sixDigits, 0, "ci lower");
    expectClose(actual.tTest.ci[1], expected.tTest.ci[1], sixDigits, 0, "ci upper");
  });
});
