import { StatsInputError } from "../errors";
import { NeumaierAccumulator } from "../core/neumaier-accumulator";
import { compensatedSum } from "../core/compensated-sum";
import type { EncodedFactor } from "../core/encode-factor";
import { anovaTable } from "./anova-table";
import { fitLinearModel } from "./fit-linear-model";
import { groupMeans } from "./group-means";
import { leastSquaresMeans } from "./least-squares-means";
import type { ModelFit } from "./model-types";

/**
 * Analysis of a Latin square, response = row + column + treatment.
 *
 * Formula (complete t × t square): SS_row = t Σ (ȳ_r - ȳ)², SS_column and
 * SS_treatment likewise, e = y - ȳ_r - ȳ_c - ȳ_j + 2ȳ with (t-1)(t-2) df.
 * With lost plots: least-squares fit in the order row, column, treatment,
 * lsmeans averaged over all rows and columns.
 *
 * Assumptions: no interactions among rows, columns and treatments.
 *
 * Reference: Cochran, W. G. & Cox, G. M. (1957) Experimental Designs,
 * 2nd ed., ch. 4; Gomez & Gomez (1984) §2.3.
 *
 * @example
 * // 3 × 3 square, rows R1-R3 read left to right (columns C1-C3): A B C / B C A / C A B
 * fitLatinSquare(
 *   new Float64Array([10, 12, 15, 11, 16, 9, 14, 8, 13]),
 *   encodeFactor(["A", "B", "C", "B", "C", "A", "C", "A", "B"]),
 *   encodeFactor(["R1", "R1", "R1", "R2", "R2", "R2", "R3", "R3", "R3"]),
 *   encodeFactor(["C1", "C2", "C3", "C1", "C2", "C3", "C1", "C2", "C3"]),
 * ).anova.map((line) => line.ss) // row, column, treatment, residual
 * // [0.6666666666666691, 0.6666666666666691, 54, 4.666666666666664]
 * // (exact: 2/3, 2/3, 54, 14/3; R anova(lm(y ~ row + column + treatment)): 0.666666666666669, 0.666666666666667, 54, 4.66666666666666)
 */
export function fitLatinSquare(
  response: Float64Array,
  treatment: EncodedFactor,
  row: EncodedFactor,
  column: EncodedFactor,
): ModelFit {
  const size = treatment.levels.length;
  if (size < 2) throw new StatsInputError("anova requires at least two treatments");
  const observations = response.length;
  const complete =
    row.levels.length === size &&
    column.levels.length === size &&
    observations === size * size &&
    isLatin(treatment, row, column, size);
  if (complete) return completeSquare(response, treatment, row, column);

  const fit = fitLinearModel(response, [
    { source: "row", factors: [row] },
    { source: "column", factors: [column] },
    { source: "treatment", factors: [treatment] },
  ]);
  if (fit.dfResidual < 1) throw new StatsInputError("anova requires residual degrees of freedom (more plots than model parameters)");
  const anova = anovaTable(fit.terms, fit.dfResidual, fit.sumOfSquaresResidual);
  const weight = 1 / (row.levels.length * column.levels.length);
  const grid = row.levels.flatMap((_, rowLevel) =>
    column.levels.map((__, columnLevel) => ({
      levels: new Map([
        [row, rowLevel],
        [column, columnLevel],
      ]),
      weight,
    })),
  );
  const { lsmeans, covariance } = leastSquaresMeans(fit, treatment, grid);
  const meanSquareResidual = anova[anova.length - 1].ms;
  return {
    anova,
    residuals: fit.residuals,
    dfResidual: fit.dfResidual,
    meanSquareResidual,
    treatment,
    lsmeans,
    lsmeanCovariance: covariance,
    errorMeanSquare: meanSquareResidual,
    errorDf: fit.dfResidual,
    balanced: false,
  };
}

function isLatin(treatment: EncodedFactor, row: EncodedFactor, column: EncodedFactor, size: number): boolean {
  const rowCells = new Uint8Array(size * size);
  const columnCells = new Uint8Array(size * size);
  const plotCells = new Uint8Array(size * size);
  for (let index = 0; index < treatment.codes.length; index++) {
    const level = treatment.codes[index];
    const rowCell = row.codes[index] * size + level;
    const columnCell = column.codes[index] * size + level;
    const plotCell = row.codes[index] * size + column.codes[index];
    if (rowCells[rowCell] || columnCells[columnCell] || plotCells[plotCell]) return false;
    rowCells[rowCell] = columnCells[columnCell] = plotCells[plotCell] = 1;
  }
  return true;
}

function completeSquare(response: Float64Array, treatment: EncodedFactor, row: EncodedFactor, column: EncodedFactor): ModelFit {
  const size = treatment.levels.length;
  const observations = response.length;
  const grandMean = compensatedSum(response) / observations;
  const treatmentMeans = groupMeans(response, treatment.codes, size).means;
  const rowMeans = groupMeans(response, row.codes, size).means;
  const columnMeans = groupMeans(response, column.codes, size).means;
  const spread = (means: Float64Array) => {
    const sum = new NeumaierAccumulator();
    for (const mean of means) sum.add((mean - grandMean) * (mean - grandMean));
    return size * sum.value();
  };
  const residuals = new Float64Array(observations);
  const residualSum = new NeumaierAccumulator();
  for (let index = 0; index < observations; index++) {
    const residual =
      response[index] -
      treatmentMeans[treatment.codes[index]] -
      rowMeans[row.codes[index]] -
      columnMeans[column.codes[index]] +
      2 * grandMean;
    residuals[index] = residual;
    residualSum.add(residual * residual);
  }
  const dfResidual = (size - 1) * (size - 2);
  if (dfResidual < 1) throw new StatsInputError("anova requires residual degrees of freedom (latin square of at least 3 treatments)");
  const anova = anovaTable(
    [
      { source: "row", df: size - 1, ss: spread(rowMeans) },
      { source: "column", df: size - 1, ss: spread(columnMeans) },
      { source: "treatment", df: size - 1, ss: spread(treatmentMeans) },
    ],
    dfResidual,
    residualSum.value(),
  );
  const lsmeanCovariance = new Float64Array(size * size);
  for (let level = 0; level < size; level++) lsmeanCovariance[level * size + level] = 1 / size;
  const meanSquareResidual = anova[anova.length - 1].ms;
  return {
    anova,
    residuals,
    dfResidual,
    meanSquareResidual,
    treatment,
    lsmeans: treatmentMeans,
    lsmeanCovariance,
    errorMeanSquare: meanSquareResidual,
    errorDf: dfResidual,
    balanced: true,
  };
}
