import type { TrialStatus } from "./vocabulary";

/** What a plan needs before it goes to the field. */
export interface PlanFacts {
  treatments: number;
  hasWeedyCheck: boolean;
  plots: number;
  assessments: number;
}

export interface Readiness {
  /** Problems that stop activation. */
  missing: string[];
  /** Strong advice that does not stop activation. */
  warnings: string[];
}

export function activationReadiness(facts: PlanFacts): Readiness {
  const missing: string[] = [];
  const warnings: string[] = [];
  if (facts.treatments < 2) missing.push("Add at least two treatments.");
  if (facts.plots === 0) missing.push("Randomize the plot layout.");
  if (facts.assessments < 1) missing.push("Plan at least one assessment.");
  if (!facts.hasWeedyCheck) warnings.push("There is no weedy check. Without an untreated check, percent control cannot be worked out; adding one is strongly recommended.");
  return { missing, warnings };
}

/**
 * The status path: draft → active (the owner, when the plan is complete) → locked (reviewer
 * sign-off) → published. Only the first step is taken from the trial page; the others belong to
 * review and publishing.
 */
export const statusSteps: Record<TrialStatus, TrialStatus | null> = {
  draft: "active",
  active: "locked",
  locked: "published",
  published: null,
};

export function statusChangeRefusal(from: TrialStatus, to: TrialStatus, readiness: Readiness): string | null {
  if (from === to) return `The trial is already ${to}.`;
  if (statusSteps[from] !== to) return `A trial cannot go from ${from} to ${to}.`;
  if (to === "locked") return "A trial is locked by the reviewer's sign-off, not from here.";
  if (to === "published") return "A locked trial is published from its results summary, not from here.";
  if (readiness.missing.length > 0) return `The plan is not complete: ${readiness.missing.join(" ")}`;
  return null;
}
