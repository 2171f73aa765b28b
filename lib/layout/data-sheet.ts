import { csvLine } from "./csv";

export type DataSheetInput = {
  plots: { number: number; block: number; treatmentCode: string; walkOrder: number }[];
  quadratsPerPlot: number;
  format: "long" | "wide";
  /** Off by default: scorers who do not know the treatment score more fairly (blind scoring). */
  includeTreatment?: boolean;
};

export const maxQuadratsPerPlot = 50;

/**
 * An empty data-entry template as CSV, plots in walking order so the file follows the person
 * in the field.
 *
 * - long: `plot,quadrat,species,value`, one row per plot × quadrat, species and value blank
 *   (one row per species can be added while scoring);
 * - wide: `plot,q1,…,qN`, one row per plot, one blank cell per quadrat.
 *
 * RFC 4180: CRLF line ends (including after the last record), fields quoted when needed.
 */
export function dataSheetCsv(input: DataSheetInput): string {
  const { quadratsPerPlot, format } = input;
  if (!Number.isInteger(quadratsPerPlot) || quadratsPerPlot < 1 || quadratsPerPlot > maxQuadratsPerPlot) {
    throw new Error(`Quadrats per plot must be a whole number from 1 to ${maxQuadratsPerPlot}, got ${quadratsPerPlot}`);
  }
  if (format !== "long" && format !== "wide") throw new Error(`Unknown data sheet format "${String(format)}": use long or wide`);

  const withTreatment = input.includeTreatment ?? false;
  const plots = [...input.plots].sort((a, b) => a.walkOrder - b.walkOrder || a.number - b.number);
  const lead = (plot: DataSheetInput["plots"][number]) => (withTreatment ? [plot.number, plot.treatmentCode] : [plot.number]);
  const leadHeader = withTreatment ? ["plot", "treatment"] : ["plot"];
  const quadrats = Array.from({ length: quadratsPerPlot }, (_, index) => index + 1);

  const lines =
    format === "long"
      ? [csvLine([...leadHeader, "quadrat", "species", "value"]), ...plots.flatMap((plot) => quadrats.map((quadrat) => csvLine([...lead(plot), quadrat, "", ""])))]
      : [csvLine([...leadHeader, ...quadrats.map((quadrat) => `q${quadrat}`)]), ...plots.map((plot) => csvLine([...lead(plot), ...quadrats.map(() => "")]))];
  return lines.map((line) => `${line}\r\n`).join("");
}
