import type { PlotMapProps } from "@/lib/layout/types";
import { renderPlotMapSvg } from "./PlotMap";

/**
 * A frame holding the plot map as ready-made SVG markup. The map is a few hundred SVG
 * elements; as React elements they went through both server render passes (the component
 * payload and the HTML) on every page view, as one string through neither. The markup comes
 * from renderStaticMarkup, which escapes every text and attribute as React does (tested
 * against renderToStaticMarkup).
 */
export function PlotMapFrame({ className, testId, ...props }: PlotMapProps & { className: string; testId?: string }) {
  return <div className={className} data-testid={testId} dangerouslySetInnerHTML={{ __html: renderPlotMapSvg(props) }} />;
}
