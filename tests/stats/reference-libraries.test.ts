// lib/stats against the two reference libraries on the npm registry that the stack names: jstat
// 1.9.6 (jStat) and simple-statistics 7.12.1, over grids covering the ranges the engine uses
// (ANOVA F and t p-values, LSD and TOST t quantiles, Tukey with up to 40 treatments, df to 1000).
// Each check names the library function it is compared with. The tolerances are the libraries'
// own accuracy, measured here: jStat's incomplete beta stops its continued fraction at a relative
// change of 3e-7, so its t and F functions carry about 7 digits, and its upper tails are 1 - cdf;
// simple-statistics' normal functions are a 4-decimal table and short rational approximations.
// lib/stats is checked to 1e-12 against R in distributions.test.ts; here the libraries confirm it
// independently, and the last block shows where they fall short of R and lib/stats does not.
import { createRequire } from "node:module";
import * as ss from "simple-statistics";
import { describe, expect, it } from "vitest";
import {
  brownForsytheLevene,
  chiSquareCdf,
  compensatedSum,
  encodeFactor,
  fCdf,
  fitCompletelyRandomized,
  fQuantile,
  incompleteBeta,
  incompleteGamma,
  logGamma,
  NeumaierAccumulator,
  normalCdf,
  normalQuantile,
  pairedTTest,
  pairwiseComparisons,
  studentizedRangeCdf,
  studentizedRangeQuantile,
  studentTCdf,
  studentTQuantile,
} from "@/lib/stats";
import { sumOfSquaredDeviations } from "@/lib/stats/core/sum-of-squared-deviations";
import { groupMeans } from "@/lib/stats/designs/group-means";
import { loadFixture, loadRows } from "./fixture-runner";
import { expectClose } from "./helpers";

// jstat ships no type declarations; only the functions compared here are typed.
interface JStat {
  normal: { cdf(x: number, mean: number, sd: number): number; inv(p: number, mean: number, sd: number): number };
  studentt: { cdf(t: number, df: number): number; inv(p: number, df: number): number };
  centralF: { cdf(f: number, df1: number, df2: number): number; inv(p: number, df1: number, df2: number): number };
  chisquare: { cdf(x: number, df: number): number };
  tukey: { cdf(q: number, means: number, df: number): number; inv(p: number, means: number, df: number): number };
  gammaln(x: number): number;
  ibeta(x: number, a: number, b: number): number;
  lowRegGamma(a: number, x: number): number;
  mean(values: number[]): number;
  variance(values: number[], sample: boolean): number;
  anovafscore(...groups: number[][]): number;
  anovaftest(...groups: number[][]): number;
  tukeyhsd(groups: number[][]): Array<[[number, number], number]>;
  tscore(value: number, values: number[]): number;
  ttest(value: number, values: number[], sides: number): number;
}
const { jStat } = createRequire(import.meta.url)("jstat") as { jStat: JStat };

const degreesOfFreedom = [1, 2, 3, 4, 5, 7, 9, 12, 15, 20, 30, 45, 66, 120, 500, 1000];
const denominatorDf = [2, 4, 6, 9, 12, 20, 35, 66, 120, 500, 1000];
const numeratorDf = [1, 2, 3, 4, 5, 8, 11, 20, 39];
const steps = (from: number, to: number, count: number) => Array.from({ length: count }, (_, index) => from + ((to - from) * index) / (count - 1));
const probabilities = [1e-10, 1e-6, 1e-4, 0.001, 0.01, 0.025, 0.05, 0.1, 0.2, 0.3, 0.4, 0.45, 0.55, 0.6, 0.7, 0.8, 0.9, 0.95, 0.975, 0.99, 0.999, 0.9999];

