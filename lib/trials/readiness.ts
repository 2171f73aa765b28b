import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import type { Trial } from "@/models";
import type { TrialStatus } from "@/models/Trial";
import { activationReadiness, statusChangeRefusal, type Readiness } from "./status";

export async function readinessOf(trialId: string): Promise<Readiness> {
  // One round trip: the trial page asks this on every view.
  const [counts] = await db().query<{ treatments: number; weedyChecks: number; plots: number; assessments: number }>(
    `SELECT (SELECT count(*) FROM treatments WHERE trial_id = :trialId)::int AS treatments,
            (SELECT count(*) FROM treatments WHERE trial_id = :trialId AND check_type = 'weedy')::int AS "weedyChecks",
            (SELECT count(*) FROM plots WHERE trial_id = :trialId)::int AS plots,
            (SELECT count(*) FROM assessments WHERE trial_id = :trialId)::int AS assessments`,
    { type: QueryTypes.SELECT, replacements: { trialId } },
  );
  return activationReadiness({ treatments: counts.treatments, hasWeedyCheck: counts.weedyChecks > 0, plots: counts.plots, assessments: counts.assessments });
}

export async function changeStatus(trial: Trial, to: TrialStatus): Promise<{ status: TrialStatus; warnings: string[] }> {
  const readiness = await readinessOf(trial.id);
  const refusal = statusChangeRefusal(trial.status, to, readiness);
  if (refusal) throw new AppError("CONFLICT", refusal);
  await trial.update({ status: to });
  return { status: to, warnings: readiness.warnings };
}
