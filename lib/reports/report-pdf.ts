import PDFDocument from "pdfkit";
import SVGtoPDF from "svg-to-pdfkit";
import { renderPlotMapSvg } from "@/components/field/PlotMap";
import { num, pValue, sourceLabels } from "@/components/results/format";
import { cautionsForCategories } from "@/lib/safety/trial-cautions";
import { scopeCaveat } from "@/lib/summaries/generate";
import { designNames } from "@/lib/trials/labels";
import type { MethodCategory } from "@/lib/trials/vocabulary";
import type { TrialReport } from "./report-data";
import { meansChartSvg } from "./means-svg";

const margin = 48;
const ink = "#1a1612";

function collect(doc: PDFKit.PDFDocument): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    doc.on("data", (chunk: Buffer) => chunks.push(chunk));
    doc.on("end", () => resolve(Buffer.concat(chunks)));
    doc.on("error", reject);
  });
}

/** Built-in Helvetica covers Windows-1252 only: replace what it cannot draw. */
const plain = (text: string) => text.replace(/[≥]/g, ">=").replace(/[≤]/g, "<=").replace(/α/g, "alpha").replace(/[“”]/g, '"').replace(/[^\x00-\xff–—²×±µ°’‘•…]/g, "?");

function table(doc: PDFKit.PDFDocument, header: string[], rows: string[][], widths: number[], align: ("left" | "right")[]) {
  const x0 = margin;
  const lineHeight = 12;
  const draw = (cells: string[], bold: boolean) => {
    if (doc.y + lineHeight > doc.page.height - margin) doc.addPage();
    const y = doc.y;
    let x = x0;
    doc.font(bold ? "Helvetica-Bold" : "Helvetica").fontSize(8.5);
    cells.forEach((cell, index) => {
      doc.text(plain(cell), x + 2, y, { width: widths[index] - 4, align: align[index], lineBreak: false, ellipsis: true });
      x += widths[index];
    });
    doc.x = x0;
    doc.y = y + lineHeight;
  };
  const total = widths.reduce((sum, width) => sum + width, 0);
  doc.moveTo(x0, doc.y).lineTo(x0 + total, doc.y).stroke(ink);
  doc.y += 2;
  draw(header, true);
  doc.moveTo(x0, doc.y).lineTo(x0 + total, doc.y).stroke(ink);
  doc.y += 2;
  rows.forEach((row) => draw(row, false));
  doc.moveTo(x0, doc.y).lineTo(x0 + total, doc.y).stroke(ink);
  doc.y += 4;
}

function heading(doc: PDFKit.PDFDocument, text: string, size = 13) {
  if (doc.y > doc.page.height - margin - 60) doc.addPage();
  doc.moveDown(0.6).font("Helvetica-Bold").fontSize(size).fillColor(ink).text(plain(text), margin, doc.y, { width: doc.page.width - 2 * margin });
  doc.moveDown(0.2);
}

function paragraph(doc: PDFKit.PDFDocument, text: string, size = 9.5) {
  doc.font("Helvetica").fontSize(size).fillColor(ink).text(plain(text), margin, doc.y, { width: doc.page.width - 2 * margin });
}

/**
 * The report's safety and scope lines: the same cautions as maps, sheets and the summary
 * (lib/safety), each once with the governing rule last, then the summary's own words on where
 * the results come from and that they are not a recommendation. The library links the report
 * to the public, so it must carry them as the summary does.
 */
export function reportSafetyLines(categories: readonly MethodCategory[], siteName: string, season: string): { cautions: string[]; scope: string } {
  return { cautions: cautionsForCategories(categories), scope: scopeCaveat(1, siteName, season) };
}

