import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { neutraliseCell, toSafeCsv } from "@/lib/exports/safe-csv";

describe("CSV export against formula injection", () => {
  it("neutralises cells a spreadsheet would run as formulas", () => {
    // The four leading characters named by the OWASP guidance on CSV injection, plus tab and CR.
    for (const cell of ["=SUM(A1:A9)", "+1+1", "-2+3", "@cmd", "\t=1", "\r=1"]) expect(neutraliseCell(cell)).toBe(`'${cell}`);
    expect(neutraliseCell("Straw mulch")).toBe("Straw mulch");
    expect(neutraliseCell(-3)).toBe(-3);
  });

  it("round-trips through a CSV reader with the apostrophe kept", () => {
    const csv = toSafeCsv(["plot", "species", "value"], [[101, '=HYPERLINK("x")', 4.5]]);
    expect(csv).toBe('plot,species,value\r\n101,"\'=HYPERLINK(""x"")",4.5');
    expect(Papa.parse<string[]>(csv).data[1]).toEqual(["101", '\'=HYPERLINK("x")', "4.5"]);
  });
});
