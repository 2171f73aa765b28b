import { StatsInputError } from "./errors";
import { trialOptionsSchema, type TrialOptions, type TrialOptionsInput } from "./trial-options";
import { readTrialRows, type TrialRow } from "./core/read-trial-rows";
import { encodeFactor, type EncodedFactor } from "./core/encode-factor";
import { centreDecimalValues } from "./core/centre-decimal-values";
import { compensatedSum } from "./core/compensated-sum";
import { transformValue, type ResponseTransform } from "./core/transform-value";
import { backTransformValue } from "./core/back-transform-value";
import { groupMeans } from "./designs/group-means";
import type { AnovaRow, ModelFit } from "./designs/model-types";
import { fitCompletelyRandomized } from "./designs/fit-completely-randomized";
import { fitRandomizedCompleteBlock } from "./designs/fit-randomized-complete-block";
import { fitLatinSquare } from "./designs/fit-latin-square";
import { fitCombinedSites } from "./designs/fit-combined-sites";
import { pairwiseComparisons } from "./comparisons/pairwise-comparisons";
import { fisherLsd } from "./comparisons/fisher-lsd";
import { compactLetterDisplay } from "./comparisons/compact-letter-display";
import { shapiroWilk } from "./tests/shapiro-wilk";
import { brownForsytheLevene } from "./tests/brown-forsythe-levene";
import { friedmanTest } from "./tests/friedman-test";
import { kruskalWallis } from "./tests/kruskal-wallis";
import { pairedTTest } from "./tests/paired-t-test";
import { welchTTest } from "./tests/welch-t-test";
import type { TTestResult } from "./tests/t-test-types";
import { equivalenceTost } from "./tests/equivalence-tost";
import { assumptionAdvice } from "./tests/assumption-advice";
import { residualDfCheck } from "./planning/residual-df-check";

/** One treatment line of the means table. */
export interface TreatmentMean {
  treatment: string;
  n: number;
  mean: number;
  lsmean: number;
  se: number;
  backTransformed?: number;
  /** Compact letters (Tukey at alpha); past 52 letters names carry primes (a', b''), so split with match(/[a-zA-Z]'{0,}/g). */
  group: string;
}

/** The analysis document (contract analysis-cli.md); optional parts appear when they apply. */
export interface TrialAnalysis {
  design: TrialOptions["design"];
  response: string;
  transform: ResponseTransform;
  n: number;
  dropped: number;
  grandMean?: number;
  cvPercent?: number;
  anova?: AnovaRow[];
  means?: TreatmentMean[] | Array<{ treatment: string; n: number; mean: number }>;
  lsd?: number | null;
  comparisons?: Array<{ a: string; b: string; diff: number; se: number; pLsd: number; pTukey: number }>;
  assumptions?: { shapiroWilk: { w: number; p: number } | null; levene: { f: number; p: number } | null };
  friedman?: { chi2: number; df: number; p: number };
  /** Completely randomized designs only: the rank-based alternative to the one-way ANOVA. */
  kruskalWallis?: { chi2: number; df: number; p: number };
  percentControl?: Array<{ treatment: string; percent: number }>;
  equivalence?: {
    margin: number;
    results: Array<{ treatment: string; reference: string; diff: number; se: number; ci90: [number, number]; p: number; equivalent: boolean }>;
  };
  tTest?: TTestResult;
  advice?: string[];
  warnings?: string[];
}

/**
 * Analyses one trial from its plot rows: the single entry point of the web
 * app and of `npm run analyze`.
 *
 * What it does: validates the options, drops lost plots, transforms the
 * response, fits the design (crd, rcbd with or without lost plots, combined
 * over sites, latin; or a paired / Welch t-test), and returns the ANOVA
 * table, grand mean and CV%, lsmeans with SEs and back-transformed values,
 * Fisher LSD and Tukey(-Kramer) comparisons with compact letters,
 * Shapiro-Wilk on residuals, Brown-Forsythe across treatments, Friedman for
 * complete blocks, Kruskal-Wallis for completely randomized designs, percent control and TOST equivalence on request, plain
 * advice and a residual-df check.
 *
 * Assumptions: see each design and test; treatment and block values are
 * labels even when numeric.
 *
 * Reference: contract analysis-cli.md; Gomez & Gomez (1984) Statistical
 * Procedures for Agricultural Research.
 *
 * @example
 * analyzeTrial(rows, { design: "rcbd", response: "hardness", treatment: "tip", block: "coupon" }).anova[1]
 * // { source: "treatment", df: 3, ss: 0.385, ms: 0.12833333333333333, f: 14.437499999999993, p: 0.0008712720711116696 }
 */
