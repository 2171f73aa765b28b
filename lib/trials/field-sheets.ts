import "server-only";
import { config } from "@/lib/config";
import { plotsOf } from "@/lib/data/plots";
import { treatmentsOf, type TreatmentRecord } from "@/lib/data/treatments";
import { trialCautions } from "./cautions";
import type { Trial } from "@/models";

/*
 * What the printed map, stake labels and data sheets are drawn from: one read of the trial's
 * plots and treatments, shaped for the field components.
 */

export interface FieldPlot {
  number: number;
  block: number;
  row: number;
  column: number;
  walkOrder: number;
  treatmentCode: string;
  category: TreatmentRecord["category"];
  checkType: TreatmentRecord["checkType"];
}

export interface FieldPlan {
  title: string;
  plots: FieldPlot[];
  treatments: { code: string; name: string; category: TreatmentRecord["category"] }[];
  plotLengthM: number;
  plotWidthM: number;
  design: Trial["design"];
  serpentine: boolean;
  cautions: string[];
}

/** The plan of a trial's field; pass treatments already loaded for the same request to save a query. */
export async function fieldPlan(trial: Trial, loadedTreatments?: Promise<TreatmentRecord[]>): Promise<FieldPlan> {
  const [plots, treatments] = await Promise.all([plotsOf(trial.id), loadedTreatments ?? treatmentsOf(trial.id)]);
  const byId = new Map(treatments.map((treatment) => [treatment.id, treatment]));
  return {
    title: trial.title,
    plots: plots.map((plot) => {
      const treatment = byId.get(plot.treatmentId)!;
      return {
        number: plot.number,
        block: plot.block,
        row: plot.row,
        column: plot.column,
        walkOrder: plot.walkOrder,
        treatmentCode: treatment.code,
        category: treatment.category,
        checkType: treatment.checkType,
      };
    }),
    treatments: treatments.map(({ code, name, category }) => ({ code, name, category })),
    plotLengthM: trial.plotLengthM,
    plotWidthM: trial.plotWidthM,
    design: trial.design,
    serpentine: trial.serpentine,
    cautions: trialCautions(treatments),
  };
}

/** The address a stake's QR code opens: the plot's own page. */
export function plotUrl(trialId: string, plotNumber: number): string {
  return `${config().APP_BASE_URL.replace(/\/$/, "")}/trials/${trialId}/plots/${plotNumber}`;
}

export function fileSlug(title: string): string {
  return title.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "").slice(0, 60) || "trial";
}
