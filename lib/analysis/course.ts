import "server-only";
import { assessmentsOf } from "@/lib/data/assessments";
import type { Trial } from "@/models";
import { assessmentRows } from "./analyze-assessment";
import { treatmentsOf } from "./assessment-results";

export interface CourseSeries {
  treatment: string;
  points: Array<{ day: number; mean: number }>;
}

/** Weed density per treatment over the assessment dates: arithmetic means of the plot values. */
export async function weedDensityCourse(trial: Trial): Promise<{ unit: string; series: CourseSeries[] }> {
  const assessments = (await assessmentsOf(trial.id)).filter((assessment) => assessment.variable === "weed-density" && assessment.timingDays !== null);
  const treatments = await treatmentsOf(trial.id);
  const loaded = await Promise.all(assessments.map((assessment) => assessmentRows(trial, assessment)));
  const series = treatments.map((treatment) => ({
    treatment: treatment.code,
    points: assessments.flatMap((assessment, index) => {
      const values = loaded[index].rows.filter((row) => row.treatment === treatment.code && row.response !== "NA").map((row) => row.response as number);
      return values.length ? [{ day: assessment.timingDays!, mean: values.reduce((sum, value) => sum + value, 0) / values.length }] : [];
    }),
  }));
  return { unit: loaded[0]?.unit ?? "plants/m²", series: series.filter((line) => line.points.length > 0) };
}
