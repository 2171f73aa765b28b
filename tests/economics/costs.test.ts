import { describe, expect, it } from "vitest";
import { costPerPercentControl, equipmentCostPerHectare, treatmentCost } from "@/lib/economics/costs";
import { partialBudget } from "@/lib/economics/partial-budget";
import { perHectareToPerAcre } from "@/lib/economics/units";

const hoeing = {
  code: "HH",
  name: "Hand hoeing",
  passes: 3,
  labourHoursPerHa: 85,
  materialCostPerHa: 0,
  equipmentCost: 12000,
  equipmentLifeYears: 8,
  equipmentHaPerYear: 25,
};

describe("weeding cost per treatment (worked by hand)", () => {
  it("adds labour, materials and equipment spread over its life", () => {
    // labour 85 h/ha × $18/h = $1 530/ha
    // equipment $12 000 ÷ (8 years × 25 ha a year) = $12 000 ÷ 200 ha = $60/ha
    // total $1 530 + $0 + $60 = $1 590/ha; per acre $1 590 × 0.40468564224 = $643.4501711616
    const cost = treatmentCost(hoeing, 18);
    expect(cost.labourCostPerHa).toBe(1530);
    expect(cost.equipmentCostPerHa).toBe(60);
    expect(cost.totalPerHa).toBe(1590);
    expect(cost.missing).toEqual([]);
    expect(perHectareToPerAcre(cost.totalPerHa)).toBeCloseTo(643.4501711616, 9);
    expect(cost.passes).toBe(3);
  });

  it("counts blanks as zero but names them, so an incomplete total is not taken as complete", () => {
    // labour unknown → 0; materials $720; equipment cost given without a life → unknown
    const cost = treatmentCost({ ...hoeing, labourHoursPerHa: null, materialCostPerHa: 720, equipmentLifeYears: null }, 18);
    expect(cost.totalPerHa).toBe(720);
    expect(cost.missing).toEqual(["labour", "equipment"]);
  });

  it("spreads equipment only when life and yearly area are known", () => {
    expect(equipmentCostPerHectare(null, 5, 10)).toBeNull();
    expect(equipmentCostPerHectare(0, null, null)).toBe(0);
    // $30 000 ÷ (5 × 40 ha) = $150/ha
    expect(equipmentCostPerHectare(30000, 5, 40)).toBe(150);
  });

  it("cost per percent of weed control", () => {
    // $1 590/ha ÷ 80% control = $19.875 per percentage point
    expect(costPerPercentControl(1590, 80)).toBe(19.875);
    expect(costPerPercentControl(1590, -5)).toBeNull();
    expect(costPerPercentControl(1590, null)).toBeNull();
  });
});

describe("partial budget against the weedy check (worked by hand)", () => {
  it("values the extra yield at the reader's price and subtracts the extra cost", () => {
    // extra yield 30 − 18 = 12 t/ha = 12 000 kg × $0.40 = $4 800/ha
    // extra cost $1 590 − $0 = $1 590/ha; net change $4 800 − $1 590 = $3 210/ha
    // range of the extra yield 9 to 15 t/ha → $3 600 − $1 590 = $2 010 to $6 000 − $1 590 = $4 410
    const budget = partialBudget({
      yieldTonnesPerHa: 30,
      checkYieldTonnesPerHa: 18,
      yieldDifferenceRange: { low: 9, high: 15 },
      costPerHa: 1590,
      checkCostPerHa: 0,
      pricePerKg: 0.4,
    });
    expect(budget.yieldDifferenceTonnesPerHa).toBe(12);
    expect(budget.addedReturnsPerHa).toBeCloseTo(4800, 9);
    expect(budget.addedCostsPerHa).toBe(1590);
    expect(budget.netChangePerHa).toBeCloseTo(3210, 9);
    expect(budget.netChangeRange!.low).toBeCloseTo(2010, 9);
    expect(budget.netChangeRange!.high).toBeCloseTo(4410, 9);
  });

  it("can be a loss, and has no range without one for the yield", () => {
    // extra yield 0.5 t/ha × 1000 × $0.90 = $450; extra cost $950 − $0; net −$500
    const budget = partialBudget({ yieldTonnesPerHa: 20.5, checkYieldTonnesPerHa: 20, yieldDifferenceRange: null, costPerHa: 950, checkCostPerHa: 0, pricePerKg: 0.9 });
    expect(budget.netChangePerHa).toBeCloseTo(-500, 9);
    expect(budget.netChangeRange).toBeNull();
  });
});
