import { cautionsForCategories } from "@/lib/safety/trial-cautions";
import type { MethodCategory } from "@/models/Treatment";

/** Every caution that applies to any of the trial's treatments, once each. */
export function trialCautions(treatments: { category: MethodCategory }[]): string[] {
  return cautionsForCategories(treatments.map((treatment) => treatment.category));
}
