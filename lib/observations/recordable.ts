import { AppError } from "@/lib/errors";
import type { Trial } from "@/models";

/** Data are recorded on active trials, and with a reason on locked ones; never on drafts or published trials. */
export function assertRecordable(trial: Trial): void {
  if (trial.status === "draft") throw new AppError("CONFLICT", "Activate the trial before recording data: its plan may still change.");
  if (trial.status === "published") throw new AppError("CONFLICT", "This trial is published; its data can no longer change.");
}