describe("normal distribution vs jStat.normal and simple-statistics", () => {
  it("normalCdf agrees with jStat.normal.cdf to 2.2e-16 absolute on [-8, 8] and 1e-13 relative above -3", () => {
    for (const x of steps(-8, 8, 321)) {
      const reference = jStat.normal.cdf(x, 0, 1);
      expectClose(normalCdf(x), reference, 0, 3e-16, `jStat.normal.cdf(${x}, 0, 1)`);
      if (x >= -3) expectClose(normalCdf(x), reference, 1e-13, 0, `jStat.normal.cdf(${x}, 0, 1), relative`);
    }
  });

  it("normalQuantile agrees with jStat.normal.inv to 1e-9 relative (jStat refines erfcinv with two Newton steps)", () => {
    for (const p of probabilities) expectClose(normalQuantile(p), jStat.normal.inv(p, 0, 1), 1e-9, 1e-15, `jStat.normal.inv(${p}, 0, 1)`);
  });

  it("normalCdf agrees with simple-statistics' 4-decimal table (cumulativeStdNormalProbability) to 5e-5", () => {
    for (const x of steps(-3.09, 3.09, 619)) {
      const z = Math.round(x * 100) / 100;
      expectClose(normalCdf(z), ss.cumulativeStdNormalProbability(z), 0, 5.0001e-5, `ss.cumulativeStdNormalProbability(${z})`);
    }
  });

  it("erf = 2 Φ(x√2) - 1 agrees with simple-statistics errorFunction to its stated 1.2e-7", () => {
    for (const x of steps(-4, 4, 161)) expectClose(2 * normalCdf(x * Math.SQRT2) - 1, ss.errorFunction(x), 0, 1.2e-7, `ss.errorFunction(${x})`);
  });

  it("normalQuantile agrees with simple-statistics probit (inverse-erf approximation) to 4e-3 relative", () => {
    for (const p of probabilities.filter((value) => value >= 1e-6 && value <= 1 - 1e-6)) {
      expectClose(normalQuantile(p), ss.probit(p), 4e-3, 0, `ss.probit(${p})`);
    }
  });
});

