import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { plotValues, type PlotValue } from "@/lib/observations/plot-values";
import type { Assessment, Trial } from "@/models";
import { currentRawValues } from "./observations";

export interface AssessmentDataStatus {
  id: string;
  name: string;
  variable: string;
  unit: string;
  plannedDate: string | null;
  quadratsPerPlot: number;
  values: number;
  plotsWithValues: number;
  latestVersion: number | null;
  updatedAt: Date | null;
}

export async function dataStatusOf(trialId: string): Promise<AssessmentDataStatus[]> {
  return db().query<AssessmentDataStatus>(
    `SELECT a.id, a.name, a.variable, a.unit, a.planned_date AS "plannedDate", a.quadrats_per_plot AS "quadratsPerPlot",
            current.values, current."plotsWithValues",
            (SELECT max(v.number) FROM dataset_versions v WHERE v.assessment_id = a.id) AS "latestVersion",
            (SELECT max(v.created_at) FROM dataset_versions v WHERE v.assessment_id = a.id) AS "updatedAt"
       FROM assessments a
       CROSS JOIN LATERAL (
         SELECT COALESCE(sum(cardinality(v.quadrats)), 0)::int AS values, count(v.plot_id)::int AS "plotsWithValues"
           FROM observation_sets s JOIN observation_values v ON v.version_id = s.version_id AND v.plot_id = s.plot_id
          WHERE s.assessment_id = a.id AND s.replaced_in_version_id IS NULL
       ) current
      WHERE a.trial_id = :trialId ORDER BY a.position`,
    { replacements: { trialId }, type: QueryTypes.SELECT },
  );
}

export interface PlotValueRow extends PlotValue {
  block: number;
  treatmentCode: string;
  treatmentName: string;
}

/** Current plot values of one assessment, each with its plot's block and treatment. */
export async function plotValuesOf(trial: Trial, assessment: Assessment | { id: string; variable: Assessment["variable"]; unit: string }): Promise<PlotValueRow[]> {
  const [raw, plots] = await Promise.all([
    currentRawValues(assessment.id),
    db().query<{ number: number; block: number; treatmentCode: string; treatmentName: string }>(
      `SELECT p.number, p.block, t.code AS "treatmentCode", t.name AS "treatmentName"
         FROM plots p JOIN treatments t ON t.id = p.treatment_id WHERE p.trial_id = :trialId`,
      { replacements: { trialId: trial.id }, type: QueryTypes.SELECT },
    ),
  ]);
  const byNumber = new Map(plots.map((plot) => [plot.number, plot]));
  return plotValues(raw, {
    variable: assessment.variable,
    unit: assessment.unit,
    quadratAreaM2: trial.quadratAreaM2,
    harvestAreaM2: trial.harvestAreaM2,
    plotAreaM2: trial.plotLengthM * trial.plotWidthM,
  }).map((value) => {
    const plot = byNumber.get(value.plotNumber)!;
    return { ...value, block: plot.block, treatmentCode: plot.treatmentCode, treatmentName: plot.treatmentName };
  });
}
