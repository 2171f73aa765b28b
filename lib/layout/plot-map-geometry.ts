import { categoryStyle, type CategoryStyle } from "./palette";
import { fieldSize, formatMetres } from "./field-size";
import type { MapPlot, MapTreatment, PlotMapProps } from "./types";

/**
 * Where everything on the plot map goes, in SVG user units, kept apart from the drawing so
 * the page map and the PDF map share one layout and the layout can be tested on its own.
 *
 * Orientation: north is up, row 1 (the first block's band) is the northern edge and column 1
 * the western end, as `models/Plot.ts` defines them. Cells are schematic (all the same size,
 * not to scale) so plot number and treatment code stay legible whatever the plot shape.
 */
export const mapMetrics = {
  margin: 16,
  rowLabelWidth: 84,
  topArea: 60,
  cellWidth: 100,
  cellHeight: 80,
  cellGap: 4,
  bandPadding: 6,
  bandGap: 10,
  plateWidth: 72,
  plateHeight: 48,
  walkStripWidth: 44,
  dimensionStripWidth: 34,
  legendColumnWidth: 400,
  legendRowHeight: 26,
  minimumWidth: 720,
} as const;

export type PlacedCell = {
  plot: MapPlot;
  style: CategoryStyle;
  x: number;
  y: number;
  plate: { x: number; y: number; width: number; height: number };
  walkOrder: number;
};

export type PlacedBand = { row: number; label: string; x: number; y: number; width: number; height: number; walksEast: boolean };
export type PlacedLegendEntry = MapTreatment & { style: CategoryStyle; x: number; y: number };

export type PlotMapGeometry = {
  width: number;
  height: number;
  rows: number;
  columns: number;
  grid: { left: number; top: number; right: number; bottom: number };
  bands: PlacedBand[];
  cells: PlacedCell[];
  northArrow: { x: number; y: number };
  walkStripX: number | null;
  dimensions: { westEast: string; northSouth: string; lineY: number; verticalX: number };
  notes: { text: string; y: number }[];
  legend: { headingY: number; entries: PlacedLegendEntry[] };
};

export function planPlotMap(props: PlotMapProps): PlotMapGeometry {
  const m = mapMetrics;
  const rows = Math.max(0, ...props.plots.map((plot) => plot.row));
  const columns = Math.max(0, ...props.plots.map((plot) => plot.column));
  const bandHeight = m.cellHeight + 2 * m.bandPadding;
  const bandWidth = columns * m.cellWidth + Math.max(0, columns - 1) * m.cellGap + 2 * m.bandPadding;

  const left = m.margin + m.rowLabelWidth;
  const top = m.margin + m.topArea;
  const right = left + bandWidth;
  const bottom = top + rows * bandHeight + Math.max(0, rows - 1) * m.bandGap;
  const walkStripX = props.serpentine ? right + 8 : null;
  const verticalX = (walkStripX === null ? right : walkStripX + m.walkStripWidth) + 14;
  const contentRight = verticalX + m.dimensionStripWidth;

  const legendColumns = Math.max(2, Math.floor((contentRight - m.margin) / m.legendColumnWidth));
  const width = Math.max(m.minimumWidth, contentRight + m.margin, m.margin * 2 + legendColumns * m.legendColumnWidth);

  const walkOrders = walkOrderOf(props.plots);
  const cells: PlacedCell[] = props.plots.map((plot) => {
    const x = left + m.bandPadding + (plot.column - 1) * (m.cellWidth + m.cellGap);
    const y = top + (plot.row - 1) * (bandHeight + m.bandGap) + m.bandPadding;
    return {
      plot,
      style: categoryStyle(plot.category),
      x,
      y,
      plate: { x: x + (m.cellWidth - m.plateWidth) / 2, y: y + (m.cellHeight - m.plateHeight) / 2, width: m.plateWidth, height: m.plateHeight },
      walkOrder: walkOrders.get(plot) ?? 0,
    };
  });

  const bands: PlacedBand[] = Array.from({ length: rows }, (_, index) => {
    const row = index + 1;
    const rowPlots = props.plots.filter((plot) => plot.row === row);
    const block = rowPlots[0]?.block ?? row;
    return {
      row,
      label: props.design === "rcbd" ? `Block ${block}` : `Row ${row}`,
      x: left,
      y: top + index * (bandHeight + m.bandGap),
      width: bandWidth,
      height: bandHeight,
      walksEast: walksEast(rowPlots, walkOrders),
    };
  });

  const size = fieldSize({ rows, columns, plotLengthM: props.plotLengthM, plotWidthM: props.plotWidthM });
  const lineY = bottom + 16;
  const notes = [
    `Plot ${formatMetres(props.plotLengthM)} m long × ${formatMetres(props.plotWidthM)} m wide. Field ${formatMetres(size.westEastM)} m (west–east) × ${formatMetres(size.northSouthM)} m (north–south) = ${formatMetres(size.areaM2)} m², paths and alleys not included. Schematic, not to scale.`,
  ];
  if (props.serpentine) {
    notes.push("Serpentine walk: odd rows are walked from west to east, even rows from east to west, following the plot numbers.");
  }
  const notesTop = lineY + 44;
  const placedNotes = notes.map((text, index) => ({ text, y: notesTop + index * 20 }));

  const headingY = notesTop + notes.length * 20 + 22;
  const entriesTop = headingY + 18;
  const legendRows = Math.ceil(props.treatments.length / legendColumns);
  const entries = props.treatments.map((treatment, index) => ({
    ...treatment,
    style: categoryStyle(treatment.category),
    x: m.margin + Math.floor(index / Math.max(1, legendRows)) * m.legendColumnWidth,
    y: entriesTop + (index % Math.max(1, legendRows)) * m.legendRowHeight,
  }));
  const height = entriesTop + legendRows * m.legendRowHeight + m.margin;

  return {
    width,
    height,
    rows,
    columns,
    grid: { left, top, right, bottom },
    bands,
    cells,
    northArrow: { x: width - m.margin - 18, y: m.margin },
    walkStripX,
    dimensions: {
      westEast: `${formatMetres(size.westEastM)} m (${columns} × ${formatMetres(props.plotWidthM)} m)`,
      northSouth: `${formatMetres(size.northSouthM)} m (${rows} × ${formatMetres(props.plotLengthM)} m)`,
      lineY,
      verticalX,
    },
    notes: placedNotes,
    legend: { headingY, entries },
  };
}

/** Stated walking order, else plot-number order (randomize.ts numbers plots in walking order). */
function walkOrderOf(plots: MapPlot[]): Map<MapPlot, number> {
  const ordered = [...plots].sort((a, b) => (a.walkOrder ?? a.number) - (b.walkOrder ?? b.number) || a.number - b.number);
  return new Map(ordered.map((plot, index) => [plot, plot.walkOrder ?? index + 1]));
}

function walksEast(rowPlots: MapPlot[], walkOrders: Map<MapPlot, number>): boolean {
  if (rowPlots.length < 2) return true;
  const first = rowPlots.reduce((a, b) => ((walkOrders.get(a) ?? 0) <= (walkOrders.get(b) ?? 0) ? a : b));
  const last = rowPlots.reduce((a, b) => ((walkOrders.get(a) ?? 0) >= (walkOrders.get(b) ?? 0) ? a : b));
  return first.column <= last.column;
}

export function designName(design: PlotMapProps["design"]): string {
  return { rcbd: "randomized complete block design", crd: "completely randomized design", latin: "Latin square" }[design];
}
