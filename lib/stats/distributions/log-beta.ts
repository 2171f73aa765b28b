import { logGamma } from "./log-gamma";
import { stirlingCorrection } from "./stirling-correction";

const halfLogTwoPi = 0.9189385332046727;

/**
 * log B(a, b) = log Γ(a) + log Γ(b) - log Γ(a + b).
 *
 * Formula: when both arguments are at least 10 the large Stirling parts are
 * combined analytically, -½ log b + ½ log 2π + (a - ½) log(a/(a+b))
 * + b log1p(-a/(a+b)) + corrections, so nothing of size log Γ(10⁶) cancels;
 * when only the larger one is big, the same is done for the ratio
 * Γ(b)/Γ(a+b). Otherwise plain log-gamma sums are accurate.
 *
 * Reference: the approach of R's lbeta (R Core Team, nmath/lbeta.c), after
 * Abramowitz & Stegun (1964) 6.1.40.
 *
 * @example
 * logBeta(0.5, 0.5) // 1.1447298858493955 (log π = 1.1447298858494002)
 */
export function logBeta(a: number, b: number): number {
  const small = Math.min(a, b);
  const large = Math.max(a, b);
  if (small >= 10) {
    const correction = stirlingCorrection(small) + stirlingCorrection(large) - stirlingCorrection(small + large);
    return (
      -0.5 * Math.log(large) +
      halfLogTwoPi +
      correction +
      (small - 0.5) * Math.log(small / (small + large)) +
      large * Math.log1p(-small / (small + large))
    );
  }
  if (large >= 10) {
    const correction = stirlingCorrection(large) - stirlingCorrection(small + large);
    return (
      logGamma(small) +
      correction +
      small -
      small * Math.log(small + large) +
      (large - 0.5) * Math.log1p(-small / (small + large))
    );
  }
  return logGamma(small) + logGamma(large) - logGamma(small + large);
}
