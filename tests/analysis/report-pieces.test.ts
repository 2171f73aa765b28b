import { describe, expect, it } from "vitest";
import { buildResults, type AnalysisRow } from "@/lib/analysis/build-results";
import { fittedAndResiduals, normalQuantilePoints } from "@/lib/analysis/diagnostics";
import { meansChartSvg } from "@/lib/reports/means-svg";
import { methodsParagraph } from "@/lib/reports/methods";
import { analysisOptionsSchema } from "@/lib/validations/analysis";

// Invented plot values with a clear treatment effect; the checks are about wiring, not statistics.
const rows: AnalysisRow[] = [];
const noise = [0.4, -0.3, 0.1, -0.2, 0.5, -0.4, 0.2, 0.3, -0.1, -0.5, 0.3, 0.0];
for (let block = 1; block <= 4; block++) {
  for (let position = 1; position <= 3; position++) {
    rows.push({ plotNumber: block * 100 + position, treatment: `T${position}`, block: String(block), row: String(block), column: String(position), response: position * 10 + block + noise[(block - 1) * 3 + position - 1] });
  }
}
const input = (options: Record<string, unknown>, data = rows) => ({
  trial: { id: "t", design: "rcbd", status: "active" },
  assessment: { id: "a", name: "Weed density", variable: "weed-density", unit: "plants/m²", timingDays: 28 },
  dataVersion: 1,
  rows: data,
  treatments: [{ code: "T1", name: "Weedy check", checkType: "weedy" }, { code: "T2", name: "Hoe", checkType: null }, { code: "T3", name: "Mulch", checkType: null }],
  options: analysisOptionsSchema.parse(options),
});

describe("results pieces", () => {
  it("fitted plus residual gives back each analysed value, on the transformed scale too", () => {
    for (const transform of ["none", "sqrt"] as const) {
      const points = fittedAndResiduals(rows, { design: "rcbd", block: "block", response: "response", treatment: "treatment", transform });
      points.forEach((point) => {
        const value = rows[point.index].response as number;
        expect(point.fitted + point.residual).toBeCloseTo(transform === "none" ? value : Math.sqrt(value), 10);
      });
      expect(points.reduce((sum, point) => sum + point.residual, 0)).toBeCloseTo(0, 10);
    }
    const qq = normalQuantilePoints([3, -1, 2, -2, 0]);
    expect(qq.map((point) => point.sample)).toEqual([...qq.map((point) => point.sample)].sort((a, b) => a - b));
  });

  it("flags a treatment whose plots are all zero and a control that cannot give percent control", () => {
    const zeros = rows.map((row) => (row.treatment === "T1" ? { ...row, response: 0 } : row));
    const results = buildResults(input({ control: "T1" }, zeros));
    expect(results.warnings.join(" ")).toContain("Every plot of T1");
    expect(results.warnings.join(" ")).toContain("Percent control is not shown");
  });

  it("writes the methods from the settings used and draws letters in the chart", () => {
    const options = analysisOptionsSchema.parse({ transform: "log1p", method: "tukey", alpha: "0.01" });
    const text = methodsParagraph({ design: "rcbd", blocks: 4, treatments: 3, quadratAreaM2: 0.25, options, control: "T1", version: "9.9.9", anyUnbalanced: false });
    expect(text).toContain("log(x + 1)");
    expect(text).toContain("Tukey");
    expect(text).toContain("α = 0.01");
    expect(text).toContain("Hoebench 9.9.9");
    const results = buildResults(input({ control: "T1" }));
    const svg = meansChartSvg(results);
    expect(svg.startsWith("<svg")).toBe(true);
    for (const mean of results.means) expect(svg).toContain(`>${mean.letters}</text>`);
  });
});
