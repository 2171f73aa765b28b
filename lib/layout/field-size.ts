/**
 * Overall field size from the plot grid. Plots sit side by side along a row, so the row
 * runs across plot widths and the rows stack along plot lengths. Paths and alleys are not
 * part of a trial's stored dimensions, so they are left out (and the map says so).
 */
export function fieldSize(input: { rows: number; columns: number; plotLengthM: number; plotWidthM: number }): {
  westEastM: number;
  northSouthM: number;
  areaM2: number;
} {
  const westEastM = input.columns * input.plotWidthM;
  const northSouthM = input.rows * input.plotLengthM;
  return { westEastM, northSouthM, areaM2: westEastM * northSouthM };
}

/** "2", "2.5", "1.25": metres without trailing zeros, at most two decimals. */
export function formatMetres(value: number): string {
  return String(Math.round(value * 100) / 100);
}
