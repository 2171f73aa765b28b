import type { TrialStatus } from "./vocabulary";

/**
 * What may change in a trial, and why not. Pure, so pages can grey out what the API would
 * refuse, and the refusal reads the same everywhere.
 *
 * - details: title, objective, crop, season, site, planting date
 * - structure: treatments, design, plot size, blocks, the plot layout
 * - assessment: the assessment list (an assessment with observations is pinned)
 * - team: technicians and reviewers
 */
export type EditPart = "details" | "structure" | "assessment" | "team";

export interface EditSituation {
  status: TrialStatus;
  /** Whether observations exist for what is being changed (the trial, or one assessment). */
  hasObservations: boolean;
}

const readOnly: Partial<Record<TrialStatus, string>> = {
  locked: "This trial is locked after review and is read-only.",
  published: "This trial is published and is read-only.",
};

export function editRefusal(part: EditPart, situation: EditSituation): string | null {
  const frozen = readOnly[situation.status];
  if (frozen) return frozen;
  // Active: the layout is staked out in the field and data are collected against it.
  if (part === "structure" && situation.status === "active") {
    return "This trial is active: its treatments, design and plots are in the field and can no longer change.";
  }
  if (part === "structure" && situation.hasObservations) {
    return "Observations have been recorded against these plots; the treatments, design and plots can no longer change.";
  }
  if (part === "assessment" && situation.hasObservations) {
    return "Observations have been recorded for this assessment; it can no longer be edited or deleted.";
  }
  return null;
}

export function randomizeRefusal(status: TrialStatus): string | null {
  if (status === "draft") return null;
  return readOnly[status] ?? "Only a draft trial can be re-randomized; this one is already in the field.";
}
