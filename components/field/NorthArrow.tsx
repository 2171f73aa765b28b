import { mapInk, mapPaper } from "@/lib/layout/palette";

/** North arrow: the map is always drawn with north up (see plot-map-geometry.ts). */
export function NorthArrow({ x, y }: { x: number; y: number }) {
  return (
    <g aria-hidden="true">
      <text x={x} y={y + 12} textAnchor="middle" fontSize={14} fontWeight="bold" fill={mapInk}>
        N
      </text>
      <polygon points={`${x},${y + 16} ${x + 9},${y + 42} ${x},${y + 36}`} fill={mapInk} />
      <polygon points={`${x},${y + 16} ${x - 9},${y + 42} ${x},${y + 36}`} fill={mapPaper} stroke={mapInk} strokeWidth={1} />
    </g>
  );
}
