import { StatsInputError } from "../errors";

/**
 * Henderson-Tilton efficacy: percent reduction of a population in treated
 * plots, corrected for the change in untreated plots, when densities differ
 * before treatment.
 *
 * Formula: efficacy = 100 × (1 - (Ta × Cb) / (Tb × Ca)), with Tb, Ta the
 * counts in treated plots before and after, Cb, Ca in the untreated check.
 *
 * Assumptions: Tb > 0 and Ca > 0.
 *
 * Reference: Henderson, C. F. & Tilton, E. W. (1955) Tests with acaricides
 * against the brown wheat mite. Journal of Economic Entomology 48:157-161.
 *
 * @example
 * hendersonTilton({ treatedBefore: 50, treatedAfter: 5, checkBefore: 40, checkAfter: 60 }) // 93.33333333333333
 */
export function hendersonTilton(counts: { treatedBefore: number; treatedAfter: number; checkBefore: number; checkAfter: number }): number {
  const { treatedBefore, treatedAfter, checkBefore, checkAfter } = counts;
  if (!(treatedBefore > 0) || !(checkAfter > 0)) throw new StatsInputError("henderson-tilton requires treated-before and check-after counts above zero");
  return 100 * (1 - (treatedAfter * checkBefore) / (treatedBefore * checkAfter));
}
