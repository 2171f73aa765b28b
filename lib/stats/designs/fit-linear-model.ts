import { NeumaierAccumulator } from "../core/neumaier-accumulator";
import type { EncodedFactor } from "../core/encode-factor";
import type { ModelTerm } from "./model-types";

/** Sequential (type I) sum of squares of one term. */
export interface SequentialTerm {
  source: string;
  df: number;
  ss: number;
}

/** Result of a least-squares fit by Householder QR with aliased columns dropped. */
export interface LinearModelFit {
  terms: SequentialTerm[];
  dfResidual: number;
  sumOfSquaresResidual: number;
  residuals: Float64Array;
  /** Estimated coefficients of the kept columns (intercept first). */
  coefficients: Float64Array;
  /** Upper-triangular R of the kept columns, rank × rank, row-major. */
  triangular: Float64Array;
  rank: number;
  /** Per term: level-combination key → kept column index, or -1 when aliased. */
  columnOfCombination: Array<Map<number, number>>;
  modelTerms: ModelTerm[];
}

/** Tolerance for declaring a column aliased, relative to its original norm (as R's lm). */
const aliasTolerance = 1e-7;

/**
 * Least-squares fit of response = intercept + Σ terms, each term coded by
 * one indicator column per observed level combination, with sequential sums
 * of squares in the order the terms are given.
 *
 * Formula: Householder QR of the model matrix X = QR processed column by
 * column; a column whose norm after the previous reflections is below 1e-7
 * of its original norm is aliased and dropped (R's dqrdc2 rule). The effects
 * Q'y split the total sum of squares: the squared effects of a term's kept
 * columns are its sequential SS, those past the rank the residual SS.
 *
 * Why QR and not normal equations: forming X'X squares the condition number;
 * the orthogonal reflections keep lost-plot analyses accurate to ~1e-13.
 *
 * Assumptions: response already centred (see centreDecimalValues) so the
 * intercept's effect does not swamp the others.
 *
 * Reference: Golub, G. H. & Van Loan, C. F. (2013) Matrix Computations,
 * 4th ed., §5.2; Chambers, J. M. (1992) Linear models, in Statistical Models
 * in S, ch. 4 (sequential ANOVA from the effects).
 *
 * @example
 * fitLinearModel(new Float64Array([1, 2, 4, 5]),
 *   [{ source: "treatment", factors: [encodeFactor(["a", "a", "b", "b"])] }]).terms
 * // [{ source: "treatment", df: 1, ss: 9 }]
 */
