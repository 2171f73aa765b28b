import "server-only";
import { db } from "@/lib/db/sequelize";
import { AppError } from "@/lib/errors";
import { findAssessment } from "@/lib/data/assessments";
import { findPlotByNumber } from "@/lib/data/plots";
import { assertRecordable } from "./recordable";
import type { SessionUser } from "@/lib/auth/session";
import type { PlotEntryInput } from "@/lib/validations/observations";
import type { Trial } from "@/models";
import { commitVersion, type CommittedVersion } from "./commit-version";

/** A technician's values for one plot, keyed in the field, as a version of their own. */
export async function savePlotEntry(user: SessionUser, trial: Trial, input: PlotEntryInput): Promise<CommittedVersion> {
  assertRecordable(trial);
  const [assessment, plot] = await Promise.all([findAssessment(trial.id, input.assessmentId), findPlotByNumber(trial.id, input.plotNumber)]);
  if (!assessment) throw new AppError("NOT_FOUND", "That assessment does not exist or is not visible to you.");
  if (!plot) throw new AppError("NOT_FOUND", `Plot ${input.plotNumber} is not in this trial.`);
  const tooHigh = input.values.find((entry) => entry.quadrat > assessment.quadratsPerPlot);
  if (tooHigh) {
    throw new AppError("INVALID_INPUT", `This assessment has ${assessment.quadratsPerPlot} quadrats per plot; there is no quadrat ${tooHigh.quadrat}.`);
  }
  const keys = new Set<string>();
  for (const entry of input.values) {
    const key = `${entry.quadrat}|${entry.species.toLowerCase()}`;
    if (keys.has(key)) throw new AppError("INVALID_INPUT", `Quadrat ${entry.quadrat}${entry.species ? ` (${entry.species})` : ""} is entered twice.`);
    keys.add(key);
  }
  return commitVersion(db(), {
    trialId: trial.id,
    assessmentId: assessment.id,
    userId: user.id,
    source: "manual",
    replacePlotNumbers: [plot.number],
    values: input.values.filter((entry) => entry.value !== null).map((entry) => ({ plotNumber: plot.number, quadrat: entry.quadrat, species: entry.species, value: entry.value! })),
    reason: input.reason,
  });
}
