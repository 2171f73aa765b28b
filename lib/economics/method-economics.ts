import type { SummaryNumbers } from "@/lib/summaries/numbers";
import type { Range } from "@/lib/summaries/types";
import { costPerPercentControl, treatmentCost, type TreatmentCost } from "./costs";
import { partialBudget, type PartialBudget } from "./partial-budget";

export interface Assumptions {
  labourRatePerHour: number;
  cropPricePerKg: number;
}

export interface MethodEconomics {
  code: string;
  name: string;
  category: string;
  checkType: string | null;
  cost: TreatmentCost;
  percentControl: number | null;
  percentRange: Range | null;
  weedsLeft: number | null;
  costPerPercentControl: number | null;
  yieldTonnesPerHa: number | null;
  budget: PartialBudget | null;
}

/**
 * Every treatment's cost, weed control and partial budget against the weedy check, under the
 * reader's labour rate and crop price. Everything per hectare; the page converts for display.
 */
export function methodEconomics(numbers: SummaryNumbers, assumptions: Assumptions): MethodEconomics[] {
  const { weeds, yield: yields } = numbers.input;
  const weedyCode = numbers.costInputs.find((input) => input.checkType === "weedy")?.code ?? null;
  const costs = new Map(numbers.costInputs.map((input) => [input.code, treatmentCost(input, assumptions.labourRatePerHour)]));
  const checkCost = weedyCode ? costs.get(weedyCode)!.totalPerHa : 0;
  const yieldOf = (code: string): number | null => {
    if (!yields) return null;
    if (code === yields.reference.code) return yields.reference.mean;
    return yields.results.find((result) => result.code === code)?.mean ?? null;
  };
  return numbers.costInputs.map((input) => {
    const cost = costs.get(input.code)!;
    const weed = weeds?.results.find((result) => result.code === input.code);
    const percent = weed ? weed.percentControl : null;
    const yieldTonnes = yieldOf(input.code);
    const againstCheck = yields?.againstWeedyCheck.find((line) => line.code === input.code);
    const budget =
      yields && yields.weedyCheckMean !== null && againstCheck && yieldTonnes !== null
        ? partialBudget({
            yieldTonnesPerHa: yields.weedyCheckMean + againstCheck.difference,
            checkYieldTonnesPerHa: yields.weedyCheckMean,
            yieldDifferenceRange: againstCheck.differenceRange,
            costPerHa: cost.totalPerHa,
            checkCostPerHa: checkCost,
            pricePerKg: assumptions.cropPricePerKg,
          })
        : null;
    return {
      code: input.code,
      name: input.name,
      category: input.category,
      checkType: input.checkType,
      cost,
      percentControl: percent,
      percentRange: weed?.percentRange ?? null,
      weedsLeft: weed ? weed.mean : input.code === weeds?.checkCode ? weeds.checkMean : null,
      costPerPercentControl: costPerPercentControl(cost.totalPerHa, percent),
      yieldTonnesPerHa: yieldTonnes,
      budget,
    };
  });
}
