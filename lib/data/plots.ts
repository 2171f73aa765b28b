import "server-only";
import { z } from "zod";
import { db } from "@/lib/db/sequelize";
import { Plot, Treatment } from "@/models";

export const plotRecordSchema = z.object({
  id: z.string(),
  number: z.number(),
  block: z.number(),
  position: z.number(),
  row: z.number(),
  column: z.number(),
  walkOrder: z.number(),
  treatmentId: z.string(),
});
export type PlotRecord = z.infer<typeof plotRecordSchema>;

/** A trial's plots in plot-number order. */
export async function plotsOf(trialId: string): Promise<PlotRecord[]> {
  db();
  const plots = await Plot.findAll({ where: { trialId }, order: [["number", "ASC"]] });
  return plots.map((plot) => plotRecordSchema.parse(plot.get({ plain: true })));
}

export async function findPlotByNumber(trialId: string, number: number): Promise<(PlotRecord & { treatmentCode: string; treatmentName: string }) | null> {
  db();
  const plot = await Plot.findOne({ where: { trialId, number }, include: [{ model: Treatment, as: "treatment", attributes: ["code", "name"] }] });
  if (!plot) return null;
  const treatment = (plot as Plot & { treatment: Treatment }).treatment;
  return { ...plotRecordSchema.parse(plot.get({ plain: true })), treatmentCode: treatment.code, treatmentName: treatment.name };
}

export async function plotCount(trialId: string): Promise<number> {
  db();
  return Plot.count({ where: { trialId } });
}
