import { toSafeCsv } from "@/lib/exports/safe-csv";
import type { TrialReport } from "./report-data";

/** Every assessment's results in one machine-readable document. */
export function reportJson(report: TrialReport) {
  return {
    trial: { id: report.overview.trial.id, title: report.overview.trial.title, design: report.overview.trial.design, status: report.overview.trial.status },
    software: `Hoebench ${report.version}`,
    generatedAt: report.generatedAt,
    options: report.options,
    methods: report.methods,
    review: report.review ? { status: report.review.status, decidedBy: report.review.decidedBy, decidedAt: report.review.decidedAt } : null,
    assessments: report.sections.map(({ assessment, results }) => ({ id: assessment.id, name: assessment.name, ...results })),
  };
}

/** One tidy row per treatment mean and per ANOVA line, so a spreadsheet can filter by table. */
export function reportCsv(report: TrialReport): string {
  const header = ["assessment", "table", "treatment_or_source", "n_or_df", "mean_or_ss", "transformed_mean_or_ms", "se_or_f", "group_or_p", "percent_control", "unit", "data_version", "transform", "method", "alpha"];
  const rows: (string | number | null)[][] = [];
  for (const { assessment, results } of report.sections) {
    const common = [results.assessment.unit, results.dataVersion, results.options.transform, results.options.method, results.options.alpha];
    for (const row of results.anova) rows.push([assessment.name, "anova", row.source, row.df, row.ss, row.ms, row.f ?? null, row.p ?? null, null, ...common]);
    for (const mean of results.means) rows.push([assessment.name, "means", mean.treatment, mean.n, mean.mean, mean.transformedMean, mean.se, mean.letters, mean.percentControl, ...common]);
  }
  return toSafeCsv(header, rows);
}