export function fitLinearModel(response: Float64Array, modelTerms: ModelTerm[]): LinearModelFit {
  const observations = response.length;
  const columns: Float64Array[] = [];
  const columnTerm: number[] = [];
  const columnKey: number[] = [];
  columns.push(new Float64Array(observations).fill(1));
  columnTerm.push(-1);
  columnKey.push(0);
  modelTerms.forEach((term, termIndex) => {
    const keys = combinationKeys(term.factors, observations);
    const seen = new Map<number, Float64Array>();
    for (let row = 0; row < observations; row++) {
      let column = seen.get(keys[row]);
      if (!column) {
        column = new Float64Array(observations);
        seen.set(keys[row], column);
      }
      column[row] = 1;
    }
    const sortedKeys = Array.from(seen.keys()).sort((first, second) => first - second);
    for (const key of sortedKeys) {
      columns.push(seen.get(key) as Float64Array);
      columnTerm.push(termIndex);
      columnKey.push(key);
    }
  });

  const reflectors: Float64Array[] = [];
  const reflectorScale: number[] = [];
  const keptColumns: Float64Array[] = [];
  const keptTerm: number[] = [];
  const columnOfCombination = modelTerms.map(() => new Map<number, number>());
  for (let candidate = 0; candidate < columns.length; candidate++) {
    const column = Float64Array.from(columns[candidate]);
    const originalNorm = Math.sqrt(sumOfSquaresFrom(column, 0));
    for (let step = 0; step < reflectors.length; step++) applyReflector(reflectors[step], reflectorScale[step], step, column);
    const rankSoFar = reflectors.length;
    const remainingNorm = Math.sqrt(sumOfSquaresFrom(column, rankSoFar));
    const termIndex = columnTerm[candidate];
    if (rankSoFar >= observations || remainingNorm <= aliasTolerance * originalNorm) {
      if (termIndex >= 0) columnOfCombination[termIndex].set(columnKey[candidate], -1);
      continue;
    }
    const alpha = column[rankSoFar] > 0 ? -remainingNorm : remainingNorm;
    const reflector = new Float64Array(observations);
    for (let row = rankSoFar; row < observations; row++) reflector[row] = column[row];
    reflector[rankSoFar] -= alpha;
    const reflectorNormSquared = sumOfSquaresFrom(reflector, rankSoFar);
    reflectors.push(reflector);
    reflectorScale.push(2 / reflectorNormSquared);
    column[rankSoFar] = alpha;
    for (let row = rankSoFar + 1; row < observations; row++) column[row] = 0;
    keptColumns.push(column);
    keptTerm.push(termIndex);
    if (termIndex >= 0) columnOfCombination[termIndex].set(columnKey[candidate], keptColumns.length - 1);
  }

  const rank = keptColumns.length;
  const effects = Float64Array.from(response);
  for (let step = 0; step < rank; step++) applyReflector(reflectors[step], reflectorScale[step], step, effects);

  const terms: SequentialTerm[] = modelTerms.map((term) => ({ source: term.source, df: 0, ss: 0 }));
  const termSums = modelTerms.map(() => new NeumaierAccumulator());
  for (let index = 0; index < rank; index++) {
    const termIndex = keptTerm[index];
    if (termIndex < 0) continue;
    terms[termIndex].df += 1;
    termSums[termIndex].add(effects[index] * effects[index]);
  }
  terms.forEach((term, termIndex) => (term.ss = termSums[termIndex].value()));
  const residualSum = new NeumaierAccumulator();
  for (let index = rank; index < observations; index++) residualSum.add(effects[index] * effects[index]);

  const triangular = new Float64Array(rank * rank);
  for (let column = 0; column < rank; column++) {
    for (let row = 0; row <= column; row++) triangular[row * rank + column] = keptColumns[column][row];
  }
  const coefficients = new Float64Array(rank);
  for (let row = rank - 1; row >= 0; row--) {
    let value = effects[row];
    for (let column = row + 1; column < rank; column++) value -= triangular[row * rank + column] * coefficients[column];
    coefficients[row] = value / triangular[row * rank + row];
  }

  const residuals = new Float64Array(observations);
  for (let index = rank; index < observations; index++) residuals[index] = effects[index];
  for (let step = rank - 1; step >= 0; step--) applyReflector(reflectors[step], reflectorScale[step], step, residuals);

  return {
    terms,
    dfResidual: observations - rank,
    sumOfSquaresResidual: residualSum.value(),
    residuals,
    coefficients,
    triangular,
    rank,
    columnOfCombination,
    modelTerms,
  };
}

/** Mixed-radix key of each observation's level combination within a term. */
function combinationKeys(factors: EncodedFactor[], observations: number): Float64Array {
  const keys = new Float64Array(observations);
  let radix = 1;
  for (const factor of factors) {
    for (let row = 0; row < observations; row++) keys[row] += factor.codes[row] * radix;
    radix *= factor.levels.length;
  }
  return keys;
}

function sumOfSquaresFrom(vector: Float64Array, start: number): number {
  let scale = 0;
  for (let index = start; index < vector.length; index++) scale = Math.max(scale, Math.abs(vector[index]));
  if (scale === 0) return 0;
  let sum = 0;
  for (let index = start; index < vector.length; index++) {
    const scaled = vector[index] / scale;
    sum += scaled * scaled;
  }
  return sum * scale * scale;
}

function applyReflector(reflector: Float64Array, scale: number, start: number, vector: Float64Array): void {
  let dot = 0;
  for (let index = start; index < vector.length; index++) dot += reflector[index] * vector[index];
  const factor = scale * dot;
  if (factor === 0) return;
  for (let index = start; index < vector.length; index++) vector[index] -= factor * reflector[index];
}
