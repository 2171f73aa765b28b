import { analyzeTrial, compactLetterDisplay, StatsInputError, weedControlEfficiency, type TreatmentMean, type TrialAnalysis, type TrialRow } from "@/lib/stats";
import type { AnalysisOptions, AssessmentResults } from "@/lib/validations/analysis";
import { transformLabels } from "@/lib/validations/analysis";
import { fittedAndResiduals, normalQuantilePoints, type DesignColumns } from "./diagnostics";

/** One plot of an assessment as the engine reads it; response "NA" is a lost plot. */
export interface AnalysisRow extends TrialRow {
  plotNumber: number;
  treatment: string;
  block: string;
  row: string;
  column: string;
  response: number | "NA";
}

export interface ResultsInput {
  trial: { id: string; design: string; status: string };
  assessment: { id: string; name: string; variable: string; unit: string; timingDays: number | null };
  dataVersion: number;
  rows: AnalysisRow[];
  treatments: Array<{ code: string; name: string; checkType: string | null }>;
  options: AnalysisOptions;
}

export function designColumns(design: string): DesignColumns {
  return design === "latin" ? { design: "latin", row: "row", column: "column" } : design === "crd" ? { design: "crd" } : { design: "rcbd", block: "block" };
}

const isWeedVariable = (variable: string) => variable === "weed-density" || variable === "weed-biomass";
const format = (value: number) => (Math.abs(value) >= 100 ? value.toFixed(0) : Math.abs(value) >= 1 ? value.toFixed(2) : value.toPrecision(2));

/** The engine's options for an assessment: the app's choices mapped onto analyzeTrial. */
export function engineOptions(design: string, options: AnalysisOptions, extras: { control?: string; reference?: string; margin?: number } = {}) {
  return { ...designColumns(design), response: "response", treatment: "treatment", transform: options.transform, alpha: options.alpha, ...extras };
}

/** Letters from Fisher's protected LSD: only when the treatment F test is significant at alpha. */
function lsdLetters(analysis: TrialAnalysis, alpha: number, significant: boolean): string[] | null {
  if (!significant) return null;
  const means = analysis.means as TreatmentMean[];
  const index = new Map(means.map((mean, position) => [mean.treatment, position]));
  const differs = new Set<string>();
  for (const comparison of analysis.comparisons ?? []) {
    if (comparison.pLsd <= alpha) differs.add(`${index.get(comparison.a)}:${index.get(comparison.b)}`);
  }
  return compactLetterDisplay(
    means.map((mean) => mean.lsmean),
    (first, second) => differs.has(`${first}:${second}`) || differs.has(`${second}:${first}`),
  );
}

function equivalenceConclusion(results: NonNullable<TrialAnalysis["equivalence"]>["results"], reference: string, margin: number, transform: string): string {
  const shown = results.filter((line) => line.equivalent).map((line) => line.treatment);
  const notShown = results.filter((line) => !line.equivalent).map((line) => line.treatment);
  const scale = transform === "none" ? "" : ` (on the ${transformLabels[transform as keyof typeof transformLabels]} scale)`;
  const parts: string[] = [];
  if (shown.length > 0) {
    parts.push(`${shown.join(", ")}: the whole 90% interval of the difference from ${reference} lies within ±${format(margin)}${scale}, so ${shown.length === 1 ? "it is" : "they are"} equivalent to ${reference} within that margin — no more than that may be concluded.`);
  }
  if (notShown.length > 0) {
    parts.push(`${notShown.join(", ")}: the 90% interval reaches past the margin, so equivalence to ${reference} is not shown. A difference that is not significant does not make treatments the same; these data cannot tell.`);
  }
  return parts.join(" ");
}

/**
 * Turns an assessment's plot rows into the results the page, report and exports show: the
 * engine's ANOVA, means and tests (analyzeTrial), letters for the chosen mean separation,
 * percent control, diagnostics and the warnings that must stay visible.
 */
