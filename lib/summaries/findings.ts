import { studentTQuantile, type TrialAnalysis } from "@/lib/stats";
import type { Range, WeedFinding, WeedResult, YieldFinding, YieldResult } from "./types";

/*
 * From the statistics engine's result to the findings the summary words. Pure.
 *
 * Ranges: the difference of two lsmeans d ± t(1 − (1 − level)/2; residual df) × SE(d), with SE
 * from the engine's pairwise comparisons. "Detected" means that range excludes zero (the same
 * as Fisher's LSD test at 1 − level), so the words never contradict the range printed beside
 * them. Percent control's range is the difference range divided by the weedy check's lsmean,
 * taking the check mean as known: a simple, slightly narrow range. A ratio (Fieller) interval
 * needs the covariance of the two lsmeans, which the engine does not report (it matters once
 * plots are lost), so the summary's words say the range is narrow instead (generate.ts,
 * rangeMeaning).
 */

export interface Difference {
  difference: number;
  range: Range | null;
  detected: boolean;
}

function residualDf(analysis: TrialAnalysis): number | null {
  const row = analysis.anova?.find((line) => line.source === "residual");
  return row && row.df > 0 ? row.df : null;
}

export function lsmeanOf(analysis: TrialAnalysis, code: string): number | null {
  const line = analysis.means?.find((mean) => mean.treatment === code);
  if (!line) return null;
  return (line as { lsmean?: number }).lsmean ?? line.mean;
}

/** Treatment − reference on the analysed scale, with its confidence range. */
export function differenceFrom(analysis: TrialAnalysis, code: string, reference: string, confidence: number): Difference | null {
  const comparison = analysis.comparisons?.find((line) => (line.a === code && line.b === reference) || (line.a === reference && line.b === code));
  if (!comparison) return null;
  const sign = comparison.a === code ? 1 : -1;
  const difference = sign * comparison.diff;
  const df = residualDf(analysis);
  if (df === null || !(comparison.se > 0) || analysis.transform !== "none") {
    return { difference, range: null, detected: comparison.pLsd < 1 - confidence };
  }
  const half = studentTQuantile(1 - (1 - confidence) / 2, df) * comparison.se;
  const range = { low: difference - half, high: difference + half };
  return { difference, range, detected: range.low > 0 || range.high < 0 };
}

export interface WeedFindingOptions {
  assessmentName: string;
  measure: WeedFinding["measure"];
  unit: string;
  daysAfterPlanting: number | null;
  checkCode: string;
  confidence: number;
  /** Reference and margin (percentage points) when the analysis ran the equivalence test. */
  reference?: { code: string; marginPoints: number };
}

export function weedFinding(analysis: TrialAnalysis, options: WeedFindingOptions): WeedFinding | null {
  const checkMean = lsmeanOf(analysis, options.checkCode);
  if (checkMean === null || !(checkMean > 0)) return null;
  const results: WeedResult[] = [];
  for (const mean of analysis.means ?? []) {
    if (mean.treatment === options.checkCode) continue;
    const against = differenceFrom(analysis, mean.treatment, options.checkCode, options.confidence);
    if (!against) continue;
    const engineControl = analysis.percentControl?.find((line) => line.treatment === mean.treatment)?.percent;
    const equivalence = options.reference ? analysis.equivalence?.results.find((line) => line.treatment === mean.treatment && line.reference === options.reference!.code) : undefined;
    results.push({
      code: mean.treatment,
      mean: lsmeanOf(analysis, mean.treatment)!,
      percentControl: engineControl ?? (-100 * against.difference) / checkMean,
      // Fewer weeds (a negative difference) is more control, so the ends swap.
      percentRange: against.range ? { low: (-100 * against.range.high) / checkMean, high: (-100 * against.range.low) / checkMean } : null,
      detected: against.detected,
      similarToReference: equivalence ? equivalence.equivalent : null,
    });
  }
  return {
    assessmentName: options.assessmentName,
    measure: options.measure,
    unit: options.unit,
    daysAfterPlanting: options.daysAfterPlanting,
    checkCode: options.checkCode,
    checkMean,
    results,
    reference: options.reference && analysis.equivalence ? options.reference : null,
  };
}

export interface YieldFindingOptions {
  assessmentName: string;
  reference: { code: string; kind: "hand" | "weed-free" };
  marginShare: number;
  weedyCheckCode: string | null;
  confidence: number;
}

export function yieldFinding(analysis: TrialAnalysis, options: YieldFindingOptions): YieldFinding | null {
  const referenceMean = lsmeanOf(analysis, options.reference.code);
  if (referenceMean === null || !(referenceMean > 0)) return null;
  const results: YieldResult[] = [];
  const againstWeedyCheck: YieldFinding["againstWeedyCheck"] = [];
  for (const mean of analysis.means ?? []) {
    const code = mean.treatment;
    if (options.weedyCheckCode && code !== options.weedyCheckCode) {
      const check = differenceFrom(analysis, code, options.weedyCheckCode, options.confidence);
      if (check) againstWeedyCheck.push({ code, difference: check.difference, differenceRange: check.range });
    }
    if (code === options.reference.code) continue;
    const against = differenceFrom(analysis, code, options.reference.code, options.confidence);
    if (!against) continue;
    const equivalence = analysis.equivalence?.results.find((line) => line.treatment === code && line.reference === options.reference.code);
    results.push({
      code,
      mean: lsmeanOf(analysis, code)!,
      difference: against.difference,
      differenceRange: against.range,
      detected: against.detected,
      equivalent: equivalence ? equivalence.equivalent : null,
    });
  }
  return {
    assessmentName: options.assessmentName,
    unit: "t/ha",
    reference: { ...options.reference, mean: referenceMean },
    marginShare: options.marginShare,
    margin: options.marginShare * referenceMean,
    results,
    againstWeedyCheck,
    weedyCheckMean: options.weedyCheckCode ? lsmeanOf(analysis, options.weedyCheckCode) : null,
  };
}
