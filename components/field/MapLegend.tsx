import { mapInk } from "@/lib/layout/palette";
import type { PlacedLegendEntry } from "@/lib/layout/plot-map-geometry";
import { patternId } from "./CategoryPatterns";

const maxNameLength = 30;

/** Legend inside the map SVG, so the printed or exported map explains itself. */
export function MapLegend({ headingY, entries, idPrefix, left }: { headingY: number; entries: PlacedLegendEntry[]; idPrefix: string; left: number }) {
  return (
    <g>
      <text x={left} y={headingY} fontSize={13} fontWeight="bold" fill={mapInk}>
        Treatments
      </text>
      {entries.map((entry) => (
        <g key={entry.code}>
          <CategorySwatch x={entry.x} y={entry.y} fill={entry.style.fill} pattern={entry.style.pattern === "plain" ? null : `url(#${patternId(idPrefix, entry.category)})`} />
          <text x={entry.x + 40} y={entry.y + 14} fontSize={12} fontWeight="bold" fill={mapInk}>
            {entry.code}
          </text>
          <text x={entry.x + 112} y={entry.y + 14} fontSize={12} fill={mapInk}>
            {`${shorten(entry.name)} (${entry.style.label})`}
          </text>
        </g>
      ))}
    </g>
  );
}

function CategorySwatch({ x, y, fill, pattern }: { x: number; y: number; fill: string; pattern: string | null }) {
  return (
    <g>
      <rect x={x} y={y} width={32} height={19} fill={fill} stroke={mapInk} strokeWidth={1} />
      {pattern ? <rect x={x} y={y} width={32} height={19} fill={pattern} /> : null}
    </g>
  );
}

function shorten(name: string): string {
  return name.length > maxNameLength ? `${name.slice(0, maxNameLength - 1)}…` : name;
}
