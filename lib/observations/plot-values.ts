import { perSquareMetreToPerSquareFoot } from "@/lib/stats/measures/per-square-metre-to-per-square-foot";
import { plotYieldPerArea } from "@/lib/stats/measures/plot-yield-per-area";
import { quadratDensity } from "@/lib/stats/measures/quadrat-density";
import type { AssessmentVariable } from "@/models/Assessment";

export interface RawValue {
  plotNumber: number;
  quadrat: number;
  species: string;
  value: number;
}

export interface PlotValue {
  plotNumber: number;
  quadrats: number;
  /** Mean of the quadrat totals, in the unit recorded. */
  rawMean: number;
  /** The value analysed, in `unit`. */
  value: number;
  unit: string;
  /** US customary equivalent for display, where one is usual. */
  customary?: { value: number; unit: string };
}

export interface PlotValueSettings {
  variable: AssessmentVariable;
  unit: string;
  quadratAreaM2: number;
  harvestAreaM2: number;
  plotAreaM2: number;
}

const perQuadrat = (unit: string) => /quadrat/i.test(unit);

/**
 * From raw quadrat values to one value per plot, the unit a weed scientist analyses:
 * species are summed within a quadrat, quadrats averaged within a plot, then counts and
 * weights per quadrat become per m², yield per plot becomes t/ha, labour per plot h/ha.
 */
export function plotValues(raw: RawValue[], settings: PlotValueSettings): PlotValue[] {
  const quadratTotals = new Map<number, Map<number, number>>();
  for (const entry of raw) {
    if (!quadratTotals.has(entry.plotNumber)) quadratTotals.set(entry.plotNumber, new Map());
    const plot = quadratTotals.get(entry.plotNumber)!;
    plot.set(entry.quadrat, (plot.get(entry.quadrat) ?? 0) + entry.value);
  }
  return [...quadratTotals.entries()]
    .sort(([a], [b]) => a - b)
    .map(([plotNumber, quadrats]) => {
      const totals = [...quadrats.values()];
      const rawMean = quadratDensity(totals, 1);
      const base = { plotNumber, quadrats: totals.length, rawMean };
      if ((settings.variable === "weed-density" || settings.variable === "weed-biomass") && perQuadrat(settings.unit)) {
        const perSquareMetre = quadratDensity(totals, settings.quadratAreaM2);
        const isCount = settings.variable === "weed-density";
        return {
          ...base,
          value: perSquareMetre,
          unit: isCount ? "plants/m²" : "g/m²",
          customary: isCount ? { value: perSquareMetreToPerSquareFoot(perSquareMetre), unit: "plants/ft²" } : undefined,
        };
      }
      if (settings.variable === "crop-yield" && /^kg/i.test(settings.unit)) {
        const { tonnesPerHectare, poundsPerAcre } = plotYieldPerArea(rawMean, settings.harvestAreaM2);
        return { ...base, value: tonnesPerHectare, unit: "t/ha", customary: { value: poundsPerAcre, unit: "lb/acre" } };
      }
      if (settings.variable === "labour-time" && /^h/i.test(settings.unit) && /plot/i.test(settings.unit)) {
        return { ...base, value: (rawMean / settings.plotAreaM2) * 10_000, unit: "h/ha" };
      }
      return { ...base, value: rawMean, unit: settings.unit };
    });
}
