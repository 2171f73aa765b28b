import "server-only";
import { z } from "zod";
import { db } from "@/lib/db/sequelize";
import { Assessment } from "@/models";
import { assessmentVariables, timingReferences } from "@/models/Assessment";

export const assessmentRecordSchema = z.object({
  id: z.string(),
  position: z.number(),
  name: z.string(),
  variable: z.enum(assessmentVariables),
  unit: z.string(),
  plannedDate: z.string().nullable(),
  timingDays: z.number().nullable(),
  timingReference: z.enum(timingReferences).nullable(),
  quadratsPerPlot: z.number(),
  notes: z.string(),
});
export type AssessmentRecord = z.infer<typeof assessmentRecordSchema>;

export async function assessmentsOf(trialId: string): Promise<AssessmentRecord[]> {
  db();
  const assessments = await Assessment.findAll({ where: { trialId }, order: [["position", "ASC"]] });
  return assessments.map((assessment) => assessmentRecordSchema.parse(assessment.get({ plain: true })));
}

export async function findAssessment(trialId: string, assessmentId: string): Promise<AssessmentRecord | null> {
  db();
  const assessment = await Assessment.findOne({ where: { trialId, id: assessmentId } });
  return assessment ? assessmentRecordSchema.parse(assessment.get({ plain: true })) : null;
}
