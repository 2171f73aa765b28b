import { findRoot } from "../core/find-root";
import { studentizedRangeCdf } from "./studentized-range-cdf";

/**
 * Quantile of the studentized range: the q with P(Q <= q) = p, e.g. the
 * Tukey HSD critical value q(0.95; means, df).
 *
 * Formula: Odeh & Evans / Copenhaver & Holland starting value (as in R's
 * qtukey), then Brent's method on P(Q <= q) - p to a relative tolerance of
 * 1e-12.
 *
 * Deviation from R: R's qtukey stops its secant search at an absolute change
 * of 1e-4, so R's values are only good to about four decimals; this one is
 * limited by the accuracy of the distribution function (about 1e-10).
 *
 * Assumptions: 0 < p < 1, numberOfMeans >= 2, df >= 2.
 *
 * Reference: Copenhaver & Holland (1988) J. Statist. Comput. Simul. 30:1-15;
 * Odeh, R. E. & Evans, J. O. (1974) Algorithm AS 70, Applied Statistics
 * 23:96-97.
 *
 * @example
 * studentizedRangeQuantile(0.95, 3, 10) // 3.876776750017843 (table value 3.88)
 */
export function studentizedRangeQuantile(p: number, numberOfMeans: number, df: number, ranges = 1): number {
  if (!(p > 0 && p < 1) || numberOfMeans < 2 || df < 2) return Number.NaN;
  const distance = (q: number) => studentizedRangeCdf(q, numberOfMeans, df, ranges) - p;
  const start = initialValue(p, numberOfMeans, df);
  let lowerBound = Math.max(0, start * 0.8);
  let upperBound = start * 1.25;
  while (lowerBound > 0 && distance(lowerBound) > 0) lowerBound = lowerBound > 1e-3 ? lowerBound / 2 : 0;
  while (distance(upperBound) < 0 && upperBound < 1e6) upperBound *= 2;
  return findRoot(distance, lowerBound, upperBound, 1e-12);
}

function initialValue(p: number, numberOfMeans: number, df: number): number {
  const tailHalf = 0.5 - 0.5 * p;
  const y = Math.sqrt(Math.log(1 / (tailHalf * tailHalf)));
  let t =
    y +
    ((((y * -0.453642210148e-4 - 0.204231210125) * y - 0.342242088547) * y - 1) * y + 0.322232421088) /
      ((((y * 0.38560700634e-2 + 0.10353775285) * y + 0.531103462366) * y + 0.588581570495) * y + 0.993484626060e-1);
  if (df < 120) t += (t * t * t + t) / df / 4;
  let q = 0.8832 - 0.2368 * t;
  if (df < 120) q += -1.214 / df + (1.208 * t) / df;
  return t * (q * Math.log(numberOfMeans - 1) + 1.4142);
}
