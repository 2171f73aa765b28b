import { StatsInputError } from "../errors";

/**
 * Abbott's correction: efficacy of a treatment corrected for the natural
 * mortality (or natural decline) seen in the untreated control.
 *
 * Formula: corrected % = 100 × (T - C) / (100 - C), with T and C the
 * percentage mortality (or reduction) in the treated and control plots.
 * Equivalently 100 × (1 - survivalTreated / survivalControl).
 *
 * Assumptions: 0 <= C < 100.
 *
 * Reference: Abbott, W. S. (1925) A method of computing the effectiveness of
 * an insecticide. Journal of Economic Entomology 18:265-267.
 *
 * @example
 * abbottCorrection(90, 20) // 87.5
 */
export function abbottCorrection(percentTreated: number, percentControl: number): number {
  if (!(percentControl >= 0 && percentControl < 100)) throw new StatsInputError("abbott correction requires a control percentage in [0, 100)");
  return (100 * (percentTreated - percentControl)) / (100 - percentControl);
}
