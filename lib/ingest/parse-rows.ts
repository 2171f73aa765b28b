import { Readable } from "node:stream";
import Papa from "papaparse";
import type { RowChecker } from "./row-checker";
import type { IngestLimits, IngestProblem } from "./types";

export const encodingProblem = (): IngestProblem => ({
  severity: "error",
  code: "encoding",
  message: 'The file is not UTF-8 text (it may be saved in an older Windows or Mac encoding). Save it as "CSV UTF-8 (comma-separated)" and upload it again.',
});

/** Bytes to text; a byte sequence that is not UTF-8 ends the text with a whole-file problem. */
export async function* decodeUtf8(bytes: AsyncIterable<Uint8Array>, fatal: IngestProblem[]): AsyncGenerator<string> {
  const decoder = new TextDecoder("utf-8", { fatal: true });
  for await (const chunk of bytes) {
    let decoded: string;
    try {
      decoded = decoder.decode(chunk, { stream: true });
    } catch {
      fatal.push(encodingProblem());
      return;
    }
    if (fatal.length) return;
    if (decoded) yield decoded;
  }
  try {
    const tail = decoder.decode();
    if (tail) yield tail;
  } catch {
    fatal.push({ severity: "error", code: "encoding", message: "The file ends in the middle of a character; it is not complete UTF-8 text. Export it again." });
  }
}

export interface ParseRowsOptions {
  limits: IngestLimits;
  /** Whole-file problems: one stops the parse. */
  fatal: IngestProblem[];
  /** The file's line number of the text's second line (its first is the header): 2 unless the text is a later part. */
  firstRow?: number;
  /** The line break, when known; papaparse guesses it otherwise. */
  newline?: "\n" | "\r\n";
}

/**
 * Parses text with papaparse as it streams and hands every row to the checker with its line
 * number, stopping at the first whole-file problem (too many columns or rows).
 */
export function parseRows(text: AsyncIterable<string>, checker: RowChecker, { limits, fatal, firstRow = 2, newline }: ParseRowsOptions): Promise<void> {
  const rowOffset = firstRow - 2;
  let line = 0;
  return new Promise<void>((resolve, reject) => {
    // A Node stream is papaparse's fast path (its NODE_STREAM_INPUT duplex is ~50× slower);
    // chunk() hands over each piece's rows at once instead of one result object per row.
    Papa.parse(Readable.from(text, { objectMode: false }) as unknown as File, {
      delimiter: ",",
      ...(newline ? { newline } : {}),
      skipEmptyLines: false,
      chunk: (results: Papa.ParseResult<string[]>, parser: Papa.Parser) => {
        for (const cells of results.data) {
          if (fatal.length) {
            parser.abort();
            return;
          }
          line += 1;
          const row = line === 1 ? 1 : line + rowOffset;
          if (row === 1 && cells.length > limits.maxColumns) {
            fatal.push({ severity: "error", code: "too-many-columns", row: 1, message: `The header has ${cells.length} columns; a data file has at most ${limits.maxColumns}. Use the data sheet template.` });
            parser.abort();
            return;
          }
          if (row - 1 > limits.maxRows) {
            fatal.push({ severity: "error", code: "too-many-rows", message: `The file has more than ${limits.maxRows.toLocaleString("en-US")} rows, the most one upload may hold. Split it by assessment date.` });
            parser.abort();
            return;
          }
          checker.accept(cells, row);
        }
      },
      complete: () => resolve(),
      error: (error: Error) => reject(error),
    });
  });
}
