// Public API of the statistics engine. Pure TypeScript: runs in Node and the browser.
export { StatsInputError } from "./errors";
export { analyzeTrial, type TrialAnalysis, type TreatmentMean } from "./analyze-trial";
export { trialOptionsSchema, type TrialOptions, type TrialOptionsInput } from "./trial-options";

export { compensatedSum } from "./core/compensated-sum";
export { NeumaierAccumulator } from "./core/neumaier-accumulator";
export { centreDecimalValues } from "./core/centre-decimal-values";
export { encodeFactor, type EncodedFactor } from "./core/encode-factor";
export { transformValue, type ResponseTransform } from "./core/transform-value";
export { backTransformValue } from "./core/back-transform-value";
export { readTrialRows, type TrialRow } from "./core/read-trial-rows";

export { normalCdf } from "./distributions/normal-cdf";
export { normalQuantile } from "./distributions/normal-quantile";
export { studentTCdf } from "./distributions/student-t-cdf";
export { studentTQuantile } from "./distributions/student-t-quantile";
export { fCdf } from "./distributions/f-cdf";
export { fQuantile } from "./distributions/f-quantile";
export { chiSquareCdf } from "./distributions/chi-square-cdf";
export { incompleteBeta, type TailProbabilities } from "./distributions/incomplete-beta";
export { incompleteGamma } from "./distributions/incomplete-gamma";
export { logGamma } from "./distributions/log-gamma";
export { studentizedRangeCdf } from "./distributions/studentized-range-cdf";
export { studentizedRangeQuantile } from "./distributions/studentized-range-quantile";
export { noncentralFCdf } from "./distributions/noncentral-f-cdf";

export type { AnovaRow, ModelFit } from "./designs/model-types";
export { fitCompletelyRandomized } from "./designs/fit-completely-randomized";
export { fitRandomizedCompleteBlock } from "./designs/fit-randomized-complete-block";
export { fitLatinSquare } from "./designs/fit-latin-square";
export { fitCombinedSites } from "./designs/fit-combined-sites";
export { fitLinearModel } from "./designs/fit-linear-model";
export { leastSquaresMeans } from "./designs/least-squares-means";

export { pairwiseComparisons, type PairwiseComparison } from "./comparisons/pairwise-comparisons";
export { fisherLsd } from "./comparisons/fisher-lsd";
export { compactLetterDisplay } from "./comparisons/compact-letter-display";

export { shapiroWilk } from "./tests/shapiro-wilk";
export { brownForsytheLevene } from "./tests/brown-forsythe-levene";
export { friedmanTest } from "./tests/friedman-test";
export { kruskalWallis, type KruskalWallisResult } from "./tests/kruskal-wallis";
export { pairedTTest } from "./tests/paired-t-test";
export { welchTTest } from "./tests/welch-t-test";
export type { TTestResult } from "./tests/t-test-types";
export { equivalenceTost } from "./tests/equivalence-tost";
export { assumptionAdvice } from "./tests/assumption-advice";

export { residualDfCheck } from "./planning/residual-df-check";
export { blocksNeeded, type BlocksNeededInput, type BlocksNeededResult } from "./planning/blocks-needed";

export { unitConstants } from "./measures/unit-constants";
export { percentControl } from "./measures/percent-control";
export { weedControlEfficiency } from "./measures/weed-control-efficiency";
export { weedIndex } from "./measures/weed-index";
export { abbottCorrection } from "./measures/abbott-correction";
export { hendersonTilton } from "./measures/henderson-tilton";
export { quadratDensity } from "./measures/quadrat-density";
export { plotYieldPerArea, type AreaYield } from "./measures/plot-yield-per-area";
export { perSquareFootToPerSquareMetre } from "./measures/per-square-foot-to-per-square-metre";
export { perSquareMetreToPerSquareFoot } from "./measures/per-square-metre-to-per-square-foot";
