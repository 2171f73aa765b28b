import { incompleteGamma } from "./incomplete-gamma";
import type { TailProbabilities } from "./incomplete-beta";

/**
 * Distribution function of the chi-square distribution, both tails.
 *
 * Formula: P(X <= x) = P(df/2, x/2), the regularized lower incomplete gamma.
 *
 * Assumptions: df > 0, x >= 0.
 *
 * Reference: Abramowitz & Stegun (1964) 26.4.19.
 *
 * @example
 * chiSquareCdf(3.841458820694124, 1).upper // 0.05000000000000013
 */
export function chiSquareCdf(x: number, df: number): TailProbabilities {
  return incompleteGamma(df / 2, x / 2);
}
