import type { IngestContext, IngestLimits, IngestProblem } from "./types";

/**
 * The later part of a large file, checked on a second thread while the first part is checked
 * on the first: rows and values as typed arrays, so they cross between threads without a
 * copy per value. Row numbers are the file's own.
 */
export interface CheckedPart {
  rows: Int32Array;
  /** Each value's plot as its place in the context's plot list. */
  plotIndexes: Int32Array;
  quadrats: Int32Array;
  /** Each value's species as its place in speciesNames (spellings as written). */
  speciesIndexes: Int32Array;
  speciesNames: string[];
  values: Float64Array;
  /** The values (by index) that drew a range warning. */
  implausibleValues: Int32Array;
  /** In row order; the first few hundred only, as a checker keeps them. */
  problems: IngestProblem[];
  /** The listed duplicates (by place in problems), with the cell and the row each repeats. */
  duplicatesListed: { problem: number; cell: string; earlier: number }[];
  problemCount: number;
  errors: number;
  rowsRead: number;
}

/** What the second thread needs to check a file's later part exactly as one pass would. */
export interface PartRequest {
  context: IngestContext;
  limits: IngestLimits;
  /** The file's header line, bytes included its line break: it names the columns. */
  header: Uint8Array;
  /** The file's line number of the part's first line. */
  firstRow: number;
  /** The line break the first part uses, so both parts split lines alike. */
  newline: "\n" | "\r\n";
}

/** A part either checked, or refused whole (the same whole-file problem a single pass reports). */
export type PartOutcome = { part: CheckedPart } | { fatal: IngestProblem };

/** The typed arrays of a part, for a transfer list. */
export function partBuffers(part: CheckedPart): ArrayBuffer[] {
  return [part.rows, part.plotIndexes, part.quadrats, part.speciesIndexes, part.values, part.implausibleValues].map((array) => array.buffer as ArrayBuffer);
}
