import { unitConstants } from "./unit-constants";

/**
 * Converts a density per m² to per ft².
 *
 * Formula: per ft² = per m² × 0.3048².
 *
 * Reference: NIST SP 811 (2008) Appendix B.
 *
 * @example
 * perSquareMetreToPerSquareFoot(100) // 9.290304
 */
export function perSquareMetreToPerSquareFoot(perSquareMetre: number): number {
  return perSquareMetre * unitConstants.metresPerFoot * unitConstants.metresPerFoot;
}
