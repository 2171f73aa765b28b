import type { AssessmentResults } from "@/lib/validations/analysis";

const escape = (text: string) => text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

function niceCeiling(value: number): number {
  if (!(value > 0)) return 1;
  const power = 10 ** Math.floor(Math.log10(value));
  for (const step of [1, 2, 2.5, 5, 10]) if (step * power >= value) return step * power;
  return 10 * power;
}

/**
 * Treatment means as a bar chart with ±SE bars and letters, drawn as plain SVG from the
 * numbers, for the printed report and its PDF (no browser, no plotly).
 */
export function meansChartSvg(results: AssessmentResults, width = 480, height = 240): string {
  const means = results.means;
  const transformed = results.options.transform !== "none";
  const left = 48;
  const bottom = 36;
  const top = 20;
  const plotWidth = width - left - 12;
  const plotHeight = height - top - bottom;
  const highest = Math.max(...means.map((mean) => mean.mean + (transformed ? 0 : mean.se)), 0);
  const ceiling = niceCeiling(highest * 1.12);
  const y = (value: number) => top + plotHeight - (Math.max(0, value) / ceiling) * plotHeight;
  const slot = plotWidth / Math.max(1, means.length);
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" font-family="Helvetica, Arial, sans-serif" font-size="10">`);
  parts.push(`<rect x="0" y="0" width="${width}" height="${height}" fill="#ffffff"/>`);
  for (let tick = 0; tick <= 4; tick++) {
    const value = (ceiling * tick) / 4;
    parts.push(`<line x1="${left}" x2="${left + plotWidth}" y1="${y(value)}" y2="${y(value)}" stroke="#e5ded6" stroke-width="0.5"/>`);
    parts.push(`<text x="${left - 4}" y="${y(value) + 3}" text-anchor="end" fill="#3b2f25">${Number(value.toPrecision(3))}</text>`);
  }
  means.forEach((mean, index) => {
    const x = left + index * slot + slot * 0.2;
    const barWidth = slot * 0.6;
    const centre = x + barWidth / 2;
    parts.push(`<rect x="${x}" y="${y(mean.mean)}" width="${barWidth}" height="${top + plotHeight - y(mean.mean)}" fill="#3f7d3a"/>`);
    let labelY = y(mean.mean) - 4;
    if (!transformed) {
      const high = y(mean.mean + mean.se);
      const low = y(mean.mean - mean.se);
      parts.push(`<line x1="${centre}" x2="${centre}" y1="${high}" y2="${low}" stroke="#3b2f25" stroke-width="1"/>`);
      parts.push(`<line x1="${centre - 4}" x2="${centre + 4}" y1="${high}" y2="${high}" stroke="#3b2f25" stroke-width="1"/>`);
      labelY = high - 4;
    }
    if (mean.letters) parts.push(`<text x="${centre}" y="${labelY}" text-anchor="middle" fill="#1a1612" font-weight="bold">${escape(mean.letters)}</text>`);
    parts.push(`<text x="${centre}" y="${top + plotHeight + 14}" text-anchor="middle" fill="#3b2f25">${escape(mean.treatment)}</text>`);
  });
  parts.push(`<line x1="${left}" x2="${left + plotWidth}" y1="${top + plotHeight}" y2="${top + plotHeight}" stroke="#3b2f25"/>`);
  parts.push(`<text x="${left}" y="${height - 4}" fill="#3b2f25">${escape(results.assessment.unit)}${transformed ? " (back-transformed means)" : ", mean ± SE"}</text>`);
  parts.push("</svg>");
  return parts.join("");
}
