import { incompleteBeta, type TailProbabilities } from "./incomplete-beta";

/**
 * Distribution function of Fisher's F with df1 and df2 degrees of freedom,
 * both tails computed directly.
 *
 * Formula: P(F <= f) = I_x(df1/2, df2/2) with x = df1·f / (df1·f + df2); the
 * upper tail uses the complement df2 / (df1·f + df2) directly, so an ANOVA
 * p-value of 3.18e-17 is not lost to 1 - 0.99999999999999997.
 *
 * Assumptions: df1, df2 > 0, f >= 0.
 *
 * Reference: Abramowitz & Stegun (1964) 26.6.2.
 *
 * @example
 * fCdf(34.7022820554917, 5, 66).upper // 3.182583726145175e-17 (R: pf(..., lower.tail = FALSE) = 3.18258372614516e-17)
 */
export function fCdf(f: number, df1: number, df2: number): TailProbabilities {
  if (Number.isNaN(f) || !(df1 > 0) || !(df2 > 0)) return { lower: Number.NaN, upper: Number.NaN };
  if (f <= 0) return { lower: 0, upper: 1 };
  if (f === Number.POSITIVE_INFINITY) return { lower: 1, upper: 0 };
  const scaled = df1 * f;
  const denominator = scaled + df2;
  return incompleteBeta(scaled / denominator, df1 / 2, df2 / 2, df2 / denominator);
}
