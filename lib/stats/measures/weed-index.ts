import { StatsInputError } from "../errors";

/**
 * Weed index: yield lost to weeds in a treatment, relative to the
 * weed-free check.
 *
 * Formula: WI = 100 × (X - Y) / X, with X the yield of the weed-free plot
 * and Y the yield of the treated plot.
 *
 * Assumptions: X > 0.
 *
 * Reference: Gill, G. S. & Kumar, V. (1969) "Weed index" a new method for
 * reporting weed control trials. Indian Journal of Agronomy 14:96-98.
 *
 * @example
 * weedIndex(5.2, 4.68) // 10.000000000000007
 */
export function weedIndex(yieldWeedFree: number, yieldTreated: number): number {
  if (!(yieldWeedFree > 0)) throw new StatsInputError("weed index requires a weed-free yield above zero");
  return (100 * (yieldWeedFree - yieldTreated)) / yieldWeedFree;
}
