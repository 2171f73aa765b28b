"use client";

import type { AssessmentResults } from "@/lib/validations/analysis";
import { Plot } from "./Plot";

const leaf = "#3f7d3a";
const soil = "#7a5c43";

/** Treatment means with ±1 SE bars (on the analysed scale when untransformed) and their letters above. */
export function MeansChart({ results }: { results: AssessmentResults }) {
  const transformed = results.options.transform !== "none";
  const x = results.means.map((mean) => mean.treatment);
  const y = results.means.map((mean) => mean.mean);
  const top = results.means.map((mean) => mean.mean + (transformed ? 0 : mean.se));
  return (
    <Plot
      label={`Treatment means${transformed ? " (back-transformed)" : " ± SE"}`}
      data={[
        {
          type: "bar",
          x,
          y,
          marker: { color: leaf },
          error_y: transformed ? undefined : { type: "data", array: results.means.map((mean) => mean.se), visible: true, color: soil },
          hovertemplate: "%{x}: %{y:.3g}<extra></extra>",
        },
        {
          type: "scatter",
          mode: "text",
          x,
          y: top,
          text: results.means.map((mean) => mean.letters ?? ""),
          textposition: "top center",
          textfont: { size: 13, color: "#1f1a14" },
          hoverinfo: "skip",
        },
      ]}
      layout={{ yaxis: { title: { text: results.assessment.unit }, rangemode: "tozero" }, xaxis: { type: "category" } }}
    />
  );
}

export function BoxChart({ results }: { results: AssessmentResults }) {
  return (
    <Plot
      label="Plot values by treatment"
      data={results.means.map((mean) => ({
        type: "box",
        name: mean.treatment,
        y: results.plotValues.filter((plot) => plot.treatment === mean.treatment).map((plot) => plot.value),
        boxpoints: "all",
        jitter: 0.3,
        pointpos: 0,
        marker: { color: leaf, size: 5 },
        line: { color: soil },
      }))}
      layout={{ yaxis: { title: { text: results.assessment.unit } } }}
    />
  );
}

export function ResidualChart({ results }: { results: AssessmentResults }) {
  const points = results.diagnostics.points;
  return (
    <Plot
      label="Residuals against fitted values"
      height={300}
      data={[
        {
          type: "scatter",
          mode: "markers",
          x: points.map((point) => point.fitted),
          y: points.map((point) => point.residual),
          text: points.map((point) => `plot ${point.plotNumber} (${point.treatment})`),
          marker: { color: leaf, size: 7 },
          hovertemplate: "%{text}<br>fitted %{x:.3g}, residual %{y:.3g}<extra></extra>",
        },
      ]}
      layout={{ xaxis: { title: { text: "Fitted value" } }, yaxis: { title: { text: "Residual" }, zeroline: true } }}
    />
  );
}

export function QqChart({ results }: { results: AssessmentResults }) {
  const qq = results.diagnostics.qq;
  const ends = qq.length ? [Math.min(qq[0].theoretical, qq[0].sample), Math.max(qq[qq.length - 1].theoretical, qq[qq.length - 1].sample)] : [-2, 2];
  return (
    <Plot
      label="Normal Q-Q plot of residuals"
      height={300}
      data={[
        { type: "scatter", mode: "lines", x: ends, y: ends, line: { color: soil, dash: "dash" }, hoverinfo: "skip" },
        { type: "scatter", mode: "markers", x: qq.map((point) => point.theoretical), y: qq.map((point) => point.sample), marker: { color: leaf, size: 7 } },
      ]}
      layout={{ xaxis: { title: { text: "Normal quantile" } }, yaxis: { title: { text: "Standardized residual" } } }}
    />
  );
}

export function EquivalenceChart({ equivalence }: { equivalence: NonNullable<AssessmentResults["equivalence"]> }) {
  const names = equivalence.results.map((line) => line.treatment);
  const margin = equivalence.margin;
  return (
    <Plot
      label={`Difference from ${equivalence.reference} with 90% interval, margin ±${margin}`}
      height={Math.max(220, 60 + 40 * names.length)}
      data={[
        {
          type: "scatter",
          mode: "markers",
          y: names,
          x: equivalence.results.map((line) => line.diff),
          error_x: {
            type: "data",
            symmetric: false,
            array: equivalence.results.map((line) => line.ci90[1] - line.diff),
            arrayminus: equivalence.results.map((line) => line.diff - line.ci90[0]),
            color: soil,
          },
          marker: { color: equivalence.results.map((line) => (line.equivalent ? leaf : "#b45309")), size: 10 },
        },
      ]}
      layout={{
        xaxis: { title: { text: `Difference from ${equivalence.reference}` }, zeroline: true },
        yaxis: { type: "category", automargin: true },
        shapes: [{ type: "rect", xref: "x", yref: "paper", x0: -margin, x1: margin, y0: 0, y1: 1, fillcolor: "#3f7d3a", opacity: 0.12, line: { width: 0 } }],
      }}
    />
  );
}

export function CourseChart({ series, unit }: { series: Array<{ treatment: string; points: Array<{ day: number; mean: number }> }>; unit: string }) {
  return (
    <Plot
      label="Weed density over the season"
      data={series.map((line) => ({ type: "scatter", mode: "lines+markers", name: line.treatment, x: line.points.map((point) => point.day), y: line.points.map((point) => point.mean) }))}
      layout={{ showlegend: true, legend: { orientation: "h", y: -0.25 }, xaxis: { title: { text: "Days after planting" } }, yaxis: { title: { text: unit }, rangemode: "tozero" } }}
    />
  );
}
