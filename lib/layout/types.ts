import type { TrialDesign } from "@/models/Trial";
import type { MethodCategory } from "@/models/Treatment";

export type { MethodCategory, TrialDesign };

/** What the randomization needs to know; the trial row supplies all of it. */
export type RandomizeInput = {
  design: TrialDesign;
  treatmentCount: number;
  /** Blocks for RCBD, replicates for CRD, rows (= columns = treatments) for a Latin square. */
  blocks: number;
  seed: number;
  serpentine: boolean;
};

/**
 * One plot as planned, before it is stored as a `Plot` row.
 *
 * Numbering follows `models/Plot.ts`: number = block (or field row) × 100 + position.
 * In CRD and Latin layouts the field row stands in for the block, so `block === row`.
 */
export type PlannedPlot = {
  number: number;
  block: number;
  /** 1-based place of the plot in its row in numbering order (snakes when serpentine). */
  position: number;
  /** Field grid row, 1 = first band. */
  row: number;
  /** Physical field column, 1 = west end, whatever the numbering direction. */
  column: number;
  /** 1..N, the order a person meets the plots walking the field. */
  walkOrder: number;
  /** 0-based index into the trial's treatment list. */
  treatmentIndex: number;
};

/** One plot as the map draws it. */
export type MapPlot = {
  number: number;
  block: number;
  row: number;
  column: number;
  treatmentCode: string;
  category: MethodCategory;
  checkType?: "weedy" | "weed-free" | null;
  /** Walking order; when missing, plot-number order (which is the walk, see randomize.ts). */
  walkOrder?: number;
};

export type MapTreatment = { code: string; name: string; category: MethodCategory };

export type PlotMapProps = {
  title: string;
  plots: MapPlot[];
  treatments: MapTreatment[];
  plotLengthM: number;
  plotWidthM: number;
  design: TrialDesign;
  serpentine: boolean;
  /** Puts each plot's walking-order number in a corner badge. */
  showWalkingOrder?: boolean;
  /** Prefix for the SVG pattern ids, needed only when two maps share one page. */
  idPrefix?: string;
};
