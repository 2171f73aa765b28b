import { describe, expect, it } from "vitest";
import { readCsv } from "@/lib/ingest/read-csv";
import { recordsOf } from "@/lib/ingest/types";
import type { IngestContext } from "@/lib/ingest/types";

const plots = [101, 102, 103, 201, 202, 203].map((number, index) => ({ number, treatmentCode: `T${(index % 3) + 1}` }));
const context: IngestContext = { plots, quadratsPerPlot: 2, unit: "plants per quadrat", plausibleMin: 0, plausibleMax: 400 };

async function* chunks(...parts: (string | Uint8Array)[]): AsyncIterable<Uint8Array> {
  for (const part of parts) yield typeof part === "string" ? new TextEncoder().encode(part) : part;
}

const fullLongFile = ["plot,quadrat,species,value", ...plots.flatMap((plot) => [1, 2].map((q) => `${plot.number},${q},,${plot.number % 7 + q}`))].join("\r\n");

describe("reading a data file", () => {
  it("takes a complete long-format sheet with every value and no problems", async () => {
    const result = await readCsv(chunks(fullLongFile), context);
    expect(result.problems).toEqual([]);
    expect(result.format).toBe("long");
    expect(recordsOf(result.values)).toHaveLength(12);
    expect(recordsOf(result.values)[0]).toEqual({ row: 2, plotNumber: 101, quadrat: 1, species: "", value: 101 % 7 + 1 });
    expect(result.sizeBytes).toBe(Buffer.byteLength(fullLongFile));
  });

  it("computes the SHA-256 of exactly the bytes received, across chunk borders", async () => {
    const { createHash } = await import("node:crypto");
    const half = Math.floor(fullLongFile.length / 2);
    const result = await readCsv(chunks(fullLongFile.slice(0, half), fullLongFile.slice(half)), context);
    expect(result.sha256).toBe(createHash("sha256").update(fullLongFile).digest("hex"));
    expect(recordsOf(result.values)).toHaveLength(12);
  });

  it("takes the wide layout with one column per quadrat, and a BOM", async () => {
    const file = "\ufeffplot,q1,q2\n101,3,4\n102,0,1\n103,5,\n201,1,1\n202,2,2\n203,9,8\n";
    const result = await readCsv(chunks(file), context);
    expect(result.format).toBe("wide");
    expect(recordsOf(result.values)).toHaveLength(11);
    expect(result.problems).toEqual([
      expect.objectContaining({ severity: "warning", code: "no-value", row: 4, column: "q2" }),
      expect.objectContaining({ severity: "warning", code: "missing-quadrat", message: expect.stringContaining("Plot 103 has fewer than 2 quadrats") }),
    ]);
  });

  it("names the row and the fix for each bad value", async () => {
    const file = [
      "plot,quadrat,species,value",
      "101,1,,4",
      "109,1,,4",
      "101,1,,5",
      "102,3,,2",
      "102,1,,many",
      "103,1,,-2",
      '103,2,,"12,5"',
      "201,1,,950",
    ].join("\n");
    const result = await readCsv(chunks(file), context);
    const byRow = Object.fromEntries(result.problems.filter((p) => p.row).map((p) => [p.row, [p.code, p.severity, p.message]]));
    expect(byRow[3]).toEqual(["unknown-plot", "error", "Row 3: plot 109 is not in this trial."]);
    expect(byRow[4]).toEqual(["duplicate", "error", "Row 4: plot 101, quadrat 1 already has a value in row 2. Keep one of them."]);
    expect(byRow[5]).toEqual(["bad-quadrat", "error", 'Row 5: quadrat "3" is not between 1 and 2.']);
    expect(byRow[6]).toEqual(["not-a-number", "error", 'Row 6: "many" for plot 102, quadrat 1 is not a number.']);
    expect(byRow[7][0]).toBe("negative");
    expect(byRow[8]).toEqual(["not-a-number", "error", 'Row 8: "12,5" uses a comma as decimal mark; write it with a point (12.5).']);
    expect(byRow[9][0]).toBe("implausible");
    expect(byRow[9][1]).toBe("warning");
    expect(result.problems.find((p) => p.code === "missing-plot")?.message).toBe("No values for plots 102, 103, 202, 203. They are analysed as lost plots unless you add them.");
  });

  it("tells species apart, case aside, however many a sheet lists", async () => {
    const species = Array.from({ length: 40 }, (_, index) => `weed${index + 1}`);
    const file = [
      "plot,quadrat,species,value",
      ...species.map((name) => `101,1,${name},1`),
      "101,1,Weed3,2",
      "101,1,WEED40,2",
      "101,2,weed40,2",
      ...plots.filter((plot) => plot.number !== 101).map((plot) => `${plot.number},1,weed1,1`),
    ].join("\n");
    const result = await readCsv(chunks(file), context);
    expect(result.problems.filter((p) => p.code === "duplicate").map((p) => p.message)).toEqual([
      "Row 42: plot 101, quadrat 1, Weed3 already has a value in row 4. Keep one of them.",
      "Row 43: plot 101, quadrat 1, WEED40 already has a value in row 41. Keep one of them.",
    ]);
    expect(recordsOf(result.values)).toHaveLength(40 + 1 + 5);
    expect(result.problems.find((p) => p.code === "missing-quadrat")?.message).toBe(
      "Plots 102, 103, 201, 202, 203 have fewer than 2 quadrats; the plot mean uses the quadrats present.",
    );
  });

  it("flags a value outside the plausible range but keeps it", async () => {
    const result = await readCsv(chunks("plot,quadrat,value\n101,1,950\n"), context);
    expect(recordsOf(result.values).map((r: { value: number }) => r.value)).toEqual([950]);
    expect(result.problems.filter((p) => p.severity === "error")).toEqual([]);
  });

  it("refuses values in another unit, from the header or a unit column", async () => {
    const header = await readCsv(chunks("plot,quadrat,value (g)\n101,1,3\n"), context);
    expect(header.problems[0]).toMatchObject({ code: "wrong-unit", severity: "error", message: "The values are in g, but this assessment records plants per quadrat. Convert them or check that this is the right assessment." });
    const column = await readCsv(chunks("plot,quadrat,value,unit\n101,1,3,g\n"), context);
    expect(column.problems[0]).toMatchObject({ code: "wrong-unit", row: 2 });
  });

  it("warns about columns it does not use", async () => {
    const result = await readCsv(chunks("plot,quadrat,value,assessor\n101,1,3,ana\n"), context);
    expect(result.problems[0]).toEqual({ severity: "warning", code: "extra-column", row: 1, column: "assessor", message: 'The column "assessor" is not used; its values are ignored.' });
  });

  it("catches a plot number that carries another treatment than the sheet says", async () => {
    const result = await readCsv(chunks("plot,treatment,quadrat,value\n101,T2,1,3\n"), context);
    expect(result.problems[0]).toMatchObject({ code: "treatment-mismatch", message: "Row 2: plot 101 carries treatment T1 in this trial, not T2. Check the plot number." });
  });

  describe("whole-file problems stop reading with one message", () => {
    const cases: [string, (string | Uint8Array)[], string, RegExp][] = [
      ["an empty file", [""], "empty-file", /The file is empty/],
      ["a header only", ["plot,quadrat,value\n"], "no-values", /has a header but no values/],
      ["a workbook", [new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3])], "not-csv", /spreadsheet workbook.*Save as/],
      ["a PDF", ["%PDF-1.7\n..."], "not-csv", /PDF document/],
      ["binary bytes", [new Uint8Array([0x70, 0x6c, 0x00, 0x74])], "not-csv", /binary data/],
      ["UTF-16 text", [new Uint8Array([0xff, 0xfe, 0x70, 0x00])], "encoding", /UTF-16/],
      ["Latin-1 text", [new Uint8Array([0x70, 0x6c, 0x6f, 0x74, 0x2c, 0x76, 0x61, 0x6c, 0x75, 0x65, 0x0a, 0x31, 0x30, 0x31, 0x2c, 0xe9, 0x0a])], "encoding", /not UTF-8/],
      ["semicolons", ["plot;quadrat;value\n101;1;3\n"], "delimiter", /semicolons/],
      ["tabs", ["plot\tquadrat\tvalue\n101\t1\t3\n"], "delimiter", /tabs/],
      ["no plot column", ["parcel,quadrat,value\n1,1,1\n"], "missing-column", /no "plot" column/],
    ];
    for (const [name, parts, code, message] of cases) {
      it(`refuses ${name}`, async () => {
        const result = await readCsv(chunks(...parts), context);
        expect(recordsOf(result.values)).toEqual([]);
        const errors = result.problems.filter((p) => p.severity === "error");
        expect(errors[0].code).toBe(code);
        expect(errors[0].message).toMatch(message);
      });
    }
  });

  it("refuses a wide sheet with two columns for one quadrat", async () => {
    const result = await readCsv(chunks("plot,q1,Q1,q2\n101,1,2,3\n"), context);
    expect(result.problems[0]).toEqual({ severity: "error", code: "extra-column", row: 1, column: "Q1", message: 'Columns "q1" and "Q1" are both quadrat 1; keep one.' });
    // The row is read once, by the first of the two columns: no value repeats itself.
    expect(result.problems.filter((p) => p.code === "duplicate")).toEqual([]);
    expect(recordsOf(result.values).map((r) => [r.quadrat, r.value])).toEqual([[1, 1], [2, 3]]);
  });

  it("gives a refused file's size and checksum over every byte, and puts the byte limit before what parsing finds", async () => {
    const { createHash } = await import("node:crypto");
    const file = "plot;quadrat;value\n101;1;3\n".repeat(20);
    const refused = await readCsv(chunks(file.slice(0, 30), file.slice(30)), context);
    expect(refused.problems).toEqual([expect.objectContaining({ code: "delimiter" })]);
    expect(refused.sizeBytes).toBe(file.length);
    expect(refused.sha256).toBe(createHash("sha256").update(file).digest("hex"));
    const large = await readCsv(chunks(file.slice(0, 30), file.slice(30)), context, { maxBytes: 100, maxRows: 10, maxColumns: 5 });
    expect(large.problems).toEqual([expect.objectContaining({ code: "too-large" })]);
  });

  it("enforces the byte, row and column limits before going on", async () => {
    const limits = { maxBytes: 64, maxRows: 3, maxColumns: 5 };
    const big = await readCsv(chunks("plot,quadrat,value\n", "x".repeat(80)), context, limits);
    expect(big.problems[0]).toMatchObject({ code: "too-large" });
    const rows = await readCsv(chunks("plot,quadrat,value\n101,1,1\n101,2,1\n102,1,1\n102,2,1\n"), context, { ...limits, maxBytes: 10_000 });
    expect(rows.problems[0]).toMatchObject({ code: "too-many-rows" });
    const wide = await readCsv(chunks(`${Array.from({ length: 100_000 }, (_, i) => `c${i}`).join(",")}\n`), context, { ...limits, maxBytes: 10_000_000 });
    expect(wide.problems[0]).toMatchObject({ code: "too-many-columns", message: "The header has 100000 columns; a data file has at most 5. Use the data sheet template." });
  });
});
