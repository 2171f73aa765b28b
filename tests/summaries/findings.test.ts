import { describe, expect, it } from "vitest";
import { analyzeTrial } from "@/lib/stats";
import { differenceFrom, weedFinding, yieldFinding } from "@/lib/summaries/findings";

// Hand-made RCBD: weedy check (WC), hand hoeing (HH), straw mulch (SM), 4 blocks.
const values: Record<string, number[]> = { WC: [100, 120, 110, 130], HH: [10, 14, 12, 8], SM: [90, 120, 100, 110] };
const rows = Object.entries(values).flatMap(([treatment, list]) => list.map((response, index) => ({ treatment, block: String(index + 1), response })));
const analysis = analyzeTrial(rows, { design: "rcbd", response: "response", treatment: "treatment", block: "block", control: "WC", reference: "HH", margin: 5 });

// R: qt(0.975, 6) = 2.446912 (residual df of an RCBD with 3 treatments and 4 blocks: (3−1)(4−1) = 6).
const T_975_6 = 2.446912;

describe("findings from the engine's result", () => {
  it("the difference range is d ± t(0.975, residual df) × SE, and 'detected' means it excludes zero", () => {
    const comparison = analysis.comparisons!.find((line) => [line.a, line.b].sort().join() === "HH,WC")!;
    const found = differenceFrom(analysis, "HH", "WC", 0.95)!;
    // HH − WC = 11 − 115 = −104 plants
    expect(found.difference).toBeCloseTo(-104, 9);
    expect(found.range!.high - found.difference).toBeCloseTo(T_975_6 * comparison.se, 5);
    expect(found.detected).toBe(true);
    expect(found.detected).toBe(comparison.pLsd < 0.05);
    // The reverse comparison is the mirror image.
    expect(differenceFrom(analysis, "WC", "HH", 0.95)!.range!.low).toBeCloseTo(-found.range!.high, 9);
  });

  it("a small difference with overlapping plots is not detected, consistent with the LSD p", () => {
    const found = differenceFrom(analysis, "SM", "WC", 0.95)!;
    const comparison = analysis.comparisons!.find((line) => [line.a, line.b].sort().join() === "SM,WC")!;
    expect(found.difference).toBeCloseTo(-10, 9);
    expect(found.detected).toBe(comparison.pLsd < 0.05);
    expect(found.range!.low < 0 && found.range!.high > 0).toBe(!found.detected);
  });

  it("percent control and its range come from the difference against the check mean", () => {
    const finding = weedFinding(analysis, { assessmentName: "Weeds", measure: "weed-density", unit: "plants/m²", daysAfterPlanting: 28, checkCode: "WC", confidence: 0.95 })!;
    expect(finding.checkMean).toBeCloseTo(115, 9);
    const hoeing = finding.results.find((result) => result.code === "HH")!;
    // 100 × (1 − 11/115) = 90.4347826…%
    expect(hoeing.percentControl).toBeCloseTo(90.43478260869566, 9);
    const range = differenceFrom(analysis, "HH", "WC", 0.95)!.range!;
    expect(hoeing.percentRange!.low).toBeCloseTo((-100 * range.high) / 115, 9);
    expect(hoeing.percentRange!.high).toBeCloseTo((-100 * range.low) / 115, 9);
    expect(hoeing.percentRange!.low).toBeLessThan(hoeing.percentControl);
    expect(hoeing.percentRange!.high).toBeGreaterThan(hoeing.percentControl);
  });

  it("yield findings carry the engine's equivalence verdict and the margin in t/ha", () => {
    const finding = yieldFinding(analysis, { assessmentName: "Yield", reference: { code: "HH", kind: "hand" }, marginShare: 0.1, weedyCheckCode: "WC", confidence: 0.95 })!;
    expect(finding.margin).toBeCloseTo(1.1, 9);
    for (const result of finding.results) {
      const engine = analysis.equivalence!.results.find((line) => line.treatment === result.code)!;
      expect(result.equivalent).toBe(engine.equivalent);
    }
    expect(finding.againstWeedyCheck.map((line) => line.code).sort()).toEqual(["HH", "SM"]);
  });
});