export function buildResults(input: ResultsInput): AssessmentResults {
  const { options, rows, treatments, assessment } = input;
  const names = new Map(treatments.map((treatment) => [treatment.code, treatment.name]));
  const analysed = rows.filter((row) => row.response !== "NA");
  const lostPlots = rows.filter((row) => row.response === "NA").map((row) => row.plotNumber);
  const warnings: string[] = [];
  const base: AssessmentResults = {
    assessment: { ...assessment },
    trial: input.trial,
    dataVersion: input.dataVersion,
    computedAt: new Date().toISOString(),
    options: {
      transform: options.transform,
      method: options.method,
      alpha: options.alpha,
      control: options.control ?? null,
      reference: options.reference ?? null,
      margin: options.margin ?? null,
    },
    empty: analysed.length === 0,
    error: null,
    anova: [],
    grandMean: null,
    cvPercent: null,
    lsd: null,
    residualDf: null,
    treatmentTest: null,
    means: [],
    lettersNote: "",
    plotValues: analysed.map((row) => ({ plotNumber: row.plotNumber, block: Number(row.block), treatment: row.treatment, value: row.response as number })),
    lostPlots,
    diagnostics: { points: [], qq: [], shapiroWilk: null, levene: null, advice: [] },
    equivalence: null,
    warnings,
  };
  if (analysed.length === 0) {
    base.lettersNote = "No data have been recorded for this assessment yet.";
    return base;
  }

  // Percent control needs a check that is a treatment here with a mean above zero.
  const rawByTreatment = new Map<string, number[]>();
  for (const row of analysed) rawByTreatment.set(row.treatment, [...(rawByTreatment.get(row.treatment) ?? []), row.response as number]);
  const rawMean = (code: string) => {
    const values = rawByTreatment.get(code) ?? [];
    return values.length ? values.reduce((sum, value) => sum + value, 0) / values.length : Number.NaN;
  };
  for (const [code, values] of rawByTreatment) {
    if (values.every((value) => value === 0)) warnings.push(`Every plot of ${code} (${names.get(code) ?? code}) is zero: its variance is zero, which breaks the equal-variance assumption; read its letters with care or analyse a transform.`);
  }
  let control = options.control;
  if (!isWeedVariable(assessment.variable)) control = undefined;
  if (control !== undefined && !(rawMean(control) > 0)) {
    warnings.push(`Percent control is not shown: ${control} is not a treatment here or its mean is zero.`);
    control = undefined;
  }
  let reference = options.reference;
  if (reference !== undefined && !rawByTreatment.has(reference)) {
    warnings.push(`The equivalence reference ${reference} is not a treatment of this assessment.`);
    reference = undefined;
  }

  let analysis: TrialAnalysis;
  try {
    analysis = analyzeTrial(rows, engineOptions(input.trial.design, options, {
      control: isWeedVariable(assessment.variable) ? control : undefined,
      ...(reference !== undefined && options.margin !== undefined ? { reference, margin: options.margin } : {}),
    }));
  } catch (error) {
    if (!(error instanceof StatsInputError)) throw error;
    base.error = `The analysis could not be run: ${error.message}.`;
    return base;
  }

  const treatmentRow = analysis.anova?.find((row) => row.source === "treatment");
  const residual = analysis.anova?.find((row) => row.source === "residual");
  const significant = treatmentRow?.p !== undefined && treatmentRow.p <= options.alpha;
  const letters = options.method === "tukey" ? (analysis.means as TreatmentMean[]).map((mean) => mean.group) : lsdLetters(analysis, options.alpha, significant);
  const percent = new Map((analysis.percentControl ?? []).map((line) => [line.treatment, line.percent]));
  const controlMean = control !== undefined ? rawMean(control) : Number.NaN;
  const order = new Map(treatments.map((treatment, index) => [treatment.code, index]));

  base.anova = analysis.anova ?? [];
  base.grandMean = analysis.grandMean ?? null;
  base.cvPercent = analysis.cvPercent ?? null;
  base.lsd = analysis.lsd ?? null;
  base.residualDf = residual?.df ?? null;
  base.treatmentTest = treatmentRow?.f !== undefined && treatmentRow.p !== undefined ? { f: treatmentRow.f, p: treatmentRow.p, significant } : null;
  base.means = (analysis.means as TreatmentMean[])
    .map((mean, index) => ({
      treatment: mean.treatment,
      name: names.get(mean.treatment) ?? mean.treatment,
      n: mean.n,
      mean: options.transform === "none" ? mean.lsmean : (mean.backTransformed ?? mean.lsmean),
      transformedMean: options.transform === "none" ? null : mean.lsmean,
      se: mean.se,
      letters: letters ? letters[index] : null,
      percentControl: mean.treatment === control ? null : (percent.get(mean.treatment) ?? null),
      weedControlEfficiency:
        assessment.variable === "weed-biomass" && control !== undefined && mean.treatment !== control ? weedControlEfficiency(controlMean, rawMean(mean.treatment)) : null,
    }))
    .sort((a, b) => (order.get(a.treatment) ?? 0) - (order.get(b.treatment) ?? 0));

  const alphaText = `α = ${options.alpha}`;
  const scaleNote = options.transform === "none" ? "" : ` Means are back-transformed from the ${transformLabels[options.transform]} scale; letters, standard errors and the LSD are on the transformed scale.`;
  const balanceNote = analysis.lsd === null ? " Plots are missing or replication differs, so least-squares means and one LSD value cannot be given; comparisons use each pair's own standard error." : "";
  base.lettersNote =
    options.method === "tukey"
      ? `Means followed by the same letter do not differ by Tukey's HSD at ${alphaText}${analysis.lsd === null ? " (Tukey-Kramer for unequal replication)" : ""}.${scaleNote}${balanceNote}`
      : significant
        ? `Means followed by the same letter do not differ by Fisher's protected LSD at ${alphaText} (treatment F test p = ${treatmentRow!.p!.toPrecision(2)}).${scaleNote}${balanceNote}`
        : `The treatment F test was not significant at ${alphaText} (p = ${treatmentRow?.p?.toPrecision(2) ?? "n/a"}), so Fisher's protected LSD makes no mean separation and no letters are shown.${scaleNote}`;

  try {
    const points = fittedAndResiduals(rows, { ...designColumns(input.trial.design), response: "response", treatment: "treatment", transform: options.transform });
    base.diagnostics.points = points.map((point) => ({ plotNumber: analysed[point.index].plotNumber, treatment: analysed[point.index].treatment, fitted: point.fitted, residual: point.residual }));
    base.diagnostics.qq = normalQuantilePoints(points.map((point) => point.residual));
  } catch (error) {
    if (!(error instanceof StatsInputError)) throw error;
  }
  base.diagnostics.shapiroWilk = analysis.assumptions?.shapiroWilk ?? null;
  base.diagnostics.levene = analysis.assumptions?.levene ?? null;
  base.diagnostics.advice = analysis.advice ?? [];

  if (analysis.equivalence && reference !== undefined) {
    base.equivalence = {
      reference,
      margin: analysis.equivalence.margin,
      results: analysis.equivalence.results.map(({ treatment, diff, ci90, p, equivalent }) => ({ treatment, diff, ci90, p, equivalent })),
      conclusion: equivalenceConclusion(analysis.equivalence.results, reference, analysis.equivalence.margin, options.transform),
    };
  }

  // Degenerate data (no residual variation) give infinite F or NaN p; JSON has no such numbers.
  const finite = (value: number | null | undefined) => (value !== null && value !== undefined && Number.isFinite(value) ? value : null);
  base.anova = base.anova.map((row) => ({ source: row.source, df: row.df, ss: row.ss, ms: row.ms, ...(finite(row.f) !== null ? { f: row.f } : {}), ...(finite(row.p) !== null ? { p: row.p } : {}) }));
  base.grandMean = finite(base.grandMean);
  base.cvPercent = finite(base.cvPercent);
  base.lsd = finite(base.lsd);
  if (base.treatmentTest && (finite(base.treatmentTest.f) === null || finite(base.treatmentTest.p) === null)) base.treatmentTest = null;
  base.means = base.means.map((mean) => ({ ...mean, se: finite(mean.se) ?? 0, percentControl: finite(mean.percentControl), weedControlEfficiency: finite(mean.weedControlEfficiency) }));
  if (residual && !(residual.ms > 0)) warnings.push("There is no residual variation (every plot equals its fitted value), so F tests and standard errors cannot be given.");

  warnings.unshift(...(analysis.warnings ?? []));
  if (lostPlots.length > 0 && !warnings.some((warning) => warning.includes("lost plots"))) warnings.push(`Plots without a value: ${lostPlots.join(", ")}.`);
  else if (lostPlots.length > 0) warnings.push(`Lost plots: ${lostPlots.join(", ")}.`);
  const sw = analysis.assumptions?.shapiroWilk;
  const lev = analysis.assumptions?.levene;
  const failed = [sw && sw.p < options.alpha ? `residuals are not normal (Shapiro-Wilk p = ${sw.p.toPrecision(2)})` : null, lev && lev.p < options.alpha ? `variances differ between treatments (Levene p = ${lev.p.toPrecision(2)})` : null].filter(Boolean);
  if (failed.length > 0) warnings.push(`Assumptions not met: ${failed.join("; ")}. See the diagnostics and the recommendation there.`);
  return base;
}
