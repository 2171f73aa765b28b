import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { plotValuesOf } from "@/lib/data/assessment-data";
import { Assessment, type Trial } from "@/models";
import { toSafeCsv } from "./safe-csv";

/** Tidy raw observations: one row per recorded value, as recorded, with the version it came in. */
export async function rawValuesCsv(trial: Trial, assessmentId?: string): Promise<string> {
  const rows = await db().query<Record<string, string | number>>(
    `SELECT a.name AS assessment, p.number AS plot, p.block, t.code AS treatment_code, t.name AS treatment,
            o.quadrat, o.species, o.value, a.unit, v.number AS version
       FROM current_observations o
       JOIN assessments a ON a.id = o.assessment_id
       JOIN plots p ON p.id = o.plot_id
       JOIN treatments t ON t.id = p.treatment_id
       JOIN dataset_versions v ON v.id = o.added_in_version_id
      WHERE a.trial_id = :trialId ${assessmentId ? "AND a.id = :assessmentId" : ""}
      ORDER BY a.position, p.number, o.quadrat, o.species`,
    { replacements: { trialId: trial.id, assessmentId: assessmentId ?? null }, type: QueryTypes.SELECT },
  );
  const header = ["trial", "assessment", "plot", "block", "treatment_code", "treatment", "quadrat", "species", "value", "unit", "version"];
  return toSafeCsv(header, rows.map((row) => [trial.title, ...header.slice(1).map((key) => row[key] ?? "")]));
}

/** Tidy plot values: one row per plot and assessment, in the unit analysed. */
export async function plotValuesCsv(trial: Trial, assessmentId?: string): Promise<string> {
  const assessments = await Assessment.findAll({ where: assessmentId ? { trialId: trial.id, id: assessmentId } : { trialId: trial.id }, order: [["position", "ASC"]] });
  const rows: (string | number)[][] = [];
  for (const assessment of assessments) {
    for (const value of await plotValuesOf(trial, assessment)) {
      rows.push([trial.title, assessment.name, value.plotNumber, value.block, value.treatmentCode, value.treatmentName, value.quadrats, value.rawMean, assessment.unit, value.value, value.unit]);
    }
  }
  return toSafeCsv(["trial", "assessment", "plot", "block", "treatment_code", "treatment", "quadrats", "mean_recorded", "recorded_unit", "value", "unit"], rows);
}
