/**
 * A partial budget of one weeding method against the weedy check, per hectare: only what
 * changes when a grower weeds this way instead of not weeding.
 *
 * added returns = (yield of the method − yield of the weedy check) × price
 * added costs   = weeding cost of the method − weeding cost of the weedy check
 * net change    = added returns − added costs
 *
 * Yields are in t/ha and prices per kg, so returns carry a factor of 1000 kg per tonne.
 * When the yield difference has a confidence range, the net change gets the matching range
 * (costs are taken as known; only the yield is uncertain).
 */
export interface PartialBudgetInput {
  yieldTonnesPerHa: number;
  checkYieldTonnesPerHa: number;
  /** Range of (method − check) yield in t/ha, when the analysis gave one. */
  yieldDifferenceRange: { low: number; high: number } | null;
  costPerHa: number;
  checkCostPerHa: number;
  pricePerKg: number;
}

export interface PartialBudget {
  yieldDifferenceTonnesPerHa: number;
  addedReturnsPerHa: number;
  addedCostsPerHa: number;
  netChangePerHa: number;
  netChangeRange: { low: number; high: number } | null;
}

const KG_PER_TONNE = 1000;

export function partialBudget(input: PartialBudgetInput): PartialBudget {
  const difference = input.yieldTonnesPerHa - input.checkYieldTonnesPerHa;
  const returns = (tonnes: number) => tonnes * KG_PER_TONNE * input.pricePerKg;
  const addedReturnsPerHa = returns(difference);
  const addedCostsPerHa = input.costPerHa - input.checkCostPerHa;
  const range = input.yieldDifferenceRange;
  return {
    yieldDifferenceTonnesPerHa: difference,
    addedReturnsPerHa,
    addedCostsPerHa,
    netChangePerHa: addedReturnsPerHa - addedCostsPerHa,
    netChangeRange: range ? { low: returns(range.low) - addedCostsPerHa, high: returns(range.high) - addedCostsPerHa } : null,
  };
}
