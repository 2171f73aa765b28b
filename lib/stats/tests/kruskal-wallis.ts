import { StatsInputError } from "../errors";
import type { EncodedFactor } from "../core/encode-factor";
import { NeumaierAccumulator } from "../core/neumaier-accumulator";
import { chiSquareCdf } from "../distributions/chi-square-cdf";

/** Kruskal-Wallis rank test result. */
export interface KruskalWallisResult {
  chi2: number;
  df: number;
  p: number;
}

/**
 * Kruskal-Wallis rank test for a completely randomized design: a
 * distribution-free alternative to the one-way ANOVA, for residuals that are
 * far from normal.
 *
 * Formula: rank all N values together (mid-ranks for ties); with R̄_j the
 * mean rank of treatment j (n_j plots) and k treatments,
 * H = 12 / (N(N+1)) · Σ n_j (R̄_j - (N+1)/2)², divided by the tie correction
 * 1 - Σ(t³ - t)/(N³ - N) over each group of t tied values; p is the upper
 * tail of χ² with k - 1 df. The sum is of squared deviations from the mean
 * rank (not Σ R_j²/n_j - 3(N+1)), so nothing cancels.
 *
 * Assumptions: independent plots; the χ² approximation wants about five or
 * more plots per treatment (small trials get an approximate p). Ranks do not
 * change under the monotone transformations, so pass the raw values.
 *
 * Reference: Kruskal, W. H. & Wallis, W. A. (1952) JASA 47:583-621;
 * Hollander, M. & Wolfe, D. A. (1973) Nonparametric Statistical Methods,
 * §6.1; R kruskal.test.
 *
 * @example
 * kruskalWallis(new Float64Array([1, 2, 2, 4, 5, 6]), encodeFactor(["a", "a", "a", "b", "b", "b"]))
 * // { chi2: 3.9705882352941178, df: 1, p: 0.04630159491511007 } (R kruskal.test: 3.97058823529412, p 0.04630159491511)
 */
export function kruskalWallis(values: ArrayLike<number>, treatment: EncodedFactor): KruskalWallisResult {
  const treatmentCount = treatment.levels.length;
  const observations = values.length;
  if (treatmentCount < 2) throw new StatsInputError("kruskal-wallis test requires at least two treatments");
  if (treatment.codes.length !== observations) throw new StatsInputError("kruskal-wallis test requires one treatment label per value");
  for (let index = 0; index < observations; index++) {
    if (!Number.isFinite(values[index])) throw new StatsInputError("kruskal-wallis test requires finite values");
  }
  const order = Array.from({ length: observations }, (_, index) => index).sort((a, b) => values[a] - values[b]);
  const rankSums = new Float64Array(treatmentCount);
  const counts = new Float64Array(treatmentCount);
  let tieSum = 0;
  let start = 0;
  while (start < observations) {
    let end = start;
    while (end + 1 < observations && values[order[end + 1]] === values[order[start]]) end++;
    const tied = end - start + 1;
    const midRank = (start + end) / 2 + 1;
    for (let position = start; position <= end; position++) {
      const level = treatment.codes[order[position]];
      rankSums[level] += midRank;
      counts[level] += 1;
    }
    tieSum += tied ** 3 - tied;
    start = end + 1;
  }
  if (counts.some((count) => count === 0)) throw new StatsInputError("kruskal-wallis test requires at least one plot per treatment");
  const tieCorrection = 1 - tieSum / (observations ** 3 - observations);
  if (!(tieCorrection > 0)) throw new StatsInputError("kruskal-wallis test requires at least two different values");
  const meanRank = (observations + 1) / 2;
  const spread = new NeumaierAccumulator();
  for (let level = 0; level < treatmentCount; level++) {
    const deviation = rankSums[level] / counts[level] - meanRank;
    spread.add(counts[level] * deviation * deviation);
  }
  const chi2 = (12 * spread.value()) / (observations * (observations + 1)) / tieCorrection;
  const df = treatmentCount - 1;
  return { chi2, df, p: chiSquareCdf(chi2, df).upper };
}
