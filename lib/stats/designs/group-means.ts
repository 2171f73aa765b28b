import { NeumaierAccumulator } from "../core/neumaier-accumulator";

/** Per-level counts and means of a response. */
export interface GroupMeans {
  counts: Float64Array;
  means: Float64Array;
}

/**
 * Counts and arithmetic means of the response within each level of a factor,
 * with compensated sums.
 *
 * Reference: Neumaier (1974) ZAMM 54:39-51 for the summation.
 *
 * @example
 * groupMeans(new Float64Array([1, 2, 4]), new Int32Array([0, 0, 1]), 2)
 * // { counts: Float64Array [2, 1], means: Float64Array [1.5, 4] }
 */
export function groupMeans(response: Float64Array, codes: Int32Array, levelCount: number): GroupMeans {
  const sums = Array.from({ length: levelCount }, () => new NeumaierAccumulator());
  const counts = new Float64Array(levelCount);
  for (let index = 0; index < response.length; index++) {
    sums[codes[index]].add(response[index]);
    counts[codes[index]] += 1;
  }
  const means = new Float64Array(levelCount);
  for (let level = 0; level < levelCount; level++) means[level] = sums[level].value() / counts[level];
  return { counts, means };
}
