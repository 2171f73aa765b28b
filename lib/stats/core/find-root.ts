/**
 * Root of a continuous function on a bracketing interval (Brent's method).
 *
 * Formula: inverse quadratic interpolation or secant steps, falling back to
 * bisection whenever they would leave the bracket or converge slowly, so the
 * bracket always shrinks and convergence is guaranteed.
 *
 * Assumptions: f(lower) and f(upper) have opposite signs (or one is zero).
 * Used to invert distribution functions (t, F quantiles) on the log scale.
 *
 * Reference: Brent, R. P. (1973) Algorithms for Minimization without
 * Derivatives, ch. 4 (procedure zero).
 *
 * @example
 * findRoot((x) => x * x - 2, 0, 2) // 1.414213562373095
 */
export function findRoot(
  f: (x: number) => number,
  lower: number,
  upper: number,
  relativeTolerance = 4e-16,
  maximumIterations = 200,
): number {
  let a = lower;
  let b = upper;
  let valueA = f(a);
  let valueB = f(b);
  if (valueA === 0) return a;
  if (valueB === 0) return b;
  if (valueA * valueB > 0) return Number.NaN;
  let c = a;
  let valueC = valueA;
  let step = b - a;
  let previousStep = step;
  for (let iteration = 0; iteration < maximumIterations; iteration++) {
    if (valueB * valueC > 0) {
      c = a;
      valueC = valueA;
      step = b - a;
      previousStep = step;
    }
    if (Math.abs(valueC) < Math.abs(valueB)) {
      a = b;
      b = c;
      c = a;
      valueA = valueB;
      valueB = valueC;
      valueC = valueA;
    }
    const tolerance = 2 * relativeTolerance * Math.abs(b) + 1e-300;
    const midpoint = 0.5 * (c - b);
    if (Math.abs(midpoint) <= tolerance || valueB === 0) return b;
    if (Math.abs(previousStep) >= tolerance && Math.abs(valueA) > Math.abs(valueB)) {
      let p: number;
      let q: number;
      const s = valueB / valueA;
      if (a === c) {
        p = 2 * midpoint * s;
        q = 1 - s;
      } else {
        const r = valueB / valueC;
        const t = valueA / valueC;
        p = s * (2 * midpoint * t * (t - r) - (b - a) * (r - 1));
        q = (t - 1) * (r - 1) * (s - 1);
      }
      if (p > 0) q = -q;
      else p = -p;
      if (2 * p < Math.min(3 * midpoint * q - Math.abs(tolerance * q), Math.abs(previousStep * q))) {
        previousStep = step;
        step = p / q;
      } else {
        step = midpoint;
        previousStep = step;
      }
    } else {
      step = midpoint;
      previousStep = step;
    }
    a = b;
    valueA = valueB;
    b += Math.abs(step) > tolerance ? step : midpoint > 0 ? tolerance : -tolerance;
    valueB = f(b);
  }
  return b;
}
