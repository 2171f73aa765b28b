import { findRoot } from "../core/find-root";
import { fCdf } from "./f-cdf";

/**
 * Quantile of the F distribution: the f with P(F > f) = upperTailProbability.
 *
 * Formula: solves log P(F > f) = log(upperTailProbability) with Brent's
 * method on a bracket grown by doubling. Stated as an upper tail because the
 * engine only needs critical values F(1-α; df1, df2).
 *
 * Assumptions: 0 < upperTailProbability < 1, df1, df2 > 0.
 *
 * Reference: Brent (1973) ch. 4; Abramowitz & Stegun (1964) 26.6.
 *
 * @example
 * fQuantile(0.05, 3, 9) // 3.8625483576247683 (R: qf(0.95, 3, 9))
 */
export function fQuantile(upperTailProbability: number, df1: number, df2: number): number {
  if (!(upperTailProbability > 0 && upperTailProbability < 1) || !(df1 > 0) || !(df2 > 0)) return Number.NaN;
  const logTarget = Math.log(upperTailProbability);
  const distance = (f: number) => Math.log(fCdf(f, df1, df2).upper) - logTarget;
  let upperBound = 4;
  while (distance(upperBound) > 0 && upperBound < 1e300) upperBound *= 4;
  return findRoot(distance, 0, upperBound);
}