describe("t, F and chi-square vs jStat", () => {
  it("studentTCdf agrees with jStat.studentt.cdf to 2e-7 relative (t in [-10, 10], df 1-1000)", () => {
    for (const t of steps(-10, 10, 81)) {
      for (const df of degreesOfFreedom) expectClose(studentTCdf(t, df).lower, jStat.studentt.cdf(t, df), 2e-7, 0, `jStat.studentt.cdf(${t}, ${df})`);
    }
  });

  it("studentTQuantile agrees with jStat.studentt.inv to 2e-7 relative (the LSD, TOST and CI quantiles)", () => {
    for (const p of [0.0005, 0.005, 0.025, 0.05, 0.1, 0.25, 0.75, 0.9, 0.95, 0.975, 0.995, 0.9995]) {
      for (const df of degreesOfFreedom) expectClose(studentTQuantile(p, df), jStat.studentt.inv(p, df), 2e-7, 0, `jStat.studentt.inv(${p}, ${df})`);
    }
  });

  it("fCdf agrees with jStat.centralF.cdf to 1e-7 relative and its 1 - cdf upper tail to 1e-7 absolute", () => {
    for (const f of [0.01, 0.1, 0.25, 0.5, 0.75, 1, 1.5, 2, 3, 4, 6, 10, 20]) {
      for (const df1 of numeratorDf) {
        for (const df2 of denominatorDf) {
          const reference = jStat.centralF.cdf(f, df1, df2);
          const tails = fCdf(f, df1, df2);
          expectClose(tails.lower, reference, 1e-7, 0, `jStat.centralF.cdf(${f}, ${df1}, ${df2})`);
          expectClose(tails.upper, 1 - reference, 0, 1e-7, `1 - jStat.centralF.cdf(${f}, ${df1}, ${df2})`);
        }
      }
    }
  });

  it("fQuantile agrees with jStat.centralF.inv to 2e-7 relative (alpha 0.001-0.2)", () => {
    for (const alpha of [0.001, 0.01, 0.05, 0.1, 0.2]) {
      for (const df1 of numeratorDf) {
        for (const df2 of denominatorDf) expectClose(fQuantile(alpha, df1, df2), jStat.centralF.inv(1 - alpha, df1, df2), 2e-7, 0, `jStat.centralF.inv(${1 - alpha}, ${df1}, ${df2})`);
      }
    }
  });

  it("chiSquareCdf agrees with jStat.chisquare.cdf to 1e-10 relative (Friedman and Kruskal-Wallis p-values)", () => {
    for (const x of [0.01, 0.1, 0.5, 1, 2, 3.84, 5, 7.8, 10, 15, 20, 30, 50]) {
      for (const df of [1, 2, 3, 4, 5, 6, 8, 10, 14, 20, 30, 40]) {
        const reference = jStat.chisquare.cdf(x, df);
        expectClose(chiSquareCdf(x, df).lower, reference, 1e-10, 0, `jStat.chisquare.cdf(${x}, ${df})`);
        expectClose(chiSquareCdf(x, df).upper, 1 - reference, 0, 1e-11, `1 - jStat.chisquare.cdf(${x}, ${df})`);
      }
    }
  });

  it("chiSquareCdf puts simple-statistics' chi-square critical values (2-decimal table) at their tail probabilities", () => {
    // The table gives two decimals, and some entries are one unit off in the last (df 6, 0.10: 10.65 for
    // R's qchisq(0.9, 6) = 10.6446), so the tolerance is the change in the tail over ±0.01.
    const table = ss.chiSquaredDistributionTable as unknown as Record<string, Record<string, number>>;
    for (const [df, row] of Object.entries(table)) {
      for (const [upperTail, critical] of Object.entries(row)) {
        if (critical < 0.5) continue; // 0, 0.01, 0.02 …: two decimals say too little about the tail there
        const change = Math.abs(chiSquareCdf(critical + 0.01, Number(df)).upper - chiSquareCdf(critical - 0.01, Number(df)).upper) / 2;
        expectClose(chiSquareCdf(critical, Number(df)).upper, Number(upperTail), 0, change, `ss.chiSquaredDistributionTable[${df}][${upperTail}] = ${critical}`);
      }
    }
  });

  it("incompleteBeta and incompleteGamma agree with jStat.ibeta (5e-8 absolute) and jStat.lowRegGamma (1e-10 relative)", () => {
    for (const x of [0.001, 0.01, 0.1, 0.3, 0.5, 0.7, 0.9, 0.99]) {
      for (const a of [0.5, 1, 1.5, 2, 5, 10, 20, 50]) {
        for (const b of [0.5, 1, 3, 10, 50, 500]) expectClose(incompleteBeta(x, a, b).lower, jStat.ibeta(x, a, b), 0, 5e-8, `jStat.ibeta(${x}, ${a}, ${b})`);
      }
    }
    for (const x of [0.01, 0.5, 1, 2, 5, 10, 30, 100]) {
      for (const a of [0.5, 1, 1.5, 2, 5, 20, 50]) expectClose(incompleteGamma(a, x).lower, jStat.lowRegGamma(a, x), 1e-10, 0, `jStat.lowRegGamma(${a}, ${x})`);
    }
  });

  it("logGamma agrees with jStat.gammaln and simple-statistics gammaln to 1e-12 (relative above 1, absolute below)", () => {
    for (const x of [1e-5, 0.1, 0.5, 1, 1.5, 2, 2.5, 3.7, 9.99, 10, 33.3, 500, 1e6]) {
      const scale = Math.max(1, Math.abs(logGamma(x)));
      expectClose(logGamma(x), jStat.gammaln(x), 0, 1e-12 * scale, `jStat.gammaln(${x})`);
      expectClose(logGamma(x), ss.gammaln(x), 0, 1e-12 * scale, `ss.gammaln(${x})`);
    }
  });
});

describe("studentized range vs jStat.tukey", () => {
  const tukeyMeans = [2, 3, 4, 6, 10, 15, 20, 40];
  const tukeyDf = [2, 3, 5, 9, 20, 60, 120, 500];
  it("studentizedRangeCdf agrees with jStat.tukey.cdf to 1e-9 absolute (2-40 means, df 2-500)", () => {
    for (const q of [0.25, 0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 6, 7]) {
      for (const means of tukeyMeans) {
        for (const df of tukeyDf) expectClose(studentizedRangeCdf(q, means, df), jStat.tukey.cdf(q, means, df), 0, 1e-9, `jStat.tukey.cdf(${q}, ${means}, ${df})`);
      }
    }
  });

  it("studentizedRangeQuantile agrees with jStat.tukey.inv to 2e-7 relative (p 0.90, 0.95, 0.99)", () => {
    for (const p of [0.9, 0.95, 0.99]) {
      for (const means of tukeyMeans) {
        for (const df of tukeyDf) expectClose(studentizedRangeQuantile(p, means, df), jStat.tukey.inv(p, means, df), 2e-7, 0, `jStat.tukey.inv(${p}, ${means}, ${df})`);
      }
    }
  });
});

