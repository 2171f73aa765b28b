// Every @example in lib/stats: the call is run here, its result must be printed in the doc comment
// exactly (so the examples stay exact), and where the result is statistical it is checked against
// R (scripts/r/doc-examples.R → tests/fixtures/stats/doc_examples.json, each entry with its R
// call, or the named R fixture) so the printed outputs trace to an outside source. A few examples
// are not statistics (error text, option defaults, exact decimal arithmetic); their source is named.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import {
  abbottCorrection,
  analyzeTrial,
  backTransformValue,
  blocksNeeded,
  brownForsytheLevene,
  centreDecimalValues,
  chiSquareCdf,
  compactLetterDisplay,
  compensatedSum,
  encodeFactor,
  equivalenceTost,
  fCdf,
  fisherLsd,
  fitCombinedSites,
  fitCompletelyRandomized,
  fitLatinSquare,
  fitLinearModel,
  fitRandomizedCompleteBlock,
  fQuantile,
  friedmanTest,
  hendersonTilton,
  incompleteBeta,
  incompleteGamma,
  kruskalWallis,
  leastSquaresMeans,
  logGamma,
  NeumaierAccumulator,
  noncentralFCdf,
  normalCdf,
  normalQuantile,
  pairedTTest,
  pairwiseComparisons,
  percentControl,
  perSquareFootToPerSquareMetre,
  perSquareMetreToPerSquareFoot,
  plotYieldPerArea,
  quadratDensity,
  readTrialRows,
  residualDfCheck,
  shapiroWilk,
  StatsInputError,
  studentizedRangeCdf,
  studentizedRangeQuantile,
  studentTCdf,
  studentTQuantile,
  assumptionAdvice,
  transformValue,
  trialOptionsSchema,
  unitConstants,
  weedControlEfficiency,
  weedIndex,
  welchTTest,
} from "@/lib/stats";
import { findRoot } from "@/lib/stats/core/find-root";
import { sumOfSquaredDeviations } from "@/lib/stats/core/sum-of-squared-deviations";
import { anovaTable } from "@/lib/stats/designs/anova-table";
import { groupMeans } from "@/lib/stats/designs/group-means";
import { logBeta } from "@/lib/stats/distributions/log-beta";
import { stirlingCorrection } from "@/lib/stats/distributions/stirling-correction";
import { loadFixture, loadRows } from "./fixture-runner";
import { expectClose } from "./helpers";

const statsRoot = path.resolve(__dirname, "../../lib/stats");
const fixture = loadFixture("doc_examples");
const r = fixture.examples;

/** Doc-comment notation: numbers as JavaScript prints them, "strings", [arrays], Float64Array [..], { key: value }. */
function show(value: unknown): string {
  if (typeof value === "string") return JSON.stringify(value);
  if (typeof value === "number" || typeof value === "boolean" || value === undefined) return String(value);
  if (value instanceof Float64Array || value instanceof Int32Array) return `${value.constructor.name} [${Array.from(value, show).join(", ")}]`;
  if (Array.isArray(value)) return `[${value.map(show).join(", ")}]`;
  const entries = Object.entries(value as Record<string, unknown>);
  return `{ ${entries.map(([key, item]) => `${key}: ${show(item)}`).join(", ")} }`;
}

