import { chiSquareCdf } from "@/lib/stats";

/**
 * Pearson's chi-square goodness-of-fit statistic summed over independent groups, each group
 * a set of observed counts against equal expected counts. Degrees of freedom add up over the
 * groups because the groups are independent samples. The p-value is the upper tail from
 * lib/stats's chiSquareCdf, computed directly rather than as 1 - cdf (checked against R's pchisq
 * in tests/stats/distributions.test.ts and against jstat in tests/stats/reference-libraries.test.ts).
 */
export function pearsonUniformityTest(groups: number[][]): { statistic: number; degreesOfFreedom: number; pValue: number } {
  let statistic = 0;
  let degreesOfFreedom = 0;
  for (const counts of groups) {
    const total = counts.reduce((sum, count) => sum + count, 0);
    const expected = total / counts.length;
    for (const observed of counts) statistic += (observed - expected) ** 2 / expected;
    degreesOfFreedom += counts.length - 1;
  }
  return { statistic, degreesOfFreedom, pValue: chiSquareCdf(statistic, degreesOfFreedom).upper };
}
