import { describe, expect, it } from "vitest";
import { methodEconomics } from "@/lib/economics/method-economics";
import type { SummaryNumbers } from "@/lib/summaries/numbers";

const cost = (code: string, name: string, category: SummaryNumbers["costInputs"][number]["category"], checkType: string | null, labourHoursPerHa: number, materialCostPerHa: number) => ({
  code, name, category, checkType, passes: 1, labourHoursPerHa, materialCostPerHa, equipmentCost: null, equipmentLifeYears: null, equipmentHaPerYear: null,
});

// Hand-made numbers: weedy check WC yields 20 t/ha, straw mulch SM 26 t/ha (range of +2 to +10 over the check).
const numbers: SummaryNumbers = {
  version: 1,
  generatedAt: "2026-01-01T00:00:00.000Z",
  defaults: { labourRatePerHour: 18, cropPricePerKg: 0.4 },
  costInputs: [cost("WC", "Weedy check", "check", "weedy", 0, 0), cost("SM", "Straw mulch", "mulch", null, 42, 720)],
  input: {
    trial: { title: "t", crop: "Onion", season: "2025", siteName: "s", region: "r", plantingDate: null, replicates: 4 },
    sites: 1,
    confidence: 0.95,
    methods: [],
    weeds: {
      assessmentName: "Weeds", measure: "weed-density", unit: "plants/m²", daysAfterPlanting: 42, checkCode: "WC", checkMean: 100, reference: null,
      results: [{ code: "SM", mean: 30, percentControl: 70, percentRange: { low: 55, high: 85 }, detected: true, similarToReference: null }],
    },
    yield: {
      assessmentName: "Yield", unit: "t/ha", reference: { code: "WC", kind: "weed-free", mean: 20 }, marginShare: 0.1, margin: 2,
      results: [{ code: "SM", mean: 26, difference: 6, differenceRange: { low: 2, high: 10 }, detected: true, equivalent: null }],
      againstWeedyCheck: [{ code: "SM", difference: 6, differenceRange: { low: 2, high: 10 } }],
      weedyCheckMean: 20,
    },
    costs: [], labourRatePerHour: 18, currency: "$",
  },
};

describe("per-method economics under the reader's assumptions (worked by hand)", () => {
  it("straw mulch: cost, cost per percent control and partial budget", () => {
    const mulch = methodEconomics(numbers, { labourRatePerHour: 20, cropPricePerKg: 0.5 }).find((row) => row.code === "SM")!;
    // labour 42 h × $20 = $840; materials $720; total $1 560/ha
    expect(mulch.cost.totalPerHa).toBe(1560);
    // $1 560 ÷ 70% = $22.2857… per percentage point
    expect(mulch.costPerPercentControl).toBeCloseTo(1560 / 70, 12);
    // extra yield 6 t/ha × 1000 × $0.50 = $3 000; minus $1 560 = $1 440; range 2 t → −$560, 10 t → $3 440
    expect(mulch.budget!.netChangePerHa).toBeCloseTo(1440, 9);
    expect(mulch.budget!.netChangeRange!.low).toBeCloseTo(-560, 9);
    expect(mulch.budget!.netChangeRange!.high).toBeCloseTo(3440, 9);
    expect(mulch.weedsLeft).toBe(30);
  });

  it("the weedy check has no budget against itself and shows the check's weeds", () => {
    const check = methodEconomics(numbers, { labourRatePerHour: 18, cropPricePerKg: 0.4 }).find((row) => row.code === "WC")!;
    expect(check.budget).toBeNull();
    expect(check.weedsLeft).toBe(100);
  });
});