// Data from outside the project: InsectSprays (R datasets, Beall 1942), the hardness RCBD
// (Montgomery) and sleep (R datasets, Cushny & Peebles 1905) from the shared reference files.
const insect = loadRows("insect_sprays.csv");
const sprays = encodeFactor(insect.map((row) => row.spray));
const counts = Float64Array.from(insect, (row) => Number(row.count));
const unbalanced = loadRows("letters_unbalanced.csv");
const unbalancedTreatment = encodeFactor(unbalanced.map((row) => row.treatment));
const unbalancedY = Float64Array.from(unbalanced, (row) => Number(row.y));
const split = (values: Float64Array, codes: Int32Array, levels: number) =>
  Array.from({ length: levels }, (_, level) => Array.from(values.filter((_, index) => codes[index] === level)));

describe("descriptive helpers vs simple-statistics and jStat", () => {
  const samples: Array<[string, number[]]> = [
    ["InsectSprays counts", Array.from(counts)],
    ["15-treatment unbalanced trial", Array.from(unbalancedY)],
    ["hardness", loadRows("reference/hardness_rcbd.csv").map((row) => Number(row.hardness))],
    ["values near 1e6 (NIST SmLs04 pattern)", Array.from({ length: 21 }, (_, index) => 1000000.4 + (index === 0 ? 0 : index % 2 ? -0.1 : 0.1))],
  ];

  it("compensatedSum and NeumaierAccumulator agree with simple-statistics sum (Kahan-Babuska)", () => {
    for (const [label, values] of [...samples, ["cancellation", [1e16, 1, -1e16]] as [string, number[]]]) {
      expect(compensatedSum(values), `ss.sum(${label})`).toBe(ss.sum(values));
      const accumulator = new NeumaierAccumulator();
      for (const value of values) accumulator.add(value);
      expect(accumulator.value(), `ss.sum(${label})`).toBe(ss.sum(values));
    }
  });

  it("means and sample variances agree with simple-statistics mean / sampleVariance and jStat.mean / jStat.variance(·, true)", () => {
    for (const [label, values] of samples) {
      const { means } = groupMeans(Float64Array.from(values), new Int32Array(values.length), 1);
      expectClose(means[0], ss.mean(values), 1e-14, 0, `ss.mean(${label})`);
      expectClose(means[0], jStat.mean(values), 1e-14, 0, `jStat.mean(${label})`);
      const variance = sumOfSquaredDeviations(values, means[0]) / (values.length - 1);
      expectClose(variance, ss.sampleVariance(values), 1e-9, 0, `ss.sampleVariance(${label})`);
      expectClose(variance, jStat.variance(values, true), 1e-9, 0, `jStat.variance(${label}, true)`);
      expectClose(sumOfSquaredDeviations(values, ss.mean(values)), ss.sumNthPowerDeviations(values, 2), 1e-9, 0, `ss.sumNthPowerDeviations(${label}, 2)`);
    }
  });

  it("groupMeans agrees with simple-statistics mean for every treatment", () => {
    const { means, counts: sizes } = groupMeans(unbalancedY, unbalancedTreatment.codes, unbalancedTreatment.levels.length);
    split(unbalancedY, unbalancedTreatment.codes, unbalancedTreatment.levels.length).forEach((group, level) => {
      expect(sizes[level]).toBe(group.length);
      expectClose(means[level], ss.mean(group), 1e-14, 0, `ss.mean(${unbalancedTreatment.levels[level]})`);
    });
  });
});

