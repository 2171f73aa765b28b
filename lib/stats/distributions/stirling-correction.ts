/**
 * Remainder of Stirling's formula, log Γ(x) - [(x - ½) log x - x + ½ log 2π],
 * for x >= 10.
 *
 * Formula: Σ B₂ₖ / (2k (2k - 1) x^(2k-1)) for k = 1..8 (Bernoulli numbers);
 * the ninth term is below 1e-17 relative at x = 10.
 *
 * Why separate: log-beta of large arguments needs the correction terms alone,
 * because Γ(a)Γ(b)/Γ(a+b) cancels the big leading parts exactly.
 *
 * Reference: Abramowitz & Stegun (1964) Handbook of Mathematical Functions,
 * 6.1.40.
 *
 * @example
 * stirlingCorrection(10) // 0.00833056343336287
 */
export function stirlingCorrection(x: number): number {
  const inverse = 1 / x;
  const inverseSquared = inverse * inverse;
  return (
    inverse *
    (1 / 12 +
      inverseSquared *
        (-1 / 360 +
          inverseSquared *
            (1 / 1260 +
              inverseSquared *
                (-1 / 1680 +
                  inverseSquared *
                    (1 / 1188 +
                      inverseSquared * (-691 / 360360 + inverseSquared * (1 / 156 + inverseSquared * (-3617 / 122400))))))))
  );
}
