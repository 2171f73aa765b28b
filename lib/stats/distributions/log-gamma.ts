import { stirlingCorrection } from "./stirling-correction";

const halfLogTwoPi = 0.9189385332046727; // ½ log(2π)

/**
 * Natural logarithm of the gamma function for x > 0.
 *
 * Formula: for x >= 10, Stirling's series (x - ½) log x - x + ½ log 2π plus
 * the Bernoulli correction; below 10 the recurrence
 * log Γ(x) = log Γ(x + m) - log(x (x+1) … (x+m-1)) shifts the argument up.
 *
 * Assumptions: x > 0 (degrees of freedom halves in this engine). Relative
 * error about 1e-15.
 *
 * Reference: Abramowitz & Stegun (1964) 6.1.15 and 6.1.40.
 *
 * @example
 * logGamma(0.5) // 0.5723649429246986 (log √π = 0.5723649429247001)
 */
export function logGamma(x: number): number {
  if (!(x > 0)) return Number.NaN;
  if (x >= 10) return (x - 0.5) * Math.log(x) - x + halfLogTwoPi + stirlingCorrection(x);
  let product = 1;
  let shifted = x;
  while (shifted < 10) {
    product *= shifted;
    shifted += 1;
  }
  return (shifted - 0.5) * Math.log(shifted) - shifted + halfLogTwoPi + stirlingCorrection(shifted) - Math.log(product);
}
