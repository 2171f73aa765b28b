import { StatsInputError } from "../errors";
import { compensatedSum } from "../core/compensated-sum";
import { sumOfSquaredDeviations } from "../core/sum-of-squared-deviations";
import { studentTCdf } from "../distributions/student-t-cdf";
import { studentTQuantile } from "../distributions/student-t-quantile";
import type { TTestResult } from "./t-test-types";

/**
 * Welch's two-sample t-test (unequal variances) of mean(a) = mean(b).
 *
 * Formula: t = (x̄_a - x̄_b) / √(s_a²/n_a + s_b²/n_b), with the
 * Welch-Satterthwaite df = (v_a + v_b)² / (v_a²/(n_a-1) + v_b²/(n_b-1)),
 * v = s²/n; two-sided p and CI from t with that fractional df.
 *
 * Assumptions: independent samples of at least two values each, not both
 * constant.
 *
 * Reference: Welch, B. L. (1947) The generalization of "Student's" problem
 * when several different population variances are involved. Biometrika
 * 34:28-35; R t.test(var.equal = FALSE).
 *
 * @example
 * welchTTest("a", "b", [1, 2, 3, 4], [2, 4, 6, 8, 10])
 * // { a: "a", b: "b", t: -2.2514363231593695, df: 5.520787746170677, p: 0.06913359319239236,
 * //   meanDiff: -3.5, ci: [-7.385368080514043, 0.3853680805140436] }
 */
export function welchTTest(
  labelA: string,
  labelB: string,
  valuesA: ArrayLike<number>,
  valuesB: ArrayLike<number>,
  confidenceLevel = 0.95,
): TTestResult {
  const countA = valuesA.length;
  const countB = valuesB.length;
  if (countA < 2 || countB < 2) throw new StatsInputError("welch t-test requires at least two values per group");
  const meanA = compensatedSum(valuesA) / countA;
  const meanB = compensatedSum(valuesB) / countB;
  const varianceOfMeanA = sumOfSquaredDeviations(valuesA, meanA) / (countA - 1) / countA;
  const varianceOfMeanB = sumOfSquaredDeviations(valuesB, meanB) / (countB - 1) / countB;
  const standardError = Math.sqrt(varianceOfMeanA + varianceOfMeanB);
  if (!(standardError > 0)) throw new StatsInputError("welch t-test requires values that are not all equal");
  const df =
    (varianceOfMeanA + varianceOfMeanB) ** 2 / (varianceOfMeanA ** 2 / (countA - 1) + varianceOfMeanB ** 2 / (countB - 1));
  const meanDiff = meanA - meanB;
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
