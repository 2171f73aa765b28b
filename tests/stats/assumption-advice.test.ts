// assumptionAdvice: every branch of the plain-language advice, on hand-made evidence. The advice
// is text, so each case asserts the exact list of sentences. The Taylor power-law slopes that pick
// the transformation are fixed by construction (variances = means gives slope 1 exactly,
// variances = means² slope 2, equal variances slope 0; log s² = log a + b log ȳ, Taylor 1961);
// the doc-comment example's slope comes from R (scripts/r/doc-examples.R).
import { describe, expect, it } from "vitest";
import { assumptionAdvice } from "@/lib/stats";
import { loadFixture } from "./fixture-runner";

type Evidence = Parameters<typeof assumptionAdvice>[0];

const counts = [1, 3, 2, 8, 6, 9, 25, 33, 31];
const countMeans = [2, 8, 30];
const base: Evidence = {
  rawValues: counts,
  groupMeans: countMeans,
  groupVariances: [5, 5, 5],
  shapiroP: 0.4,
  leveneP: 0.6,
  alpha: 0.05,
  transform: "none",
  design: "crd",
};
const advise = (changes: Partial<Evidence>) => assumptionAdvice({ ...base, ...changes });

const allReasonable = "Residuals look normal and variances similar: the ANOVA assumptions are reasonable.";
const squareRoot = "The variance rises in proportion to the mean, as for counts: analyse √y (--transform sqrt).";
const logarithm = "The standard deviation rises with the mean: analyse log(y + 1) (--transform log1p).";
const arcsine = "Percentages near 0 or 100 have smaller variances: analyse asin √(y/100) (--transform asin-sqrt).";
const countsGeneric = "Counts usually need √y or log(y + 1) (--transform sqrt or log1p).";
const kruskal = "If a transformation does not help, the Kruskal-Wallis rank test (reported) does not assume normality.";
const friedman = "If a transformation does not help, the Friedman rank test (reported) does not assume normality.";
const rankGeneric = "If a transformation does not help, use a rank-based test such as Kruskal-Wallis.";

describe("assumptionAdvice", () => {
  it("says the assumptions are reasonable when neither test rejects", () => {
    expect(advise({})).toEqual([allReasonable]);
  });

  it("treats a test that could not run (p = null) as not rejecting", () => {
    expect(advise({ shapiroP: null, leveneP: null })).toEqual([allReasonable]);
  });

  it("rejects only when p < alpha: p = alpha is not significant", () => {
    expect(advise({ shapiroP: 0.05, leveneP: 0.05 })).toEqual([allReasonable]);
    expect(advise({ shapiroP: 0.02, leveneP: 0.02, alpha: 0.01 })).toEqual([allReasonable]);
  });

  it("variance proportional to the mean (slope 1) → square root", () => {
    expect(advise({ leveneP: 0.004, groupVariances: countMeans })).toEqual([
      "Variances differ between treatments (Brown-Forsythe p = 0.004).",
      squareRoot,
    ]);
  });

  it("standard deviation proportional to the mean (slope 2) → log(y + 1)", () => {
    expect(advise({ leveneP: 0.03, groupVariances: countMeans.map((mean) => mean * mean) })).toEqual([
      "Variances differ between treatments (Brown-Forsythe p = 0.030).",
      logarithm,
    ]);
  });

  it("percentages with no mean-variance trend → arcsine square root", () => {
    const percentages = [92.5, 88.1, 95.4, 51.2, 47.9, 55.3, 6.5, 11.2, 3.4];
    expect(advise({ leveneP: 0.01, rawValues: percentages, groupMeans: [92, 51.5, 7], groupVariances: [12, 12, 12] })).toEqual([
      "Variances differ between treatments (Brown-Forsythe p = 0.010).",
      arcsine,
    ]);
  });

  it("whole-number data in 0-100 are counts, not percentages: generic count advice when there is no trend", () => {
    expect(advise({ leveneP: 0.01, groupVariances: [5, 5, 5] })).toEqual([
      "Variances differ between treatments (Brown-Forsythe p = 0.010).",
      countsGeneric,
    ]);
  });

  it("no transformation advice for data that are neither counts nor percentages without a trend", () => {
    const yields = [4210.5, 3987.2, 4402.8, 5120.1, 4890.6, 5333.9];
    expect(advise({ leveneP: 0.02, rawValues: yields, groupMeans: [4200, 5100], groupVariances: [43000, 48000] })).toEqual([
      "Variances differ between treatments (Brown-Forsythe p = 0.020).",
    ]);
  });

  it("no slope from fewer than three treatments with positive mean and variance", () => {
    // Slope 1 among the usable points, but only two are usable (a zero mean and a zero variance are left out).
    expect(advise({ leveneP: 0.02, groupMeans: [2, 8, 0, 30], groupVariances: [2, 8, 4, 0] })).toEqual([
      "Variances differ between treatments (Brown-Forsythe p = 0.020).",
      countsGeneric,
    ]);
  });

  it("gives no transformation advice when a transformation is already applied", () => {
    for (const transform of ["sqrt", "log1p", "asin-sqrt"] as const) {
      expect(advise({ transform, leveneP: 0.004, shapiroP: 0.01, groupVariances: countMeans })).toEqual([
        "Variances differ between treatments (Brown-Forsythe p = 0.004).",
        "Residuals depart from a normal distribution (Shapiro-Wilk p = 0.010).",
        kruskal,
      ]);
    }
  });

  it("non-normal residuals name the rank test the analysis reports for the design", () => {
    const normality = "Residuals depart from a normal distribution (Shapiro-Wilk p = 0.012).";
    // Neither counts nor percentages (decimals above 100): no transformation advice in between.
    const nonCounts = { rawValues: [101.5, 102.5, 103.5, 104.5], groupMeans: [102, 104], groupVariances: [0.5, 0.5], shapiroP: 0.012 };
    expect(advise({ ...nonCounts, design: "crd" })).toEqual([normality, kruskal]);
    expect(advise({ ...nonCounts, design: "rcbd" })).toEqual([normality, friedman]);
    expect(advise({ ...nonCounts, design: "latin" })).toEqual([normality, rankGeneric]);
  });

  it("non-normal residuals alone also trigger the transformation advice", () => {
    expect(advise({ shapiroP: 0.001, groupVariances: countMeans, design: "rcbd" })).toEqual([
      "Residuals depart from a normal distribution (Shapiro-Wilk p = 0.001).",
      squareRoot,
      friedman,
    ]);
  });

  it("prints p below 0.001 in exponent form", () => {
    expect(advise({ leveneP: 0.00042, shapiroP: 1e-7, groupVariances: countMeans })).toEqual([
      "Variances differ between treatments (Brown-Forsythe p = 4.2e-4).",
      "Residuals depart from a normal distribution (Shapiro-Wilk p = 1.0e-7).",
      squareRoot,
      kruskal,
    ]);
  });

  it("the doc-comment example: R's Taylor slope (1.0356) lies in the square-root band (0.5, 1.5)", () => {
    const slope = loadFixture("doc_examples").examples.assumptionAdvice.taylorSlope; // R: coef(lm(log(var) ~ log(mean)))[2]
    expect(slope).toBeGreaterThan(0.5);
    expect(slope).toBeLessThan(1.5);
    expect(advise({ groupVariances: [2, 9, 33], shapiroP: 0.01, leveneP: 0.004 })).toEqual([
      "Variances differ between treatments (Brown-Forsythe p = 0.004).",
      "Residuals depart from a normal distribution (Shapiro-Wilk p = 0.010).",
      squareRoot,
      kruskal,
    ]);
  });
});
