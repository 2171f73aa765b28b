"use client";

import dynamic from "next/dynamic";
import type { PlotParams } from "react-plotly.js/factory";

/**
 * Plotly in the browser only (it touches window), from the bundled minified build so charts
 * need no network. Loaded once, on demand, by every chart on the page.
 */
const PlotlyPlot = dynamic<PlotParams>(
  async () => {
    const [{ default: createPlotlyComponent }, { default: Plotly }] = await Promise.all([import("react-plotly.js/factory"), import("plotly.js-dist-min")]);
    return createPlotlyComponent(Plotly as never);
  },
  { ssr: false, loading: () => <p className="p-4 text-sm text-soil-700">Drawing the chart…</p> },
);

export const baseLayout = {
  autosize: true,
  margin: { l: 56, r: 16, t: 36, b: 64 },
  font: { family: "Inter, system-ui, sans-serif", size: 12, color: "#3b2f25" },
  paper_bgcolor: "#ffffff",
  plot_bgcolor: "#ffffff",
  showlegend: false,
};

export function Plot({ data, layout, label, height = 340 }: { data: unknown[]; layout: Record<string, unknown>; label: string; height?: number }) {
  return (
    <figure className="rounded border border-soil-200 bg-white p-2" aria-label={label} data-testid="chart">
      <PlotlyPlot
        data={data}
        layout={{ ...baseLayout, ...layout, title: { text: label, font: { size: 13 } } }}
        config={{ displaylogo: false, responsive: true, modeBarButtonsToRemove: ["lasso2d", "select2d"] }}
        style={{ width: "100%", height }}
        useResizeHandler
      />
    </figure>
  );
}
