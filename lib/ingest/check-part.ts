import type { PartOutcome, PartRequest } from "./checked-part";
import { decodeUtf8, parseRows } from "./parse-rows";
import { RowChecker } from "./row-checker";
import type { IngestProblem } from "./types";

type Pieces = AsyncIterable<Uint8Array> | Iterable<Uint8Array>;

async function* headerThen(header: Uint8Array, bytes: Pieces): AsyncGenerator<Uint8Array> {
  yield header;
  yield* bytes;
}

/**
 * Checks the later part of a file (its bytes after a line break) as a single pass over the
 * whole file would check those lines: same columns (from the header), same line numbers, same
 * limits. Runs on the second thread, or on the first when no second is free.
 */
export async function checkPart(request: PartRequest, bytes: Pieces): Promise<PartOutcome> {
  const fatal: IngestProblem[] = [];
  const checker = new RowChecker(request.context, { reportHeader: false });
  await parseRows(decodeUtf8(headerThen(request.header, bytes), fatal), checker, {
    limits: request.limits,
    fatal,
    firstRow: request.firstRow,
    newline: request.newline,
  });
  return fatal.length ? { fatal: fatal[0] } : { part: checker.exportPart() };
}
