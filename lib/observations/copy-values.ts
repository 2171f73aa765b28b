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

/**
 * One row of PostgreSQL's binary COPY format for observation_values: [field count][version]
 * [plot][quadrats][species][values], each field after its byte length. An array is
 * [dimensions=1][has nulls=0][element type][length][lower bound=1] and then each element
 * after its byte length (arrayfuncs.c, array_send).
 */
function encodeRow(versionId: Buffer, plotId: Buffer, plot: PlotValues, encodedSpecies: Map<string, Buffer>): Buffer {
  const count = plot.quadrats.length;
  const species = plot.species.map((name) => {
    let bytes = encodedSpecies.get(name);
    if (!bytes) encodedSpecies.set(name, (bytes = Buffer.from(name, "utf8")));
    return bytes;
  });
  let speciesBytes = 0;
  for (const bytes of species) speciesBytes += bytes.length;
  const arrayHead = 20;
  const quadratsSize = arrayHead + count * 8;
  const speciesSize = arrayHead + count * 4 + speciesBytes;
  const valuesSize = arrayHead + count * 12;
  const row = Buffer.allocUnsafe(2 + (4 + 16) * 2 + 4 + quadratsSize + 4 + speciesSize + 4 + valuesSize);
  let at = row.writeInt16BE(5, 0);
  at = row.writeInt32BE(16, at);
  at += versionId.copy(row, at);
  at = row.writeInt32BE(16, at);
  at += plotId.copy(row, at);
  const arrayStart = (size: number, elementOid: number) => {
    at = row.writeInt32BE(size, at);
    at = row.writeInt32BE(1, at);
    at = row.writeInt32BE(0, at);
    at = row.writeInt32BE(elementOid, at);
    at = row.writeInt32BE(count, at);
    at = row.writeInt32BE(1, at);
  };
  arrayStart(quadratsSize, INT4_OID);
  for (const quadrat of plot.quadrats) {
    at = row.writeInt32BE(4, at);
    at = row.writeInt32BE(quadrat, at);
  }
  arrayStart(speciesSize, TEXT_OID);
  for (const bytes of species) {
    at = row.writeInt32BE(bytes.length, at);
    at += bytes.copy(row, at);
  }
  arrayStart(valuesSize, FLOAT8_OID);
  for (const value of plot.values) {
    at = row.writeInt32BE(8, at);
    at = row.writeDoubleBE(value, at);
  }
  return row;
}

const uuidBytes = (uuid: string) => Buffer.from(uuid.replace(/-/g, ""), "hex");

function* binaryRows(plots: readonly PlotValues[], versionId: string, plotIds: Map<number, string>): Generator<Buffer> {
  const header = Buffer.alloc(SIGNATURE.length + 8);
  SIGNATURE.copy(header);
  yield header;
  const version = uuidBytes(versionId);
  const encodedSpecies = new Map<string, Buffer>();
  for (const plot of plots) {
    const plotId = plotIds.get(plot.plotNumber);
    if (!plotId) throw new Error(`plot ${plot.plotNumber} has no id`);
    yield encodeRow(version, uuidBytes(plotId), plot, encodedSpecies);
  }
  const trailer = Buffer.alloc(2);
  trailer.writeInt16BE(-1);
  yield trailer;
}

/**
 * A version's values as one binary COPY payload for observation_values, a row per plot.
 * Encoded ahead of the COPY, while the database is still busy with the version's own row.
 */
export function encodeValues(plots: readonly PlotValues[], versionId: string, plotIds: Map<number, string>): Buffer {
  return Buffer.concat([...binaryRows(plots, versionId, plotIds)]);
}

/** Sends an encoded payload with COPY on the client that holds the version's transaction. Binary, so PostgreSQL parses no text. */
export async function copyValues(client: pg.ClientBase, payload: Buffer): Promise<void> {
  const target = client.query(copyFrom('COPY observation_values (version_id, plot_id, quadrats, species, "values") FROM STDIN (FORMAT binary)'));
  await pipeline(Readable.from([payload], { objectMode: false }), target);
}
