import { Readable } from "node:stream";
import { pipeline } from "node:stream/promises";
import type pg from "pg";
import { from as copyFrom } from "pg-copy-streams";
import type { PlotValues } from "./group-values";

const SIGNATURE = Buffer.from("PGCOPY\n\xff\r\n\0", "latin1");
// Element type oids of PostgreSQL's built-in types, fixed since its first releases.
const INT4_OID = 23;
const TEXT_OID = 25;
const FLOAT8_OID = 701;
const ARRAY_HEAD = 20;
/** Bytes per buffer of the payload: a few large writes, none too large to allocate at once. */
const BATCH_BYTES = 256 * 1024;

const uuidBytes = (uuid: string) => Buffer.from(uuid.replace(/-/g, ""), "hex");

interface EncodedPlot {
  plotId: Buffer;
  names: Buffer[];
  nameBytes: number;
  size: number;
}

/** A plot's row in bytes before writing it, so a batch is allocated once at its final size. */
function measure(plot: PlotValues, plotId: Buffer, encodedNames: Map<string, Buffer>): EncodedPlot {
  const count = plot.quadrats.length;
  const names = plot.speciesNames.map((name) => {
    let bytes = encodedNames.get(name);
    if (!bytes) encodedNames.set(name, (bytes = Buffer.from(name, "utf8")));
    return bytes;
  });
  let nameBytes = 0;
  for (const bytes of names) nameBytes += bytes.length;
  const size =
    2 + (4 + 16) * 2 + (4 + ARRAY_HEAD + count * 8) + (4 + ARRAY_HEAD + names.length * 4 + nameBytes) + (4 + ARRAY_HEAD + count * 8) + (4 + ARRAY_HEAD + count * 12);
  return { plotId, names, nameBytes, size };
}

/**
 * One row of PostgreSQL's binary COPY format for observation_values: [field count][version]
 * [plot][quadrats][species names][species numbers][values], each field after its byte length.
 * An array is [dimensions=1][has nulls=0][element type][length][lower bound=1] and then each
 * element after its byte length (arrayfuncs.c, array_send). Returns the offset after the row.
 */
function writeRow(target: Buffer, view: DataView, start: number, versionId: Buffer, plot: PlotValues, encoded: EncodedPlot): number {
  let at = start;
  view.setInt16(at, 6);
  view.setInt32(at + 2, 16);
  versionId.copy(target, at + 6);
  view.setInt32(at + 22, 16);
  encoded.plotId.copy(target, at + 26);
  at += 42;
  const arrayStart = (count: number, elementBytes: number, elementOid: number) => {
    view.setInt32(at, ARRAY_HEAD + elementBytes);
    view.setInt32(at + 4, 1);
    view.setInt32(at + 8, 0);
    view.setInt32(at + 12, elementOid);
    view.setInt32(at + 16, count);
    view.setInt32(at + 20, 1);
    at += 4 + ARRAY_HEAD;
  };
  const writeIntegers = (numbers: number[]) => {
    arrayStart(numbers.length, numbers.length * 8, INT4_OID);
    for (const number of numbers) {
      view.setInt32(at, 4);
      view.setInt32(at + 4, number);
      at += 8;
    }
  };
  writeIntegers(plot.quadrats);
  arrayStart(encoded.names.length, encoded.names.length * 4 + encoded.nameBytes, TEXT_OID);
  for (const bytes of encoded.names) {
    view.setInt32(at, bytes.length);
    at += 4 + bytes.copy(target, at + 4);
  }
  writeIntegers(plot.speciesNumbers);
  arrayStart(plot.values.length, plot.values.length * 12, FLOAT8_OID);
  for (const value of plot.values) {
    view.setInt32(at, 8);
    view.setFloat64(at + 4, value);
    at += 12;
  }
  return at;
}

/**
 * A version's values in PostgreSQL's binary COPY format for observation_values, a row per
 * plot, in batches of about BATCH_BYTES: signature and header first, the end marker last.
 */
export function* encodeValues(plots: readonly PlotValues[], versionId: string, plotIds: ReadonlyMap<number, string>): Generator<Buffer> {
  const header = Buffer.alloc(SIGNATURE.length + 8);
  SIGNATURE.copy(header);
  yield header;
  const version = uuidBytes(versionId);
  const encodedNames = new Map<string, Buffer>();
  let next = 0;
  while (next < plots.length) {
    const batch: EncodedPlot[] = [];
    let size = 0;
    for (; next < plots.length && (batch.length === 0 || size < BATCH_BYTES); next += 1) {
      const plotId = plotIds.get(plots[next].plotNumber);
      if (!plotId) throw new Error(`plot ${plots[next].plotNumber} has no id`);
      const encoded = measure(plots[next], uuidBytes(plotId), encodedNames);
      batch.push(encoded);
      size += encoded.size;
    }
    const target = Buffer.allocUnsafe(size);
    const view = new DataView(target.buffer, target.byteOffset, target.byteLength);
    let at = 0;
    for (let index = 0; index < batch.length; index += 1) at = writeRow(target, view, at, version, plots[next - batch.length + index], batch[index]);
    yield target;
  }
  const trailer = Buffer.alloc(2);
  trailer.writeInt16BE(-1);
  yield trailer;
}

/**
 * Sends an encoded payload with one binary COPY on the client that holds the version's
 * transaction. Binary, so PostgreSQL parses no text.
 */
export async function copyValues(client: pg.ClientBase, payload: readonly Buffer[]): Promise<void> {
  const target = client.query(copyFrom('COPY observation_values (version_id, plot_id, quadrats, species_names, species_numbers, "values") FROM STDIN (FORMAT binary)'));
  await pipeline(Readable.from(payload, { objectMode: false }), target);
}
