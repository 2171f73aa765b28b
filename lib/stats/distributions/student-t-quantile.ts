import { findRoot } from "../core/find-root";
import { studentTCdf } from "./student-t-cdf";

/**
 * Quantile of Student's t distribution: the t with P(T <= t) = p.
 *
 * Formula: solves log P(T > t) = log min(p, 1-p) for t > 0 with Brent's
 * method (working on the log of the small tail keeps relative accuracy for
 * tiny probabilities), then applies the sign by symmetry.
 *
 * Assumptions: 0 < p < 1, df > 0.
 *
 * Reference: Brent (1973) ch. 4; t distribution as in Abramowitz & Stegun
 * (1964) 26.7.
 *
 * @example
 * studentTQuantile(0.975, 10) // 2.2281388519862726
 */
export function studentTQuantile(p: number, df: number): number {
  if (Number.isNaN(p) || p < 0 || p > 1 || !(df > 0)) return Number.NaN;
  if (p === 0.5) return 0;
  if (p === 0) return Number.NEGATIVE_INFINITY;
  if (p === 1) return Number.POSITIVE_INFINITY;
  const tail = Math.min(p, 1 - p);
  const logTail = Math.log(tail);
  const distance = (t: number) => Math.log(studentTCdf(t, df).upper) - logTail;
  let upperBound = 2;
  while (distance(upperBound) > 0 && upperBound < 1e300) upperBound *= 4;
  const magnitude = findRoot(distance, 0, upperBound);
  return p < 0.5 ? -magnitude : magnitude;
}
