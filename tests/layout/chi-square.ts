import { createRequire } from "node:module";

// jstat ships no type declarations; only the one function the tests need is typed here.
const require = createRequire(import.meta.url);
const { jStat } = require("jstat") as { jStat: { chisquare: { cdf(x: number, degreesOfFreedom: number): number } } };

/**
 * Pearson's chi-square goodness-of-fit statistic summed over independent groups, each group
 * a set of observed counts against equal expected counts. Degrees of freedom add up over the
 * groups because the groups are independent samples.
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
  return { statistic, degreesOfFreedom, pValue: 1 - jStat.chisquare.cdf(statistic, degreesOfFreedom) };
}
