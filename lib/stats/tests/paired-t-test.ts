import { StatsInputError } from "../errors";
import { compensatedSum } from "../core/compensated-sum";
import { sumOfSquaredDeviations } from "../core/sum-of-squared-deviations";
import { studentTCdf } from "../distributions/student-t-cdf";
import { studentTQuantile } from "../distributions/student-t-quantile";
import type { TTestResult } from "./t-test-types";

/**
 * Paired t-test of mean(a - b) = 0 over pairs (e.g. two methods on the same
 * plot or subject).
 *
 * Formula: d_i = a_i - b_i, t = d̄ / (s_d / √n) with n - 1 df, two-sided p,
 * CI = d̄ ± t(1 - (1-level)/2; n-1) s_d/√n.
 *
 * Assumptions: differences independent and roughly normal; n >= 2 with
 * non-zero spread.
 *
 * Reference: Student (1908) The probable error of a mean. Biometrika 6:1-25;
 * R t.test(paired = TRUE).
 *
 * @example
 * pairedTTest("drug1", "drug2", drug1, drug2) // sleep data (R datasets::sleep)
 * // { a: "drug1", b: "drug2", t: -4.062127683382037, df: 9, p: 0.0028328901973842793,
 * //   meanDiff: -1.58, ci: [-2.4598857632769837, -0.7001142367230166] }
 */
export function pairedTTest(
  labelA: string,
  labelB: string,
  valuesA: ArrayLike<number>,
  valuesB: ArrayLike<number>,
  confidenceLevel = 0.95,
): TTestResult {
  const count = valuesA.length;
  if (count !== valuesB.length || count < 2) throw new StatsInputError("paired t-test requires at least two complete pairs");
  const differences = new Float64Array(count);
  for (let index = 0; index < count; index++) differences[index] = valuesA[index] - valuesB[index];
  const meanDiff = compensatedSum(differences) / count;
  const variance = sumOfSquaredDeviations(differences, meanDiff) / (count - 1);
  if (!(variance > 0)) throw new StatsInputError("paired t-test requires differences that are not all equal");
  const standardError = Math.sqrt(variance / count);
  const df = count - 1;
  const t = meanDiff / standardError;
  const halfWidth = studentTQuantile(1 - (1 - confidenceLevel) / 2, df) * standardError;
  return {
    a: labelA,
    b: labelB,
    t,
    df,
    p: Math.min(1, 2 * studentTCdf(Math.abs(t), df).upper),
    meanDiff,
    ci: [meanDiff - halfWidth, meanDiff + halfWidth],
  };
}
