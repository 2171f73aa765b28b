import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { plotValuesOf, type PlotValueRow } from "@/lib/data/assessment-data";
import { analyzeTrial, type TrialAnalysis } from "@/lib/stats";
import type { Assessment, Trial } from "@/models";

export interface AssessmentAnalysisOptions {
  transform?: "none" | "sqrt" | "log1p" | "asin-sqrt";
  alpha?: number;
  /** Treatment code of the check for percent control (usually the weedy check). */
  control?: string;
  /** Treatment code of the equivalence reference (usually hand weeding) and the margin, in the analysed unit. */
  reference?: string;
  margin?: number;
}

export interface AssessmentAnalysis {
  analysis: TrialAnalysis;
  plotValues: PlotValueRow[];
  unit: string;
  /** Plots of the trial with no value in this assessment (analysed as lost). */
  lostPlots: number[];
}

/**
 * The one way the app analyses an assessment: the current plot values, laid out as the
 * trial's design, through the statistics engine (lib/stats). Treatments are their codes.
 */
export async function analyzeAssessment(trial: Trial, assessment: Assessment | { id: string; variable: Assessment["variable"]; unit: string }, options: AssessmentAnalysisOptions = {}): Promise<AssessmentAnalysis> {
  const [values, plots] = await Promise.all([
    plotValuesOf(trial, assessment),
    db().query<{ number: number; block: number; row: number; column: number; treatmentCode: string }>(
      `SELECT p.number, p.block, p.row, p.column, t.code AS "treatmentCode"
         FROM plots p JOIN treatments t ON t.id = p.treatment_id WHERE p.trial_id = :trialId ORDER BY p.number`,
      { replacements: { trialId: trial.id }, type: QueryTypes.SELECT },
    ),
  ]);
  const valueByPlot = new Map(values.map((value) => [value.plotNumber, value.value]));
  const rows = plots.map((plot) => ({
    treatment: plot.treatmentCode,
    block: String(plot.block),
    row: String(plot.row),
    column: String(plot.column),
    response: valueByPlot.has(plot.number) ? valueByPlot.get(plot.number)! : "NA",
  }));
  const design = trial.design === "latin" ? { design: "latin" as const, row: "row", column: "column" } : trial.design === "crd" ? { design: "crd" as const } : { design: "rcbd" as const, block: "block" };
  const analysis = analyzeTrial(rows, {
    ...design,
    response: "response",
    treatment: "treatment",
    transform: options.transform ?? "none",
    alpha: options.alpha ?? 0.05,
    control: options.control,
    reference: options.reference,
    margin: options.margin,
  });
  return {
    analysis,
    plotValues: values,
    unit: values[0]?.unit ?? assessment.unit,
    lostPlots: plots.filter((plot) => !valueByPlot.has(plot.number)).map((plot) => plot.number),
  };
}
