import PDFDocument from "pdfkit";
import SVGtoPDF from "svg-to-pdfkit";
import { renderPlotMapSvg } from "@/components/field/PlotMap";
import type { PlotMapProps } from "./types";

export type PlotMapPdfInput = PlotMapProps & { subtitle?: string; cautions?: string[] };
export type PlotMapPdfOptions = {
  /** Leave page streams uncompressed (tests read the text); compressed by default. */
  compress?: boolean;
};

const margin = 36;
const ink = "#1a1612";

/**
 * The plot map as a one-page A4 landscape PDF for the field folder: title, subtitle, the map
 * (with its legend, dimensions and north arrow) scaled to fit, and safety cautions if any.
 *
 * Only PDF's built-in Helvetica is used, so nothing is fetched or embedded; it covers the
 * Windows-1252 characters (×, –, ², …) the map uses, not arbitrary Unicode.
 */
export async function plotMapPdf(input: PlotMapPdfInput, options: PlotMapPdfOptions = {}): Promise<Buffer> {
  const { subtitle, cautions = [], ...mapProps } = input;
  const doc = new PDFDocument({
    size: "A4",
    layout: "landscape",
    margin,
    compress: options.compress ?? true,
    info: { Title: mapProps.title, Subject: subtitle ?? "Plot map", Creator: "Hoebench" },
    displayTitle: true,
  });
  const finished = collect(doc);
  const contentWidth = doc.page.width - 2 * margin;

  doc.fillColor(ink).font("Helvetica-Bold").fontSize(18).text(mapProps.title, margin, margin, { width: contentWidth });
  if (subtitle) doc.font("Helvetica").fontSize(11).text(subtitle, { width: contentWidth });
  const mapTop = doc.y + 8;

  const cautionsHeight = measureCautions(doc, cautions, contentWidth);
  const mapBottom = doc.page.height - margin - cautionsHeight;
  const svg = renderPlotMapSvg(mapProps);
  const { width: svgWidth, height: svgHeight } = svgSize(svg);
  // A floor keeps a very long title plus many cautions from giving a zero or negative scale.
  const scale = Math.max(0.05, Math.min(contentWidth / svgWidth, (mapBottom - mapTop) / svgHeight));
  SVGtoPDF(doc, svg, margin, mapTop, {
    width: svgWidth * scale,
    height: svgHeight * scale,
    assumePt: true,
    preserveAspectRatio: "xMinYMin meet",
    fontCallback: (_family, bold) => (bold ? "Helvetica-Bold" : "Helvetica"),
  });

  if (cautions.length > 0) writeCautions(doc, cautions, contentWidth, mapBottom + 10);
  doc.end();
  return finished;
}

function collect(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on("data", (chunk: Buffer) => chunks.push(chunk));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
}

function svgSize(svg: string): { width: number; height: number } {
  const match = /viewBox="0 0 ([\d.]+) ([\d.]+)"/.exec(svg);
  if (!match) throw new Error("The plot map SVG has no viewBox");
  return { width: Number(match[1]), height: Number(match[2]) };
}

const cautionsHeading = "Safety";
const cautionFontSize = 9;
const columnGap = 18;

/** Long caution lists go in two columns so the map keeps most of the page. */
function cautionColumns(cautions: string[], width: number): { lines: string[]; x: number; width: number }[] {
  const lines = cautions.map((caution) => `•  ${caution}`);
  if (lines.length <= 4) return [{ lines, x: margin, width }];
  const half = Math.ceil(lines.length / 2);
  const columnWidth = (width - columnGap) / 2;
  return [
    { lines: lines.slice(0, half), x: margin, width: columnWidth },
    { lines: lines.slice(half), x: margin + columnWidth + columnGap, width: columnWidth },
  ];
}

function headingHeight(doc: PDFKit.PDFDocument, width: number): number {
  doc.font("Helvetica-Bold").fontSize(11);
  return doc.heightOfString(cautionsHeading, { width }) + 4;
}

function measureCautions(doc: PDFKit.PDFDocument, cautions: string[], width: number): number {
  if (cautions.length === 0) return 0;
  const heading = headingHeight(doc, width);
  doc.font("Helvetica").fontSize(cautionFontSize);
  const columnHeights = cautionColumns(cautions, width).map((column) =>
    column.lines.reduce((sum, line) => sum + doc.heightOfString(line, { width: column.width }) + 2, 0),
  );
  return heading + Math.max(...columnHeights) + 10;
}

function writeCautions(doc: PDFKit.PDFDocument, cautions: string[], width: number, top: number): void {
  const heading = headingHeight(doc, width);
  doc.fillColor(ink).text(cautionsHeading, margin, top, { width });
  doc.font("Helvetica").fontSize(cautionFontSize);
  for (const column of cautionColumns(cautions, width)) {
    doc.text("", column.x, top + heading);
    for (const line of column.lines) doc.text(line, column.x, doc.y, { width: column.width, paragraphGap: 2 });
  }
}
