import { categoryStyle, mapInk } from "@/lib/layout/palette";
import type { MapTreatment } from "@/lib/layout/types";
import { CategoryPatternDefs, patternId } from "./CategoryPatterns";

/**
 * Treatment legend for HTML pages (code, name, category swatch with its pattern), for pages
 * that show treatments outside the plot map. One hidden SVG holds the patterns the swatches use.
 */
export function TreatmentLegend({ treatments, idPrefix = "legend" }: { treatments: MapTreatment[]; idPrefix?: string }) {
  return (
    <div>
      <svg width={0} height={0} aria-hidden="true" className="absolute">
        <CategoryPatternDefs idPrefix={idPrefix} />
      </svg>
      <ul className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-2">
        {treatments.map((treatment) => (
          <li key={treatment.code} className="flex items-center gap-2">
            <CategorySwatch category={treatment.category} idPrefix={idPrefix} />
            <span className="w-16 shrink-0 font-semibold">{treatment.code}</span>
            <span>
              {treatment.name} <span className="text-soil-700">({categoryStyle(treatment.category).label})</span>
            </span>
          </li>
        ))}
      </ul>
    </div>
  );
}

export function CategorySwatch({ category, idPrefix }: { category: MapTreatment["category"]; idPrefix: string }) {
  const style = categoryStyle(category);
  return (
    <svg width={32} height={20} viewBox="0 0 32 20" aria-hidden="true" className="shrink-0">
      <rect x={0.5} y={0.5} width={31} height={19} fill={style.fill} stroke={mapInk} />
      {style.pattern === "plain" ? null : <rect x={0.5} y={0.5} width={31} height={19} fill={`url(#${patternId(idPrefix, category)})`} />}
    </svg>
  );
}
