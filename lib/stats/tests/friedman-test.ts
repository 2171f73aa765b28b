import { StatsInputError } from "../errors";
import type { EncodedFactor } from "../core/encode-factor";
import { chiSquareCdf } from "../distributions/chi-square-cdf";

/** Friedman rank test result. */
export interface FriedmanResult {
  chi2: number;
  df: number;
  p: number;
}

/**
 * Friedman's rank test for a complete randomized block design: a
 * distribution-free alternative to the RCBD ANOVA.
 *
 * Formula: rank within each block (mid-ranks for ties), R_j the rank sum of
 * treatment j over b blocks, k treatments:
 * χ² = 12 Σ (R_j - b(k+1)/2)² / [b k (k+1) - Σ(t³ - t)/(k - 1)],
 * the denominator corrected for each group of t tied values; p from χ² with
 * k - 1 df.
 *
 * Assumptions: exactly one observation per treatment and block.
 *
 * Reference: Friedman, M. (1937) JASA 32:675-701; Hollander, M. & Wolfe,
 * D. A. (1973) Nonparametric Statistical Methods, §7.1; R friedman.test.
 *
 * @example
 * friedmanTest(hardness, tips, coupons) // { chi2: 8.846153846153847, df: 3, p: 0.03140785417386048 }
 */
export function friedmanTest(values: Float64Array, treatment: EncodedFactor, block: EncodedFactor): FriedmanResult {
  const treatmentCount = treatment.levels.length;
  const blockCount = block.levels.length;
  if (treatmentCount < 2 || blockCount < 2) throw new StatsInputError("friedman test requires at least two treatments and two blocks");
  const table = new Float64Array(blockCount * treatmentCount).fill(Number.NaN);
  for (let index = 0; index < values.length; index++) {
    const cell = block.codes[index] * treatmentCount + treatment.codes[index];
    if (!Number.isNaN(table[cell])) throw new StatsInputError("friedman test requires exactly one plot per treatment and block");
    table[cell] = values[index];
  }
  if (table.some(Number.isNaN)) throw new StatsInputError("friedman test requires exactly one plot per treatment and block");
  const rankSums = new Float64Array(treatmentCount);
  let tieCorrection = 0;
  for (let blockLevel = 0; blockLevel < blockCount; blockLevel++) {
    const row = table.subarray(blockLevel * treatmentCount, (blockLevel + 1) * treatmentCount);
    const order = Array.from({ length: treatmentCount }, (_, index) => index).sort((a, b) => row[a] - row[b]);
    let start = 0;
    while (start < treatmentCount) {
      let end = start;
      while (end + 1 < treatmentCount && row[order[end + 1]] === row[order[start]]) end++;
      const tied = end - start + 1;
      const midRank = (start + end) / 2 + 1;
      for (let position = start; position <= end; position++) rankSums[order[position]] += midRank;
      tieCorrection += tied ** 3 - tied;
      start = end + 1;
    }
  }
  const expected = (blockCount * (treatmentCount + 1)) / 2;
  let spread = 0;
  for (const sum of rankSums) spread += (sum - expected) ** 2;
  const chi2 =
    (12 * spread) / (blockCount * treatmentCount * (treatmentCount + 1) - tieCorrection / (treatmentCount - 1));
  const df = treatmentCount - 1;
  return { chi2, df, p: chiSquareCdf(chi2, df).upper };
}
