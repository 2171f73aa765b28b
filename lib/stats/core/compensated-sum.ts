/**
 * Sum of an array with Neumaier's improved Kahan compensation.
 *
 * Formula: s = s + x, with the rounding error of each addition
 * (|s| >= |x| ? (s - t) + x : (x - t) + s) kept in a separate correction
 * term that is added back at the end.
 *
 * Assumptions: finite inputs. The error bound does not grow with n, which
 * matters for sums of squares of many plots.
 *
 * Reference: Neumaier, A. (1974) Rundungsfehleranalyse einiger Verfahren zur
 * Summation endlicher Summen. ZAMM 54:39-51.
 *
 * @example
 * compensatedSum([1e16, 1, -1e16]) // 1
 */
export function compensatedSum(values: ArrayLike<number>): number {
  let sum = 0;
  let correction = 0;
  for (let index = 0; index < values.length; index++) {
    const value = values[index];
    const total = sum + value;
    if (Math.abs(sum) >= Math.abs(value)) correction += sum - total + value;
    else correction += value - total + sum;
    sum = total;
  }
  return sum + correction;
}
