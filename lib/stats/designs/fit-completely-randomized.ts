import { StatsInputError } from "../errors";
import { NeumaierAccumulator } from "../core/neumaier-accumulator";
import { compensatedSum } from "../core/compensated-sum";
import type { EncodedFactor } from "../core/encode-factor";
import { anovaTable } from "./anova-table";
import { groupMeans } from "./group-means";
import type { ModelFit } from "./model-types";

/**
 * One-way analysis of variance for a completely randomized design
 * (response = treatment), equal or unequal replication.
 *
 * Formula: SS_treatment = Σ n_j (ȳ_j - ȳ)², SS_residual = Σ (y_ij - ȳ_j)²,
 * both as two-pass compensated sums of deviations (never Σy² - nȳ²);
 * lsmeans are the treatment means with Var = MS_residual / n_j.
 *
 * Assumptions: response centred by the caller; independent normal errors
 * with common variance.
 *
 * Reference: Montgomery, D. C. (2017) Design and Analysis of Experiments,
 * 9th ed., §3.3; accuracy targets from the NIST StRD one-way ANOVA sets.
 *
 * @example
 * fitCompletelyRandomized(new Float64Array([1, 2, 4, 5]), encodeFactor(["a", "a", "b", "b"])).anova[0].ss // 9
 */
export function fitCompletelyRandomized(response: Float64Array, treatment: EncodedFactor): ModelFit {
  const treatmentCount = treatment.levels.length;
  if (treatmentCount < 2) throw new StatsInputError("anova requires at least two treatments");
  const observations = response.length;
  const dfResidual = observations - treatmentCount;
  if (dfResidual < 1) throw new StatsInputError("anova requires residual degrees of freedom (replicated treatments)");
  const { counts, means } = groupMeans(response, treatment.codes, treatmentCount);
  const grandMean = compensatedSum(response) / observations;
  const treatmentSum = new NeumaierAccumulator();
  for (let level = 0; level < treatmentCount; level++) {
    const deviation = means[level] - grandMean;
    treatmentSum.add(counts[level] * deviation * deviation);
  }
  const residuals = new Float64Array(observations);
  const residualSum = new NeumaierAccumulator();
  for (let index = 0; index < observations; index++) {
    const residual = response[index] - means[treatment.codes[index]];
    residuals[index] = residual;
    residualSum.add(residual * residual);
  }
  const anova = anovaTable(
    [{ source: "treatment", df: treatmentCount - 1, ss: treatmentSum.value() }],
    dfResidual,
    residualSum.value(),
  );
  const lsmeanCovariance = new Float64Array(treatmentCount * treatmentCount);
  for (let level = 0; level < treatmentCount; level++) lsmeanCovariance[level * treatmentCount + level] = 1 / counts[level];
  const meanSquareResidual = anova[anova.length - 1].ms;
  return {
    anova,
    residuals,
    dfResidual,
    meanSquareResidual,
    treatment,
    lsmeans: means,
    lsmeanCovariance,
    errorMeanSquare: meanSquareResidual,
    errorDf: dfResidual,
    balanced: counts.every((count) => count === counts[0]),
  };
}
