import { incompleteBeta, type TailProbabilities } from "./incomplete-beta";
import { normalCdf } from "./normal-cdf";

/**
 * Distribution function of Student's t with df degrees of freedom, both
 * tails computed directly.
 *
 * Formula: P(|T| > |t|) = I_{df/(df+t²)}(df/2, ½), passing t²/(df+t²) as the
 * exact complement so that p-values like 1e-13 keep their digits; each tail
 * is half of it on its side. df = ∞ gives the normal distribution.
 *
 * Assumptions: df > 0 (fractional df allowed, as for Welch's test).
 *
 * Reference: Abramowitz & Stegun (1964) 26.7.1 and 26.5.27.
 *
 * @example
 * studentTCdf(2.228138851986274, 10) // { lower: 0.9750000000000001, upper: 0.024999999999999925 }
 */
export function studentTCdf(t: number, df: number): TailProbabilities {
  if (Number.isNaN(t) || !(df > 0)) return { lower: Number.NaN, upper: Number.NaN };
  if (df === Number.POSITIVE_INFINITY) return { lower: normalCdf(t), upper: normalCdf(-t) };
  if (!Number.isFinite(t)) return t > 0 ? { lower: 1, upper: 0 } : { lower: 0, upper: 1 };
  const square = t * t;
  const denominator = df + square;
  const twoSided = incompleteBeta(df / denominator, df / 2, 0.5, square / denominator).lower;
  const smallTail = twoSided / 2;
  return t > 0 ? { lower: 1 - smallTail, upper: smallTail } : { lower: smallTail, upper: 1 - smallTail };
}
