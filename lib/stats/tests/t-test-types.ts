/** Result of a two-group t-test in the shape of the analysis output. */
export interface TTestResult {
  a: string;
  b: string;
  t: number;
  df: number;
  p: number;
  meanDiff: number;
  ci: [number, number];
}
