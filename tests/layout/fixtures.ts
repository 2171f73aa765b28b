import { randomizeLayout } from "@/lib/layout/randomize";
import type { MapTreatment, PlotMapProps, TrialDesign } from "@/lib/layout/types";

/** Invented treatments covering every method category, for rendering tests. */
export const sampleTreatments: MapTreatment[] = [
  { code: "WC", name: "Weedy check", category: "check" },
  { code: "WF", name: "Weed-free check", category: "check" },
  { code: "HW2", name: "Hand weeding twice", category: "hand" },
  { code: "STRAW", name: "Straw mulch", category: "mulch" },
  { code: "TINE", name: "Tine cultivation", category: "cultivation" },
  { code: "FLAME", name: "Flame weeding", category: "thermal" },
  { code: "ROBOT", name: "Camera-guided weeder", category: "robotic" },
  { code: "HERB", name: "Herbicide as labelled", category: "chemical" },
];

export function sampleMapProps(options: { design?: TrialDesign; blocks?: number; treatments?: MapTreatment[]; serpentine?: boolean } = {}): PlotMapProps {
  const treatments = options.treatments ?? sampleTreatments;
  const design = options.design ?? "rcbd";
  const blocks = options.blocks ?? 4;
  const serpentine = options.serpentine ?? false;
  const layout = randomizeLayout({ design, treatmentCount: treatments.length, blocks, seed: 7, serpentine });
  return {
    title: "Carrot weed control trial",
    plots: layout.map((plot) => ({
      number: plot.number,
      block: plot.block,
      row: plot.row,
      column: plot.column,
      treatmentCode: treatments[plot.treatmentIndex].code,
      category: treatments[plot.treatmentIndex].category,
      checkType: treatments[plot.treatmentIndex].code === "WC" ? "weedy" : treatments[plot.treatmentIndex].code === "WF" ? "weed-free" : null,
    })),
    treatments,
    plotLengthM: 10,
    plotWidthM: 2,
    design,
    serpentine,
  };
}
