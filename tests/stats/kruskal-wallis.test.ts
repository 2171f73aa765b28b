// Kruskal-Wallis rank test against R's kruskal.test (scripts/r/kruskal-wallis.R,
// tests/fixtures/stats/kruskal_wallis.json): InsectSprays (Beall 1942; R datasets::InsectSprays,
// counts with ties), an unbalanced 0-4 score trial with heavy ties (set.seed(2024), exported as
// kruskal_scores_crd.csv), and the doc-comment example.
import { describe, expect, it } from "vitest";
import { analyzeTrial, encodeFactor, kruskalWallis, StatsInputError } from "@/lib/stats";
import { loadFixture, loadRows } from "./fixture-runner";
import { expectClose } from "./helpers";

const fixture = loadFixture("kruskal_wallis");

function checkAgainstR(actual: { chi2: number; df: number; p: number } | undefined, expected: { chi2: number; df: number; p: number }, label: string) {
  expect(actual, `${label}: kruskalWallis present`).toBeDefined();
  expect(actual!.df).toBe(expected.df);
  expectClose(actual!.chi2, expected.chi2, 1e-12, 0, `${label} chi2`);
  expectClose(actual!.p, expected.p, 1e-10, 0, `${label} p`);
}

describe("Kruskal-Wallis test (R kruskal.test)", () => {
  for (const name of ["insectSprays", "tiedScores"]) {
    it(`${name}: analyzeTrial reports R's chi2, df and p for a crd`, () => {
      const set = fixture[name];
      const result = analyzeTrial(loadRows(set.data), set.options);
      checkAgainstR(result.kruskalWallis, set, name);
    });
  }

  it("the tie correction matters on the score trial (R's value differs from the uncorrected H)", () => {
    const set = fixture.tiedScores;
    expect(set.distinctValues).toBe(5);
    const rows = loadRows(set.data);
    const values = Float64Array.from(rows, (row) => Number(row.score));
    const result = kruskalWallis(values, encodeFactor(rows.map((row) => row.treatment)));
    checkAgainstR(result, set, "direct call");
    // 22 plots on 5 score values: R's statistic is the uncorrected H divided by 1 - Σ(t³ - t)/(N³ - N).
    const tieSizes = new Map<number, number>();
    for (const value of values) tieSizes.set(value, (tieSizes.get(value) ?? 0) + 1);
    const n = values.length;
    const correction = 1 - Array.from(tieSizes.values()).reduce((sum, t) => sum + t ** 3 - t, 0) / (n ** 3 - n);
    expect(correction).toBeLessThan(0.95);
    expect(Math.abs(result.chi2 * correction - set.chi2) / set.chi2).toBeGreaterThan(0.05);
  });

  it("is the same whatever monotone transformation is analysed (ranks of the raw counts)", () => {
    const set = fixture.insectSprays;
    const result = analyzeTrial(loadRows(set.data), { ...set.options, transform: "sqrt" });
    checkAgainstR(result.kruskalWallis, set, "sqrt");
  });

  it("gives the doc-comment example's value (R: kruskal.test(c(1,2,2,4,5,6), g))", () => {
    const result = kruskalWallis(new Float64Array([1, 2, 2, 4, 5, 6]), encodeFactor(["a", "a", "a", "b", "b", "b"]));
    checkAgainstR(result, fixture.tiny, "tiny");
  });

  it("is only reported for completely randomized designs (Friedman covers complete blocks)", () => {
    const result = analyzeTrial(loadRows("gomez_rcbd.csv"), { design: "rcbd", response: "yield", treatment: "rate", block: "rep" });
    expect(result.kruskalWallis).toBeUndefined();
    expect(result.friedman).toBeDefined();
  });

  it("refuses data it cannot rank meaningfully", () => {
    const two = encodeFactor(["a", "a", "b", "b"]);
    expect(() => kruskalWallis(new Float64Array([3, 3, 3, 3]), two)).toThrow(StatsInputError);
    expect(() => kruskalWallis(new Float64Array([3, 3, 3, 3]), two)).toThrow("kruskal-wallis test requires at least two different values");
    expect(() => kruskalWallis(new Float64Array([1, 2]), encodeFactor(["a", "a"]))).toThrow("kruskal-wallis test requires at least two treatments");
    expect(() => kruskalWallis(new Float64Array([1, Number.NaN, 3, 4]), two)).toThrow("kruskal-wallis test requires finite values");
  });
});
