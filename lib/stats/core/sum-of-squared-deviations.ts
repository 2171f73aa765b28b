import { NeumaierAccumulator } from "./neumaier-accumulator";

/**
 * Sum of squared deviations from a given centre, Σ (x - centre)².
 *
 * Computed in two passes by the caller (centre first, then this sum) rather
 * than as Σx² - n·mean², which loses all digits when the data sit far from
 * zero (NIST StRD SmLs07-09, values near 1e12).
 *
 * Reference: Chan, Golub & LeVeque (1983) Algorithms for computing the
 * sample variance. The American Statistician 37:242-247.
 *
 * @example
 * sumOfSquaredDeviations([1, 2, 3], 2) // 2
 */
export function sumOfSquaredDeviations(values: ArrayLike<number>, centre: number): number {
  const sum = new NeumaierAccumulator();
  for (let index = 0; index < values.length; index++) {
    const deviation = values[index] - centre;
    sum.add(deviation * deviation);
  }
  return sum.value();
}