export function analyzeTrial(rows: ReadonlyArray<TrialRow>, optionsInput: TrialOptionsInput): TrialAnalysis {
  const parsed = trialOptionsSchema.safeParse(optionsInput);
  if (!parsed.success) throw new StatsInputError(parsed.error.issues[0]?.message ?? "analysis requires valid options");
  const options = parsed.data;
  const labelColumns = [options.treatment, options.block, options.row, options.column, options.site].filter(
    (column): column is string => column !== undefined,
  );
  const plots = readTrialRows(rows, options.response, labelColumns);
  const transform = options.transform;
  const treatment = encodeFactor(plots.labels[options.treatment]);
  if (treatment.levels.length < 2) throw new StatsInputError("analysis requires at least two treatments");

  let offset = 0;
  let analysed: Float64Array;
  if (transform === "none") {
    const centred = centreDecimalValues(plots.responses);
    offset = centred.offset;
    analysed = centred.centred;
  } else {
    analysed = Float64Array.from(plots.rawValues, (value) => transformValue(value, transform));
  }
  const base = { design: options.design, response: options.response, transform, n: analysed.length, dropped: plots.dropped };

  if (options.design === "paired" || options.design === "two-sample") {
    return { ...base, ...twoGroupAnalysis(options, treatment, plots.labels, analysed, offset) };
  }

  const factor = (column: string | undefined) => encodeFactor(plots.labels[column as string]);
  let fit: ModelFit;
  if (options.design === "crd") fit = fitCompletelyRandomized(analysed, treatment);
  else if (options.design === "latin") fit = fitLatinSquare(analysed, treatment, factor(options.row), factor(options.column));
  else if (options.site !== undefined) fit = fitCombinedSites(analysed, treatment, factor(options.block), factor(options.site));
  else fit = fitRandomizedCompleteBlock(analysed, treatment, factor(options.block));

  const grandMean = compensatedSum(analysed) / analysed.length + offset;
  const cvPercent = (100 * Math.sqrt(fit.meanSquareResidual)) / grandMean;
  const levels = treatment.levels;
  const count = levels.length;
  const arithmetic = groupMeans(analysed, treatment.codes, count);
  const comparisons = pairwiseComparisons(fit);
  const significant = new Uint8Array(count * count);
  let pairIndex = 0;
  for (let first = 0; first < count; first++) {
    for (let second = first + 1; second < count; second++) {
      if (comparisons[pairIndex++].pTukey <= options.alpha) significant[first * count + second] = 1;
    }
  }
  const letters = compactLetterDisplay(fit.lsmeans, (first, second) => significant[first * count + second] === 1);
  const means: TreatmentMean[] = levels.map((level, index) => {
    const lsmean = fit.lsmeans[index] + offset;
    const line: TreatmentMean = {
      treatment: level,
      n: arithmetic.counts[index],
      mean: arithmetic.means[index] + offset,
      lsmean,
      se: Math.sqrt(fit.errorMeanSquare * fit.lsmeanCovariance[index * count + index]),
      group: letters[index],
    };
    if (transform !== "none") line.backTransformed = backTransformValue(lsmean, transform);
    return line;
  });

  const shapiro = analysed.length >= 3 && analysed.length <= 5000 ? attempt(() => shapiroWilk(fit.residuals)) : null;
  const levene = attempt(() => brownForsytheLevene(analysed, treatment));
  const result: TrialAnalysis = {
    ...base,
    grandMean,
    cvPercent,
    anova: fit.anova,
    means,
    // The contract asks for null whenever plots are missing or replication differs, even if SEs happen to coincide.
    lsd: fit.balanced ? fisherLsd(comparisons, fit.errorDf, options.alpha) : null,
    comparisons: comparisons.map(({ a, b, diff, se, pLsd, pTukey }) => ({ a, b, diff, se, pLsd, pTukey })),
    assumptions: {
      shapiroWilk: shapiro ? { w: shapiro.w, p: shapiro.p } : null,
      levene: levene ? { f: levene.f, p: levene.p } : null,
    },
  };
  if (options.design === "rcbd" && options.site === undefined) {
    const friedman = attempt(() => friedmanTest(analysed, treatment, factor(options.block)));
    if (friedman) result.friedman = friedman;
  }
  if (options.design === "crd") {
    // Ranks of the raw values: the offered transformations are monotone, so they would not change them.
    const kruskal = attempt(() => kruskalWallis(plots.rawValues, treatment));
    if (kruskal) result.kruskalWallis = kruskal;
  }
  if (options.control !== undefined) result.percentControl = percentControl(plots.rawValues, treatment, options.control);
  if (options.reference !== undefined && options.margin !== undefined) {
    const tost = equivalenceTost(fit, options.reference, options.margin, options.alpha);
    result.equivalence = {
      margin: options.margin,
      results: tost.map(({ treatment: level, reference, diff, se, ci90, p, equivalent }) => ({ treatment: level, reference, diff, se, ci90, p, equivalent })),
    };
  }
  const rawGroups = groupMeans(plots.rawValues, treatment.codes, count);
  result.advice = assumptionAdvice({
    rawValues: plots.rawValues,
    groupMeans: rawGroups.means,
    groupVariances: groupVariances(plots.rawValues, treatment, rawGroups.means),
    shapiroP: shapiro ? shapiro.p : null,
    leveneP: levene ? levene.p : null,
    alpha: options.alpha,
    transform,
    design: options.design,
  });
  const dfCheck = residualDfCheck(fit.dfResidual);
  result.warnings = dfCheck.adequate ? [] : [dfCheck.message];
  if (plots.dropped > 0) result.warnings.push(`${plots.dropped} plot(s) without a response were left out (lost plots).`);
  return result;
}

