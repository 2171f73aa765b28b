import type { MethodCategory } from "@/models/Treatment";
import { cautionsFor, governingRule } from "./cautions";

/**
 * Cautions for a whole trial (a map or data sheet covering several treatments): each caution
 * once, in category order, with the governing rule once at the end.
 */
export function cautionsForCategories(categories: readonly MethodCategory[]): string[] {
  const lines = new Set<string>();
  for (const category of categories) for (const caution of cautionsFor(category)) if (caution !== governingRule) lines.add(caution);
  return lines.size === 0 ? [] : [...lines, governingRule];
}
