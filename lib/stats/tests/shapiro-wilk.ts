import { StatsInputError } from "../errors";
import { normalCdf } from "../distributions/normal-cdf";
import { normalQuantile } from "../distributions/normal-quantile";

/** Shapiro-Wilk statistic W and its p-value. */
export interface ShapiroWilkResult {
  w: number;
  p: number;
}

const smallCoefficients1 = [0, 0.221157, -0.147981, -2.07119, 4.434685, -2.706056];
const smallCoefficients2 = [0, 0.042981, -0.293762, -1.752461, 5.682633, -3.582633];
const meanSmall = [0.544, -0.39978, 0.025054, -6.714e-4];
const sdSmall = [1.3822, -0.77857, 0.062767, -0.0020322];
const meanLarge = [-1.5861, -0.31082, -0.083751, 0.0038915];
const sdLarge = [-0.4803, -0.082676, 0.0030302];
const gammaSmall = [-2.273, 0.459];

/**
 * Shapiro-Wilk test of normality (used on model residuals).
 *
 * Formula: W = (Σ a_i x_(i))² / Σ (x_i - x̄)², with Royston's approximation
 * of the coefficients a_i from normal scores m_i = Φ⁻¹((i - 3/8)/(n + 1/4)),
 * W computed as 1 - W₁ (W₁ = (√(SSa·SSx) - Sax)(√(SSa·SSx) + Sax)/(SSa·SSx))
 * to avoid rounding near 1; p from Royston's normalising transformation of
 * log(1 - W) (n = 3 exact, 4..11 and 12..5000 separate polynomials).
 *
 * Assumptions: 3 <= n <= 5000, not all values equal.
 *
 * Reference: Royston, P. (1995) Remark AS R94: A remark on algorithm AS 181:
 * the W-test for normality. Applied Statistics 44:547-551 (the algorithm of
 * R's shapiro.test).
 *
 * @example
 * shapiroWilk([2.1, 3.4, 1.9, 5.6, 4.4, 3.3, 2.8]) // { w: 0.9401366782604087, p: 0.6399513751796624 } (R: shapiro.test)
 */
export function shapiroWilk(values: ArrayLike<number>): ShapiroWilkResult {
  const sorted = Float64Array.from(values).sort();
  const count = sorted.length;
  if (count < 3 || count > 5000) throw new StatsInputError("shapiro-wilk requires between 3 and 5000 values");
  const range = sorted[count - 1] - sorted[0];
  if (range < 1e-10 * Math.max(1, Math.abs(sorted[0]))) throw new StatsInputError("shapiro-wilk requires values that are not all identical");
  const half = Math.floor(count / 2);
  const coefficients = new Float64Array(half + 1); // 1-based as in AS R94
  if (count === 3) coefficients[1] = Math.SQRT1_2;
  else {
    const shifted = count + 0.25;
    let sumSquares = 0;
    for (let index = 1; index <= half; index++) {
      coefficients[index] = normalQuantile((index - 0.375) / shifted);
      sumSquares += coefficients[index] * coefficients[index];
    }
    sumSquares *= 2;
    const rootSumSquares = Math.sqrt(sumSquares);
    const inverseRootN = 1 / Math.sqrt(count);
    const first = polynomial(smallCoefficients1, inverseRootN) - coefficients[1] / rootSumSquares;
    let start: number;
    let factor: number;
    if (count > 5) {
      start = 3;
      const second = -coefficients[2] / rootSumSquares + polynomial(smallCoefficients2, inverseRootN);
      factor = Math.sqrt(
        (sumSquares - 2 * coefficients[1] ** 2 - 2 * coefficients[2] ** 2) / (1 - 2 * first ** 2 - 2 * second ** 2),
      );
      coefficients[2] = second;
    } else {
      start = 2;
      factor = Math.sqrt((sumSquares - 2 * coefficients[1] ** 2) / (1 - 2 * first ** 2));
    }
    coefficients[1] = first;
    for (let index = start; index <= half; index++) coefficients[index] /= -factor;
  }

  let meanCoefficient = -coefficients[1];
  let meanScaled = sorted[0] / range;
  for (let index = 1, mirror = count - 1; index < count; mirror--) {
    meanScaled += sorted[index] / range;
    index++;
    if (index !== mirror) meanCoefficient += Math.sign(index - mirror) * coefficients[Math.min(index, mirror)];
  }
  meanCoefficient /= count;
  meanScaled /= count;
  let sumSquaresCoefficients = 0;
  let sumSquaresValues = 0;
  let crossProduct = 0;
  for (let index = 0, mirror = count - 1; index < count; index++, mirror--) {
    const coefficient =
      index !== mirror ? Math.sign(index - mirror) * coefficients[1 + Math.min(index, mirror)] - meanCoefficient : -meanCoefficient;
    const deviation = sorted[index] / range - meanScaled;
    sumSquaresCoefficients += coefficient * coefficient;
    sumSquaresValues += deviation * deviation;
    crossProduct += coefficient * deviation;
  }
  const root = Math.sqrt(sumSquaresCoefficients * sumSquaresValues);
  const oneMinusW = ((root - crossProduct) * (root + crossProduct)) / (sumSquaresCoefficients * sumSquaresValues);
  const w = 1 - oneMinusW;

  if (count === 3) {
    const p = 1.90985931710274 * (Math.asin(Math.sqrt(w)) - 1.0471975511966);
    return { w, p: Math.min(1, Math.max(0, p)) };
  }
  let y = Math.log(oneMinusW);
  const logN = Math.log(count);
  let mean: number;
  let sd: number;
  if (count <= 11) {
    const gamma = polynomial(gammaSmall, count);
    if (y >= gamma) return { w, p: 1e-99 };
    y = -Math.log(gamma - y);
    mean = polynomial(meanSmall, count);
    sd = Math.exp(polynomial(sdSmall, count));
  } else {
    mean = polynomial(meanLarge, logN);
    sd = Math.exp(polynomial(sdLarge, logN));
  }
  return { w, p: normalCdf(-(y - mean) / sd) };
}

function polynomial(coefficients: number[], x: number): number {
  let result = coefficients[coefficients.length - 1];
  for (let index = coefficients.length - 2; index >= 0; index--) result = result * x + coefficients[index];
  return result;
}
