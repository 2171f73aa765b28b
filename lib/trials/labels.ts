import type { AssessmentVariable, MethodCategory, TrialDesign, TrialStatus } from "./vocabulary";

/** Plain trade words for stored codes; safe to use in client components. */

export const designNames: Record<TrialDesign, string> = {
  rcbd: "Randomized complete block (RCBD)",
  crd: "Completely randomized (CRD)",
  latin: "Latin square",
};

export const categoryNames: Record<MethodCategory, string> = {
  check: "Check",
  hand: "Hand weeding",
  mulch: "Mulch",
  cultivation: "Cultivation",
  thermal: "Thermal (flame, steam)",
  robotic: "Robotic",
  chemical: "Herbicide",
  other: "Other",
};

export const variableNames: Record<AssessmentVariable, string> = {
  "weed-density": "Weed density",
  "weed-biomass": "Weed biomass",
  "crop-yield": "Crop yield",
  "crop-injury": "Crop injury rating",
  "weed-control-rating": "Weed control rating",
  "labour-time": "Labour time",
  custom: "Other (custom variable)",
};

export const defaultUnits: Record<AssessmentVariable, string> = {
  "weed-density": "plants per quadrat",
  "weed-biomass": "g per quadrat",
  "crop-yield": "kg per plot",
  "crop-injury": "% (0 = none, 100 = dead)",
  "weed-control-rating": "% control (0–100)",
  "labour-time": "h per plot",
  custom: "",
};

export const statusNames: Record<TrialStatus, string> = { draft: "Draft", active: "Active", locked: "Locked", published: "Published" };

export function blockWord(design: TrialDesign, count = 2): string {
  const word = design === "crd" ? "replicate" : design === "latin" ? "row" : "block";
  return count === 1 ? word : `${word}s`;
}

/** Residual degrees of freedom of a design, for the planner's 12-df check. */
export function residualDf(design: TrialDesign, treatments: number, blocks: number): number {
  if (design === "crd") return treatments * (blocks - 1);
  if (design === "latin") return (treatments - 1) * (treatments - 2);
  return (treatments - 1) * (blocks - 1);
}

export const wizardSteps = [
  { key: "basics", label: "Basics" },
  { key: "treatments", label: "Treatments" },
  { key: "design", label: "Design and plots" },
  { key: "assessments", label: "Assessments" },
  { key: "team", label: "Team" },
] as const;
export type WizardStep = (typeof wizardSteps)[number]["key"];
