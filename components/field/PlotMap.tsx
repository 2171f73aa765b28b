import { bandFill, bandStroke, mapInk, mapPaper } from "@/lib/layout/palette";
import { designName, mapMetrics, planPlotMap, type PlacedBand, type PlotMapGeometry } from "@/lib/layout/plot-map-geometry";
import { renderStaticMarkup } from "@/lib/layout/static-markup";
import type { PlotMapProps } from "@/lib/layout/types";
import { CategoryPatternDefs } from "./CategoryPatterns";
import { MapLegend } from "./MapLegend";
import { NorthArrow } from "./NorthArrow";
import { PlotCell } from "./PlotCell";

export type { PlotMapProps };

const fontFamily = "Helvetica, Arial, sans-serif";

/**
 * The trial's field plan as one SVG: blocks (or rows) as labelled bands, plots with number and
 * treatment code, legend, north arrow, dimensions and, when serpentine, walking arrows.
 * No hooks and no client code, so it renders on the server, in print and in the PDF.
 */
export function PlotMap(props: PlotMapProps) {
  const geometry = planPlotMap(props);
  const idPrefix = props.idPrefix ?? "plotmap";
  const showWalkingOrder = props.showWalkingOrder ?? false;
  return (
    <svg
      xmlns="http://www.w3.org/2000/svg"
      viewBox={`0 0 ${geometry.width} ${geometry.height}`}
      width={geometry.width}
      height={geometry.height}
      role="img"
      aria-label={describe(props, geometry)}
      fontFamily={fontFamily}
      className="h-auto max-w-full"
    >
      <title>{props.title}</title>
      <CategoryPatternDefs idPrefix={idPrefix} />
      <rect x={0} y={0} width={geometry.width} height={geometry.height} fill={mapPaper} />
      {geometry.bands.map((band) => (
        <Band key={band.row} band={band} />
      ))}
      {geometry.cells.map((cell) => (
        <PlotCell key={cell.plot.number} cell={cell} idPrefix={idPrefix} showWalkingOrder={showWalkingOrder} />
      ))}
      {geometry.walkStripX === null ? null : geometry.bands.map((band) => <WalkArrow key={band.row} band={band} x={geometry.walkStripX!} />)}
      <NorthArrow x={geometry.northArrow.x} y={geometry.northArrow.y} />
      <Dimensions geometry={geometry} />
      {geometry.notes.map((note) => (
        <text key={note.y} x={mapMetrics.margin} y={note.y} fontSize={12} fill={mapInk}>
          {note.text}
        </text>
      ))}
      <MapLegend headingY={geometry.legend.headingY} entries={geometry.legend.entries} idPrefix={idPrefix} left={mapMetrics.margin} />
    </svg>
  );
}

/** The map as a standalone SVG string, for the PDF (works in route handlers; see static-markup.ts). */
export function renderPlotMapSvg(props: PlotMapProps): string {
  return renderStaticMarkup(<PlotMap {...props} />);
}

function describe(props: PlotMapProps, geometry: PlotMapGeometry): string {
  const lines = props.design === "rcbd" ? "blocks" : "rows";
  const walk = props.serpentine ? ", walked in a serpentine" : "";
  return `${props.title}: plot map, ${designName(props.design)}, ${props.plots.length} plots in ${geometry.rows} ${lines} of ${geometry.columns}${walk}; north is at the top.`;
}

function Band({ band }: { band: PlacedBand }) {
  return (
    <g>
      <rect x={band.x} y={band.y} width={band.width} height={band.height} fill={bandFill} stroke={bandStroke} strokeWidth={1} />
      <text x={band.x - 10} y={band.y + band.height / 2 + 5} textAnchor="end" fontSize={14} fontWeight="bold" fill={mapInk}>
        {band.label}
      </text>
    </g>
  );
}

/** Arrow beside each row showing which way that row is walked. */
function WalkArrow({ band, x }: { band: PlacedBand; x: number }) {
  const y = band.y + band.height / 2;
  const [tail, head] = band.walksEast ? [x + 4, x + 36] : [x + 36, x + 4];
  const barb = band.walksEast ? -9 : 9;
  return (
    <g aria-hidden="true">
      <line x1={tail} y1={y} x2={head} y2={y} stroke={mapInk} strokeWidth={2.5} />
      <polygon points={`${head},${y} ${head + barb},${y - 6} ${head + barb},${y + 6}`} fill={mapInk} />
    </g>
  );
}

/** Dimension lines: field width under the grid, field length up its right side. */
function Dimensions({ geometry }: { geometry: PlotMapGeometry }) {
  const { grid, dimensions } = geometry;
  const y = dimensions.lineY;
  const x = dimensions.verticalX;
  const middleY = (grid.top + grid.bottom) / 2;
  return (
    <g>
      <line x1={grid.left} y1={y} x2={grid.right} y2={y} stroke={mapInk} strokeWidth={1} />
      <line x1={grid.left} y1={y - 6} x2={grid.left} y2={y + 6} stroke={mapInk} strokeWidth={1} />
      <line x1={grid.right} y1={y - 6} x2={grid.right} y2={y + 6} stroke={mapInk} strokeWidth={1} />
      <text x={(grid.left + grid.right) / 2} y={y + 20} textAnchor="middle" fontSize={12} fill={mapInk}>
        {dimensions.westEast}
      </text>
      <line x1={x} y1={grid.top} x2={x} y2={grid.bottom} stroke={mapInk} strokeWidth={1} />
      <line x1={x - 6} y1={grid.top} x2={x + 6} y2={grid.top} stroke={mapInk} strokeWidth={1} />
      <line x1={x - 6} y1={grid.bottom} x2={x + 6} y2={grid.bottom} stroke={mapInk} strokeWidth={1} />
      <text x={x + 18} y={middleY} textAnchor="middle" fontSize={12} fill={mapInk} transform={`rotate(-90 ${x + 18} ${middleY})`}>
        {dimensions.northSouth}
      </text>
    </g>
  );
}