/** The technical report as an A4 PDF: the same content as the printable page, charts drawn from SVG made from the numbers. */
export async function trialReportPdf(report: TrialReport, options: { compress?: boolean } = {}): Promise<Buffer> {
  const { overview, treatments, plan, sections, review } = report;
  const trial = overview.trial;
  const doc = new PDFDocument({ size: "A4", margin, compress: options.compress ?? true, info: { Title: `Technical report: ${trial.title}`, Creator: `Hoebench ${report.version}` }, displayTitle: true });
  const finished = collect(doc);
  const width = doc.page.width - 2 * margin;

  doc.font("Helvetica-Bold").fontSize(17).fillColor(ink).text(plain(`Technical report: ${trial.title}`), { width });
  paragraph(doc, `${trial.crop} · ${trial.season} · ${overview.site.name}, ${overview.site.location} (${overview.site.region}) · researcher ${overview.ownerName} · trial status ${trial.status}`);
  heading(doc, "Trial");
  paragraph(doc, trial.objective);
  paragraph(doc, `Design: ${designNames[trial.design]}, ${trial.blocks} ${trial.design === "crd" ? "replicates" : "blocks"}, plots ${trial.plotLengthM} × ${trial.plotWidthM} m; planting ${trial.plantingDate ?? "not recorded"}. Soil: ${overview.site.soil}.`);

  heading(doc, "Treatments");
  table(doc, ["Code", "Treatment", "Timing", "Settings"], treatments.map((treatment) => [treatment.code, treatment.name, treatment.timing, treatment.rateOrSettings]), [40, 150, 160, width - 350], ["left", "left", "left", "left"]);

  const safety = reportSafetyLines(treatments.map((treatment) => treatment.category), overview.site.name, trial.season);
  heading(doc, safety.cautions.length > 0 ? "Safety and scope" : "Scope");
  for (const caution of safety.cautions) paragraph(doc, `• ${caution}`);
  if (safety.cautions.length > 0) doc.moveDown(0.3);
  paragraph(doc, safety.scope);

  if (plan.plots.length > 0) {
    heading(doc, "Plot map");
    const svg = renderPlotMapSvg({ title: plan.title, plots: plan.plots, treatments: plan.treatments, plotLengthM: plan.plotLengthM, plotWidthM: plan.plotWidthM, design: plan.design, serpentine: plan.serpentine, showWalkingOrder: false });
    const match = /viewBox="0 0 ([\d.]+) ([\d.]+)"/.exec(svg);
    const [svgWidth, svgHeight] = match ? [Number(match[1]), Number(match[2])] : [width, width * 0.6];
    const scale = Math.min(width / svgWidth, 330 / svgHeight);
    if (doc.y + svgHeight * scale > doc.page.height - margin) doc.addPage();
    SVGtoPDF(doc, svg, margin, doc.y, { width: svgWidth * scale, height: svgHeight * scale, assumePt: true, preserveAspectRatio: "xMinYMin meet", fontCallback: (_family, bold) => (bold ? "Helvetica-Bold" : "Helvetica") });
    doc.y += svgHeight * scale + 6;
  }

  heading(doc, "Methods");
  paragraph(doc, report.methods);

  for (const { assessment, results } of sections) {
    doc.addPage();
    heading(doc, assessment.name);
    if (results.empty) {
      paragraph(doc, "No data were recorded.");
      continue;
    }
    for (const warning of results.warnings) paragraph(doc, `Note: ${warning}`, 8.5);
    doc.moveDown(0.3);
    const transformed = results.options.transform !== "none";
    table(
      doc,
      ["Source", "df", "SS", "MS", "F", "Pr > F"],
      results.anova.map((row) => [sourceLabels[row.source] ?? row.source, String(row.df), num(row.ss, 4), num(row.ms, 4), row.f === undefined ? "" : num(row.f), pValue(row.p)]),
      [150, 40, 80, 80, 60, 70],
      ["left", "right", "right", "right", "right", "right"],
    );
    paragraph(doc, `CV = ${num(results.cvPercent)}% · grand mean = ${num(results.grandMean)}${transformed ? " (transformed)" : ` ${results.assessment.unit}`} · LSD (${results.options.alpha}) = ${results.lsd === null ? "not given (unbalanced)" : num(results.lsd)}`, 8.5);
    doc.moveDown(0.4);
    const hasControl = results.means.some((mean) => mean.percentControl !== null);
    // Only the columns that apply: transformed means and percent control appear when used.
    const columns: Array<{ header: string; width: number; align: "left" | "right"; cell: (mean: (typeof results.means)[number]) => string }> = [
      { header: "Treatment", width: 170, align: "left", cell: (mean) => `${mean.treatment} ${mean.name}` },
      { header: "n", width: 30, align: "right", cell: (mean) => String(mean.n) },
      { header: `Mean (${results.assessment.unit})`, width: 80, align: "right", cell: (mean) => num(mean.mean) },
      ...(transformed ? [{ header: "Transformed", width: 70, align: "right" as const, cell: (mean: (typeof results.means)[number]) => num(mean.transformedMean) }] : []),
      { header: "SE", width: 50, align: "right", cell: (mean) => num(mean.se) },
      { header: "Group", width: 50, align: "left", cell: (mean) => mean.letters ?? "–" },
      ...(hasControl ? [{ header: "% control", width: 60, align: "right" as const, cell: (mean: (typeof results.means)[number]) => (mean.percentControl === null ? "–" : num(mean.percentControl)) }] : []),
    ];
    table(doc, columns.map((column) => column.header), results.means.map((mean) => columns.map((column) => column.cell(mean))), columns.map((column) => column.width), columns.map((column) => column.align));
    paragraph(doc, results.lettersNote, 8);
    doc.moveDown(0.4);
    const chart = meansChartSvg(results);
    if (doc.y + 220 > doc.page.height - margin) doc.addPage();
    SVGtoPDF(doc, chart, margin, doc.y, { width: 440, height: 220, assumePt: true, fontCallback: (_family, bold) => (bold ? "Helvetica-Bold" : "Helvetica") });
    doc.y += 236;
    if (results.diagnostics.shapiroWilk || results.diagnostics.levene) {
      paragraph(doc, `Shapiro-Wilk W = ${num(results.diagnostics.shapiroWilk?.w, 4)}, p = ${pValue(results.diagnostics.shapiroWilk?.p)}; Levene (Brown-Forsythe) F = ${num(results.diagnostics.levene?.f)}, p = ${pValue(results.diagnostics.levene?.p)}. ${results.diagnostics.advice.join(" ")}`, 8);
    }
  }

  heading(doc, "Reviewer's sign-off");
  paragraph(doc, review?.status === "approved" ? `Approved by ${review.decidedBy} on ${new Date(review.decidedAt!).toISOString().slice(0, 10)}.${review.decisionNote ? ` "${review.decisionNote}"` : ""}` : "Not signed off: these results have not been approved by a reviewer.");
  paragraph(doc, `Generated ${report.generatedAt.slice(0, 16).replace("T", " ")} UTC with Hoebench ${report.version}.`, 8);
  doc.end();
  return finished;
}
