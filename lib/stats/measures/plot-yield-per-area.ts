import { StatsInputError } from "../errors";
import { unitConstants } from "./unit-constants";

/** Yield of a plot expressed per area. */
export interface AreaYield {
  tonnesPerHectare: number;
  poundsPerAcre: number;
}

/**
 * Converts the harvested yield of a plot (kg) to tonnes per hectare and
 * pounds per acre.
 *
 * Formula: t/ha = kg / area(m²) × 10 000 / 1000;
 * lb/acre = kg / area(m²) / 0.45359237 × 4046.8564224.
 *
 * Assumptions: harvested (net) area in m², > 0.
 *
 * Reference: NIST SP 811 (2008) Appendix B for the exact unit factors.
 *
 * @example
 * plotYieldPerArea(6.5, 12) // { tonnesPerHectare: 5.416666666666666, poundsPerAcre: 4832.636908773398 }
 */
export function plotYieldPerArea(yieldKilograms: number, harvestedAreaSquareMetres: number): AreaYield {
  if (!(harvestedAreaSquareMetres > 0)) throw new StatsInputError("yield conversion requires a harvested area above zero");
  const kilogramsPerSquareMetre = yieldKilograms / harvestedAreaSquareMetres;
  const squareMetresPerAcre = unitConstants.hectaresPerAcre * unitConstants.squareMetresPerHectare;
  return {
    tonnesPerHectare: (kilogramsPerSquareMetre * unitConstants.squareMetresPerHectare) / 1000,
    poundsPerAcre: (kilogramsPerSquareMetre / unitConstants.kilogramsPerPound) * squareMetresPerAcre,
  };
}