/** The lines of a file's @example; comment lines that continue a comment-only line are joined to it. */
function exampleLines(file: string): string[] {
  const blocks = [...readFileSync(path.join(statsRoot, file), "utf8").matchAll(/@example\n([\s\S]*?)\*\//g)];
  expect(blocks.length, `${file}: one @example`).toBe(1);
  const lines: string[] = [];
  for (const raw of blocks[0][1].split("\n")) {
    const line = raw.replace(/^\s*\*\s?/, "").trimEnd();
    if (line === "") continue;
    const previous = lines[lines.length - 1];
    if (line.startsWith("//") && previous?.startsWith("//") && lines.length > 0 && !isLeadingComment(lines)) {
      lines[lines.length - 1] = `${previous} ${line.replace(/^\/\/\s*/, "")}`;
    } else lines.push(line);
  }
  return lines;
}

/** A comment line before any code (a caption such as "// hardness RCBD") is not an output. */
function isLeadingComment(lines: string[]): boolean {
  return lines.every((line) => line.startsWith("//"));
}

/** Asserts the example prints `printed` right after a "//" (followed by the end, a space or a comma). */
function expectPrinted(file: string, printed: string): void {
  const lines = exampleLines(file);
  const found = lines.some((line) =>
    line
      .split("//")
      .slice(1)
      .some((comment) => {
        const text = comment.trimStart();
        return text.startsWith(printed) && [undefined, " ", ","].includes(text[printed.length]);
      }),
  );
  expect(found, `${file} @example should print ${printed}; it reads:\n${lines.join("\n")}`).toBe(true);
}

// Shared data of the examples, from outside the project: the hardness RCBD (Montgomery) and
// the sleep data (R datasets::sleep), as copied from ../shared/reference.
const hardnessRows = loadRows("reference/hardness_rcbd.csv");
const hardness = Float64Array.from(hardnessRows, (row) => Number(row.hardness));
const tips = encodeFactor(hardnessRows.map((row) => row.tip));
const coupons = encodeFactor(hardnessRows.map((row) => row.coupon));
const hardnessFit = fitRandomizedCompleteBlock(hardness, tips, coupons);
const sleep = loadRows("reference/sleep_paired.csv");
const drug1 = sleep.filter((row) => row.drug === "drug1").map((row) => Number(row.extra));
const drug2 = sleep.filter((row) => row.drug === "drug2").map((row) => Number(row.extra));

interface DocExample {
  /** File under lib/stats holding the @example. */
  file: string;
  /** Runs the example's call. */
  run: () => any;
  /** What the example prints, when it is not show(result). */
  printed?: (result: any) => string;
  /** Checks the result against its outside source (named in each label). */
  reference: (result: any) => void;
}

const relative = 1e-12;

const examples: DocExample[] = [
  {
    file: "comparisons/compact-letter-display.ts",
    run: () => compactLetterDisplay([10, 9, 1], (i, j) => Math.abs(i - j) === 2 || (i === 1 && j === 2) || (i === 2 && j === 1)),
    // R multcomp:::insert_absorb (the insert-absorb algorithm behind multcomp::cld)
    reference: (letters) => expect(letters, r.compactLetterDisplay.call).toEqual(r.compactLetterDisplay.letters),
  },
  {
    file: "comparisons/fisher-lsd.ts",
    run: () => fisherLsd(pairwiseComparisons(hardnessFit), 9, 0.05),
    reference: (lsd) => expectClose(lsd, r.fisherLsd.value, relative, 0, `R ${r.fisherLsd.call}`),
  },
  {
    file: "comparisons/pairwise-comparisons.ts",
    run: () => pairwiseComparisons(hardnessFit)[2],
    reference: (pair) => {
      const call = `R ${r.pairwiseComparisons.call}`;
      expect([pair.a, pair.b]).toEqual(["tip1", "tip4"]);
      for (const key of ["diff", "se", "t", "pLsd"]) expectClose(pair[key], r.pairwiseComparisons[key], 1e-11, 0, `${call} ${key}`);
      expectClose(pair.pTukey, r.pairwiseComparisons.pTukey, 1e-10, 0, `${call} pTukey`);
    },
  },
  {
    file: "core/back-transform-value.ts",
    run: () => backTransformValue(0.5235987755982989, "asin-sqrt"),
    reference: (value) => expectClose(value, r.backTransformValue.value, 1e-15, 0, `R ${r.backTransformValue.call}`),
  },
  {
    file: "core/centre-decimal-values.ts",
    run: () => centreDecimalValues(["1000000000000.4", "1000000000000.6"]),
    // Not a statistic: exact decimal arithmetic, 1000000000000.4 - 10^12 = 0.4 (then the nearest double).
    reference: (centred) => {
      expect(centred.offset).toBe(1e12);
      expect(Array.from(centred.centred)).toEqual([Number("0.4"), Number("0.6")]);
    },
  },
  {
    file: "core/compensated-sum.ts",
    run: () => compensatedSum([1e16, 1, -1e16]),
    reference: (sum) => expect(sum, `R ${r.compensatedSum.call}`).toBe(r.compensatedSum.value),
  },
  {
    file: "core/encode-factor.ts",
    run: () => encodeFactor(["b", "a", "b"]),
    reference: (factor) => {
      expect(factor.levels, `R ${r.encodeFactor.call}`).toEqual(r.encodeFactor.levels);
      expect(Array.from(factor.codes), `R ${r.encodeFactor.call}`).toEqual(r.encodeFactor.codes);
    },
  },
  {
    file: "core/find-root.ts",
    run: () => findRoot((x) => x * x - 2, 0, 2),
    // findRoot stops at 4e-16 relative; the fixture holds R's value to 15 significant digits.
    reference: (root) => expectClose(root, r.findRoot.value, 1e-14, 0, `R ${r.findRoot.call}`),
  },
  {
    file: "core/neumaier-accumulator.ts",
    run: () => {
      const sum = new NeumaierAccumulator();
      sum.add(1e16);
      sum.add(1);
      sum.add(-1e16);
      return sum.value();
    },
    reference: (sum) => expect(sum, `R ${r.compensatedSum.call}`).toBe(r.compensatedSum.value),
  },
  {
    file: "core/read-trial-rows.ts",
    run: () => readTrialRows([{ t: "A", y: "1.5" }, { t: "B", y: "NA" }], "y", ["t"]),
    // Not a statistic: the input rules of the contract analysis-cli.md ("NA" is a lost plot, dropped).
    reference: (plots) => {
      expect(plots.dropped).toBe(1);
      expect(plots.labels.t).toEqual(["A"]);
    },
  },
  {
    file: "core/sum-of-squared-deviations.ts",
    run: () => sumOfSquaredDeviations([1, 2, 3], 2),
    reference: (sum) => expectClose(sum, r.sumOfSquaredDeviations.value, relative, 0, `R ${r.sumOfSquaredDeviations.call}`),
  },
  {
    file: "core/transform-value.ts",
    run: () => transformValue(25, "asin-sqrt"),
    reference: (value) => expectClose(value, r.transformValue.value, 1e-15, 0, `R ${r.transformValue.call}`),
  },
  {
    file: "designs/anova-table.ts",
    run: () => anovaTable([{ source: "treatment", df: 2, ss: 10 }], 6, 3),
    reference: ([treatment, residual]) => {
      const call = `R ${r.anovaTable.call}`;
      expectClose(treatment.ms, r.anovaTable.ms, relative, 0, call);
      expectClose(treatment.f, r.anovaTable.f, relative, 0, call);
      expectClose(treatment.p, r.anovaTable.p, relative, 0, call);
      expectClose(residual.ms, r.anovaTable.msResidual, relative, 0, call);
    },
  },
  {
    file: "designs/fit-combined-sites.ts",
    run: () =>
      fitCombinedSites(
        new Float64Array([10, 12, 11, 14, 7, 8, 9, 11]),
        encodeFactor(["a", "b", "a", "b", "a", "b", "a", "b"]),
        encodeFactor(["1", "1", "2", "2", "1", "1", "2", "2"]),
        encodeFactor(["S1", "S1", "S1", "S1", "S2", "S2", "S2", "S2"]),
      ).anova.map((row) => [row.source, row.ss, row.f]),
    // R: sequential anova, F against the random-site error terms (doc_examples.json "combined")
    reference: (rows) => {
      expect(rows.map((row: any[]) => row[0])).toEqual(["site", "block(site)", "treatment", "site:treatment", "residual"]);
      rows.forEach((row: any[], index: number) => {
        expectClose(row[1], fixture.combined.ss[index], relative, 1e-13, `R ${fixture.r_calls[1]} ss[${index}]`);
        if (index < 4) expectClose(row[2], fixture.combined.f[index], 1e-12, 0, `R ${fixture.r_calls[1]} f[${index}]`);
      });
    },
  },
  {
    file: "designs/fit-completely-randomized.ts",
    run: () => fitCompletelyRandomized(new Float64Array([1, 2, 4, 5]), encodeFactor(["a", "a", "b", "b"])).anova[0].ss,
    reference: (ss) => expectClose(ss, r.fitCompletelyRandomized.ss, relative, 0, `R ${r.fitCompletelyRandomized.call}`),
  },
  {
    file: "designs/fit-latin-square.ts",
    run: () =>
      fitLatinSquare(
        new Float64Array([10, 12, 15, 11, 16, 9, 14, 8, 13]),
        encodeFactor(["A", "B", "C", "B", "C", "A", "C", "A", "B"]),
        encodeFactor(["R1", "R1", "R1", "R2", "R2", "R2", "R3", "R3", "R3"]),
        encodeFactor(["C1", "C2", "C3", "C1", "C2", "C3", "C1", "C2", "C3"]),
      ).anova.map((line) => line.ss),
    reference: (ss) => ss.forEach((value: number, index: number) => expectClose(value, fixture.latin.ss[index], relative, 1e-13, `R ${fixture.r_calls[0]} ss[${index}]`)),
  },
  {
    file: "designs/fit-linear-model.ts",
    run: () => fitLinearModel(new Float64Array([1, 2, 4, 5]), [{ source: "treatment", factors: [encodeFactor(["a", "a", "b", "b"])] }]).terms,
    reference: ([term]) => {
      expect(term.df, `R ${r.fitCompletelyRandomized.call}`).toBe(r.fitCompletelyRandomized.df);
      expectClose(term.ss, r.fitCompletelyRandomized.ss, relative, 0, `R ${r.fitCompletelyRandomized.call}`);
    },
  },
  {
    file: "designs/fit-randomized-complete-block.ts",
    run: () => fitRandomizedCompleteBlock(hardness, tips, coupons).anova.map((row) => row.ss),
    reference: (ss) => ss.forEach((value: number, index: number) => expectClose(value, r.fitRandomizedCompleteBlock.ss[index], 1e-13, 0, `R ${r.fitRandomizedCompleteBlock.call}[${index}]`)),
  },
  {
    file: "designs/group-means.ts",
    run: () => groupMeans(new Float64Array([1, 2, 4]), new Int32Array([0, 0, 1]), 2),
    reference: (groups) => {
      expect(Array.from(groups.counts), `R ${r.groupMeans.call}`).toEqual(r.groupMeans.counts);
      Array.from(groups.means as Float64Array).forEach((mean, index) => expectClose(mean, r.groupMeans.means[index], relative, 0, `R ${r.groupMeans.call}`));
    },
  },
  {
    file: "designs/least-squares-means.ts",
    run: () => {
      const blocks = encodeFactor(["B1", "B1", "B2"]);
      const treatment = encodeFactor(["a", "b", "a"]);
      const fit = fitLinearModel(new Float64Array([1, 3, 2]), [{ source: "block", factors: [blocks] }, { source: "treatment", factors: [treatment] }]);
      return leastSquaresMeans(fit, treatment, [0, 1].map((b) => ({ levels: new Map([[blocks, b]]), weight: 0.5 })));
    },
    reference: (result) => {
      const call = `R ${r.leastSquaresMeans.call}`;
      Array.from(result.lsmeans as Float64Array).forEach((mean, index) => expectClose(mean, r.leastSquaresMeans.lsmeans[index], 0, 1e-14, `${call} lsmean[${index}]`));
      Array.from(result.covariance as Float64Array).forEach((entry, index) => expectClose(entry, r.leastSquaresMeans.covariance[index], 0, 1e-14, `${call} covariance[${index}]`));
    },
  },
  {
    file: "distributions/chi-square-cdf.ts",
    run: () => chiSquareCdf(3.841458820694124, 1).upper,
    reference: (p) => expectClose(p, r.chiSquareCdf.value, relative, 0, `R ${r.chiSquareCdf.call}`),
  },
  {
    file: "distributions/f-cdf.ts",
    run: () => fCdf(34.7022820554917, 5, 66).upper,
    reference: (p) => expectClose(p, r.fCdf.value, relative, 0, `R ${r.fCdf.call}`),
  },
  {
    file: "distributions/f-quantile.ts",
    run: () => fQuantile(0.05, 3, 9),
    reference: (q) => expectClose(q, r.fQuantile.value, relative, 0, `R ${r.fQuantile.call}`),
  },
  {
    file: "distributions/incomplete-beta.ts",
    run: () => incompleteBeta(0.5, 2, 3),
    reference: (tails) => {
      expectClose(tails.lower, r.incompleteBeta.lower, relative, 0, `R ${r.incompleteBeta.call}`);
      expectClose(tails.upper, r.incompleteBeta.upper, relative, 0, `R ${r.incompleteBeta.call}`);
    },
  },
  {
    file: "distributions/incomplete-gamma.ts",
    run: () => incompleteGamma(1, 2),
    reference: (tails) => {
      expectClose(tails.lower, r.incompleteGamma.lower, relative, 0, `R ${r.incompleteGamma.call}`);
      expectClose(tails.upper, r.incompleteGamma.upper, relative, 0, `R ${r.incompleteGamma.call}`);
    },
  },
  {
    file: "distributions/log-beta.ts",
    run: () => logBeta(0.5, 0.5),
    reference: (value) => expectClose(value, r.logBeta.value, relative, 0, `R ${r.logBeta.call}`),
  },
  {
    file: "distributions/log-gamma.ts",
    run: () => logGamma(0.5),
    reference: (value) => expectClose(value, r.logGamma.value, relative, 0, `R ${r.logGamma.call}`),
  },
  {
    file: "distributions/noncentral-f-cdf.ts",
    run: () => noncentralFCdf(3, 3, 12, 5).lower,
    // The Poisson mixture of R's pbeta; R's own pf(ncp =) (pnbeta) stops at an error of 1e-9.
    reference: (p) => {
      expectClose(p, r.noncentralFCdf.value, 1e-11, 0, `R ${r.noncentralFCdf.call}`);
      expectClose(p, r.noncentralFCdf.pf, 1e-9, 0, "R pf(3, 3, 12, ncp = 5)");
    },
  },
  {
    file: "distributions/normal-cdf.ts",
    run: () => normalCdf(1.959963984540054),
    reference: (p) => expectClose(p, r.normalCdf.value, relative, 0, `R ${r.normalCdf.call}`),
  },
  {
    file: "distributions/normal-quantile.ts",
    run: () => normalQuantile(0.975),
    reference: (q) => expectClose(q, r.normalQuantile.value, relative, 0, `R ${r.normalQuantile.call}`),
  },
  {
    file: "distributions/stirling-correction.ts",
    run: () => stirlingCorrection(10),
    reference: (value) => {
      expectClose(value, r.stirlingCorrection.value, 1e-14, 0, `R ${r.stirlingCorrection.call}`);
      expectClose(value, r.stirlingCorrection.fromLgamma, 1e-12, 0, "R lgamma(10) - Stirling's leading terms");
    },
  },
  {
    file: "distributions/student-t-cdf.ts",
    run: () => studentTCdf(2.228138851986274, 10),
    reference: (tails) => {
      expectClose(tails.lower, r.studentTCdf.lower, relative, 0, `R ${r.studentTCdf.call}`);
      expectClose(tails.upper, r.studentTCdf.upper, relative, 0, `R ${r.studentTCdf.call}`);
    },
  },
  {
    file: "distributions/student-t-quantile.ts",
    run: () => studentTQuantile(0.975, 10),
    reference: (q) => expectClose(q, r.studentTQuantile.value, relative, 0, `R ${r.studentTQuantile.call}`),
  },
  {
    file: "distributions/studentized-range-cdf.ts",
    run: () => studentizedRangeCdf(3.5, 4, 20),
    reference: (p) => expectClose(p, r.studentizedRangeCdf.value, relative, 0, `R ${r.studentizedRangeCdf.call}`),
  },
  {
    file: "distributions/studentized-range-quantile.ts",
    run: () => studentizedRangeQuantile(0.95, 3, 10),
    reference: (q) => {
      expectClose(q, r.studentizedRangeQuantile.value, 1e-9, 0, `R ${r.studentizedRangeQuantile.call}`);
      expectClose(q, 3.88, 0, 0.005, "published studentized range table, q(0.05; 3, 10) = 3.88");
    },
  },
  {
    file: "measures/abbott-correction.ts",
    run: () => abbottCorrection(90, 20),
    reference: (value) => expectClose(value, r.abbottCorrection.value, relative, 0, `R ${r.abbottCorrection.call}`),
  },
  {
    file: "measures/henderson-tilton.ts",
    run: () => hendersonTilton({ treatedBefore: 50, treatedAfter: 5, checkBefore: 40, checkAfter: 60 }),
    reference: (value) => expectClose(value, r.hendersonTilton.value, relative, 0, `R ${r.hendersonTilton.call}`),
  },
  {
    file: "measures/per-square-foot-to-per-square-metre.ts",
    run: () => perSquareFootToPerSquareMetre(1),
    reference: (value) => expectClose(value, r.perSquareFootToPerSquareMetre.value, relative, 0, `R ${r.perSquareFootToPerSquareMetre.call}`),
  },
  {
    file: "measures/per-square-metre-to-per-square-foot.ts",
    run: () => perSquareMetreToPerSquareFoot(100),
    reference: (value) => expectClose(value, r.perSquareMetreToPerSquareFoot.value, relative, 0, `R ${r.perSquareMetreToPerSquareFoot.call}`),
  },
  {
    file: "measures/percent-control.ts",
    run: () => percentControl(12, 80),
    reference: (value) => expectClose(value, r.percentControl.value, relative, 0, `R ${r.percentControl.call}`),
  },
  {
    file: "measures/plot-yield-per-area.ts",
    run: () => plotYieldPerArea(6.5, 12),
    reference: (result) => {
      expectClose(result.tonnesPerHectare, r.plotYieldPerArea.tonnesPerHectare, relative, 0, `R ${r.plotYieldPerArea.call}`);
      expectClose(result.poundsPerAcre, r.plotYieldPerArea.poundsPerAcre, relative, 0, `R ${r.plotYieldPerArea.call}`);
    },
  },
  {
    file: "measures/quadrat-density.ts",
    run: () => quadratDensity([12, 8, 10, 14], 0.25),
    reference: (value) => expectClose(value, r.quadratDensity.value, relative, 0, `R ${r.quadratDensity.call}`),
  },
  {
    file: "measures/unit-constants.ts",
    run: () => unitConstants.metresPerFoot ** 2 * 43560,
    // NIST SP 811: 1 acre = 4046.856 422 4 m² exactly (international foot).
    reference: (value) => expectClose(value, r.unitConstants.value, 1e-15, 0, `R ${r.unitConstants.call}`),
  },
  {
    file: "measures/weed-control-efficiency.ts",
    run: () => weedControlEfficiency(250, 40),
    reference: (value) => expectClose(value, r.weedControlEfficiency.value, relative, 0, `R ${r.weedControlEfficiency.call}`),
  },
  {
    file: "measures/weed-index.ts",
    run: () => weedIndex(5.2, 4.68),
    reference: (value) => expectClose(value, r.weedIndex.value, relative, 0, `R ${r.weedIndex.call}`),
  },
  {
    file: "planning/blocks-needed.ts",
    run: () => blocksNeeded({ treatments: 6, cvPercent: 15, difference: 30, differenceKind: "percent" }),
    printed: (result) => `${result.blocks} (power ${result.power})`,
    reference: (result) => {
      const call = `R ${r.blocksNeeded.call}`;
      expect(result.blocks, call).toBe(r.blocksNeeded.blocks);
      expect(r.blocksNeeded.powerWithSevenBlocks, `${call}: 7 blocks are not enough`).toBeLessThan(0.8);
      expectClose(result.power, r.blocksNeeded.power, 1e-11, 0, call);
      expectClose(result.criticalF, r.blocksNeeded.criticalF, relative, 0, "R qf(0.95, 5, 35)");
    },
  },
  {
    file: "planning/residual-df-check.ts",
    run: () => residualDfCheck(9).adequate,
    // Not a statistic: EPPO PP 1/152 asks for at least 12 residual degrees of freedom.
    reference: (adequate) => expect(adequate).toBe(9 >= 12),
  },
  {
    file: "tests/assumption-advice.ts",
    run: () =>
      assumptionAdvice({ rawValues: [1, 3, 2, 8, 6, 9, 25, 33, 31], groupMeans: [2, 8, 30], groupVariances: [2, 9, 33], shapiroP: 0.01, leveneP: 0.004, alpha: 0.05, transform: "none", design: "crd" }),
    // The advice is text; the statistic behind the √y line is Taylor's slope, 1.0356 in R (square-root band 0.5-1.5).
    reference: (advice) => {
      const slope = r.assumptionAdvice.taylorSlope;
      expect(slope > 0.5 && slope < 1.5, `R ${r.assumptionAdvice.call} = ${slope}`).toBe(true);
      expect(advice).toContain("The variance rises in proportion to the mean, as for counts: analyse √y (--transform sqrt).");
    },
  },
  {
    file: "tests/brown-forsythe-levene.ts",
    run: () => brownForsytheLevene(hardness, tips),
    reference: (result) => {
      const call = `R ${r.brownForsytheLevene.call}`;
      expectClose(result.f, r.brownForsytheLevene.f, relative, 0, call);
      expect([result.dfTreatment, result.dfResidual], call).toEqual([r.brownForsytheLevene.dfTreatment, r.brownForsytheLevene.dfResidual]);
      expectClose(result.p, r.brownForsytheLevene.p, relative, 0, call);
    },
  },
  {
    file: "tests/equivalence-tost.ts",
    run: () => equivalenceTost(hardnessFit, "tip1", 0.2, 0.05)[0],
    reference: (result) => {
      const call = `R ${r.equivalenceTost.call}`;
      const expected = r.equivalenceTost;
      expect([result.treatment, result.reference]).toEqual(["tip2", "tip1"]);
      expectClose(result.diff, expected.diff, 1e-11, 0, `${call} diff`);
      expectClose(result.se, expected.se, relative, 0, `${call} se`);
      expectClose(result.ci90[0], expected.ci90[0], relative, 0, `${call} ci90`);
      expectClose(result.ci90[1], expected.ci90[1], relative, 0, `${call} ci90`);
      expectClose(result.pLower, expected.pLower, 1e-11, 0, `${call} pLower`);
      expectClose(result.pUpper, expected.pUpper, 1e-11, 0, `${call} pUpper`);
      expectClose(result.p, Math.max(expected.pLower, expected.pUpper), 1e-11, 0, `${call} p`);
      expect(result.equivalent).toBe(Math.max(expected.pLower, expected.pUpper) < 0.05);
    },
  },
  {
    file: "tests/friedman-test.ts",
    run: () => friedmanTest(hardness, tips, coupons),
    reference: (result) => {
      const call = `R ${r.friedmanTest.call}`;
      expectClose(result.chi2, r.friedmanTest.chi2, relative, 0, call);
      expect(result.df, call).toBe(r.friedmanTest.df);
      expectClose(result.p, r.friedmanTest.p, relative, 0, call);
    },
  },
  {
    file: "tests/kruskal-wallis.ts",
    run: () => kruskalWallis(new Float64Array([1, 2, 2, 4, 5, 6]), encodeFactor(["a", "a", "a", "b", "b", "b"])),
    reference: (result) => {
      const tiny = loadFixture("kruskal_wallis").tiny; // R kruskal.test (scripts/r/kruskal-wallis.R)
      expectClose(result.chi2, tiny.chi2, relative, 0, "R kruskal.test chi2");
      expect(result.df).toBe(tiny.df);
      expectClose(result.p, tiny.p, relative, 0, "R kruskal.test p");
    },
  },
  {
    file: "tests/paired-t-test.ts",
    run: () => pairedTTest("drug1", "drug2", drug1, drug2),
    reference: (result) => compareTTest(result, r.pairedTTest),
  },
  {
    file: "tests/shapiro-wilk.ts",
    run: () => shapiroWilk([2.1, 3.4, 1.9, 5.6, 4.4, 3.3, 2.8]),
    reference: (result) => {
      const n7 = loadFixture("shapiro_levene").shapiro.find((sample: any) => sample.name === "n7"); // R shapiro.test
      expect(n7.values).toEqual([2.1, 3.4, 1.9, 5.6, 4.4, 3.3, 2.8]);
      expectClose(result.w, n7.w, 1e-10, 0, "R shapiro.test W");
      expectClose(result.p, n7.p, 1e-8, 0, "R shapiro.test p");
    },
  },
  {
    file: "tests/welch-t-test.ts",
    run: () => welchTTest("a", "b", [1, 2, 3, 4], [2, 4, 6, 8, 10]),
    reference: (result) => compareTTest(result, r.welchTTest),
  },
  {
    file: "analyze-trial.ts",
    run: () => analyzeTrial(hardnessRows, { design: "rcbd", response: "hardness", treatment: "tip", block: "coupon" }).anova![1],
    reference: (row) => {
      const call = `R ${r.analyzeTrial.call}`;
      expect(row.df, call).toBe(r.analyzeTrial.df);
      for (const key of ["ss", "ms", "f", "p"]) expectClose(row[key], r.analyzeTrial[key], 1e-11, 0, `${call} ${key}`);
    },
  },
  {
    file: "errors.ts",
    run: () => new StatsInputError("anova requires at least two treatments").message,
    // Not a statistic: the message is passed through unchanged (errors.ts contract).
    reference: (message) => expect(message).toBe("anova requires at least two treatments"),
  },
  {
    file: "trial-options.ts",
    run: () => trialOptionsSchema.parse({ design: "crd", response: "count", treatment: "spray" }).alpha,
    // Not a statistic: the default of the contract analysis-cli.md, [--alpha 0.05].
    reference: (alpha) => expect(alpha).toBe(0.05),
  },
];

function compareTTest(result: any, expected: any): void {
  const label = `R ${expected.call}`;
  for (const key of ["t", "df", "p", "meanDiff"]) expectClose(result[key], expected[key], 1e-11, 0, `${label} ${key}`);
  expectClose(result.ci[0], expected.ci[0], 1e-11, 0, `${label} conf.int`);
  expectClose(result.ci[1], expected.ci[1], 1e-11, 0, `${label} conf.int`);
}

function filesWithExamples(directory: string, prefix = ""): string[] {
  return readdirSync(directory, { withFileTypes: true }).flatMap((entry) => {
    const relativePath = prefix ? `${prefix}/${entry.name}` : entry.name;
    if (entry.isDirectory()) return filesWithExamples(path.join(directory, entry.name), relativePath);
    if (!entry.name.endsWith(".ts")) return [];
    return readFileSync(path.join(directory, entry.name), "utf8").includes("@example") ? [relativePath] : [];
  });
}

describe("doc-comment examples of lib/stats", () => {
  it("every @example in lib/stats is checked here", () => {
    expect(examples.map((example) => example.file).sort()).toEqual(filesWithExamples(statsRoot).sort());
  });

  for (const example of examples) {
    it(`${example.file}: prints the exact result, which agrees with its outside source`, () => {
      const result = example.run();
      expectPrinted(example.file, example.printed ? example.printed(result) : show(result));
      example.reference(result);
    });
  }
});

describe("the R data of the design examples are the examples' data", () => {
  it("fitLatinSquare and fitCombinedSites examples use the data scripts/r/doc-examples.R analysed", () => {
    const latin = readFileSync(path.join(statsRoot, "designs/fit-latin-square.ts"), "utf8");
    expect(latin).toContain(`new Float64Array([${fixture.latin.y.join(", ")}])`);
    const combined = readFileSync(path.join(statsRoot, "designs/fit-combined-sites.ts"), "utf8");
    expect(combined).toContain(`new Float64Array([${fixture.combined.y.join(", ")}])`);
    const latinFit = fitLatinSquare(new Float64Array(fixture.latin.y), encodeFactor(fixture.latin.treatment), encodeFactor(fixture.latin.row), encodeFactor(fixture.latin.column));
    latinFit.anova.slice(0, 3).forEach((line, index) => {
      expect(line.df).toBe(fixture.latin.df[index]);
      expectClose(line.f as number, fixture.latin.f[index], 1e-12, 0, `R ${fixture.r_calls[0]} f[${index}]`);
      expectClose(line.p as number, fixture.latin.p[index], 1e-12, 0, `R ${fixture.r_calls[0]} p[${index}]`);
    });
    const combinedFit = fitCombinedSites(new Float64Array(fixture.combined.y), encodeFactor(fixture.combined.trt), encodeFactor(fixture.combined.block), encodeFactor(fixture.combined.site));
    combinedFit.anova.slice(0, 4).forEach((line, index) => {
      expect(line.df).toBe(fixture.combined.df[index]);
      expectClose(line.p as number, fixture.combined.p[index], 1e-12, 0, `R ${fixture.r_calls[1]} p[${index}]`);
    });
  });
});