function twoGroupAnalysis(
  options: TrialOptions,
  treatment: EncodedFactor,
  labels: Record<string, string[]>,
  analysed: Float64Array,
  offset: number,
): Partial<TrialAnalysis> {
  const analysis = options.design === "paired" ? "paired t-test" : "welch t-test";
  if (treatment.levels.length !== 2) throw new StatsInputError(`${analysis} requires exactly two treatments`);
  const [labelA, labelB] = treatment.levels;
  const summary = groupMeans(analysed, treatment.codes, 2);
  const means = treatment.levels.map((level, index) => ({ treatment: level, n: summary.counts[index], mean: summary.means[index] + offset }));
  if (options.design === "two-sample") {
    const valuesA = analysed.filter((_, index) => treatment.codes[index] === 0);
    const valuesB = analysed.filter((_, index) => treatment.codes[index] === 1);
    return { means, tTest: welchTTest(labelA, labelB, valuesA, valuesB) };
  }
  const pairs = new Map<string, [number, number]>();
  const pairLabels = labels[options.block as string];
  analysed.forEach((value, index) => {
    const pair = pairs.get(pairLabels[index]) ?? [Number.NaN, Number.NaN];
    const side = treatment.codes[index];
    if (!Number.isNaN(pair[side])) throw new StatsInputError(`paired t-test requires one ${labelA} and one ${labelB} value per ${options.block} (${pairLabels[index]} has more)`);
    pair[side] = value;
    pairs.set(pairLabels[index], pair);
  });
  const complete = Array.from(pairs.values()).filter(([a, b]) => !Number.isNaN(a) && !Number.isNaN(b));
  return {
    means,
    tTest: pairedTTest(labelA, labelB, complete.map((pair) => pair[0]), complete.map((pair) => pair[1])),
  };
}

function percentControl(rawValues: Float64Array, treatment: EncodedFactor, control: string): Array<{ treatment: string; percent: number }> {
  const controlIndex = treatment.levels.indexOf(control);
  if (controlIndex < 0) throw new StatsInputError(`percent control requires the control "${control}" to be a treatment level`);
  const { means } = groupMeans(rawValues, treatment.codes, treatment.levels.length);
  if (means[controlIndex] === 0) throw new StatsInputError("percent control requires a control mean that is not zero");
  return treatment.levels
    .map((level, index) => ({ treatment: level, percent: 100 * (1 - means[index] / means[controlIndex]) }))
    .filter((line) => line.treatment !== control);
}

function groupVariances(values: Float64Array, groups: EncodedFactor, means: Float64Array): Float64Array {
  const sums = new Float64Array(groups.levels.length);
  const counts = new Float64Array(groups.levels.length);
  values.forEach((value, index) => {
    const level = groups.codes[index];
    sums[level] += (value - means[level]) ** 2;
    counts[level] += 1;
  });
  return sums.map((sum, level) => (counts[level] > 1 ? sum / (counts[level] - 1) : Number.NaN));
}

function attempt<T>(compute: () => T): T | null {
  try {
    return compute();
  } catch (error) {
    if (error instanceof StatsInputError) return null;
    throw error;
  }
}
