export type ProblemSeverity = "error" | "warning";

export type ProblemCode =
  | "empty-file"
  | "not-csv"
  | "encoding"
  | "delimiter"
  | "too-large"
  | "too-many-rows"
  | "too-many-columns"
  | "missing-column"
  | "extra-column"
  | "wrong-unit"
  | "unknown-plot"
  | "bad-quadrat"
  | "duplicate"
  | "not-a-number"
  | "negative"
  | "implausible"
  | "no-value"
  | "missing-plot"
  | "missing-quadrat"
  | "treatment-mismatch"
  | "ragged-row"
  | "no-values"
  | "more-problems";

/** One thing wrong with a file, as the uploader sees it: where, and what to do. */
export interface IngestProblem {
  severity: ProblemSeverity;
  code: ProblemCode;
  /** Line in the file as a spreadsheet numbers it (the header is row 1); absent for whole-file problems. */
  row?: number;
  column?: string;
  message: string;
}

/** One raw value ready to store: a quadrat (and species) of a plot. */
export interface IngestRecord {
  row: number;
  plotNumber: number;
  quadrat: number;
  species: string;
  value: number;
}

export interface IngestContext {
  plots: { number: number; treatmentCode: string }[];
  quadratsPerPlot: number;
  unit: string;
  plausibleMin: number | null;
  plausibleMax: number | null;
}

export interface IngestLimits {
  maxBytes: number;
  maxRows: number;
  maxColumns: number;
}

export const defaultIngestLimits: IngestLimits = { maxBytes: 20 * 1024 * 1024, maxRows: 200_000, maxColumns: 60 };

export interface IngestResult {
  format: "long" | "wide" | null;
  records: IngestRecord[];
  problems: IngestProblem[];
  rowsRead: number;
}
