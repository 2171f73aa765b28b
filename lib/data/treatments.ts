import "server-only";
import { z } from "zod";
import { db } from "@/lib/db/sequelize";
import { Treatment } from "@/models";
import { checkTypes, methodCategories } from "@/models/Treatment";

export const treatmentRecordSchema = z.object({
  id: z.string(),
  position: z.number(),
  code: z.string(),
  name: z.string(),
  category: z.enum(methodCategories),
  checkType: z.enum(checkTypes).nullable(),
  description: z.string(),
  timing: z.string(),
  rateOrSettings: z.string(),
  labourHoursPerHa: z.number().nullable(),
  materialCostPerHa: z.number().nullable(),
});
export type TreatmentRecord = z.infer<typeof treatmentRecordSchema>;

export function toTreatmentRecord(treatment: Treatment): TreatmentRecord {
  return treatmentRecordSchema.parse(treatment.get({ plain: true }));
}

/** A trial's treatments in list order, which is also the order randomization draws from. */
export async function treatmentsOf(trialId: string): Promise<TreatmentRecord[]> {
  db();
  const treatments = await Treatment.findAll({ where: { trialId }, order: [["position", "ASC"]] });
  return treatments.map(toTreatmentRecord);
}

export async function findTreatment(trialId: string, treatmentId: string): Promise<TreatmentRecord | null> {
  db();
  const treatment = await Treatment.findOne({ where: { trialId, id: treatmentId } });
  return treatment ? toTreatmentRecord(treatment) : null;
}
