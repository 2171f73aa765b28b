import { StatsInputError } from "../errors";

/**
 * Percent weed control of a treatment relative to the untreated (weedy)
 * check, from weed density or biomass.
 *
 * Formula: 100 × (1 - treated / check). Negative values mean more weeds
 * than the check.
 *
 * Assumptions: check > 0; both on the original (untransformed) scale.
 *
 * Reference: Frans, R., Talbert, R., Marx, D. & Crowley, H. (1986)
 * Experimental design and techniques for measuring and analyzing plant
 * responses to weed control practices. In Research Methods in Weed Science,
 * 3rd ed., Southern Weed Science Society, pp. 29-46.
 *
 * @example
 * percentControl(12, 80) // 85
 */
export function percentControl(treated: number, check: number): number {
  if (!(check > 0)) throw new StatsInputError("percent control requires a weedy check value above zero");
  return 100 * (1 - treated / check);
}
