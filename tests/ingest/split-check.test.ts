import { createHash } from "node:crypto";
import { describe, expect, it } from "vitest";
import { claimCheckThread, type PartJob } from "@/lib/ingest/check-thread";
import { checkPart } from "@/lib/ingest/check-part";
import type { PartRequest } from "@/lib/ingest/checked-part";
import { ChunkQueue } from "@/lib/ingest/chunk-queue";
import { readCsv, type ReadCsvOptions } from "@/lib/ingest/read-csv";
import { defaultIngestLimits, type IngestContext, type IngestLimits } from "@/lib/ingest/types";

// A large file is checked in two parts on two threads; whatever the file, the result must be
// the one a single pass over it gives (which tests/ingest/read-csv.test.ts pins down).

const plotNumbers = Array.from({ length: 12 }, (_, index) => (Math.floor(index / 4) + 1) * 100 + (index % 4) + 1);
const context: IngestContext = {
  plots: plotNumbers.map((number, index) => ({ number, treatmentCode: `T${(index % 4) + 1}` })),
  quadratsPerPlot: 6,
  unit: "plants per quadrat",
  plausibleMin: 0,
  plausibleMax: 50,
};

/** The file in pieces of a few dozen bytes, so a cut falls inside a piece and several follow it. */
async function* pieces(file: string | Uint8Array, size = 61): AsyncIterable<Uint8Array> {
  const bytes = typeof file === "string" ? new TextEncoder().encode(file) : file;
  for (let start = 0; start < bytes.length; start += size) yield bytes.subarray(start, start + size);
}

const byteLength = (file: string | Uint8Array) => (typeof file === "string" ? Buffer.byteLength(file) : file.length);

/** Checks the file in one pass and cut in two, and gives both results and the cuts made. */
async function bothWays(file: string | Uint8Array, limits: IngestLimits = defaultIngestLimits, claim: (request: PartRequest) => PartJob | null = claimCheckThread) {
  const cuts: PartRequest[] = [];
  const options: ReadCsvOptions = {
    expectedBytes: byteLength(file),
    splitFromBytes: 1,
    claimPartChecker: (request) => {
      cuts.push(request);
      return claim(request);
    },
  };
  const single = await readCsv(pieces(file), context, limits);
  const split = await readCsv(pieces(file), context, limits, options);
  return { single, split, cuts };
}

/** Line number of the first line that starts at or after the middle byte (the cut's place). */
function lineAfterMiddle(file: string): number {
  const bytes = Buffer.from(file);
  const cut = bytes.indexOf(10, Math.floor(bytes.length / 2));
  return bytes.subarray(0, cut + 1).toString().split("\n").length;
}

/** Every plot and quadrat once, for two species (one written two ways), with values 0 to 9. */
function fullFile(newline = "\n"): string[] {
  const lines = ["plot,quadrat,species,value"];
  for (const plot of plotNumbers) {
    for (let quadrat = 1; quadrat <= 6; quadrat += 1) {
      lines.push(`${plot},${quadrat},pigweed,${(plot + quadrat) % 10}`);
      lines.push(`${plot},${quadrat},${plot > 200 ? "Purslane" : "purslane"},${quadrat}`);
    }
  }
  void newline;
  return lines;
}

