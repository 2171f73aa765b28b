import { emptyColumns, speciesAt, type ValueColumns } from "@/lib/observations/value-columns";

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

/** A file's values in columns, with the line each came from. */
export interface IngestValues extends ValueColumns {
  rows: Int32Array;
}

export const noValues = (): IngestValues => ({ rows: new Int32Array(), ...emptyColumns() });

/** Values start to end as one object each (the preview, tests). */
export function recordsOf(values: IngestValues, start = 0, end = values.rows.length): IngestRecord[] {
  const records: IngestRecord[] = [];
  for (let index = start; index < Math.min(end, values.rows.length); index += 1) {
    records.push({ row: values.rows[index], plotNumber: values.plotNumbers[index], quadrat: values.quadrats[index], species: speciesAt(values, index), value: values.values[index] });
  }
  return records;
}

export interface IngestContext {
  /** The trial's plots; `id` where the server read them (a commit can then skip reading them again). */
  plots: { number: number; treatmentCode: string; id?: string }[];
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
  values: IngestValues;
  problems: IngestProblem[];
  rowsRead: number;
}
