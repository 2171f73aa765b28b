import "server-only";
import { AppError } from "@/lib/errors";
import type { Trial } from "@/models";
import { editRefusal, randomizeRefusal, type EditPart } from "./edit-rules";
import { hasObservations } from "./observations";

/** Throws a 409 with the plain reason when the trial's state does not allow this change. */
export async function assertEditable(trial: Trial, part: EditPart): Promise<void> {
  // Assessment-level observations are checked one by one where the list is saved.
  const observed = part === "structure" ? await hasObservations(trial.id) : false;
  const reason = editRefusal(part, { status: trial.status, hasObservations: observed });
  if (reason) throw new AppError("CONFLICT", reason);
}

export async function assertRandomizable(trial: Trial): Promise<void> {
  const reason = randomizeRefusal(trial.status) ?? editRefusal("structure", { status: trial.status, hasObservations: await hasObservations(trial.id) });
  if (reason) throw new AppError("CONFLICT", reason);
}
