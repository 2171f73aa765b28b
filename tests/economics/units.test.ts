import { describe, expect, it } from "vitest";
import {
  acresToHectares,
  gramsPerSquareMetreToPoundsPerAcre,
  hectaresToAcres,
  kilogramsPerHectareToPoundsPerAcre,
  measureIn,
  perAcreToPerHectare,
  perHectareToPerAcre,
  plantsPerSquareMetreToPerSquareFoot,
  poundsPerAcreToKilogramsPerHectare,
  pricePerKilogramToPerPound,
  pricePerPoundToPerKilogram,
  tonnesPerHectareToPoundsPerAcre,
} from "@/lib/economics/units";

// Exact definitions: 1 ft = 0.3048 m and 1 lb = 0.45359237 kg (international yard and pound
// agreement, 1959); 1 acre = 43 560 ft² = 4046.8564224 m² = 0.40468564224 ha.
// Source: NIST Special Publication 811 (2008 ed.), Appendix B.8/B.9 (factors for units listed
// alphabetically and by kind: "square foot (ft²) = 9.290 304 E-02 m²" exact, "pound
// (avoirdupois) (lb) = 4.535 9237 E-01 kg" exact).
describe("unit conversions against the published definitions", () => {
  it("1 acre is 0.40468564224 ha exactly, and back", () => {
    expect(acresToHectares(1)).toBe(0.40468564224);
    expect(hectaresToAcres(0.40468564224)).toBe(1);
    // 1 ha = 2.471 054 acres (international acre), the value printed in conversion tables.
    expect(hectaresToAcres(1)).toBeCloseTo(2.471054, 6);
  });

  it("1 acre is 43 560 ft² built from the exact foot", () => {
    const squareMetresPerAcre = 43560 * 0.3048 ** 2;
    expect(acresToHectares(1) * 10000).toBeCloseTo(squareMetresPerAcre, 9);
  });

  it("plants per m² to per ft²: 1 ft² = 0.09290304 m² exactly", () => {
    expect(plantsPerSquareMetreToPerSquareFoot(100)).toBeCloseTo(9.290304, 12);
    expect(measureIn(100, "plants/m²", "us")).toEqual({ value: plantsPerSquareMetreToPerSquareFoot(100), unit: "plants/ft²" });
  });

  it("kg/ha to lb/acre is 0.892 179, lb/acre to kg/ha is 1.120 851 (conversion-table values)", () => {
    expect(kilogramsPerHectareToPoundsPerAcre(1)).toBeCloseTo(0.892179, 6);
    expect(poundsPerAcreToKilogramsPerHectare(1)).toBeCloseTo(1.120851, 6);
    expect(poundsPerAcreToKilogramsPerHectare(kilogramsPerHectareToPoundsPerAcre(1234.5))).toBeCloseTo(1234.5, 9);
  });

  it("t/ha and g/m² to lb/acre agree with kg/ha", () => {
    expect(tonnesPerHectareToPoundsPerAcre(1)).toBeCloseTo(892.179, 3);
    // 1 g/m² = 10 kg/ha = 8.92179 lb/acre
    expect(gramsPerSquareMetreToPoundsPerAcre(1)).toBeCloseTo(8.92179, 5);
  });

  it("money and hours per hectare to per acre", () => {
    // $1 000 per hectare × 0.40468564224 ha per acre = $404.68564224 per acre
    expect(perHectareToPerAcre(1000)).toBeCloseTo(404.68564224, 9);
    expect(perAcreToPerHectare(404.68564224)).toBeCloseTo(1000, 9);
    expect(measureIn(85, "h/ha", "us").value).toBeCloseTo(34.39828, 5);
  });

  it("crop prices per kg to per lb: a pound is 0.45359237 kg", () => {
    expect(pricePerKilogramToPerPound(1)).toBe(0.45359237);
    expect(pricePerPoundToPerKilogram(0.45359237)).toBe(1);
  });

  it("metric values pass through unchanged", () => {
    expect(measureIn(2.5, "t/ha", "metric")).toEqual({ value: 2.5, unit: "t/ha" });
  });
});
