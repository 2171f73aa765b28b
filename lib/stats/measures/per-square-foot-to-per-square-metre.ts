import { unitConstants } from "./unit-constants";

/**
 * Converts a density per ft² (plants, weeds) to per m².
 *
 * Formula: per m² = per ft² / 0.3048² (1 ft² = 0.09290304 m² exactly).
 *
 * Reference: NIST SP 811 (2008) Appendix B.
 *
 * @example
 * perSquareFootToPerSquareMetre(1) // 10.763910416709722
 */
export function perSquareFootToPerSquareMetre(perSquareFoot: number): number {
  return perSquareFoot / (unitConstants.metresPerFoot * unitConstants.metresPerFoot);
}
