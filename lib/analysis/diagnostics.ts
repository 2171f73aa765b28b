import {
  encodeFactor,
  fitCompletelyRandomized,
  fitLatinSquare,
  fitRandomizedCompleteBlock,
  normalQuantile,
  readTrialRows,
  transformValue,
  type ResponseTransform,
  type TrialRow,
} from "@/lib/stats";

export type DesignColumns = { design: "rcbd"; block: string } | { design: "crd" } | { design: "latin"; row: string; column: string };

export interface DiagnosticPoint {
  /** Index into the rows that had a response, in their order. */
  index: number;
  fitted: number;
  residual: number;
}

/**
 * Fitted values and residuals of the same model analyzeTrial fits, on the analysed
 * (transformed) scale, for the residual and Q-Q plots. lib/stats returns residuals only
 * inside its fit, so the fit is repeated here through its public design functions;
 * fitted = analysed value − residual.
 */
export function fittedAndResiduals(rows: ReadonlyArray<TrialRow>, columns: DesignColumns & { response: string; treatment: string; transform: ResponseTransform }): DiagnosticPoint[] {
  const labelColumns = [columns.treatment, ...(columns.design === "rcbd" ? [columns.block] : columns.design === "latin" ? [columns.row, columns.column] : [])];
  const plots = readTrialRows(rows, columns.response, labelColumns);
  const analysed = Float64Array.from(plots.rawValues, (value) => (columns.transform === "none" ? value : transformValue(value, columns.transform)));
  const treatment = encodeFactor(plots.labels[columns.treatment]);
  const fit =
    columns.design === "crd"
      ? fitCompletelyRandomized(analysed, treatment)
      : columns.design === "latin"
        ? fitLatinSquare(analysed, treatment, encodeFactor(plots.labels[columns.row]), encodeFactor(plots.labels[columns.column]))
        : fitRandomizedCompleteBlock(analysed, treatment, encodeFactor(plots.labels[columns.block]));
  return Array.from(fit.residuals, (residual, index) => ({ index, fitted: analysed[index] - residual, residual }));
}

/** Normal Q-Q points of standardized residuals with Blom's plotting positions (i − 3/8)/(n + 1/4). */
export function normalQuantilePoints(residuals: ReadonlyArray<number>): Array<{ theoretical: number; sample: number }> {
  const n = residuals.length;
  if (n < 2) return [];
  const mean = residuals.reduce((sum, value) => sum + value, 0) / n;
  const sd = Math.sqrt(residuals.reduce((sum, value) => sum + (value - mean) ** 2, 0) / (n - 1)) || 1;
  return [...residuals]
    .sort((a, b) => a - b)
    .map((value, index) => ({ theoretical: normalQuantile((index + 1 - 0.375) / (n + 0.25)), sample: (value - mean) / sd }));
}
