import type { TreatmentCostInput } from "@/lib/economics/costs";
import type { MethodCategory } from "@/lib/trials/vocabulary";
import type { SummaryInput } from "./types";

/**
 * The numbers a summary was generated from. Stored as JSON when a summary is published, so
 * the text growers read stays linked to the exact results behind it; also what the public
 * page's charts and cost calculator read, so they always match the text.
 */
export interface SummaryNumbers {
  version: 1;
  generatedAt: string;
  input: SummaryInput;
  costInputs: Array<TreatmentCostInput & { category: MethodCategory; checkType: string | null }>;
  defaults: { labourRatePerHour: number; cropPricePerKg: number };
}
