import { describe, expect, it } from "vitest";
import { plotMapPdf } from "@/lib/layout/map-pdf";
import { cautionsFor } from "@/lib/safety/cautions";
import { sampleMapProps } from "./fixtures";

/** pdfkit writes each document-information string as its own object: follow the reference. */
function infoString(text: string, key: string): string | undefined {
  const reference = new RegExp(`/${key} (\\d+) 0 R`).exec(text)?.[1];
  return reference === undefined ? undefined : new RegExp(`\\n${reference} 0 obj\\n\\((.*)\\)\\nendobj`).exec(text)?.[1];
}

function pageCount(pdf: Buffer): number {
  return (pdf.toString("latin1").match(/\/Type \/Page\b(?!s)/g) ?? []).length;
}

describe("plotMapPdf", () => {
  it("makes a one-page PDF for an 8 × 4 trial, titled with the trial title", async () => {
    const pdf = await plotMapPdf({ ...sampleMapProps(), subtitle: "RCBD, 8 treatments × 4 blocks" }, { compress: false });
    const text = pdf.toString("latin1");
    expect(text.startsWith("%PDF-")).toBe(true);
    expect(pageCount(pdf)).toBe(1);
    expect(infoString(text, "Title")).toBe("Carrot weed control trial");
    expect(infoString(text, "Creator")).toBe("Hoebench");
  });

  it("lays the page out as A4 landscape", async () => {
    const text = (await plotMapPdf(sampleMapProps(), { compress: false })).toString("latin1");
    expect(text).toMatch(/\/MediaBox \[0 0 841\.89 595\.28\]/);
  });

  it("stays on one page with every caution and a larger serpentine trial", async () => {
    const cautions = [...cautionsFor("chemical"), ...cautionsFor("thermal"), ...cautionsFor("robotic")];
    const pdf = await plotMapPdf({ ...sampleMapProps({ blocks: 8, serpentine: true }), showWalkingOrder: true, cautions });
    expect(pageCount(pdf)).toBe(1);
  });

  it("compresses by default", async () => {
    const text = (await plotMapPdf(sampleMapProps())).toString("latin1");
    expect(text).toContain("/FlateDecode");
  });
});
