import { mapInk, mapPaper } from "@/lib/layout/palette";
import { mapMetrics, type PlacedCell } from "@/lib/layout/plot-map-geometry";
import { patternId } from "./CategoryPatterns";

const checkLabels = { weedy: "weedy check", "weed-free": "weed-free check" } as const;

/**
 * One plot: category fill, its pattern over the whole cell, and a solid plate in the middle so
 * the plot number and code sit on the plain fill (contrast ≥ 4.5:1) and never on pattern marks.
 */
export function PlotCell({ cell, idPrefix, showWalkingOrder }: { cell: PlacedCell; idPrefix: string; showWalkingOrder: boolean }) {
  const { plot, style, x, y, plate } = cell;
  const centreX = plate.x + plate.width / 2;
  const checkLabel = plot.checkType ? checkLabels[plot.checkType] : null;
  const firstLine = plate.y + (checkLabel ? 18 : 21);
  return (
    <g>
      <rect x={x} y={y} width={mapMetrics.cellWidth} height={mapMetrics.cellHeight} fill={style.fill} stroke={mapInk} strokeWidth={1} />
      {style.pattern === "plain" ? null : (
        <rect x={x} y={y} width={mapMetrics.cellWidth} height={mapMetrics.cellHeight} fill={`url(#${patternId(idPrefix, plot.category)})`} />
      )}
      <rect x={plate.x} y={plate.y} width={plate.width} height={plate.height} rx={3} fill={style.fill} />
      <text x={centreX} y={firstLine} textAnchor="middle" fontSize={17} fontWeight="bold" fill={style.text}>
        {plot.number}
      </text>
      <text x={centreX} y={firstLine + 16} textAnchor="middle" fontSize={13} fill={style.text}>
        {plot.treatmentCode}
      </text>
      {checkLabel ? (
        <text x={centreX} y={firstLine + 27} textAnchor="middle" fontSize={9} fill={style.text}>
          {checkLabel}
        </text>
      ) : null}
      {showWalkingOrder ? (
        <g>
          <circle cx={x + 11} cy={y + 11} r={9} fill={mapPaper} stroke={mapInk} strokeWidth={1} />
          <text x={x + 11} y={y + 14} textAnchor="middle" fontSize={9} fontWeight="bold" fill={mapInk}>
            {cell.walkOrder}
          </text>
        </g>
      ) : null}
    </g>
  );
}
