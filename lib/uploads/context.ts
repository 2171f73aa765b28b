import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { notFound } from "@/lib/errors";
import type { IngestContext } from "@/lib/ingest/types";
import { Assessment } from "@/models";

/** What a data file for this assessment is checked against: its plots, quadrats, unit and range. */
export async function ingestContextFor(trialId: string, assessmentId: string): Promise<IngestContext> {
  const sequelize = db();
  const assessment = await Assessment.findOne({ where: { id: assessmentId, trialId } });
  if (!assessment) throw notFound("assessment");
  const plots = await sequelize.query<{ number: number; treatmentCode: string; id: string }>(
    `SELECT p.number, t.code AS "treatmentCode", p.id FROM plots p JOIN treatments t ON t.id = p.treatment_id
      WHERE p.trial_id = :trialId ORDER BY p.number`,
    { replacements: { trialId }, type: QueryTypes.SELECT },
  );
  return {
    plots,
    quadratsPerPlot: assessment.quadratsPerPlot,
    unit: assessment.unit,
    plausibleMin: assessment.plausibleMin,
    plausibleMax: assessment.plausibleMax,
  };
}

/** Refuses an assessment that is not this trial's, without reading its plots. */
export async function assertAssessmentOf(trialId: string, assessmentId: string): Promise<void> {
  const found = await db().query("SELECT 1 FROM assessments WHERE id = :assessmentId AND trial_id = :trialId", {
    replacements: { trialId, assessmentId },
    type: QueryTypes.SELECT,
  });
  if (found.length === 0) throw notFound("assessment");
}
