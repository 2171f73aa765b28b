import { describe, expect, it } from "vitest";
import { plotValues, type PlotValueSettings } from "@/lib/observations/plot-values";
import { perSquareMetreToPerSquareFoot } from "@/lib/stats/measures/per-square-metre-to-per-square-foot";

const base: PlotValueSettings = { variable: "weed-density", unit: "plants per quadrat", quadratAreaM2: 0.25, harvestAreaM2: 4.5, plotAreaM2: 9 };

describe("plot values from raw quadrat values", () => {
  it("sums species within a quadrat and averages quadrats, then divides by the quadrat area", () => {
    const values = plotValues(
      [
        { plotNumber: 101, quadrat: 1, species: "pigweed", value: 6 },
        { plotNumber: 101, quadrat: 1, species: "purslane", value: 6 },
        { plotNumber: 101, quadrat: 2, species: "pigweed", value: 8 },
        { plotNumber: 101, quadrat: 3, species: "", value: 10 },
        { plotNumber: 101, quadrat: 4, species: "", value: 14 },
      ],
      base,
    );
    // (12 + 8 + 10 + 14) / 4 = 11 plants per 0.25 m² quadrat = 44 plants/m² (arithmetic by hand).
    expect(values).toHaveLength(1);
    expect(values[0].rawMean).toBe(11);
    expect(values[0].value).toBe(44);
    expect(values[0].unit).toBe("plants/m²");
    // 1 ft² = 0.09290304 m² exactly (NIST SP 811): 44 × 0.09290304 = 4.08773376 plants/ft².
    expect(values[0].customary?.value).toBeCloseTo(4.08773376, 12);
    // The statistics engine's own conversion, not a second copy of the constant.
    expect(values[0].customary).toEqual({ value: perSquareMetreToPerSquareFoot(44), unit: "plants/ft²" });
  });

  it("uses the quadrats present when some were lost", () => {
    const [value] = plotValues([{ plotNumber: 201, quadrat: 1, species: "", value: 3 }, { plotNumber: 201, quadrat: 3, species: "", value: 5 }], base);
    expect(value.quadrats).toBe(2);
    expect(value.value).toBe(16);
  });

  it("turns yield per harvested plot area into t/ha and lb/acre", () => {
    const [value] = plotValues([{ plotNumber: 101, quadrat: 1, species: "", value: 13.5 }], { ...base, variable: "crop-yield", unit: "kg per plot" });
    // 13.5 kg / 4.5 m² = 3 kg/m² = 30 t/ha; 3 kg/m² × 4046.8564224 m²/acre / 0.45359237 kg/lb = 26765.6... lb/acre.
    expect(value.value).toBeCloseTo(30, 12);
    expect(value.customary?.value).toBeCloseTo((3 * 4046.8564224) / 0.45359237, 9);
  });

  it("scales labour per plot to hours per hectare", () => {
    const [value] = plotValues([{ plotNumber: 101, quadrat: 1, species: "", value: 0.45 }], { ...base, variable: "labour-time", unit: "h per plot" });
    expect(value.value).toBeCloseTo(500, 10);
    expect(value.unit).toBe("h/ha");
  });

  it("leaves ratings as recorded", () => {
    const [value] = plotValues([{ plotNumber: 101, quadrat: 1, species: "", value: 80 }, { plotNumber: 101, quadrat: 2, species: "", value: 90 }], { ...base, variable: "weed-control-rating", unit: "%" });
    expect(value.value).toBe(85);
    expect(value.unit).toBe("%");
  });
});