describe("checking a large file in two parts at once", () => {
  it("gives a clean file's values, line numbers and checksum exactly as one pass does", async () => {
    const file = `${fullFile().join("\n")}\n`;
    const { single, split, cuts } = await bothWays(file);
    expect(cuts).toHaveLength(1);
    expect(cuts[0].firstRow).toBe(lineAfterMiddle(file));
    expect(cuts[0].newline).toBe("\n");
    expect(single.problems).toEqual([]);
    expect(split).toEqual(single);
    expect(split.values.rows.at(-1)).toBe(145);
    expect([...split.values.speciesIndexes.slice(-2)].map((index) => split.values.speciesNames[index])).toEqual(["pigweed", "Purslane"]);
  });

  it("finds every problem in either part, and duplicates across the cut, in file order", async () => {
    const lines = fullFile();
    // Early lines, repeated late: the later copy is the duplicate (one of them out of range too).
    lines[3] = "101,2,pigweed,75";
    lines.push("101,2,pigweed,80", "101,3,PIGWEED,4", "102,1,purslane,");
    lines.splice(100, 0, "999,1,pigweed,1", "102,2,pigweed,many", "103,2,pigweed,-3", "104,7,pigweed,1", "104,3,pigweed,2,extra");
    lines.splice(20, 0, "102,3,purslane,3,5", "203,1,pigweed,12,5");
    const file = `${lines.join("\n")}\n`;
    const { single, split, cuts } = await bothWays(file);
    expect(cuts).toHaveLength(1);
    expect(single.problems.map((problem) => problem.code)).toEqual([
      "implausible",
      "ragged-row",
      "ragged-row",
      "unknown-plot",
      "not-a-number",
      "negative",
      "bad-quadrat",
      "ragged-row",
      "duplicate",
      "duplicate",
      "no-value",
    ]);
    expect(single.problems.find((problem) => problem.row === lines.length - 2)?.message).toBe(
      `Row ${lines.length - 2}: plot 101, quadrat 2, pigweed already has a value in row 4. Keep one of them.`,
    );
    expect(split).toEqual(single);
  });

  it("reads a file with Windows line breaks, and a wide file, as one pass does", async () => {
    const crlf = `${fullFile().join("\r\n")}\r\n`;
    const windows = await bothWays(crlf);
    expect(windows.cuts[0]?.newline).toBe("\r\n");
    expect(windows.split).toEqual(windows.single);

    const wideLines = ["plot,q1,q2,q3,q4,q5,q6", ...plotNumbers.map((plot) => `${plot},1,2,3,4,5,6`), ...plotNumbers.map((plot) => `${plot},1,2,3,4,5,6`), "101,,60,,,,"];
    const wide = await bothWays(`${wideLines.join("\n")}\n`);
    expect(wide.cuts).toHaveLength(1);
    expect(wide.single.problems.filter((problem) => problem.code === "duplicate")).toHaveLength(73);
    expect(wide.split).toEqual(wide.single);
  });

  it("lists the first 500 problems of the whole file and counts the rest, as one pass does", async () => {
    const lines = ["plot,quadrat,species,value", ...Array.from({ length: 1_400 }, (_, index) => `${index % 3 === 0 ? 999 : 101},1,pigweed,${index}`)];
    const { single, split, cuts } = await bothWays(`${lines.join("\n")}\n`);
    expect(cuts).toHaveLength(1);
    expect(single.problems).toHaveLength(501);
    expect(single.problems.at(-1)?.message).toMatch(/^\d+ further problems are not listed/);
    expect(split).toEqual(single);
  });

  it("refuses the whole file for a problem only the later part has", async () => {
    const head = `${fullFile().join("\n")}\n`;
    const latin1 = Buffer.concat([Buffer.from(head), Buffer.from([0x31, 0x30, 0x31, 0x2c, 0xe9, 0x0a])]);
    const encoding = await bothWays(latin1);
    expect(encoding.cuts).toHaveLength(1);
    expect(encoding.split.problems).toEqual([expect.objectContaining({ code: "encoding" })]);
    // Size and checksum too: a refused file's are the whole file's, however it was read.
    expect(encoding.split).toEqual(encoding.single);
    expect(encoding.split.sha256).toBe(createHash("sha256").update(latin1).digest("hex"));
    expect(encoding.split.sizeBytes).toBe(latin1.length);

    const rows = await bothWays(head, { ...defaultIngestLimits, maxRows: 140 });
    expect(rows.split.problems).toEqual([expect.objectContaining({ code: "too-many-rows" })]);
    expect(rows.split).toEqual(rows.single);

    const large = await bothWays(head, { ...defaultIngestLimits, maxBytes: Math.floor(byteLength(head) * 0.75) });
    expect(large.split.problems).toEqual([expect.objectContaining({ code: "too-large" })]);
    expect(large.split).toEqual(large.single);
  });

  it("cuts no file inside its first piece, from which papaparse guesses the line break", async () => {
    // Windows breaks first, then old-Mac ones: one pass splits lines at the break guessed from the first piece.
    // The Windows lines are long, so the file's middle falls among them.
    const lines = fullFile().map((line, index) => (index > 0 && index <= 20 ? line.replace(/,(pigweed|purslane),/, `,${"x".repeat(200)}$1,`) : line));
    const file = `${lines.slice(0, 21).join("\r\n")}\r\n${lines.slice(21).join("\r")}\r`;
    expect(file.indexOf("\r", file.length / 2)).toBeLessThan(file.lastIndexOf("\r\n"));
    const cuts: PartRequest[] = [];
    const options: ReadCsvOptions = { expectedBytes: byteLength(file), splitFromBytes: 1, claimPartChecker: (request) => (cuts.push(request), claimCheckThread(request)) };
    const single = await readCsv(pieces(file, byteLength(file)), context);
    const split = await readCsv(pieces(file, byteLength(file)), context, defaultIngestLimits, options);
    expect(cuts).toEqual([]);
    expect(split).toEqual(single);
  });

  it("does not cut a file whose first half has a quoted cell or mixed line breaks", async () => {
    const lines = fullFile();
    lines[5] = '101,3,"pigweed",3';
    const quoted = await bothWays(`${lines.join("\n")}\n`);
    expect(quoted.cuts).toEqual([]);
    expect(quoted.split).toEqual(quoted.single);

    const mixed = await bothWays(`${fullFile().slice(0, 10).join("\r\n")}\r\n${fullFile().slice(10).join("\n")}\n`);
    expect(mixed.cuts).toEqual([]);
    expect(mixed.split).toEqual(mixed.single);
  });

  it("checks the later part itself when the second thread fails", async () => {
    const file = `${fullFile().join("\n")}\n`;
    const failing = (): PartJob => {
      const outcome = Promise.reject(new Error("the thread stopped"));
      outcome.catch(() => {});
      return { send: () => {}, end: () => {}, drop: () => {}, outcome };
    };
    const { single, split, cuts } = await bothWays(file, defaultIngestLimits, failing);
    expect(cuts).toHaveLength(1);
    expect(split).toEqual(single);
  });

  it("checks a later part on this thread the same as on the second", async () => {
    const file = `${fullFile().join("\n")}\n`;
    const here = (request: PartRequest): PartJob => {
      const bytes = new ChunkQueue<Uint8Array>();
      return { send: (piece) => bytes.push(piece), end: () => bytes.end(), drop: () => bytes.fail(new Error("dropped")), outcome: checkPart(request, bytes) };
    };
    const { single, split } = await bothWays(file, defaultIngestLimits, here);
    expect(split).toEqual(single);
  });
});
