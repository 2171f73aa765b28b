import { mulberry32, type RandomSource } from "./prng";
import { randomPermutation, shuffled } from "./shuffle";
import type { PlannedPlot, RandomizeInput } from "./types";

export const treatmentCountRange = { min: 2, max: 60 } as const;
export const blockCountRange = { min: 1, max: 50 } as const;
/** The seed is stored in a signed 32-bit column; unsigned 32-bit values are accepted too. */
export const seedRange = { min: -2147483648, max: 4294967295 } as const;

/**
 * Draws the field layout of a trial, reproducibly from its seed.
 *
 * - RCBD: block b is field row b; the treatments are shuffled independently in every block.
 * - CRD: every treatment appears `blocks` times (replicates); all plots are shuffled together
 *   over a grid of `blocks` rows × `treatmentCount` columns.
 * - Latin square: rows = columns = treatments, each treatment once in every row and column.
 *
 * Numbering (all designs): number = row × 100 + position, so 101…108, 201…208 for eight
 * treatments. Without serpentine, position = physical column (1 = west end). With serpentine
 * the numbering itself snakes: odd rows are numbered west → east, even rows east → west, so
 * position 1 of row 2 is at the east end, as in the usual serpentine plot numbering. `column`
 * always holds the physical column. `walkOrder` is 1..N in plot-number order, so with
 * serpentine the walk snakes too and nobody walks back to the west end between rows.
 */
export function randomizeLayout(input: RandomizeInput): PlannedPlot[] {
  validate(input);
  const random = mulberry32(input.seed);
  const treatmentsByRowAndColumn = drawTreatmentGrid(input, random);
  return numberPlots(treatmentsByRowAndColumn, input.serpentine);
}

function validate(input: RandomizeInput): void {
  const { design, treatmentCount, blocks, seed } = input;
  if (design !== "rcbd" && design !== "crd" && design !== "latin") {
    throw new Error(`Unknown design "${String(design)}": use rcbd, crd or latin`);
  }
  if (!Number.isInteger(treatmentCount) || treatmentCount < treatmentCountRange.min || treatmentCount > treatmentCountRange.max) {
    throw new Error(`The number of treatments must be a whole number from ${treatmentCountRange.min} to ${treatmentCountRange.max}, got ${treatmentCount}`);
  }
  if (!Number.isInteger(blocks) || blocks < blockCountRange.min || blocks > blockCountRange.max) {
    throw new Error(`The number of blocks must be a whole number from ${blockCountRange.min} to ${blockCountRange.max}, got ${blocks}`);
  }
  if (!Number.isInteger(seed) || seed < seedRange.min || seed > seedRange.max) {
    throw new Error(`The random seed must be a whole number from ${seedRange.min} to ${seedRange.max}, got ${seed}`);
  }
  if (design === "latin" && blocks !== treatmentCount) {
    throw new Error(`a Latin square needs as many rows as treatments (${treatmentCount} treatments, ${blocks} rows)`);
  }
}

/** grid[row - 1][column - 1] = treatment index, by physical column. */
function drawTreatmentGrid(input: RandomizeInput, random: RandomSource): number[][] {
  switch (input.design) {
    case "rcbd":
      return Array.from({ length: input.blocks }, () => randomPermutation(input.treatmentCount, random));
    case "crd":
      return completelyRandomGrid(input.treatmentCount, input.blocks, random);
    case "latin":
      return randomLatinSquare(input.treatmentCount, random);
  }
}

function completelyRandomGrid(treatmentCount: number, replicates: number, random: RandomSource): number[][] {
  const everyPlot = Array.from({ length: treatmentCount * replicates }, (_, index) => index % treatmentCount);
  const drawn = shuffled(everyPlot, random);
  return Array.from({ length: replicates }, (_, row) => drawn.slice(row * treatmentCount, (row + 1) * treatmentCount));
}

/**
 * A cyclic square (cell (r, c) holds (r + c) mod n) with its rows, columns and treatment
 * labels each randomly permuted.
 *
 * This does not reach every Latin square of the size with equal chance (for n ≥ 5 many
 * squares are not isotopic to the cyclic one), but every square it draws gives each
 * treatment each row and each column exactly once, and every treatment is equally likely in
 * every cell: the common field practice for a randomized Latin square.
 */
function randomLatinSquare(size: number, random: RandomSource): number[][] {
  const rowOrder = randomPermutation(size, random);
  const columnOrder = randomPermutation(size, random);
  const treatmentLabel = randomPermutation(size, random);
  return rowOrder.map((r) => columnOrder.map((c) => treatmentLabel[(r + c) % size]));
}

function numberPlots(grid: number[][], serpentine: boolean): PlannedPlot[] {
  const plots: PlannedPlot[] = [];
  grid.forEach((rowTreatments, rowIndex) => {
    const row = rowIndex + 1;
    const columns = rowTreatments.length;
    const numberedEastToWest = serpentine && row % 2 === 0;
    for (let position = 1; position <= columns; position++) {
      const column = numberedEastToWest ? columns + 1 - position : position;
      plots.push({
        number: row * 100 + position,
        block: row,
        position,
        row,
        column,
        walkOrder: plots.length + 1,
        treatmentIndex: rowTreatments[column - 1],
      });
    }
  });
  return plots;
}