describe("one-way ANOVA, Tukey, Brown-Forsythe and paired t vs jStat / simple-statistics", () => {
  for (const [label, values, treatment] of [
    ["InsectSprays", counts, sprays],
    ["15 treatments, 3-8 plots each", unbalancedY, unbalancedTreatment],
  ] as const) {
    const groups = split(values, treatment.codes, treatment.levels.length);
    const fit = fitCompletelyRandomized(values, treatment);

    it(`${label}: F and p agree with jStat.anovafscore / jStat.anovaftest`, () => {
      expectClose(fit.anova[0].f as number, jStat.anovafscore(...groups), 1e-12, 0, "jStat.anovafscore");
      expectClose(fit.anova[0].p as number, jStat.anovaftest(...groups), 0, 1e-7, "jStat.anovaftest (1 - cdf)");
    });

    it(`${label}: Tukey(-Kramer) p-values agree with jStat.tukeyhsd`, () => {
      const mine = pairwiseComparisons(fit);
      const theirs = jStat.tukeyhsd(groups);
      expect(theirs.length).toBe(mine.length);
      theirs.forEach(([[first, second], p], index) => {
        expect([mine[index].a, mine[index].b]).toEqual([treatment.levels[first], treatment.levels[second]]);
        expectClose(mine[index].pTukey, p, 0, 1e-8, `jStat.tukeyhsd ${treatment.levels[first]}-${treatment.levels[second]}`);
      });
    });

    it(`${label}: Brown-Forsythe equals jStat's ANOVA on absolute deviations from simple-statistics medians`, () => {
      const deviations = groups.map((group) => group.map((value) => Math.abs(value - ss.median(group))));
      const levene = brownForsytheLevene(values, treatment);
      expectClose(levene.f, jStat.anovafscore(...deviations), 1e-12, 0, "jStat.anovafscore(|y - ss.median|)");
      expectClose(levene.p, jStat.anovaftest(...deviations), 0, 1e-7, "jStat.anovaftest(|y - ss.median|)");
    });
  }

  // simple-statistics' tTest divides by the population standard deviation, so it is not the paired t;
  // jStat.tscore uses the sample standard deviation.
  it("paired t agrees with jStat.tscore and jStat.ttest on the differences (sleep data)", () => {
    const sleep = loadRows("reference/sleep_paired.csv");
    const drug1 = sleep.filter((row) => row.drug === "drug1").map((row) => Number(row.extra));
    const drug2 = sleep.filter((row) => row.drug === "drug2").map((row) => Number(row.extra));
    const differences = drug1.map((value, index) => value - drug2[index]);
    const result = pairedTTest("drug1", "drug2", drug1, drug2);
    // jStat.tscore(value, x) is (value - mean) / (s / √n): the null value comes first, hence the sign.
    expectClose(result.t, -jStat.tscore(0, differences), 1e-12, 0, "-jStat.tscore(0, differences)");
    expectClose(result.p, jStat.ttest(0, differences, 2), 1e-6, 0, "jStat.ttest(0, differences, 2)");
  });
});

describe("where the libraries fall short (why lib/stats has its own distributions): R's values", () => {
  const r = loadFixture("distributions");

  it("tiny F upper tails: R's pf(lower.tail = FALSE) is matched by fCdf to 1e-10, while jStat's 1 - cdf loses at least 5 digits", () => {
    const tiny = r.f.filter((row: any) => row.upper > 0 && row.upper < 1e-12);
    expect(tiny.length).toBeGreaterThan(5);
    for (const row of tiny) {
      expectClose(fCdf(row.f, row.df1, row.df2).upper, row.upper, 1e-10, 0, `R pf(${row.f}, ${row.df1}, ${row.df2}, lower.tail = FALSE)`);
      const jstatUpper = 1 - jStat.centralF.cdf(row.f, row.df1, row.df2);
      expect(Math.abs(jstatUpper - row.upper) / row.upper, `1 - jStat.centralF.cdf(${row.f}, ${row.df1}, ${row.df2})`).toBeGreaterThan(1e-5);
    }
  });

  it("central t probabilities: jStat.studentt.cdf is about 7 digits from R's pt, studentTCdf 12 or more", () => {
    let worstJstat = 0;
    for (const row of r.t) {
      if (row.lower < 1e-3 || row.lower > 1 - 1e-3) continue;
      expectClose(studentTCdf(row.t, row.df).lower, row.lower, 1e-12, 0, `R pt(${row.t}, ${row.df})`);
      worstJstat = Math.max(worstJstat, Math.abs(jStat.studentt.cdf(row.t, row.df) - row.lower) / row.lower);
    }
    expect(worstJstat).toBeGreaterThan(1e-10);
    expect(worstJstat).toBeLessThan(1e-6);
  });
});
