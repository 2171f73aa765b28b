import type { PairwiseComparison } from "./pairwise-comparisons";
import { studentTQuantile } from "../distributions/student-t-quantile";

/**
 * Fisher's least significant difference: the smallest difference between
 * two treatment means that is significant at level alpha.
 *
 * Formula: LSD = t(1 - α/2; df_error) · SE_d, where SE_d = √(2 MS_error / r)
 * is the common standard error of a difference. Returns null when the
 * standard errors of the differences are not all equal (lost plots, unequal
 * replication): a single LSD would then be wrong for some pairs and the
 * pairwise p-values must be used instead.
 *
 * Reference: Fisher, R. A. (1935) The Design of Experiments; Gomez & Gomez
 * (1984) §5.1.1.
 *
 * @example
 * fisherLsd(hardnessComparisons, 9, 0.05) // 0.1508104775198807 (R: 0.150810477519881)
 */
export function fisherLsd(comparisons: ReadonlyArray<PairwiseComparison>, errorDf: number, alpha: number): number | null {
  if (comparisons.length === 0) return null;
  const commonError = comparisons[0].se;
  const equal = comparisons.every((comparison) => Math.abs(comparison.se - commonError) <= 1e-9 * commonError);
  if (!equal) return null;
  return studentTQuantile(1 - alpha / 2, errorDf) * commonError;
}
