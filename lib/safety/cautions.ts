import type { MethodCategory } from "@/models/Treatment";

/**
 * Safety cautions printed beside treatments on maps, data sheets and plans.
 *
 * They remind people of known hazards and of who decides: the product label, the equipment
 * maker and local rules. They are deliberately not application advice (no rates, timings or
 * products), which Hoebench does not give. Check, hand-weeding, mulch and other treatments
 * carry none, so the box does not cry wolf on every sheet.
 */
export const governingRule = "The product label and local regulations govern; Hoebench gives no application advice; follow licensed practice.";

const chemical = [
  "Read the product label before use and follow it; where the law makes the label binding, the label is the law.",
  "Wear the protective equipment the label states.",
  "Keep to the re-entry and pre-harvest intervals on the label before entering, scoring or harvesting treated plots.",
  "Store the product and dispose of it, its rinsate and empty containers as the label states.",
  "Only licensed or certified applicators may apply it where the law requires one.",
];

const thermal = [
  "Fire risk: dry crop residue, mulch and nearby materials can catch fire from the flame.",
  "Keep water or a fire extinguisher at hand while flaming.",
  "Handle fuel gas cylinders, hoses and fittings as the equipment maker instructs; check for leaks.",
  "Burners, shields and treated ground stay hot: risk of burns and heat injury.",
  "Check local burn restrictions and fire-danger warnings before flaming.",
];

const machinery = [
  "Keep guards and shields in place while the machine runs.",
  "Keep people and animals clear of the working area.",
  "Stop the machine and wait for moving parts to halt before clearing blockages or making adjustments.",
  "Moving tines, blades, wheels and batteries are hazards; follow the maker's instructions.",
];

const robotic = ["Know where the robot's emergency stop is, and charge and handle its batteries as the maker instructs."];

const byCategory: Record<MethodCategory, string[]> = {
  chemical: [...chemical, governingRule],
  thermal: [...thermal, governingRule],
  cultivation: [...machinery, governingRule],
  robotic: [...machinery, ...robotic, governingRule],
  check: [],
  hand: [],
  mulch: [],
  other: [],
};

export function cautionsFor(category: MethodCategory): string[] {
  return [...(byCategory[category] ?? [])];
}

/** A few words for a plot stake, where the full cautions do not fit: what to mind in that plot. */
const stakeWarnings: Partial<Record<MethodCategory, string>> = {
  chemical: "Treated plot: keep to the label's re-entry interval",
  thermal: "Flamed plot: fire and burn risk",
  cultivation: "Machinery: moving parts",
  robotic: "Weeding robot: moving parts",
};

export function stakeWarningFor(category: MethodCategory): string | null {
  return stakeWarnings[category] ?? null;
}
