import { createHash } from "node:crypto";
import Papa from "papaparse";
import { RowChecker } from "./row-checker";
import { sniffFile } from "./sniff";
import { defaultIngestLimits, type IngestContext, type IngestLimits, type IngestProblem, type IngestResult } from "./types";

export interface ReadCsvResult extends IngestResult {
  sizeBytes: number;
  sha256: string;
}

const delimiterNames: Record<string, string> = { ";": "semicolons (;)", "\t": "tabs", "|": "vertical bars (|)" };

function wrongDelimiter(firstLine: string): IngestProblem | null {
  if (firstLine.includes(",")) return null;
  for (const [delimiter, name] of Object.entries(delimiterNames)) {
    if (firstLine.includes(delimiter)) {
      return {
        severity: "error",
        code: "delimiter",
        row: 1,
        message: `The columns are separated by ${name}, not commas. Save the file as "CSV (comma-separated)" and upload it again.`,
      };
    }
  }
  return null;
}

class StopReading extends Error {}

/**
 * Streams a data file through checks without holding it twice in memory: byte limit, file
 * type, UTF-8, delimiter, column and row limits, then every row through RowChecker.
 * Whole-file problems stop the reading early with a single clear message.
 */
export async function readCsv(source: AsyncIterable<Uint8Array>, context: IngestContext, limits: IngestLimits = defaultIngestLimits): Promise<ReadCsvResult> {
  const hash = createHash("sha256");
  const decoder = new TextDecoder("utf-8", { fatal: true });
  const checker = new RowChecker(context);
  const fatal: IngestProblem[] = [];
  let sizeBytes = 0;
  let rowNumber = 0;
  let sniffed = false;
  let firstText = true;

  const parser = Papa.parse(Papa.NODE_STREAM_INPUT, { delimiter: ",", skipEmptyLines: false }) as unknown as NodeJS.ReadWriteStream;
  const rowsDone = new Promise<void>((resolve, reject) => {
    parser.on("data", (cells: string[]) => {
      if (fatal.length) return;
      rowNumber += 1;
      if (rowNumber === 1 && cells.length > limits.maxColumns) {
        fatal.push({ severity: "error", code: "too-many-columns", row: 1, message: `The header has ${cells.length} columns; a data file has at most ${limits.maxColumns}. Use the data sheet template.` });
        return;
      }
      if (rowNumber - 1 > limits.maxRows) {
        fatal.push({ severity: "error", code: "too-many-rows", message: `The file has more than ${limits.maxRows.toLocaleString("en-US")} rows, the most one upload may hold. Split it by assessment date.` });
        return;
      }
      checker.accept(cells, rowNumber);
    });
    parser.on("end", resolve);
    parser.on("error", reject);
  });

  try {
    for await (const chunk of source) {
      sizeBytes += chunk.byteLength;
      if (sizeBytes > limits.maxBytes) {
        fatal.push({ severity: "error", code: "too-large", message: `The file is larger than ${Math.round(limits.maxBytes / 1024 / 1024)} MB, the most one upload may be.` });
        throw new StopReading();
      }
      if (!sniffed) {
        sniffed = true;
        const problem = sniffFile(chunk);
        if (problem) {
          fatal.push(problem);
          throw new StopReading();
        }
      }
      hash.update(chunk);
      let text: string;
      try {
        text = decoder.decode(chunk, { stream: true });
      } catch {
        fatal.push({
          severity: "error",
          code: "encoding",
          message: 'The file is not UTF-8 text (it may be saved in an older Windows or Mac encoding). Save it as "CSV UTF-8 (comma-separated)" and upload it again.',
        });
        throw new StopReading();
      }
      if (firstText && text.length > 0) {
        firstText = false;
        const problem = wrongDelimiter(text.replace(/^\ufeff/, "").split(/\r?\n/)[0]);
        if (problem) {
          fatal.push(problem);
          throw new StopReading();
        }
      }
      parser.write(text);
      if (fatal.length) throw new StopReading();
    }
    if (!sniffed) fatal.push(sniffFile(new Uint8Array())!);
    else {
      try {
        const tail = decoder.decode();
        if (tail) parser.write(tail);
      } catch {
        fatal.push({ severity: "error", code: "encoding", message: "The file ends in the middle of a character; it is not complete UTF-8 text. Export it again." });
      }
    }
  } catch (error) {
    if (!(error instanceof StopReading)) throw error;
  }
  parser.end();
  await rowsDone;

  if (fatal.length) return { format: null, records: [], problems: fatal, rowsRead: 0, sizeBytes, sha256: hash.digest("hex") };
  return { ...checker.finish(), sizeBytes, sha256: hash.digest("hex") };
}
