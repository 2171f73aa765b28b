import { logGamma } from "./log-gamma";
import type { TailProbabilities } from "./incomplete-beta";

const tiny = 1e-300;
const relativeTolerance = 1e-15;
const maximumIterations = 100000;

/**
 * Regularized incomplete gamma functions P(a, x) and Q(a, x) = 1 - P(a, x),
 * each computed directly.
 *
 * Formula: for x < a + 1 the series P = e^{-x} x^a / Γ(a+1) · Σ xⁿ/((a+1)…(a+n));
 * otherwise Legendre's continued fraction for Q (Lentz evaluation).
 *
 * Assumptions: a > 0, x >= 0. Used for chi-square tails (Friedman).
 *
 * Reference: Press et al. (2007) Numerical Recipes, 3rd ed., §6.2;
 * NIST DLMF 8.7.1 and 8.9.2.
 *
 * @example
 * incompleteGamma(1, 2) // { lower: 0.8646647167633875, upper: 0.13533528323661245 } (exact: 1 - e⁻², e⁻²)
 */
export function incompleteGamma(a: number, x: number): TailProbabilities {
  if (!(a > 0) || Number.isNaN(x)) return { lower: Number.NaN, upper: Number.NaN };
  if (x <= 0) return { lower: 0, upper: 1 };
  if (x === Number.POSITIVE_INFINITY) return { lower: 1, upper: 0 };
  const logFront = -x + a * Math.log(x) - logGamma(a);
  if (x < a + 1) {
    let term = 1 / a;
    let sum = term;
    let denominator = a;
    for (let step = 0; step < maximumIterations; step++) {
      denominator += 1;
      term *= x / denominator;
      sum += term;
      if (Math.abs(term) < Math.abs(sum) * relativeTolerance) break;
    }
    const lower = sum * Math.exp(logFront);
    return { lower, upper: 1 - lower };
  }
  let b = x + 1 - a;
  let numeratorTerm = 1 / tiny;
  let denominatorTerm = 1 / b;
  let fraction = denominatorTerm;
  for (let step = 1; step <= maximumIterations; step++) {
    const coefficient = -step * (step - a);
    b += 2;
    denominatorTerm = coefficient * denominatorTerm + b;
    if (Math.abs(denominatorTerm) < tiny) denominatorTerm = tiny;
    numeratorTerm = b + coefficient / numeratorTerm;
    if (Math.abs(numeratorTerm) < tiny) numeratorTerm = tiny;
    denominatorTerm = 1 / denominatorTerm;
    const change = denominatorTerm * numeratorTerm;
    fraction *= change;
    if (Math.abs(change - 1) < relativeTolerance) break;
  }
  const upper = Math.exp(logFront) * fraction;
  return { lower: 1 - upper, upper };
}
