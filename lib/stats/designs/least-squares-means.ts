import { StatsInputError } from "../errors";
import type { EncodedFactor } from "../core/encode-factor";
import type { LinearModelFit } from "./fit-linear-model";

/** A point of the reference grid: a level for every non-treatment factor, and its weight. */
export interface GridPoint {
  levels: Map<EncodedFactor, number>;
  weight: number;
}

/** Least-squares means of the treatment levels and their unscaled covariance. */
export interface LeastSquaresMeans {
  lsmeans: Float64Array;
  /** k × k row-major; multiply by the error mean square for Var(lsmeans). */
  covariance: Float64Array;
}

/**
 * Least-squares (estimated marginal) means of each treatment: the model's
 * prediction averaged with equal weights over a reference grid of the other
 * factors (all blocks; all rows and columns; all sites and their blocks).
 *
 * Formula: lsmean_j = L_j β̂ with L_j = Σ_g w_g x(g, j); Var = σ² L (X'X)⁻¹ L'
 * computed as W W' with W = L R⁻¹ from the QR factor (no inverse of X'X).
 *
 * Assumptions: every level combination a grid point needs was observed;
 * otherwise the mean is not estimable and an error is raised.
 *
 * Reference: Searle, S. R., Speed, F. M. & Milliken, G. A. (1980) Population
 * marginal means in the linear model: an alternative to least squares means.
 * The American Statistician 34:216-221; the default of R's emmeans.
 *
 * @example
 * // two blocks, treatment b lost in block B2: y(a,B1) = 1, y(b,B1) = 3, y(a,B2) = 2
 * const blocks = encodeFactor(["B1", "B1", "B2"]); const treatment = encodeFactor(["a", "b", "a"]);
 * const fit = fitLinearModel(new Float64Array([1, 3, 2]), [{ source: "block", factors: [blocks] }, { source: "treatment", factors: [treatment] }]);
 * leastSquaresMeans(fit, treatment, [0, 1].map((b) => ({ levels: new Map([[blocks, b]]), weight: 0.5 })))
 * // { lsmeans: Float64Array [1.4999999999999996, 3.5],
 * //   covariance: Float64Array [0.5, 1.1102230246251565e-16, 1.1102230246251565e-16, 1.5000000000000009] }
 */
export function leastSquaresMeans(
  fit: LinearModelFit,
  treatment: EncodedFactor,
  grid: ReadonlyArray<GridPoint>,
): LeastSquaresMeans {
  const treatmentCount = treatment.levels.length;
  const rank = fit.rank;
  const contrastRows = new Float64Array(treatmentCount * rank);
  for (let level = 0; level < treatmentCount; level++) {
    const row = contrastRows.subarray(level * rank, (level + 1) * rank);
    for (const point of grid) {
      row[0] += point.weight;
      fit.modelTerms.forEach((term, termIndex) => {
        let key = 0;
        let radix = 1;
        for (const factor of term.factors) {
          const code = factor === treatment ? level : point.levels.get(factor);
          if (code === undefined) throw new StatsInputError(`lsmeans requires a level of every factor in term ${term.source}`);
          key += code * radix;
          radix *= factor.levels.length;
        }
        const column = fit.columnOfCombination[termIndex].get(key);
        if (column === undefined) {
          throw new StatsInputError(
            `lsmeans requires every ${term.source} combination to be observed (treatment ${treatment.levels[level]} has none)`,
          );
        }
        if (column >= 0) row[column] += point.weight;
      });
    }
  }
  const lsmeans = new Float64Array(treatmentCount);
  const whitened = new Float64Array(treatmentCount * rank);
  for (let level = 0; level < treatmentCount; level++) {
    let estimate = 0;
    for (let column = 0; column < rank; column++) estimate += contrastRows[level * rank + column] * fit.coefficients[column];
    lsmeans[level] = estimate;
    for (let column = 0; column < rank; column++) {
      let value = contrastRows[level * rank + column];
      for (let previous = 0; previous < column; previous++) {
        value -= fit.triangular[previous * rank + column] * whitened[level * rank + previous];
      }
      whitened[level * rank + column] = value / fit.triangular[column * rank + column];
    }
  }
  const covariance = new Float64Array(treatmentCount * treatmentCount);
  for (let first = 0; first < treatmentCount; first++) {
    for (let second = first; second < treatmentCount; second++) {
      let value = 0;
      for (let column = 0; column < rank; column++) {
        value += whitened[first * rank + column] * whitened[second * rank + column];
      }
      covariance[first * treatmentCount + second] = value;
      covariance[second * treatmentCount + first] = value;
    }
  }
  return { lsmeans, covariance };
}
