import "server-only";
import { QueryTypes } from "sequelize";
import { db } from "@/lib/db/sequelize";
import { plotValuesOf, type PlotValueRow } from "@/lib/data/assessment-data";
import { analyzeTrial, type TrialAnalysis } from "@/lib/stats";
import type { Assessment, Trial } from "@/models";
import { designColumns, type AnalysisRow } from "./build-results";

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

export interface AssessmentRows {
  rows: AnalysisRow[];
  plotValues: PlotValueRow[];
  unit: string;
}

/** Every plot of the trial with its current value of one assessment ("NA" when lost), as the engine reads them. */
export async function assessmentRows(trial: Trial, assessment: Assessment | { id: string; variable: Assessment["variable"]; unit: string }): Promise<AssessmentRows> {
  const [values, plots] = await Promise.all([
    plotValuesOf(trial, assessment),
    db().query<{ number: number; block: number; row: number; column: number; treatmentCode: string }>(
      `SELECT p.number, p.block, p.row, p.column, t.code AS "treatmentCode"
         FROM plots p JOIN treatments t ON t.id = p.treatment_id WHERE p.trial_id = :trialId ORDER BY p.number`,
      { replacements: { trialId: trial.id }, type: QueryTypes.SELECT },
    ),
  ]);
  const valueByPlot = new Map(values.map((value) => [value.plotNumber, value.value]));
  const rows: AnalysisRow[] = plots.map((plot) => ({
    plotNumber: plot.number,
    treatment: plot.treatmentCode,
    block: String(plot.block),
    row: String(plot.row),
    column: String(plot.column),
    response: valueByPlot.has(plot.number) ? valueByPlot.get(plot.number)! : "NA",
  }));
  return { rows, plotValues: values, unit: values[0]?.unit ?? assessment.unit };
}

/**
 * The one way the app analyses an assessment: the current plot values, laid out as the
 * trial's design, through the statistics engine (lib/stats). Treatments are their codes.
 */
export async function analyzeAssessment(trial: Trial, assessment: Assessment | { id: string; variable: Assessment["variable"]; unit: string }, options: AssessmentAnalysisOptions = {}): Promise<AssessmentAnalysis> {
  const { rows, plotValues, unit } = await assessmentRows(trial, assessment);
  const analysis = analyzeTrial(rows, {
    ...designColumns(trial.design),
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
    plotValues,
    unit,
    lostPlots: rows.filter((row) => row.response === "NA").map((row) => row.plotNumber),
  };
}
