import { createHash } from "node:crypto";
import { claimCheckThread, type PartJob } from "./check-thread";
import { checkPart } from "./check-part";
import type { PartOutcome, PartRequest } from "./checked-part";
import { ChunkQueue } from "./chunk-queue";
import { LineScan } from "./line-scan";
import { decodeUtf8, parseRows } from "./parse-rows";
import { RowChecker } from "./row-checker";
import { sniffFile } from "./sniff";
import { defaultIngestLimits, noValues, type IngestContext, type IngestLimits, type IngestProblem, type IngestResult } from "./types";

export interface ReadCsvResult extends IngestResult {
  sizeBytes: number;
  sha256: string;
}

export interface ReadCsvOptions {
  /**
   * The file's size, when storage tells it before the bytes arrive: a file of at least
   * `splitFromBytes` is checked in two parts at once, the later part on a second thread.
   */
  expectedBytes?: number;
  splitFromBytes?: number;
  /** Where a later part goes: the second thread unless a test says otherwise. */
  claimPartChecker?: (request: PartRequest) => PartJob | null;
}

/** Below this a second thread saves less than handing it the bytes costs. */
export const SPLIT_FROM_BYTES = 256 * 1024;

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

/**
 * The first part's text, with the whole-file checks the first text allows (the delimiter).
 * Between pieces the event loop turns, so the bytes still arriving are read meanwhile (and
 * the later part reaches its thread) instead of waiting for the parse of all queued pieces.
 */
async function* firstPartText(bytes: AsyncIterable<Uint8Array>, fatal: IngestProblem[]): AsyncGenerator<string> {
  let first = true;
  for await (const text of decodeUtf8(bytes, fatal)) {
    await new Promise((resolve) => setImmediate(resolve));
    if (first) {
      first = false;
      const problem = wrongDelimiter(text.replace(/^\ufeff/, "").split(/\r?\n/)[0]);
      if (problem) {
        fatal.push(problem);
        return;
      }
    }
    yield text;
  }
}

/**
 * Streams a data file through checks without holding it twice in memory: byte limit, file
 * type, UTF-8, delimiter, column and row limits, then every row through RowChecker.
 * Whole-file problems stop the reading early with a single clear message.
 *
 * A large file whose first half has no quoted cells is cut at the line break after its middle:
 * its later part is checked on a second thread while this one checks the first, and the two
 * checks are joined as if one pass had read every line (RowChecker.absorb).
 */
export async function readCsv(
  source: AsyncIterable<Uint8Array>,
  context: IngestContext,
  limits: IngestLimits = defaultIngestLimits,
  options: ReadCsvOptions = {},
): Promise<ReadCsvResult> {
  const hash = createHash("sha256");
  const checker = new RowChecker(context);
  const fatal: IngestProblem[] = [];
  const firstPart = new ChunkQueue<Uint8Array>();
  const { expectedBytes = 0, splitFromBytes = SPLIT_FROM_BYTES, claimPartChecker = claimCheckThread } = options;
  const cutFrom = expectedBytes >= splitFromBytes ? Math.floor(expectedBytes / 2) : Infinity;
  let sizeBytes = 0;
  // The outcome is decided (a whole-file problem in the first part): the rest is only counted and hashed.
  let stopped = false;
  // The caller has gone (an error): the rest is not even read.
  let abandoned = false;
  // Found while reading, and first in what is reported: what kind of file this is (its first
  // bytes), then the byte limit. Both are facts about the bytes, found the same way however
  // the file is parsed, so one pass and two halves report the same.
  let sniffProblem: IngestProblem | null = null;
  let overLimit = false;

  // The later part: its request, the thread checking it, and its bytes (kept in case the
  // thread fails, when this thread checks them itself).
  let later = null as { request: PartRequest; job: PartJob; chunks: Uint8Array[] } | null;

  // Bytes are read as fast as they arrive, not as fast as the first part is parsed, so the
  // later part reaches the second thread early. Every byte up to the limit is counted and
  // hashed, a refused file's too: its size and checksum are the whole file's.
  async function readBytes(): Promise<void> {
    const scan = new LineScan();
    let cutting = Number.isFinite(cutFrom);
    let sniffed = false;
    let header = new Uint8Array();
    let offset = 0;
    for await (const chunk of source) {
      if (abandoned) break;
      sizeBytes += chunk.byteLength;
      if (sizeBytes > limits.maxBytes) {
        overLimit = true;
        break;
      }
      hash.update(chunk);
      if (!sniffed) {
        sniffed = true;
        sniffProblem = sniffFile(chunk);
        const headerEnd = chunk.indexOf(10);
        // A header longer than the first piece: too odd a file to cut.
        if (headerEnd === -1) cutting = false;
        else header = new Uint8Array(chunk.subarray(0, headerEnd + 1));
      }
      if (sniffProblem || stopped) continue;
      if (later) {
        later.chunks.push(chunk);
        later.job.send(chunk);
        continue;
      }
      let firstBytes = chunk;
      if (cutting) {
        // Never inside the first piece: papaparse guesses the line break from all of it, so the
        // first part must hold all of it for the two to agree on the line break.
        const cut = offset > 0 && offset + chunk.length > cutFrom ? chunk.indexOf(10, Math.max(0, cutFrom - offset)) : -1;
        if (cut !== -1) firstBytes = chunk.subarray(0, cut + 1);
        scan.take(firstBytes);
        const newline = cut !== -1 ? scan.newline() : null;
        const request: PartRequest | null = newline ? { context, limits, header, firstRow: scan.lines + 1, newline } : null;
        const job = request ? claimPartChecker(request) : null;
        if (request && job) {
          later = { request, job, chunks: [] };
          const rest = chunk.subarray(cut + 1);
          if (rest.length > 0) {
            later.chunks.push(rest);
            job.send(rest);
          }
        } else if (cut !== -1) {
          // Not cut after all: this thread reads the whole file.
          cutting = false;
          firstBytes = chunk;
        }
      }
      offset += chunk.length;
      firstPart.push(firstBytes);
    }
    if (!sniffed) sniffProblem = sniffFile(new Uint8Array());
    firstPart.end();
    later?.job.end();
  }

  const reading = readBytes().catch((error: Error) => {
    firstPart.fail(error);
    throw error;
  });
  reading.catch(() => {});
  let outcome: PartOutcome | null = null;
  let settled = false;
  try {
    await parseRows(firstPartText(firstPart, fatal), checker, { limits, fatal });
    if (fatal.length) stopped = true;
    await reading;
    if (later && !fatal.length && !sniffProblem && !overLimit) {
      const { request, job, chunks } = later;
      outcome = await job.outcome.catch(() => checkPart(request, chunks));
    }
    settled = true;
  } finally {
    if (!settled) abandoned = true;
    // Refused on the first part, or failed: the second thread is let go for the next file.
    if (later && outcome === null) later.job.drop();
  }
  const tooLarge: IngestProblem = { severity: "error", code: "too-large", message: `The file is larger than ${Math.round(limits.maxBytes / 1024 / 1024)} MB, the most one upload may be.` };
  // The first part's problems come before the later part's in the file.
  const problem = sniffProblem ?? (overLimit ? tooLarge : null) ?? fatal[0] ?? (outcome && "fatal" in outcome ? outcome.fatal : null);
  if (problem) return { format: null, values: noValues(), problems: [problem], rowsRead: 0, sizeBytes, sha256: hash.digest("hex") };
  if (outcome && "part" in outcome) checker.absorb(outcome.part);
  return { ...checker.finish(), sizeBytes, sha256: hash.digest("hex") };
}
