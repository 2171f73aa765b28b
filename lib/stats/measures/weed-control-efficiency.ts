import { StatsInputError } from "../errors";

/**
 * Weed control efficiency (WCE): reduction in weed dry matter by a
 * treatment relative to the unweeded control.
 *
 * Formula: WCE = 100 × (WDc - WDt) / WDc, with WDc and WDt the weed dry
 * matter (g/m²) in the unweeded control and the treated plot.
 *
 * Assumptions: WDc > 0.
 *
 * Reference: Mani, V. S., Malla, M. L., Gautam, K. C. & Bhagwandas (1973)
 * Weed killing chemicals in potato cultivation. Indian Farming 23(8):17-18;
 * widely used in Indian Journal of Weed Science.
 *
 * @example
 * weedControlEfficiency(250, 40) // 84
 */
export function weedControlEfficiency(weedDryMatterControl: number, weedDryMatterTreated: number): number {
  if (!(weedDryMatterControl > 0)) throw new StatsInputError("weed control efficiency requires control dry matter above zero");
  return (100 * (weedDryMatterControl - weedDryMatterTreated)) / weedDryMatterControl;
}
