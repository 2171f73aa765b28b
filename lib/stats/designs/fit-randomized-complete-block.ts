import { StatsInputError } from "../errors";
import { NeumaierAccumulator } from "../core/neumaier-accumulator";
import { compensatedSum } from "../core/compensated-sum";
import type { EncodedFactor } from "../core/encode-factor";
import { anovaTable } from "./anova-table";
import { fitLinearModel } from "./fit-linear-model";
import { groupMeans } from "./group-means";
import { leastSquaresMeans } from "./least-squares-means";
import type { ModelFit } from "./model-types";

/**
 * Analysis of a randomized complete block design, response = block + treatment,
 * including trials with lost plots.
 *
 * Formula (complete: every treatment once in every block):
 * SS_block = t Σ (ȳ_.b - ȳ)², SS_treatment = b Σ (ȳ_j. - ȳ)²,
 * e_jb = y_jb - ȳ_j. - ȳ_.b + ȳ, lsmean = ȳ_j., Var = MS_residual / b.
 * With lost plots the general least-squares fit is used: blocks first, then
 * treatment (sequential SS, i.e. treatment adjusted for blocks), lsmeans
 * averaged over blocks with equal weights, standard errors from (X'X)⁻¹.
 *
 * Assumptions: additive block and treatment effects, independent normal
 * errors with common variance; response centred by the caller.
 *
 * Reference: Gomez, K. A. & Gomez, A. A. (1984) Statistical Procedures for
 * Agricultural Research, 2nd ed., §2.2 and §7.1 (missing plots);
 * Searle, Speed & Milliken (1980) for the lsmeans.
 *
 * @example
 * // hardness data (Montgomery); R: block 0.825, treatment 0.385, residual 0.08
 * fitRandomizedCompleteBlock(hardness, tips, coupons).anova.map((row) => row.ss)
 * // [0.8249999999999961, 0.385000000000001, 0.08000000000000024]
 */
export function fitRandomizedCompleteBlock(response: Float64Array, treatment: EncodedFactor, block: EncodedFactor): ModelFit {
  const treatmentCount = treatment.levels.length;
  const blockCount = block.levels.length;
  if (treatmentCount < 2) throw new StatsInputError("anova requires at least two treatments");
  if (blockCount < 2) throw new StatsInputError("rcbd requires at least two blocks");
  const observations = response.length;
  const cellCounts = new Int32Array(treatmentCount * blockCount);
  for (let index = 0; index < observations; index++) cellCounts[treatment.codes[index] * blockCount + block.codes[index]] += 1;
  const complete = cellCounts.every((count) => count === 1);
  if (complete) return completeBlocks(response, treatment, block);

  const fit = fitLinearModel(response, [
    { source: "block", factors: [block] },
    { source: "treatment", factors: [treatment] },
  ]);
  if (fit.dfResidual < 1) throw new StatsInputError("anova requires residual degrees of freedom (more plots than model parameters)");
  const anova = anovaTable(fit.terms, fit.dfResidual, fit.sumOfSquaresResidual);
  const grid = block.levels.map((_, level) => ({ levels: new Map([[block, level]]), weight: 1 / blockCount }));
  const { lsmeans, covariance } = leastSquaresMeans(fit, treatment, grid);
  const meanSquareResidual = anova[anova.length - 1].ms;
  return {
    anova,
    residuals: fit.residuals,
    dfResidual: fit.dfResidual,
    meanSquareResidual,
    treatment,
    lsmeans,
    lsmeanCovariance: covariance,
    errorMeanSquare: meanSquareResidual,
    errorDf: fit.dfResidual,
    balanced: cellCounts.every((count) => count === cellCounts[0]),
  };
}

function completeBlocks(response: Float64Array, treatment: EncodedFactor, block: EncodedFactor): ModelFit {
  const treatmentCount = treatment.levels.length;
  const blockCount = block.levels.length;
  const observations = response.length;
  const grandMean = compensatedSum(response) / observations;
  const treatmentMeans = groupMeans(response, treatment.codes, treatmentCount).means;
  const blockMeans = groupMeans(response, block.codes, blockCount).means;
  const treatmentSum = new NeumaierAccumulator();
  for (const mean of treatmentMeans) treatmentSum.add((mean - grandMean) * (mean - grandMean));
  const blockSum = new NeumaierAccumulator();
  for (const mean of blockMeans) blockSum.add((mean - grandMean) * (mean - grandMean));
  const residuals = new Float64Array(observations);
  const residualSum = new NeumaierAccumulator();
  for (let index = 0; index < observations; index++) {
    const residual =
      response[index] - treatmentMeans[treatment.codes[index]] - blockMeans[block.codes[index]] + grandMean;
    residuals[index] = residual;
    residualSum.add(residual * residual);
  }
  const dfResidual = (treatmentCount - 1) * (blockCount - 1);
  const anova = anovaTable(
    [
      { source: "block", df: blockCount - 1, ss: treatmentCount * blockSum.value() },
      { source: "treatment", df: treatmentCount - 1, ss: blockCount * treatmentSum.value() },
    ],
    dfResidual,
    residualSum.value(),
  );
  const lsmeanCovariance = new Float64Array(treatmentCount * treatmentCount);
  for (let level = 0; level < treatmentCount; level++) lsmeanCovariance[level * treatmentCount + level] = 1 / blockCount;
  const meanSquareResidual = anova[anova.length - 1].ms;
  return {
    anova,
    residuals,
    dfResidual,
    meanSquareResidual,
    treatment,
    lsmeans: treatmentMeans,
    lsmeanCovariance,
    errorMeanSquare: meanSquareResidual,
    errorDf: dfResidual,
    balanced: true,
  };
}
