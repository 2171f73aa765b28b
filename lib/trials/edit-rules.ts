import type { TrialStatus } from "./vocabulary";

/**
 * What may change in a trial, and why not. Pure, so pages can grey out what the API would
 * refuse, and the refusal reads the same everywhere.
 *
 * - details: title, objective, crop, season, site, planting date (crop, season and planting
 *   date are pinned once observations exist: they say what the recorded values mean)
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

/** Details that say what recorded values mean: days after planting count from the planting date. */
export const pinnedDetails = ["crop", "season", "plantingDate"] as const;
export type PinnedDetail = (typeof pinnedDetails)[number];

const pinnedDetailNames: Record<PinnedDetail, string> = { crop: "crop", season: "season", plantingDate: "planting date" };

/** Why these changed details are refused, or null; title, objective and (in draft) site stay open. */
export function pinnedDetailsRefusal(changed: readonly PinnedDetail[], hasObservations: boolean): string | null {
  if (!hasObservations || changed.length === 0) return null;
  const names = changed.map((detail) => pinnedDetailNames[detail]);
  return `Observations have been recorded in this trial, and its crop, season and planting date say what they mean; the ${names.join(" and ")} can no longer change.`;
}

export const pinnedDetailsNote = "Observations have been recorded: the crop, season and planting date can no longer change.";
