import { StatsInputError } from "../errors";
import { NeumaierAccumulator } from "../core/neumaier-accumulator";
import { compensatedSum } from "../core/compensated-sum";
import type { EncodedFactor } from "../core/encode-factor";
import { fCdf } from "../distributions/f-cdf";
import { groupMeans } from "../designs/group-means";

/** Levene-type test statistic and p-value. */
export interface LeveneResult {
  f: number;
  dfTreatment: number;
  dfResidual: number;
  p: number;
}

/**
 * Brown-Forsythe test for equal variances across treatments: Levene's test
 * with deviations from the group median.
 *
 * Formula: z_ij = |y_ij - median_j|, then the one-way ANOVA F of z on the
 * groups: F = [Σ n_j (z̄_j - z̄)² / (k-1)] / [Σ (z_ij - z̄_j)² / (N-k)].
 *
 * Assumptions: at least two groups and N > k. The median makes the test
 * robust to skewed data such as weed counts.
 *
 * Reference: Brown, M. B. & Forsythe, A. B. (1974) Robust tests for the
 * equality of variances. JASA 69:364-367; R car::leveneTest(center = median).
 *
 * @example
 * // hardness data across the four tips
 * brownForsytheLevene(hardness, tips) // { f: 0.4864864864864868, dfTreatment: 3, dfResidual: 12, p: 0.6979963001965435 }
 */
export function brownForsytheLevene(values: Float64Array, groups: EncodedFactor): LeveneResult {
  const groupCount = groups.levels.length;
  const count = values.length;
  if (groupCount < 2 || count <= groupCount) throw new StatsInputError("levene test requires at least two groups and more values than groups");
  const members: number[][] = Array.from({ length: groupCount }, () => []);
  for (let index = 0; index < count; index++) members[groups.codes[index]].push(values[index]);
  const medians = members.map(median);
  const deviations = new Float64Array(count);
  for (let index = 0; index < count; index++) deviations[index] = Math.abs(values[index] - medians[groups.codes[index]]);
  const { counts, means } = groupMeans(deviations, groups.codes, groupCount);
  const overall = compensatedSum(deviations) / count;
  const between = new NeumaierAccumulator();
  for (let level = 0; level < groupCount; level++) between.add(counts[level] * (means[level] - overall) ** 2);
  const within = new NeumaierAccumulator();
  for (let index = 0; index < count; index++) within.add((deviations[index] - means[groups.codes[index]]) ** 2);
  const dfTreatment = groupCount - 1;
  const dfResidual = count - groupCount;
  const f = between.value() / dfTreatment / (within.value() / dfResidual);
  return { f, dfTreatment, dfResidual, p: fCdf(f, dfTreatment, dfResidual).upper };
}

function median(list: number[]): number {
  const sorted = Float64Array.from(list).sort();
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}
