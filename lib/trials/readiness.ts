import "server-only";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import { Assessment, Plot, Treatment, type Trial } from "@/models";
import type { TrialStatus } from "@/models/Trial";
import { activationReadiness, statusChangeRefusal, type Readiness } from "./status";

export async function readinessOf(trialId: string): Promise<Readiness> {
  db();
  const [treatments, weedyChecks, plots, assessments] = await Promise.all([
    Treatment.count({ where: { trialId } }),
    Treatment.count({ where: { trialId, checkType: "weedy" } }),
    Plot.count({ where: { trialId } }),
    Assessment.count({ where: { trialId } }),
  ]);
  return activationReadiness({ treatments, hasWeedyCheck: weedyChecks > 0, plots, assessments });
}

export async function changeStatus(trial: Trial, to: TrialStatus): Promise<{ status: TrialStatus; warnings: string[] }> {
  const readiness = await readinessOf(trial.id);
  const refusal = statusChangeRefusal(trial.status, to, readiness);
  if (refusal) throw new AppError("CONFLICT", refusal);
  await trial.update({ status: to });
  return { status: to, warnings: readiness.warnings };
}
