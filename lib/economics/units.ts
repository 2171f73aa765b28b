import { unitConstants } from "@/lib/stats/measures/unit-constants";
import { perSquareMetreToPerSquareFoot } from "@/lib/stats/measures/per-square-metre-to-per-square-foot";

/**
 * Metric ↔ US customary conversions for what growers read: areas, amounts per area, money
 * and hours per area, crop prices. Every factor derives from the exact definitions in
 * lib/stats/measures/unit-constants.ts (1 ft = 0.3048 m, 1 lb = 0.45359237 kg: the 1959
 * international yard and pound agreement; 1 acre = 43 560 ft² = 0.40468564224 ha; NIST SP 811
 * Appendix B), so nothing here is a rounded table value.
 */
export const unitSystems = ["metric", "us"] as const;
export type UnitSystem = (typeof unitSystems)[number];

const { hectaresPerAcre, kilogramsPerPound } = unitConstants;

export const hectaresToAcres = (hectares: number) => hectares / hectaresPerAcre;
export const acresToHectares = (acres: number) => acres * hectaresPerAcre;

/** Anything counted per hectare (money, hours, plants) → per acre: an acre is 0.40468564224 ha. */
export const perHectareToPerAcre = (perHectare: number) => perHectare * hectaresPerAcre;
export const perAcreToPerHectare = (perAcre: number) => perAcre / hectaresPerAcre;

/** kg/ha → lb/acre: × 0.40468564224 / 0.45359237 ≈ 0.892179. */
export const kilogramsPerHectareToPoundsPerAcre = (kgPerHa: number) => (kgPerHa * hectaresPerAcre) / kilogramsPerPound;
export const poundsPerAcreToKilogramsPerHectare = (lbPerAcre: number) => (lbPerAcre * kilogramsPerPound) / hectaresPerAcre;
export const tonnesPerHectareToPoundsPerAcre = (tPerHa: number) => kilogramsPerHectareToPoundsPerAcre(tPerHa * 1000);

/** Weed biomass g/m² → lb/acre (1 g/m² = 10 kg/ha). */
export const gramsPerSquareMetreToPoundsPerAcre = (gPerM2: number) => kilogramsPerHectareToPoundsPerAcre(gPerM2 * 10);

/** plants/m² → plants/ft² (the engine's own conversion). */
export const plantsPerSquareMetreToPerSquareFoot = perSquareMetreToPerSquareFoot;

/** Price per kg ↔ price per lb: a pound is 0.45359237 kg, so it costs that share of a kilogram. */
export const pricePerKilogramToPerPound = (perKg: number) => perKg * kilogramsPerPound;
export const pricePerPoundToPerKilogram = (perLb: number) => perLb / kilogramsPerPound;

/** A per-hectare amount in the reader's system. */
export function areaAmount(perHectare: number, system: UnitSystem): number {
  return system === "metric" ? perHectare : perHectareToPerAcre(perHectare);
}

export const areaUnit = (system: UnitSystem) => (system === "metric" ? "hectare" : "acre");
export const areaUnitShort = (system: UnitSystem) => (system === "metric" ? "ha" : "acre");

/** A measured value (in the unit the app analyses) in the reader's system. */
export function measureIn(value: number, unit: string, system: UnitSystem): { value: number; unit: string } {
  if (system === "metric") return { value, unit };
  switch (unit) {
    case "plants/m²":
      return { value: plantsPerSquareMetreToPerSquareFoot(value), unit: "plants/ft²" };
    case "g/m²":
      return { value: gramsPerSquareMetreToPoundsPerAcre(value), unit: "lb/acre" };
    case "t/ha":
      return { value: tonnesPerHectareToPoundsPerAcre(value), unit: "lb/acre" };
    case "kg/ha":
      return { value: kilogramsPerHectareToPoundsPerAcre(value), unit: "lb/acre" };
    case "h/ha":
      return { value: perHectareToPerAcre(value), unit: "h/acre" };
    default:
      return { value, unit };
  }
}
