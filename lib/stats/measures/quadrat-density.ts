import { StatsInputError } from "../errors";
import { compensatedSum } from "../core/compensated-sum";

/**
 * Plot weed density per m² from counts in several quadrats of one plot.
 *
 * Formula: density = mean(counts) / quadratArea, area in m² (a 0.25 m²
 * quadrat is 50 cm × 50 cm).
 *
 * Assumptions: at least one quadrat, area > 0; quadrats of equal size.
 *
 * Reference: Burrill, L. C., Cárdenas, J. & Locatelli, E. (1976) Field
 * Manual for Weed Control Research (quadrat counts of weed density).
 *
 * @example
 * quadratDensity([12, 8, 10, 14], 0.25) // 44
 */
export function quadratDensity(counts: ArrayLike<number>, quadratAreaSquareMetres: number): number {
  if (counts.length === 0) throw new StatsInputError("quadrat density requires at least one count");
  if (!(quadratAreaSquareMetres > 0)) throw new StatsInputError("quadrat density requires a quadrat area above zero");
  return compensatedSum(counts) / counts.length / quadratAreaSquareMetres;
}
