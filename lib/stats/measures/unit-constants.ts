/**
 * Exact definitions of the imperial units used in field trials.
 *
 * Values: 1 ft = 0.3048 m and 1 lb = 0.45359237 kg (international yard and
 * pound agreement, 1959); 1 acre = 43 560 ft² = 0.40468564224 ha.
 *
 * Reference: NIST Special Publication 811 (2008), Guide for the Use of the
 * International System of Units, Appendix B.
 *
 * @example
 * unitConstants.metresPerFoot ** 2 * 43560 // 4046.8564224 (m² per acre)
 */
export const unitConstants = {
  metresPerFoot: 0.3048,
  kilogramsPerPound: 0.45359237,
  hectaresPerAcre: 0.40468564224,
  squareMetresPerHectare: 10000,
} as const;
