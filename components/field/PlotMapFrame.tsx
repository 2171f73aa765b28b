import { LruCache } from "@/lib/lru-cache";
import type { PlotMapProps } from "@/lib/layout/types";
import type { FieldPlan } from "@/lib/trials/field-sheets";
import type { Trial } from "@/models";
import { renderPlotMapSvg } from "./PlotMap";

// Built markup by trial state: the map changes only when the trial or its plots and treatments do.
const builtMaps = new LruCache<string>(200);

/**
 * What a trial's map depends on: the trial row (title, plot size, design, numbering) and its
 * data revision, which database triggers move on any plot or treatment change.
 */
export function plotMapCacheKey(trial: Trial, variant: string): string {
  return [trial.id, trial.dataRevision, trial.updatedAt?.getTime?.() ?? 0, variant].join("|");
}

/**
 * A frame holding the plot map as ready-made SVG markup. The map is a few hundred SVG
 * elements; as React elements they went through both server render passes (the component
 * payload and the HTML) on every page view, as one string through neither. The markup comes
 * from renderStaticMarkup, which escapes every text and attribute as React does (tested
 * against renderToStaticMarkup).
 */
export function PlotMapFrame({ plan, showWalkingOrder, cacheKey, className, testId }: { plan: FieldPlan; showWalkingOrder?: boolean; cacheKey: string; className: string; testId?: string }) {
  let markup = builtMaps.get(cacheKey);
  if (markup === undefined) {
    const { title, plots, treatments, plotLengthM, plotWidthM, design, serpentine } = plan;
    const props: PlotMapProps = { title, plots, treatments, plotLengthM, plotWidthM, design, serpentine, showWalkingOrder };
    builtMaps.set(cacheKey, (markup = renderPlotMapSvg(props)));
  }
  return <div className={className} data-testid={testId} dangerouslySetInnerHTML={{ __html: markup }} />;
}
