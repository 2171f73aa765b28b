import type { ModelFit } from "../designs/model-types";
import { studentTCdf } from "../distributions/student-t-cdf";
import { studentizedRangeCdf } from "../distributions/studentized-range-cdf";

/** One treatment pair: lsmean(a) - lsmean(b) with unadjusted and Tukey-adjusted p-values. */
export interface PairwiseComparison {
  a: string;
  b: string;
  diff: number;
  se: number;
  t: number;
  pLsd: number;
  pTukey: number;
}

/**
 * All pairwise differences of treatment lsmeans, each unordered pair once
 * (a before b in level order).
 *
 * Formula: d = m_a - m_b, SE = √(MS_error (C_aa + C_bb - 2 C_ab)) with C the
 * unscaled lsmean covariance, t = d / SE; Fisher's LSD p = 2 P(T_df > |t|);
 * Tukey (Tukey-Kramer when SEs differ) p = P(Q_{k,df} > √2 |t|).
 *
 * Assumptions: MS_error and df are the model's (site:treatment in a
 * combined analysis).
 *
 * Reference: Kramer, C. Y. (1956) Extension of multiple range tests to group
 * means with unequal numbers of replications. Biometrics 12:307-310;
 * Tukey, J. W. (1953) The Problem of Multiple Comparisons; the same
 * quantities as R's emmeans pairs(adjust = "none" | "tukey").
 *
 * @example
 * // hardness RCBD, tip1 vs tip4
 * pairwiseComparisons(fit)[2]
 * // { a: "tip1", b: "tip4", diff: -0.3000000000000007, se: 0.06666666666666676, t: -4.500000000000004,
 * //   pLsd: 0.0014889494154117287, pTukey: 0.006658314691186162 }
 */
export function pairwiseComparisons(fit: ModelFit): PairwiseComparison[] {
  const levels = fit.treatment.levels;
  const count = levels.length;
  const comparisons: PairwiseComparison[] = [];
  for (let first = 0; first < count; first++) {
    for (let second = first + 1; second < count; second++) {
      const diff = fit.lsmeans[first] - fit.lsmeans[second];
      const varianceFactor =
        fit.lsmeanCovariance[first * count + first] +
        fit.lsmeanCovariance[second * count + second] -
        2 * fit.lsmeanCovariance[first * count + second];
      const se = Math.sqrt(fit.errorMeanSquare * varianceFactor);
      const t = diff / se;
      const pLsd = 2 * studentTCdf(Math.abs(t), fit.errorDf).upper;
      const pTukey = 1 - studentizedRangeCdf(Math.SQRT2 * Math.abs(t), count, fit.errorDf);
      comparisons.push({ a: levels[first], b: levels[second], diff, se, t, pLsd: Math.min(1, pLsd), pTukey: Math.max(0, pTukey) });
    }
  }
  return comparisons;
}
