/**
 * Standard normal distribution function Φ(x).
 *
 * Formula: W. J. Cody's rational Chebyshev approximations for erf/erfc on
 * |x| <= 0.674, 0.674 < |x| <= √32 and |x| > √32, with the exp(-x²/2)
 * factor split as exp(-x₁²/2)·exp(-(x-x₁)(x+x₁)/2) (x₁ = x rounded to 1/16)
 * so the tail keeps full relative precision. The upper tail is Φ(-x), which
 * is computed directly, not as 1 - Φ(x).
 *
 * Assumptions: none; relative accuracy about 1e-15 down to 1e-300.
 *
 * Reference: Cody, W. J. (1969) Rational Chebyshev approximations for the
 * error function. Mathematics of Computation 23:631-637; the same
 * coefficients as R's pnorm (nmath/pnorm.c).
 *
 * @example
 * normalCdf(1.959963984540054) // 0.975
 */
export function normalCdf(x: number): number {
  if (Number.isNaN(x)) return Number.NaN;
  const absolute = Math.abs(x);
  if (absolute <= 0.67448975) {
    let numerator = 0;
    let denominator = 0;
    if (absolute > 1.1102230246251565e-16) {
      const square = x * x;
      numerator = 0.065682337918207449113 * square;
      denominator = square;
      numerator = (numerator + 2.2352520354606839287) * square;
      denominator = (denominator + 47.20258190468824187) * square;
      numerator = (numerator + 161.02823106855587881) * square;
      denominator = (denominator + 976.09855173777669322) * square;
      numerator = (numerator + 1067.6894854603709582) * square;
      denominator = (denominator + 10260.932208618978205) * square;
    }
    const value = (x * (numerator + 18154.981253343561249)) / (denominator + 45507.789335026729956);
    return 0.5 + value;
  }
  let upperTail: number;
  if (absolute <= 5.656854249492380195206754896838) {
    let numerator = 1.0765576773720192317e-8 * absolute;
    let denominator = absolute;
    const c = [
      0.39894151208813466764, 8.8831497943883759412, 93.506656132177855979, 597.27027639480026226,
      2494.5375852903726711, 6848.1904505362823326, 11602.651437647350124,
    ];
    const d = [
      22.266688044328115691, 235.38790178262499861, 1519.377599407554805, 6485.558298266760755,
      18615.571640885098091, 34900.952721145977266, 38912.003286093271411,
    ];
    for (let index = 0; index < 7; index++) {
      numerator = (numerator + c[index]) * absolute;
      denominator = (denominator + d[index]) * absolute;
    }
    const ratio = (numerator + 9842.7148383839780218) / (denominator + 19685.429676859990727);
    upperTail = gaussianFactor(absolute) * ratio;
  } else if (absolute < 50) {
    const inverseSquare = 1 / (x * x);
    const p = [0.21589853405795699, 0.1274011611602473639, 0.022235277870649807, 0.001421619193227893466];
    const q = [1.28426009614491121, 0.468238212480865118, 0.0659881378689285515, 0.00378239633202758244];
    let numerator = 0.02307344176494017303 * inverseSquare;
    let denominator = inverseSquare;
    for (let index = 0; index < 4; index++) {
      numerator = (numerator + p[index]) * inverseSquare;
      denominator = (denominator + q[index]) * inverseSquare;
    }
    let ratio = (inverseSquare * (numerator + 2.9112874951168792e-5)) / (denominator + 7.29751555083966205e-5);
    ratio = (0.398942280401432677939946059934 - ratio) / absolute;
    upperTail = gaussianFactor(absolute) * ratio;
  } else {
    upperTail = 0;
  }
  return x > 0 ? 1 - upperTail : upperTail;
}

function gaussianFactor(absolute: number): number {
  const rounded = Math.trunc(absolute * 16) / 16;
  const remainder = (absolute - rounded) * (absolute + rounded);
  return Math.exp(-rounded * rounded * 0.5) * Math.exp(-remainder * 0.5);
}
