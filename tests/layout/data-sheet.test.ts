import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { DataSheet } from "@/components/field/DataSheet";
import { csvField } from "@/lib/layout/csv";
import { dataSheetCsv } from "@/lib/layout/data-sheet";

// Given out of walking order on purpose.
const plots = [
  { number: 201, block: 2, treatmentCode: "HERB", walkOrder: 4 },
  { number: 101, block: 1, treatmentCode: "WC", walkOrder: 1 },
  { number: 102, block: 1, treatmentCode: "=SUM(A1)", walkOrder: 2 },
  { number: 202, block: 2, treatmentCode: "HW, 2x", walkOrder: 3 },
];

describe("dataSheetCsv", () => {
  it("long format: one row per plot × quadrat in walking order, blank species and value, CRLF", () => {
    const csv = dataSheetCsv({ plots, quadratsPerPlot: 2, format: "long" });
    expect(csv).toBe(["plot,quadrat,species,value", "101,1,,", "101,2,,", "102,1,,", "102,2,,", "202,1,,", "202,2,,", "201,1,,", "201,2,,"].map((line) => `${line}\r\n`).join(""));
  });

  it("wide format: one row per plot, one blank cell per quadrat", () => {
    const csv = dataSheetCsv({ plots, quadratsPerPlot: 3, format: "wide" });
    expect(csv.split("\r\n")).toEqual(["plot,q1,q2,q3", "101,,,", "102,,,", "202,,,", "201,,,", ""]);
  });

  it("leaves treatments out unless asked (blind scoring), and then quotes and defuses them", () => {
    expect(dataSheetCsv({ plots, quadratsPerPlot: 1, format: "wide" })).not.toContain("HERB");
    const csv = dataSheetCsv({ plots, quadratsPerPlot: 1, format: "wide", includeTreatment: true });
    expect(csv.split("\r\n")).toEqual(["plot,treatment,q1", "101,WC,", "102,'=SUM(A1),", '202,"HW, 2x",', "201,HERB,", ""]);
    const long = dataSheetCsv({ plots, quadratsPerPlot: 1, format: "long", includeTreatment: true });
    expect(long.split("\r\n")[0]).toBe("plot,treatment,quadrat,species,value");
  });

  it("refuses impossible quadrat counts and formats", () => {
    expect(() => dataSheetCsv({ plots, quadratsPerPlot: 0, format: "long" })).toThrow("Quadrats per plot");
    expect(() => dataSheetCsv({ plots, quadratsPerPlot: 1.5, format: "long" })).toThrow("Quadrats per plot");
    expect(() => dataSheetCsv({ plots, quadratsPerPlot: 1, format: "tall" as "long" })).toThrow("Unknown data sheet format");
  });
});

describe("csvField (RFC 4180)", () => {
  it("quotes commas, quotes and line breaks and doubles inner quotes", () => {
    expect(csvField('say "hi"')).toBe('"say ""hi"""');
    expect(csvField("a\r\nb")).toBe('"a\r\nb"');
    expect(csvField(101)).toBe("101");
    expect(csvField("+1")).toBe("'+1");
    expect(csvField("@cmd")).toBe("'@cmd");
    expect(csvField("-x")).toBe("'-x");
  });
});

describe("DataSheet", () => {
  const blindPlots = plots.map(({ number, block, walkOrder }) => ({ number, block, walkOrder }));
  const props = { trialTitle: "Carrot trial", assessmentName: "Weed density", unit: "plants/m²", plannedDate: "2025-06-01", quadratsPerPlot: 3, plots: blindPlots };

  it("prints the heading, blanks, and plots in walking order with quadrat and notes columns", () => {
    const html = renderToStaticMarkup(createElement(DataSheet, props));
    expect(html).toContain("Carrot trial");
    expect(html).toContain("Weed density");
    expect(html).toContain("planned 2025-06-01");
    for (const label of ["Date:", "Assessor:", "Weather:"]) expect(html).toContain(label);
    const order = ["101", "102", "202", "201"].map((number) => html.indexOf(`>${number}</th>`));
    expect(order.every((index, i) => index > 0 && (i === 0 || index > order[i - 1]))).toBe(true);
    expect(html).toContain("Q3 <span");
    expect(html).toContain(">Notes</th>");
    expect(html).not.toContain(">Treatment</th>");
    expect(html).not.toContain('role="note"');
  });

  it("shows treatments only when given and cautions when passed", () => {
    const html = renderToStaticMarkup(createElement(DataSheet, { ...props, cautions: ["Keep guards in place."] }));
    expect(html).not.toContain(">Treatment</th>");
    expect(html).toContain('role="note"');
    const open = renderToStaticMarkup(createElement(DataSheet, { ...props, plots }));
    expect(open).toContain(">Treatment</th>");
    expect(open).toContain(">HERB</td>");
  });
});
